// Permit use cases: request, issue, refuse, withdraw, close, confirm striking, delegate issuing.
// Each state change is one transaction with its audit events and its e-mails (outbox).
import "server-only";
import { and, eq, inArray, isNull } from "drizzle-orm";
import { db, type DbOrTx } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import { listSiteRoleEmails } from "@/db/queries/memberships";
import { enqueueEmails, listEmailsFor } from "@/db/queries/outbox";
import {
  getDelegationForUser, getPermitForUpdate, getPermitForUser, getPermitView, getSiteMembersForPermit, insertDelegation,
  insertPermit, insertPermitMembers, listActiveDelegations, listPermitMembers, listSchemeZoneMembers, lockMembers,
  membersCoveredByOtherIssued, nextPermitNumber, revokeDelegation, setMembersStatus, updatePermit, type PermitView,
  type ReviewMember,
} from "@/db/queries/permits";
import { getScheme } from "@/db/queries/schemes";
import type { SessionUser } from "@/db/queries/users";
import { getZone } from "@/db/queries/zones";
import { members, permitMembers, schemes, users, zones, type SiteRole } from "@/db/schema";
import { permitIssuedEmail } from "@/emails/permit-issued";
import { permitRefusedEmail } from "@/emails/permit-refused";
import { permitWithdrawnEmail } from "@/emails/permit-withdrawn";
import { assertSitePermission, getSiteAccess, isUuid } from "@/lib/authz";
import { AppError, ConflictError, fieldErrorsFromZod, ForbiddenError, NotFoundError, ValidationError } from "@/lib/errors";
import { PERMIT_STATUS_LABELS } from "@/lib/labels";
import { rolesAllowPure } from "@/lib/permissions";
import {
  delegationSchema, MAX_DELEGATION_DAYS, MAX_VALIDITY_DAYS, PERMIT_KIND_LABELS, permitIssueSchema, permitNumberLabel,
  permitReasonSchema, permitRequestSchema,
} from "@/lib/validations/permit";
import { fmtDateTime, fmtUtilisation, type UnitSystem } from "./format";
import { evaluatePermit, type Evaluation, type SchemeFacts } from "./preconditions";

import { renderAndStorePermitPdf } from "./pdf";
import { permitUrl } from "./urls";

export { renderAndStorePermitPdf, renderPendingPermitPdfs } from "./pdf";
export { permitUrl };

const HOUR = 3600_000;
const DAY = 24 * HOUR;

/** 422 listing every reason a permit cannot be issued, per member, in words. */
export class PreconditionError extends AppError {
  constructor(readonly evaluation: Evaluation) {
    const fields: Record<string, string> = {};
    for (const f of evaluation.permit.filter((x) => !x.ok)) fields[f.key] = fields[f.key] ? `${fields[f.key]}; ${f.text}` : f.text;
    for (const m of evaluation.members) {
      const bad = m.findings.filter((f) => !f.ok).map((f) => f.text);
      if (bad.length) fields[m.tag] = bad.join("; ");
    }
    super(422, "preconditions_failed", `This permit cannot be issued yet. ${evaluation.reasons.join(". ")}.`, fields);
  }
}


function scopeWords(n: number, zoneNames: string[]) {
  return `${n} member${n === 1 ? "" : "s"}${zoneNames.length ? ` in ${zoneNames.join(", ")}` : ""}`;
}
const zonesOf = (ms: ReviewMember[]) => [...new Set(ms.map((m) => m.zoneName).filter((z): z is string => !!z))];

// ------------------------------------------------------------------ access
/** The permit if the user may see its site (404 otherwise, including another organisation's). */
export async function loadPermitForUser(user: SessionUser, permitId: string) {
  if (!isUuid(permitId)) throw new NotFoundError("That permit");
  const permit = await getPermitForUser({ permitId, organisationId: user.organisationId });
  if (!permit) throw new NotFoundError("That permit");
  let access;
  try {
    access = await getSiteAccess(user, permit.siteId);
  } catch (e) {
    if (e instanceof NotFoundError) throw new NotFoundError("That permit");
    throw e;
  }
  return { permit, ...access };
}

