// Issuing: one transaction (permit row, members and the site's counter locked; preconditions
// checked again under the locks; members loaded; audit; e-mails queued and held for the PDF),
// then the PDF rendered from the permit's record, which is also what the caller shows.
import "server-only";
import { listSiteRoleEmails } from "@/db/queries/memberships";
import { getPermitRequester, listPermitMemberIds, listPermitMembers, listSchemeFacts, lockMembers, nextPermitNumber, setMembersStatus } from "@/db/queries/permits";
import type { NewEmail } from "@/db/queries/outbox";
import type { SessionUser } from "@/db/queries/users";
import type { Permit, SiteRole } from "@/db/schema";
import { permitIssuedEmail } from "@/emails/permit-issued";
import { permitIssuedUnderScopeEmail } from "@/emails/permit-issued-under-scope";
import type { Site } from "@/lib/api/resources";
import { ValidationError } from "@/lib/errors";
import { MAX_VALIDITY_DAYS, PERMIT_KIND_LABELS, permitNumberLabel, type PermitIssueInput } from "@/lib/validations/permit";
import { authorityFor } from "./authority";
import { detailFor, permitRecord } from "./detail";
import { alreadyDecided, PreconditionError } from "./errors";
import { fmtValidUntil, type UnitSystem } from "./format";
import { renderAndStorePermitPdf } from "./pdf";
import { evaluatePermit } from "./preconditions";
import { transitionPermit } from "./transition";
import { permitUrl } from "./urls";
import { DAY, HOUR, requestReference, scopeWords, zonesOf } from "./words";

type Ctx = { req: Request; user: SessionUser; site: Site; roles: SiteRole[]; resource: Permit; input: PermitIssueInput };

export async function issuePermit(ctx: Ctx, nowArg?: Date) {
  const { user, site, input } = ctx;
  const authority = await authorityFor(ctx);
  const as = authority.ok ? authority.as : "coordinator";
  const now = nowArg ?? new Date();
  const validUntil = input.validUntil ? new Date(input.validUntil) : new Date(now.getTime() + site.permitValidityHours * HOUR);
  if (validUntil.getTime() <= now.getTime()) throw new ValidationError({ validUntil: "The permit must be valid until a time in the future." });
  if (validUntil.getTime() > now.getTime() + MAX_VALIDITY_DAYS * DAY)
    throw new ValidationError({ validUntil: `A permit may be valid for at most ${MAX_VALIDITY_DAYS} days; issue a new one for longer work.` });
  const units = site.unitSystem as UnitSystem;

  await transitionPermit({
    permitId: ctx.resource.id,
    actor: { organisationId: user.organisationId, userId: user.id },
    from: ["requested"],
    refuse: (locked, tx) => alreadyDecided(locked.id, tx),
    plan: async (locked, tx) => {
      const ids = await listPermitMemberIds({ permitId: locked.id }, tx);
      await lockMembers({ memberIds: ids }, tx);
      const scope = await listPermitMembers({ permitId: locked.id }, tx);
      const evaluation = evaluatePermit({
        kind: locked.kind,
        members: scope,
        schemes: await listSchemeFacts({ schemeIds: scope.map((m) => m.schemeId) }, tx),
        evidence: locked.evidence,
        now,
        units,
        timeZone: site.timezone,
      });
      if (!evaluation.canIssue) throw new PreconditionError(evaluation);

      const number = await nextPermitNumber({ siteId: locked.siteId }, tx);
      const label = permitNumberLabel(locked.kind, number)!;
      const requester = await getPermitRequester({ userId: locked.requestedBy }, tx);
      const supervisors = await listSiteRoleEmails({ siteId: locked.siteId, role: "supervisor" }, tx);
      const recipients = new Map<string, { userId: string; email: string }>();
      for (const r of [...supervisors, ...(requester ? [{ userId: requester.id, email: requester.email }] : [])])
        recipients.set(r.email.toLowerCase(), { userId: r.userId, email: r.email });
      const loaded = locked.kind === "load" ? await setMembersStatus({ memberIds: ids, from: ["draft", "submitted"], to: "loaded" }, tx) : [];

      const conditions = input.conditions || null;
      const zoneNames = zonesOf(scope);
      const facts = {
        numberLabel: label,
        request: requestReference({ requestNumber: locked.requestNumber, requestedByName: requester?.name, requestedAt: locked.requestedAt }, site.timezone),
        kindLabel: PERMIT_KIND_LABELS[locked.kind],
        siteName: site.name,
        scope: scopeWords(scope.length, zoneNames),
        zones: zoneNames.join(", ") || "—",
        validUntil: fmtValidUntil(now, validUntil, site.timezone),
        issuedBy: user.name,
        conditions,
        url: permitUrl(locked.siteId, locked.id),
      };
      const mail = permitIssuedEmail(facts);
      const emails: NewEmail[] = [...recipients.values()].map((r) => ({
        siteId: locked.siteId,
        kind: "permit.issued",
        toEmail: r.email,
        toUserId: r.userId,
        ...mail,
        waitFor: `pdf:${locked.id}`,
        relatedType: "permit",
        relatedId: locked.id,
      }));
      if (as === "delegated supervisor") {
        // The coordinator hears at once, not when the PDF is ready: nothing waits on it.
        const notice = permitIssuedUnderScopeEmail({ ...facts, requestedBy: requester?.name ?? "—" });
        const coordinators = await listSiteRoleEmails({ siteId: locked.siteId, role: "coordinator" }, tx);
        for (const c of coordinators)
          emails.push({ siteId: locked.siteId, kind: "permit.issued_under_scope", toEmail: c.email, toUserId: c.userId, ...notice, relatedType: "permit", relatedId: locked.id });
      }
      return {
        values: { status: "issued", number, approvedBy: user.id, issuedAt: now, validUntil, conditions, recipients: [...recipients.values()].map((r) => r.email) },
        audit: {
          action: "permit.issued",
          before: { status: "requested" },
          after: { status: "issued", number: label, validUntil, conditions, recipients: [...recipients.values()].map((r) => r.email), as, delegationId: authority.ok ? (authority.delegationId ?? null) : null },
        },
        also: loaded.map((m) => ({
          action: "member.loaded",
          entityType: "member",
          entityId: m.id,
          before: { status: scope.find((s) => s.id === m.id)?.status },
          after: { status: "loaded", permit: label },
        })),
        emails,
      };
    },
  });

  // After commit: the record once, the PDF from it. If rendering fails, the worker's
  // renderPendingPermitPdfs retries it and the e-mails stay held until the PDF exists.
  const record = (await permitRecord(ctx.resource.id, now))!;
  let pdfReady = false;
  try {
    const key = await renderAndStorePermitPdf(record.permit.id, record);
    if (key) {
      pdfReady = true;
      record.permit = { ...record.permit, pdfKey: key };
      record.pdfUrl = `/api/v1/permits/${record.permit.id}/pdf`;
      record.emails = record.emails.map((e) => ({ ...e, waiting: false }));
    }
  } catch (e) {
    console.error("[permits] PDF rendering failed after issue; the worker will retry", record.permit.id, e);
  }
  return { detail: await detailFor(ctx, record, now), pdfReady };
}
