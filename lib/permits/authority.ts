// Who may decide a permit: the site's coordinator, or a supervisor with an in-date issuing scope
// covering every zone in it. Issuing adds separation of duties: whoever requested a permit does
// not issue it. Routes check this in their `authorize` hook; the answer is kept per request so
// the use case reads the same answer (how the person is allowed) without deriving it again.
import "server-only";
import { listActiveDelegations, listPermitMembers } from "@/db/queries/permits";
import type { SessionUser } from "@/db/queries/users";
import type { Permit, SiteRole } from "@/db/schema";
import { ForbiddenError } from "@/lib/errors";
import { rolesAllowPure } from "@/lib/permissions";

export type Authority = { ok: true; as: "coordinator" | "delegated supervisor"; delegationId?: string } | { ok: false; reason: string };

export async function issuingAuthority({
  user,
  siteId,
  roles,
  zoneIds,
  now = new Date(),
}: {
  user: SessionUser;
  siteId: string;
  roles: readonly SiteRole[];
  zoneIds: (string | null)[];
  now?: Date;
}): Promise<Authority> {
  if (rolesAllowPure(roles, "issuePermit")) return { ok: true, as: "coordinator" };
  if (!roles.includes("supervisor")) return { ok: false, reason: "Only the site's temporary works coordinator, or a supervisor given issuing scope, may decide permits." };
  const delegations = await listActiveDelegations({ siteId, userId: user.id, now });
  if (delegations.length === 0) return { ok: false, reason: "You have no in-date issuing scope from the coordinator on this site." };
  const needed = [...new Set(zoneIds)];
  if (needed.includes(null)) return { ok: false, reason: "This permit includes members with no zone; only the coordinator may decide it." };
  const covering = delegations.find((d) => needed.every((z) => d.zoneIds.includes(z as string)));
  if (!covering) return { ok: false, reason: "Your issuing scope does not cover every zone in this permit; the coordinator must decide it." };
  return { ok: true, as: "delegated supervisor", delegationId: covering.id };
}

/** Separation of duties: the reason the requester may not issue their own permit, or null. */
export function ownRequestReason(user: SessionUser, permit: Pick<Permit, "requestedBy">): string | null {
  if (permit.requestedBy !== user.id) return null;
  return "You requested this permit, so someone else must issue it: another coordinator, or a supervisor with issuing scope for its zones (separation of duties).";
}

type Ctx = { req: Request; user: SessionUser; roles: SiteRole[]; resource: Permit };
const perRequest = new WeakMap<Request, Promise<Authority>>();

/** The decider's authority for this request's permit (computed once per request). */
export function authorityFor(ctx: Ctx): Promise<Authority> {
  let a = perRequest.get(ctx.req);
  if (!a) {
    a = listPermitMembers({ permitId: ctx.resource.id }).then((scope) =>
      issuingAuthority({ user: ctx.user, siteId: ctx.resource.siteId, roles: ctx.roles, zoneIds: scope.map((m) => m.zoneId) }),
    );
    perRequest.set(ctx.req, a);
  }
  return a;
}

/** `authorize` hook: refuse, withdraw, close. */
export async function mayDecide(ctx: Ctx) {
  const a = await authorityFor(ctx);
  if (!a.ok) throw new ForbiddenError(a.reason);
}

/** `authorize` hook: issue — the decider, and not the person who requested it. */
export async function mayIssue(ctx: Ctx) {
  await mayDecide(ctx);
  const own = ownRequestReason(ctx.user, ctx.resource);
  if (own) throw new ForbiddenError(own);
}