/**
 * Coordinators of the site may decide permits; a supervisor only with an in-date delegation that
 * covers every zone in the permit's scope. Returns how the user is allowed, or why not.
 */
export async function issuingAuthority(
  { user, siteId, roles, zoneIds, now = new Date() }: { user: SessionUser; siteId: string; roles: readonly SiteRole[]; zoneIds: (string | null)[]; now?: Date },
  tx: DbOrTx = db,
): Promise<{ ok: true; as: "coordinator" | "delegated supervisor"; delegationId?: string } | { ok: false; reason: string }> {
  if (rolesAllowPure(roles, "issuePermit")) return { ok: true, as: "coordinator" };
  if (!roles.includes("supervisor")) return { ok: false, reason: "Only the site's temporary works coordinator, or a supervisor given issuing scope, may decide permits." };
  const delegations = await listActiveDelegations({ siteId, userId: user.id, now }, tx);
  if (delegations.length === 0) return { ok: false, reason: "You have no in-date issuing scope from the coordinator on this site." };
  const needed = [...new Set(zoneIds)];
  if (needed.includes(null)) return { ok: false, reason: "This permit includes members with no zone; only the coordinator may decide it." };
  const covering = delegations.find((d) => needed.every((z) => d.zoneIds.includes(z as string)));
  if (!covering) return { ok: false, reason: "Your issuing scope does not cover every zone in this permit; the coordinator must decide it." };
  return { ok: true, as: "delegated supervisor", delegationId: covering.id };
}

async function schemeFacts(schemeIds: (string | null)[], tx: DbOrTx): Promise<SchemeFacts[]> {
  const ids = [...new Set(schemeIds.filter((s): s is string => !!s))];
  if (ids.length === 0) return [];
  return tx
    .select({ id: schemes.id, reference: schemes.reference, category: schemes.category, certificateKey: schemes.certificateKey, validUntil: schemes.validUntil })
    .from(schemes)
    .where(inArray(schemes.id, ids));
}

function parse<T>(schema: { safeParse: (v: unknown) => { success: true; data: T } | { success: false; error: { issues: { path: PropertyKey[]; message: string }[] } } }, body: unknown): T {
  const r = schema.safeParse(body);
  if (!r.success) throw new ValidationError(fieldErrorsFromZod(r.error.issues));
  return r.data;
}

