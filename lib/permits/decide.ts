// Refusing a request, withdrawing an issued permit, closing it: each one state transition.
import "server-only";
import { getPermitRequester, listPermitMembers, lockMembers, membersCoveredByOtherIssued, setMembersStatus } from "@/db/queries/permits";
import type { SessionUser } from "@/db/queries/users";
import type { Permit } from "@/db/schema";
import { permitRefusedEmail } from "@/emails/permit-refused";
import { permitWithdrawnEmail } from "@/emails/permit-withdrawn";
import type { Site } from "@/lib/api/resources";
import { PERMIT_KIND_LABELS, permitNumberLabel } from "@/lib/validations/permit";
import { alreadyDecided, wrongState } from "./errors";
import { transitionPermit } from "./transition";
import { permitUrl } from "./urls";
import { requestReference, scopeWords, zonesOf } from "./words";

type Ctx<I = undefined> = { user: SessionUser; site: Site; resource: Permit; input: I };
const actorOf = (user: SessionUser) => ({ organisationId: user.organisationId, userId: user.id });

export async function refusePermit({ user, site, resource, input: { reason } }: Ctx<{ reason: string }>) {
  const { permit } = await transitionPermit({
    permitId: resource.id,
    actor: actorOf(user),
    from: ["requested"],
    refuse: (locked, tx) => alreadyDecided(locked.id, tx),
    plan: async (locked, tx) => {
      const scope = await listPermitMembers({ permitId: locked.id }, tx);
      const requester = await getPermitRequester({ userId: locked.requestedBy }, tx);
      const mail = permitRefusedEmail({
        reference: requestReference({ requestNumber: locked.requestNumber, requestedByName: requester?.name, requestedAt: locked.requestedAt }, site.timezone),
        kindLabel: PERMIT_KIND_LABELS[locked.kind],
        siteName: site.name,
        scope: scopeWords(scope.length, zonesOf(scope)),
        refusedBy: user.name,
        reason,
        url: permitUrl(locked.siteId, locked.id),
      });
      return {
        values: { status: "refused", refusedReason: reason, closedAt: new Date(), closedBy: user.id },
        audit: { action: "permit.refused", before: { status: "requested" }, after: { status: "refused", reason } },
        emails: requester
          ? [{ siteId: locked.siteId, kind: "permit.refused", toEmail: requester.email, toUserId: requester.id, ...mail, relatedType: "permit", relatedId: locked.id }]
          : [],
      };
    },
  });
  return permit;
}

export async function withdrawPermit({ user, site, resource, input: { reason } }: Ctx<{ reason: string }>) {
  const { permit } = await transitionPermit({
    permitId: resource.id,
    actor: actorOf(user),
    from: ["issued"],
    refuse: (locked) => wrongState("Only an issued permit can be withdrawn", locked.status),
    plan: async (locked, tx) => {
      const scope = await listPermitMembers({ permitId: locked.id }, tx);
      const label = permitNumberLabel(locked.kind, locked.number)!;
      const ids = scope.map((m) => m.id);
      await lockMembers({ memberIds: ids }, tx);
      let released: { id: string; tag: string }[] = [];
      if (locked.kind === "load") {
        // A member leaves "loaded" unless another issued permit to load still covers it.
        const stillCovered = await membersCoveredByOtherIssued({ memberIds: ids, kind: "load", excludePermitId: locked.id }, tx);
        released = await setMembersStatus({ memberIds: ids.filter((id) => !stillCovered.has(id)), from: ["loaded"], to: "submitted" }, tx);
      }
      const mail = permitWithdrawnEmail({
        numberLabel: label,
        kindLabel: PERMIT_KIND_LABELS[locked.kind],
        siteName: site.name,
        scope: scopeWords(scope.length, zonesOf(scope)),
        withdrawnBy: user.name,
        reason,
        url: permitUrl(locked.siteId, locked.id),
      });
      return {
        values: { status: "withdrawn", withdrawnReason: reason, closedAt: new Date(), closedBy: user.id },
        audit: { action: "permit.withdrawn", before: { status: "issued" }, after: { status: "withdrawn", reason } },
        also: released.map((m) => ({
          action: "member.unloaded",
          entityType: "member",
          entityId: m.id,
          before: { status: "loaded" },
          after: { status: "submitted", permit: label, reason: "permit withdrawn" },
        })),
        emails: locked.recipients.map((email) => ({ siteId: locked.siteId, kind: "permit.withdrawn", toEmail: email, ...mail, relatedType: "permit", relatedId: locked.id })),
      };
    },
  });
  return permit;
}

export async function closePermit({ user, resource }: Omit<Ctx, "site">) {
  const { permit } = await transitionPermit({
    permitId: resource.id,
    actor: actorOf(user),
    from: ["issued"],
    refuse: (locked) => wrongState("Only an issued permit can be closed", locked.status),
    plan: async () => ({
      values: { status: "closed", closedAt: new Date(), closedBy: user.id },
      audit: { action: "permit.closed", before: { status: "issued" }, after: { status: "closed" } },
    }),
  });
  return permit;
}
