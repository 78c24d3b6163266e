// The alert scans. Each takes `now` (tests move the clock instead of waiting) and optionally
// the sites to look at; each is safe to run from several workers at once: an alert fires once
// because of its unique key, and a permit expires once because only one update finds it issued.
import "server-only";
import { transaction } from "@/db";
import { findFailingEmails, findUnalertedOverloads } from "@/db/queries/alerts";
import { recordAudit } from "@/db/queries/audit";
import { listInspectionRound } from "@/db/queries/inspections";
import { expireIssuedPermit, listIssuedPermitsForExpiry, unloadMembersOfExpiredPermit } from "@/db/queries/permits";
import { DUE_SOON_MS, inspectionState } from "@/lib/inspections/due";
import { formatDateTime, formatHours } from "@/lib/format-date";
import { formatKn, formatPercent, permitLabel } from "./format";
import { raiseAlerts, type AlertCandidate } from "./raise";

export type ScanScope = { now?: Date; siteIds?: string[] | null };

const cap = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

/** The overload alert for a member whose latest check fails (one per check: the check is the threshold). */
export function overloadCandidate(
  m: { siteId: string; memberId: string; tag: string; checkId: string; utilisation: number | null; capacityN: number | null; loadN: number; extensionMm: number },
  now: Date,
): AlertCandidate {
  return {
    siteId: m.siteId,
    kind: "member_overloaded",
    subjectType: "member",
    subjectId: m.memberId,
    threshold: m.checkId,
    title: `${m.tag} is overloaded: utilisation ${formatPercent(m.utilisation)}`,
    body:
      m.capacityN == null
        ? `${m.tag} can no longer be checked at its extension of ${Math.round(m.extensionMm)} mm (outside its type's range or table). Treat it as failing: do not load it until it is corrected and re-checked.`
        : `${m.tag} carries ${formatKn(m.loadN)} at an extension of ${Math.round(m.extensionMm)} mm, against a capacity of ${formatKn(m.capacityN)} (utilisation ${formatPercent(m.utilisation)}). Do not load it further; the temporary works coordinator should review it now.`,
    link: `/sites/${m.siteId}/members/${m.memberId}`,
    createdAt: now,
  };
}

/** Members whose latest check fails: alert once per check (a new failing check alerts again). */
export async function sweepOverloads({ now = new Date(), siteIds = null }: ScanScope = {}) {
  const rows = await findUnalertedOverloads({ siteIds });
  if (rows.length === 0) return 0;
  const candidates = rows.map((m) => overloadCandidate({ ...m, checkId: m.checkId! }, now));
  const r = await transaction((tx) => raiseAlerts(candidates, tx));
  return r.raised.length;
}

/** Permits about to expire (the site's warning time before) and permits that have expired. */
export async function scanPermitExpiry({ now = new Date(), siteIds = null }: ScanScope = {}) {
  const permits = await listIssuedPermitsForExpiry({ siteIds });
  let raised = 0;
  for (const p of permits) {
    const until = p.validUntil!;
    const label = permitLabel(p);
    const link = `/sites/${p.siteId}/permits/${p.id}`;
    if (until <= now) {
      raised += await transaction(async (tx) => {
        const won = await expireIssuedPermit({ permitId: p.id, now }, tx);
        if (!won) return 0; // another worker expired it
        const unloaded = await unloadMembersOfExpiredPermit({ permitId: p.id, now }, tx);
        const audit = { organisationId: p.organisationId, siteId: p.siteId, actorId: null };
        await recordAudit({ ...audit, action: "permit.expired", entityType: "permit", entityId: p.id, before: { status: "issued" }, after: { status: "expired", validUntil: until.toISOString(), unloadedMembers: unloaded.map((m) => m.tag) } }, tx);
        for (const m of unloaded)
          await recordAudit({ ...audit, action: "member.status_changed", entityType: "member", entityId: m.id, before: { status: "loaded" }, after: { status: "submitted", reason: `${label} expired` } }, tx);
        const r = await raiseAlerts(
          [
            {
              siteId: p.siteId,
              kind: "permit_expired",
              subjectType: "permit",
              subjectId: p.id,
              threshold: `expired:${until.toISOString()}`,
              title: `${cap(label)} has expired`,
              body:
                `${cap(label)} on ${p.siteName} expired at ${formatDateTime(until, p.siteTimezone)}. ` +
                (unloaded.length
                  ? `${unloaded.length} member${unloaded.length === 1 ? " is" : "s are"} no longer covered by a permit to load (${unloaded.slice(0, 20).map((m) => m.tag).join(", ")}${unloaded.length > 20 ? "…" : ""}). `
                  : "") +
                "Issue a new permit before any further loading.",
              link,
              createdAt: now,
            },
          ],
          tx,
        );
        return r.raised.length;
      });
    } else if (until.getTime() - p.expiryWarningHours * 3600_000 <= now.getTime()) {
      const r = await transaction((tx) =>
        raiseAlerts(
          [
            {
              siteId: p.siteId,
              kind: "permit_expiring",
              subjectType: "permit",
              subjectId: p.id,
              threshold: `expiring:${until.toISOString()}`,
              title: `${cap(label)} expires ${formatDateTime(until, p.siteTimezone)}`,
              body: `${cap(label)} on ${p.siteName} expires at ${formatDateTime(until, p.siteTimezone)} (within ${formatHours(p.expiryWarningHours)}). Renew it or plan to unload before then.`,
              link,
              createdAt: now,
            },
          ],
          tx,
        ),
      );
      raised += r.raised.length;
    }
  }
  return raised;
}