// ----------------------------------------------------------------- request
export async function requestPermit({ user, siteId, body }: { user: SessionUser; siteId: string; body: unknown }) {
  const { site } = await assertSitePermission(user, siteId, "requestPermit");
  const input = parse(permitRequestSchema, body);
  let scope: ReviewMember[];
  let schemeId: string | null = null;
  let zoneId: string | null = null;
  if (input.scope === "members") {
    const ids = [...new Set(input.memberIds!)];
    scope = await getSiteMembersForPermit({ siteId, memberIds: ids });
    if (scope.length !== ids.length) {
      const missing = ids.length - scope.length;
      throw new ValidationError({ memberIds: `${missing} of the chosen members ${missing === 1 ? "is" : "are"} not on this site.` });
    }
    const schemeIds = new Set(scope.map((m) => m.schemeId));
    const zoneIds = new Set(scope.map((m) => m.zoneId));
    if (schemeIds.size === 1) schemeId = [...schemeIds][0] ?? null;
    if (zoneIds.size === 1) zoneId = [...zoneIds][0] ?? null;
  } else {
    const [scheme, zone] = await Promise.all([getScheme({ siteId, schemeId: input.schemeId! }), getZone({ siteId, zoneId: input.zoneId! })]);
    const fields: Record<string, string> = {};
    if (!scheme) fields.schemeId = "That scheme is not on this site.";
    if (!zone) fields.zoneId = "That zone is not on this site.";
    if (Object.keys(fields).length) throw new ValidationError(fields);
    scope = await listSchemeZoneMembers({
      siteId,
      schemeId: scheme!.id,
      zoneId: zone!.id,
      statuses: input.kind === "load" ? ["draft", "submitted"] : ["loaded", "submitted", "out_of_service"],
    });
    if (scope.length === 0)
      throw new ValidationError({
        schemeId: `Scheme ${scheme!.reference} has no members in ${zone!.name} that ${input.kind === "load" ? "are waiting to be loaded" : "are still standing"}.`,
      });
    schemeId = scheme!.id;
    zoneId = zone!.id;
  }

  // Members that cannot be in this request, each named with the reason.
  const problems: string[] = [];
  for (const m of scope) {
    if (input.kind === "load") {
      if (m.coveredBy?.kind === "load") problems.push(`${m.tag} is already loaded under issued permit ${permitNumberLabel("load", m.coveredBy.number)}`);
      else if (!["draft", "submitted"].includes(m.status)) problems.push(`${m.tag} is ${m.status === "out_of_service" ? "out of service" : m.status}; only draft or submitted members can be loaded`);
      else if (m.checkPass === false)
        problems.push(
          m.utilisation == null
            ? `${m.tag} fails its capacity check (the check could not be completed)`
            : `${m.tag} fails its capacity check at ${fmtUtilisation(m.utilisation)} utilisation`,
        );
      else if (m.checkPass == null) problems.push(`${m.tag} has no capacity check yet`);
    } else {
      if (m.status === "struck") problems.push(`${m.tag} has already been struck`);
      else if (m.coveredBy?.kind === "strike") problems.push(`${m.tag} is already released for striking under ${permitNumberLabel("strike", m.coveredBy.number)}`);
    }
  }
  if (problems.length) {
    const field = input.scope === "members" ? "memberIds" : "schemeId";
    throw new ValidationError({ [field]: `${problems.join("; ")}.` }, `These members cannot be in this request: ${problems.join("; ")}.`);
  }

  const permit = await db.transaction(async (tx) => {
    const row = await insertPermit(
      {
        siteId,
        kind: input.kind,
        schemeId,
        zoneId,
        requestedBy: user.id,
        requestNote: input.note || null,
        evidence: (input.evidence as Record<string, unknown> | undefined) ?? null,
      },
      tx,
    );
    await insertPermitMembers({ permitId: row.id, memberIds: scope.map((m) => m.id) }, tx);
    await recordAudit(
      {
        organisationId: user.organisationId,
        siteId,
        actorId: user.id,
        action: "permit.requested",
        entityType: "permit",
        entityId: row.id,
        after: { kind: row.kind, members: scope.map((m) => m.tag), schemeId, zoneId, evidence: row.evidence, note: row.requestNote },
      },
      tx,
    );
    return row;
  });
  return permit;
}

