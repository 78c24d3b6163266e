// One view of a member record, shared by the member page and GET /api/v1/members/{id}: the member,
// its checks and photos, its inspections and permits, the state it is in (said first, in words,
// with what to do next) and its history as sentences.
import "server-only";
import { listAuditForEntity } from "@/db/queries/audit";
import { listChecks } from "@/db/queries/checks";
import { listInspections } from "@/db/queries/inspections";
import { getNamesForIds, listPermitsOfMember } from "@/db/queries/member-history";
import type { MemberView } from "@/db/queries/members";
import { listPhotos } from "@/db/queries/photos";
import type { Step } from "@/lib/engineering";
import { checkLabel } from "@/lib/inspections/checklist";
import { photoView } from "@/lib/photos";
import { checkView } from "./members";
import { historySentences, idsInAudit, type HistoryEntry } from "./member-history-text";
import { memberState, type MemberState } from "./member-state";

export type { HistoryEntry, MemberState };

type SiteForDetail = { id: string; organisationId: string; timezone: string; unitSystem: "si" | "us" };

export async function memberDetail({ member, site }: { member: MemberView; site: SiteForDetail }) {
  const [checks, photoRows, inspectionRows, permitRows, audit] = await Promise.all([
    listChecks({ memberId: member.id }),
    listPhotos({ memberId: member.id }),
    listInspections({ memberId: member.id }),
    listPermitsOfMember({ memberId: member.id }),
    listAuditForEntity({ entityType: "member", entityId: member.id, organisationId: site.organisationId }),
  ]);
  const latestRow = checks.find((c) => c.id === member.latestCheckId) ?? checks[0];
  const inspections = inspectionRows.map((i) => ({
    id: i.id,
    result: i.result,
    inspectedAt: i.inspectedAt,
    nextDueAt: i.nextDueAt,
    inspectorName: i.inspectorName,
    notes: i.notes,
    failedItems: i.items.filter((it) => it.result === "fail").map((it) => `${checkLabel(it.check)}${it.note ? ` (${it.note})` : ""}`),
    photoIds: i.photoIds,
    /** The plumb reading, when one was taken: the angle used for the re-check, and the offset as read. */
    plumbDeg: i.plumbDeg,
    plumbOffsetMm: i.plumbOffsetMm,
    plumbOverMm: i.plumbOverMm,
  }));
  const permits = permitRows.map((p) => ({
    id: p.id,
    kind: p.kind,
    number: p.number,
    status: p.status,
    label: `Permit to ${p.kind}${p.number != null ? ` No. ${p.number}` : " (requested)"}`,
    requestedAt: p.requestedAt,
    requestedByName: p.requestedByName,
    issuedAt: p.issuedAt,
    approvedByName: p.approvedByName,
    validUntil: p.validUntil,
    closedAt: p.closedAt,
    /** Whether the permit still names this member (a failed inspection takes it off). */
    covers: p.removedAt == null,
    removedAt: p.removedAt,
    removedReason: p.removedReason,
  }));
  const ids = idsInAudit(audit);
  const names = await getNamesForIds({ organisationId: site.organisationId, siteId: site.id, ...ids });
  const history = historySentences(audit, { timeZone: site.timezone, unitSystem: site.unitSystem, names, inspections });
  return {
    member,
    check: latestRow ? checkView(latestRow) : null,
    checks: checks.map((c) => {
      const result = c.result as { steps?: Step[] };
      const inputs = c.inputs as { slabLoad?: { steps?: Step[] }; backpropLoad?: { steps?: Step[] } };
      const load = inputs.slabLoad ?? inputs.backpropLoad;
      return { ...checkView(c), reason: c.reason, createdByName: c.createdByName, steps: [...(load?.steps ?? []), ...(result.steps ?? [])] };
    }),
    photos: await Promise.all(photoRows.map((p) => photoView({ ...p, status: "ready", memberId: member.id, rejectReason: null }))),
    inspections,
    permits,
    state: memberState({ member, inspections, permits, history, timeZone: site.timezone }),
    history,
  };
}

export type MemberDetail = Awaited<ReturnType<typeof memberDetail>>;