/** Inspections due within 24 h, and inspections overdue or made due now by a coordinator's trigger. */
export async function scanInspections({ now = new Date(), siteIds = null }: ScanScope = {}) {
  const rows = await listInspectionRound({ siteIds, statuses: ["submitted", "loaded"] });
  const candidates: AlertCandidate[] = [];
  for (const r of rows) {
    const s = inspectionState(r, now, r.inspectionIntervalDays);
    // Members never inspected wait for their first inspection (a permit cannot be issued without it).
    if (!s.dueAt || (s.state !== "overdue" && s.state !== "due_now" && s.state !== "due_soon")) continue;
    const base = { siteId: r.siteId, subjectType: "member", subjectId: r.memberId, threshold: `due:${s.dueAt.toISOString()}`, link: `/sites/${r.siteId}/members/${r.memberId}/inspect`, createdAt: now };
    if (s.state === "due_soon" && s.dueAt.getTime() - now.getTime() <= DUE_SOON_MS)
      candidates.push({ ...base, kind: "inspection_due_soon", title: `${r.tag}: inspection due ${formatDateTime(s.dueAt, r.siteTimezone)}`, body: `${r.tag}${r.zoneName ? ` (${r.zoneName})` : ""} was last inspected ${formatDateTime(r.lastInspectedAt!, r.siteTimezone)}; its next inspection is due ${formatDateTime(s.dueAt, r.siteTimezone)}.` });
    else if (s.state === "due_now")
      candidates.push({ ...base, kind: "inspection_overdue", title: `${r.tag}: inspection due now — ${r.triggerReason}`, body: `The coordinator asked for inspections${r.zoneName ? ` in ${r.zoneName}` : ""} after: ${r.triggerReason} (${formatDateTime(r.triggeredAt!, r.siteTimezone)}). ${r.tag} has not been inspected since.` });
    else if (s.state === "overdue")
      candidates.push({ ...base, kind: "inspection_overdue", title: `${r.tag}: inspection overdue since ${formatDateTime(s.dueAt, r.siteTimezone)}`, body: `${r.tag}${r.zoneName ? ` (${r.zoneName})` : ""} was last inspected ${formatDateTime(r.lastInspectedAt!, r.siteTimezone)} and was due again ${formatDateTime(s.dueAt, r.siteTimezone)}. Inspect it before it carries more load.` });
  }
  if (candidates.length === 0) return 0;
  let raised = 0;
  // One transaction per site keeps each site's e-mail grouping together and the transactions short.
  for (const siteId of new Set(candidates.map((c) => c.siteId))) {
    const r = await transaction((tx) => raiseAlerts(candidates.filter((c) => c.siteId === siteId), tx));
    raised += r.raised.length;
  }
  return raised;
}

/** E-mails that keep failing: the coordinator and admin hear once per message. */
export const FAILING_AFTER_ATTEMPTS = 3;
export async function scanFailingEmails({ now = new Date(), siteIds = null }: ScanScope = {}) {
  const rows = await findFailingEmails({ siteIds, minAttempts: FAILING_AFTER_ATTEMPTS });
  if (rows.length === 0) return 0;
  const candidates: AlertCandidate[] = rows.map((m) => ({
    siteId: m.siteId!,
    kind: "email_failing",
    subjectType: "email",
    subjectId: m.id,
    threshold: "failing",
    title: `E-mail to ${m.toEmail} is not being delivered`,
    body: `"${m.subject}" to ${m.toEmail} has failed ${m.attempts} time${m.attempts === 1 ? "" : "s"}${m.status === "failed" ? " and will not be retried" : " and is still being retried"}. Last error: ${m.lastError ?? "unknown"}. Tell the person another way if it matters now.`,
    link: null,
    createdAt: now,
  }));
  const r = await transaction((tx) => raiseAlerts(candidates, tx));
  return r.raised.length;
}

/** Everything the worker runs on a schedule (the overload sweep also runs on its own, more often). */
export async function runAlertScans(scope: ScanScope = {}) {
  const now = scope.now ?? new Date();
  const s = { ...scope, now };
  return {
    overloads: await sweepOverloads(s),
    permits: await scanPermitExpiry(s),
    inspections: await scanInspections(s),
    emails: await scanFailingEmails(s),
  };
}