// -------------------------------------------------------------------- issue
export async function issuePermit({ user, permitId, body, now: nowArg }: { user: SessionUser; permitId: string; body: unknown; now?: Date }) {
  const { permit, site, roles } = await loadPermitForUser(user, permitId);
  const scopeRows = await db
    .select({ zoneId: members.zoneId })
    .from(permitMembers)
    .innerJoin(members, eq(members.id, permitMembers.memberId))
    .where(and(eq(permitMembers.permitId, permit.id), isNull(permitMembers.removedAt)));
  const authority = await issuingAuthority({ user, siteId: permit.siteId, roles, zoneIds: scopeRows.map((r) => r.zoneId) });
  if (!authority.ok) throw new ForbiddenError(authority.reason);
  const input = parse(permitIssueSchema, body);

  const now = nowArg ?? new Date();
  const validUntil = input.validUntil ? new Date(input.validUntil) : new Date(now.getTime() + site.permitValidityHours * HOUR);
  if (validUntil.getTime() <= now.getTime()) throw new ValidationError({ validUntil: "The permit must be valid until a time in the future." });
  if (validUntil.getTime() > now.getTime() + MAX_VALIDITY_DAYS * DAY)
    throw new ValidationError({ validUntil: `A permit may be valid for at most ${MAX_VALIDITY_DAYS} days; issue a new one for longer work.` });
  const units = site.unitSystem as UnitSystem;

  const issued = await db.transaction(async (tx) => {
    const locked = await getPermitForUpdate({ permitId: permit.id }, tx);
    if (!locked) throw new NotFoundError("That permit");
    if (locked.status !== "requested") throw await alreadyDecided(locked.id, tx);

    const ids = (
      await tx.select({ id: permitMembers.memberId }).from(permitMembers).where(and(eq(permitMembers.permitId, locked.id), isNull(permitMembers.removedAt)))
    ).map((r) => r.id);
    await lockMembers({ memberIds: ids }, tx);
    const scope = await listPermitMembers({ permitId: locked.id }, tx);
    const evaluation = evaluatePermit({
      kind: locked.kind,
      members: scope,
      schemes: await schemeFacts(scope.map((m) => m.schemeId), tx),
      evidence: locked.evidence,
      now,
      units,
      timeZone: site.timezone,
    });
    if (!evaluation.canIssue) throw new PreconditionError(evaluation);

    const number = await nextPermitNumber({ siteId: locked.siteId }, tx);
    const label = permitNumberLabel(locked.kind, number)!;
    const [requester] = await tx.select({ id: users.id, email: users.email, name: users.name }).from(users).where(eq(users.id, locked.requestedBy));
    const supervisors = await listSiteRoleEmails({ siteId: locked.siteId, role: "supervisor" }, tx);
    const recipients = new Map<string, { userId: string; email: string }>();
    for (const r of [...supervisors, ...(requester ? [{ userId: requester.id, email: requester.email }] : [])])
      recipients.set(r.email.toLowerCase(), { userId: r.userId, email: r.email });

    const row = await updatePermit(
      {
        permitId: locked.id,
        values: {
          status: "issued",
          number,
          approvedBy: user.id,
          issuedAt: now,
          validUntil,
          conditions: input.conditions || null,
          recipients: [...recipients.values()].map((r) => r.email),
        },
      },
      tx,
    );
    const loaded = locked.kind === "load" ? await setMembersStatus({ memberIds: ids, from: ["draft", "submitted"], to: "loaded" }, tx) : [];

    await recordAudit(
      {
        organisationId: user.organisationId,
        siteId: locked.siteId,
        actorId: user.id,
        action: "permit.issued",
        entityType: "permit",
        entityId: locked.id,
        before: { status: "requested" },
        after: { status: "issued", number: label, validUntil, conditions: row.conditions, recipients: row.recipients, as: authority.as, delegationId: authority.delegationId ?? null },
      },
      tx,
    );
    for (const m of loaded) {
      const before = scope.find((s) => s.id === m.id)?.status;
      await recordAudit(
        { organisationId: user.organisationId, siteId: locked.siteId, actorId: user.id, action: "member.loaded", entityType: "member", entityId: m.id, before: { status: before }, after: { status: "loaded", permit: label } },
        tx,
      );
    }

    const zoneNames = zonesOf(scope);
    const mail = permitIssuedEmail({
      numberLabel: label,
      kindLabel: PERMIT_KIND_LABELS[locked.kind],
      siteName: site.name,
      scope: scopeWords(scope.length, zoneNames),
      zones: zoneNames.join(", ") || "—",
      validUntil: fmtDateTime(validUntil, site.timezone, units),
      issuedBy: user.name,
      conditions: row.conditions,
      url: permitUrl(locked.siteId, locked.id),
    });
    await enqueueEmails(
      [...recipients.values()].map((r) => ({
        siteId: locked.siteId,
        kind: "permit.issued",
        toEmail: r.email,
        toUserId: r.userId,
        ...mail,
        waitFor: `pdf:${locked.id}`,
        relatedType: "permit",
        relatedId: locked.id,
      })),
      tx,
    );
    return row;
  });

  // After commit: the PDF. If this fails, the worker's renderPendingPermitPdfs retries it and
  // the e-mails stay held until the PDF exists.
  let pdfReady = false;
  try {
    pdfReady = !!(await renderAndStorePermitPdf(issued.id));
  } catch (e) {
    console.error("[permits] PDF rendering failed after issue; the worker will retry", issued.id, e);
  }
  return { permit: issued, pdfReady };
}

