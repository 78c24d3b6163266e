// One detail view model per permit: the page, GET /api/v1/permits/{id} and the PDF all read it.
// `permitRecord` is what anyone may see (the worker renders the PDF from it); `permitDetail`
// adds what the signed-in person may do.
import "server-only";
import { listEmailsFor } from "@/db/queries/outbox";
import { getPermitView, listPermitMembers, listSchemeFacts } from "@/db/queries/permits";
import type { SessionUser } from "@/db/queries/users";
import type { Permit, SiteRole } from "@/db/schema";
import { rolesAllowPure } from "@/lib/permissions";
import { permitNumberLabel } from "@/lib/validations/permit";
import { issuingAuthority, ownRequestReason } from "./authority";
import type { UnitSystem } from "./format";
import { evaluatePermit } from "./preconditions";
import { requestReference } from "./words";

/** Everything recorded about a permit, evaluated against the preconditions at `now`. Null: no such permit. */
export async function permitRecord(permitId: string, now = new Date()) {
  const view = await getPermitView({ permitId });
  if (!view) return null;
  const permit = view.permit;
  const scope = await listPermitMembers({ permitId });
  const units = view.siteUnitSystem as UnitSystem;
  const evaluation = evaluatePermit({
    kind: permit.kind,
    members: scope,
    schemes: await listSchemeFacts({ schemeIds: scope.map((m) => m.schemeId) }),
    evidence: permit.evidence,
    now,
    units,
    timeZone: view.siteTimezone,
  });
  const emails = await listEmailsFor({ relatedType: "permit", relatedId: permit.id });
  return {
    permit,
    view,
    numberLabel: permitNumberLabel(permit.kind, permit.number),
    units,
    timeZone: view.siteTimezone,
    scope,
    evaluation,
    emails,
    pdfUrl: permit.pdfKey ? `/api/v1/permits/${permit.id}/pdf` : null,
  };
}
export type PermitRecord = NonNullable<Awaited<ReturnType<typeof permitRecord>>>;

type Who = { user: SessionUser; roles: SiteRole[] };

/** The record with what this person may do on it. */
export async function detailFor({ user, roles }: Who, record: PermitRecord, now = new Date()) {
  const p = record.permit;
  const authority = await issuingAuthority({ user, siteId: p.siteId, roles, zoneIds: record.scope.map((m) => m.zoneId), now });
  const ownRequest = authority.ok ? ownRequestReason(user, p) : null;
  const s = p.status;
  return {
    ...record,
    authority,
    /** Why this decider may not issue (separation of duties), for the review page. */
    issueBlockedBy: ownRequest,
    may: {
      issue: s === "requested" && authority.ok && !ownRequest,
      refuse: s === "requested" && authority.ok,
      withdraw: s === "issued" && authority.ok,
      close: s === "issued" && authority.ok,
      confirmStruck: s === "issued" && p.kind === "strike" && rolesAllowPure(roles, "confirmStriking"),
      amendEvidence: s === "requested" && p.kind === "strike" && rolesAllowPure(roles, "requestPermit"),
    },
  };
}

/** The permit found by the route (the seam has already checked the person may see it). */
export async function permitDetail({ user, roles, resource }: Who & { resource: Pick<Permit, "id"> }, now = new Date()) {
  const record = (await permitRecord(resource.id, now))!;
  return detailFor({ user, roles }, record, now);
}
export type PermitDetail = Awaited<ReturnType<typeof detailFor>>;

/** The API shape of one permit: stable field names, numbers in SI (N, mm). */
export function permitJson(d: PermitDetail) {
  const p = d.permit;
  return {
    id: p.id,
    siteId: p.siteId,
    kind: p.kind,
    number: p.number,
    numberLabel: d.numberLabel,
    /** Who asked and when, in the site's time zone: the request's reference before (and after) it has a number. */
    requestReference: requestReference({ requestNumber: p.requestNumber, requestedByName: d.view.requestedByName, requestedAt: p.requestedAt }, d.timeZone),
    /** The request's number on its site (in `requestReference`: "Request 14 by …"). */
    requestNumber: p.requestNumber,
    status: p.status,
    scheme: d.view.schemeReference ? { id: p.schemeId, reference: d.view.schemeReference, category: d.view.schemeCategory, hasCertificate: !!d.view.schemeCertificateKey } : null,
    zone: d.view.zoneName ? { id: p.zoneId, name: d.view.zoneName } : null,
    requestedBy: d.view.requestedByName,
    requestedAt: p.requestedAt,
    requestNote: p.requestNote,
    evidence: p.evidence,
    evidenceHistory: p.evidenceHistory,
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
      zoneId: m.zoneId,
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
    issueBlockedBy: d.issueBlockedBy,
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