/** The 409 for a permit someone else has already decided, saying who and when. */
async function alreadyDecided(permitId: string, tx: DbOrTx) {
  const v = await getPermitView({ permitId }, tx);
  if (!v) return new NotFoundError("That permit");
  const p = v.permit;
  const when = (d: Date | null) => fmtDateTime(d, v.siteTimezone, v.siteUnitSystem as UnitSystem);
  if (p.status === "issued" || p.status === "closed" || p.status === "expired")
    return new ConflictError(
      `This request has already been issued as ${permitNumberLabel(p.kind, p.number)} by ${v.approvedByName ?? "someone else"} at ${when(p.issuedAt)}; nothing was changed.`,
    );
  if (p.status === "refused") return new ConflictError(`This request was refused by ${v.closedByName ?? "someone else"} at ${when(p.closedAt)}; nothing was changed.`);
  return new ConflictError(`This permit is ${PERMIT_STATUS_LABELS[p.status].toLowerCase()}; nothing was changed.`);
}

async function scopeZoneIds(permitId: string) {
  const rows = await listPermitMembers({ permitId });
  return { rows, zoneIds: rows.map((r) => r.zoneId) };
}

async function requireDecider(user: SessionUser, permitId: string) {
  const loaded = await loadPermitForUser(user, permitId);
  const { rows, zoneIds } = await scopeZoneIds(loaded.permit.id);
  const authority = await issuingAuthority({ user, siteId: loaded.permit.siteId, roles: loaded.roles, zoneIds });
  if (!authority.ok) throw new ForbiddenError(authority.reason);
  return { ...loaded, scope: rows };
}

// ------------------------------------------------------------------- refuse
export async function refusePermit({ user, permitId, body }: { user: SessionUser; permitId: string; body: unknown }) {
  const { permit, site, scope } = await requireDecider(user, permitId);
  const { reason } = parse(permitReasonSchema, body);
  return db.transaction(async (tx) => {
    const locked = await getPermitForUpdate({ permitId: permit.id }, tx);
    if (!locked || locked.status !== "requested") throw await alreadyDecided(permit.id, tx);
    const now = new Date();
    const row = await updatePermit({ permitId: locked.id, values: { status: "refused", refusedReason: reason, closedAt: now, closedBy: user.id } }, tx);
    await recordAudit(
      { organisationId: user.organisationId, siteId: locked.siteId, actorId: user.id, action: "permit.refused", entityType: "permit", entityId: locked.id, before: { status: "requested" }, after: { status: "refused", reason } },
      tx,
    );
    const [requester] = await tx.select({ id: users.id, email: users.email }).from(users).where(eq(users.id, locked.requestedBy));
    if (requester) {
      const mail = permitRefusedEmail({
        kindLabel: PERMIT_KIND_LABELS[locked.kind],
        siteName: site.name,
        scope: scopeWords(scope.length, zonesOf(scope)),
        refusedBy: user.name,
        reason,
        url: permitUrl(locked.siteId, locked.id),
      });
      await enqueueEmails([{ siteId: locked.siteId, kind: "permit.refused", toEmail: requester.email, toUserId: requester.id, ...mail, relatedType: "permit", relatedId: locked.id }], tx);
    }
    return row;
  });
}

// ----------------------------------------------------------------- withdraw
export async function withdrawPermit({ user, permitId, body }: { user: SessionUser; permitId: string; body: unknown }) {
  const { permit, site, scope } = await requireDecider(user, permitId);
  const { reason } = parse(permitReasonSchema, body);
  return db.transaction(async (tx) => {
    const locked = await getPermitForUpdate({ permitId: permit.id }, tx);
    if (!locked) throw new NotFoundError("That permit");
    if (locked.status !== "issued") throw new ConflictError(`Only an issued permit can be withdrawn; this one is ${PERMIT_STATUS_LABELS[locked.status].toLowerCase()}.`);
    const label = permitNumberLabel(locked.kind, locked.number)!;
    const ids = scope.map((m) => m.id);
    await lockMembers({ memberIds: ids }, tx);
    const row = await updatePermit({ permitId: locked.id, values: { status: "withdrawn", withdrawnReason: reason, closedAt: new Date(), closedBy: user.id } }, tx);
    let released: { id: string; tag: string }[] = [];
    if (locked.kind === "load") {
      // A member leaves "loaded" unless another issued permit to load still covers it.
      const stillCovered = await membersCoveredByOtherIssued({ memberIds: ids, kind: "load", excludePermitId: locked.id }, tx);
      released = await setMembersStatus({ memberIds: ids.filter((id) => !stillCovered.has(id)), from: ["loaded"], to: "submitted" }, tx);
    }
    await recordAudit(
      { organisationId: user.organisationId, siteId: locked.siteId, actorId: user.id, action: "permit.withdrawn", entityType: "permit", entityId: locked.id, before: { status: "issued" }, after: { status: "withdrawn", reason } },
      tx,
    );
    for (const m of released)
      await recordAudit(
        { organisationId: user.organisationId, siteId: locked.siteId, actorId: user.id, action: "member.unloaded", entityType: "member", entityId: m.id, before: { status: "loaded" }, after: { status: "submitted", permit: label, reason: "permit withdrawn" } },
        tx,
      );
    const mail = permitWithdrawnEmail({
      numberLabel: label,
      kindLabel: PERMIT_KIND_LABELS[locked.kind],
      siteName: site.name,
      scope: scopeWords(scope.length, zonesOf(scope)),
      withdrawnBy: user.name,
      reason,
      url: permitUrl(locked.siteId, locked.id),
    });
    await enqueueEmails(
      locked.recipients.map((email) => ({ siteId: locked.siteId, kind: "permit.withdrawn", toEmail: email, ...mail, relatedType: "permit", relatedId: locked.id })),
      tx,
    );
    return row;
  });
}

// -------------------------------------------------------------------- close
export async function closePermit({ user, permitId }: { user: SessionUser; permitId: string }) {
  const { permit } = await requireDecider(user, permitId);
  return db.transaction(async (tx) => {
    const locked = await getPermitForUpdate({ permitId: permit.id }, tx);
    if (!locked) throw new NotFoundError("That permit");
    if (locked.status !== "issued") throw new ConflictError(`Only an issued permit can be closed; this one is ${PERMIT_STATUS_LABELS[locked.status].toLowerCase()}.`);
    const row = await updatePermit({ permitId: locked.id, values: { status: "closed", closedAt: new Date(), closedBy: user.id } }, tx);
    await recordAudit(
      { organisationId: user.organisationId, siteId: locked.siteId, actorId: user.id, action: "permit.closed", entityType: "permit", entityId: locked.id, before: { status: "issued" }, after: { status: "closed" } },
      tx,
    );
    return row;
  });
}

// ------------------------------------------------------------ confirm struck
export async function confirmStruck({ user, permitId }: { user: SessionUser; permitId: string }) {
  const { permit, roles } = await loadPermitForUser(user, permitId);
  if (!rolesAllowPure(roles, "confirmStriking")) throw new ForbiddenError("Only a temporary works supervisor or the coordinator confirms that striking is done.");
  if (permit.kind !== "strike") throw new ConflictError("Only a permit to strike is confirmed as struck.");
  return db.transaction(async (tx) => {
    const locked = await getPermitForUpdate({ permitId: permit.id }, tx);
    if (!locked) throw new NotFoundError("That permit");
    if (locked.status !== "issued") throw new ConflictError(`Striking can be confirmed only while the permit is issued; this one is ${PERMIT_STATUS_LABELS[locked.status].toLowerCase()}.`);
    const ids = (await tx.select({ id: permitMembers.memberId }).from(permitMembers).where(and(eq(permitMembers.permitId, locked.id), isNull(permitMembers.removedAt)))).map((r) => r.id);
    await lockMembers({ memberIds: ids }, tx);
    const now = new Date();
    const label = permitNumberLabel("strike", locked.number)!;
    const row = await updatePermit({ permitId: locked.id, values: { struckConfirmedAt: now, struckConfirmedBy: user.id, status: "closed", closedAt: now, closedBy: user.id } }, tx);
    const struck = await setMembersStatus({ memberIds: ids, from: ["draft", "submitted", "loaded", "out_of_service"], to: "struck" }, tx);
    await recordAudit(
      { organisationId: user.organisationId, siteId: locked.siteId, actorId: user.id, action: "permit.struck_confirmed", entityType: "permit", entityId: locked.id, before: { status: "issued" }, after: { status: "closed", struckConfirmedAt: now, members: struck.map((m) => m.tag) } },
      tx,
    );
    for (const m of struck)
      await recordAudit(
        { organisationId: user.organisationId, siteId: locked.siteId, actorId: user.id, action: "member.struck", entityType: "member", entityId: m.id, after: { status: "struck", permit: label } },
        tx,
      );
    return row;
  });
}

// --------------------------------------------------------------- delegation
export async function delegateIssuing({ user, siteId, body, now = new Date() }: { user: SessionUser; siteId: string; body: unknown; now?: Date }) {
  await assertSitePermission(user, siteId, "delegatePermits");
  const input = parse(delegationSchema, body);
  const validUntil = new Date(input.validUntil);
  const fields: Record<string, string> = {};
  if (validUntil.getTime() <= now.getTime()) fields.validUntil = "The scope must run until a time in the future.";
  else if (validUntil.getTime() > now.getTime() + MAX_DELEGATION_DAYS * DAY) fields.validUntil = `Give issuing scope for at most ${MAX_DELEGATION_DAYS} days at a time.`;
  const supervisors = await listSiteRoleEmails({ siteId, role: "supervisor" });
  if (!supervisors.some((s) => s.userId === input.userId)) fields.userId = "Issuing scope can be given only to a temporary works supervisor on this site.";
  const zoneIds = [...new Set(input.zoneIds)];
  const siteZones = await db.select({ id: zones.id }).from(zones).where(and(eq(zones.siteId, siteId), inArray(zones.id, zoneIds)));
  if (siteZones.length !== zoneIds.length) fields.zoneIds = "Choose zones on this site.";
  if (Object.keys(fields).length) throw new ValidationError(fields);
  return db.transaction(async (tx) => {
    const row = await insertDelegation({ siteId, userId: input.userId, zoneIds, validUntil, grantedBy: user.id }, tx);
    await recordAudit(
      { organisationId: user.organisationId, siteId, actorId: user.id, action: "permit_delegation.granted", entityType: "permit_delegation", entityId: row.id, after: { userId: input.userId, zoneIds, validUntil } },
      tx,
    );
    return row;
  });
}

export async function revokeIssuing({ user, delegationId }: { user: SessionUser; delegationId: string }) {
  if (!isUuid(delegationId)) throw new NotFoundError("That issuing scope");
  const d = await getDelegationForUser({ delegationId, organisationId: user.organisationId });
  if (!d) throw new NotFoundError("That issuing scope");
  await assertSitePermission(user, d.siteId, "delegatePermits");
  return db.transaction(async (tx) => {
    const row = await revokeDelegation({ delegationId: d.id, at: new Date() }, tx);
    if (!row) throw new ConflictError("This issuing scope was already revoked.");
    await recordAudit(
      { organisationId: user.organisationId, siteId: d.siteId, actorId: user.id, action: "permit_delegation.revoked", entityType: "permit_delegation", entityId: d.id, before: { revokedAt: null }, after: { revokedAt: row.revokedAt } },
      tx,
    );
    return row;
  });
}

// -------------------------------------------------------------------- views
/** Everything the permit page and GET /permits/{id} show, including what the user may do. */
export async function permitDetail(user: SessionUser, permitId: string, now = new Date()) {
  const { permit, site, roles } = await loadPermitForUser(user, permitId);
  const view = (await getPermitView({ permitId: permit.id })) as PermitView;
  const scope = await listPermitMembers({ permitId: permit.id });
  const units = site.unitSystem as UnitSystem;
  const evaluation = evaluatePermit({
    kind: permit.kind,
    members: scope,
    schemes: await schemeFacts(scope.map((m) => m.schemeId), db),
    evidence: permit.evidence,
    now,
    units,
    timeZone: site.timezone,
  });
  const authority = await issuingAuthority({ user, siteId: permit.siteId, roles, zoneIds: scope.map((m) => m.zoneId), now });
  const emails = await listEmailsFor({ relatedType: "permit", relatedId: permit.id });
  const s = permit.status;
  return {
    permit: view.permit,
    view,
    numberLabel: permitNumberLabel(permit.kind, permit.number),
    site,
    units,
    scope,
    evaluation,
    emails,
    pdfUrl: permit.pdfKey ? `/api/v1/permits/${permit.id}/pdf` : null,
    authority,
    may: {
      issue: s === "requested" && authority.ok,
      refuse: s === "requested" && authority.ok,
      withdraw: s === "issued" && authority.ok,
      close: s === "issued" && authority.ok,
      confirmStruck: s === "issued" && permit.kind === "strike" && rolesAllowPure(roles, "confirmStriking"),
    },
  };
}
export type PermitDetail = Awaited<ReturnType<typeof permitDetail>>;

/** The API shape of one permit: stable field names, numbers in SI (N, mm). */
export function permitJson(d: PermitDetail) {
  const p = d.permit;
  return {
    id: p.id,
    siteId: p.siteId,
    kind: p.kind,
    number: p.number,
    numberLabel: d.numberLabel,
    status: p.status,
    scheme: d.view.schemeReference ? { id: p.schemeId, reference: d.view.schemeReference, category: d.view.schemeCategory, hasCertificate: !!d.view.schemeCertificateKey } : null,
    zone: d.view.zoneName ? { id: p.zoneId, name: d.view.zoneName } : null,
    requestedBy: d.view.requestedByName,
    requestedAt: p.requestedAt,
    requestNote: p.requestNote,
    evidence: p.evidence,
    approvedBy: d.view.approvedByName,
    issuedAt: p.issuedAt,
    validUntil: p.validUntil,
    conditions: p.conditions,
    recipients: p.recipients,
    refusedReason: p.refusedReason,
    withdrawnReason: p.withdrawnReason,
    closedAt: p.closedAt,
    closedBy: d.view.closedByName,
    struckConfirmedAt: p.struckConfirmedAt,
    struckConfirmedBy: d.view.struckConfirmedByName,
    pdfUrl: d.pdfUrl,
    members: d.scope.map((m) => ({
      id: m.id,
      tag: m.tag,
      status: m.status,
      zone: m.zoneName,
      type: m.memberTypeName,
      extensionMm: m.extensionMm,
      loadN: m.loadN,
      capacityN: m.capacityN,
      utilisation: m.utilisation,
      checkPass: m.checkPass,
      photos: m.readyPhotos,
      latestInspection: m.latestInspection,
    })),
    preconditions: { canIssue: d.evaluation.canIssue, reasons: d.evaluation.reasons, permit: d.evaluation.permit, members: d.evaluation.members },
    emails: d.emails.map((e) => ({
      to: e.toEmail,
      kind: e.kind,
      status: e.waiting ? "waiting for the PDF" : e.status,
      attempts: e.attempts,
      lastError: e.lastError,
      sentAt: e.sentAt,
    })),
    may: d.may,
  };
}
