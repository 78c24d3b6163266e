import type { Metadata } from "next";
import Link from "next/link";
import { Forbidden } from "@/components/forbidden";
import { Icon } from "@/components/icons";
import { PrintButton } from "@/components/print-button";
import { ButtonLink } from "@/components/ui/button";
import { listInspectionRound, listRecentTriggers, listRoundFilters } from "@/db/queries/inspections";
import { formatDateTime } from "@/lib/format-date";
import { loadSitePage } from "@/lib/auth/site-page";
import { isUuid } from "@/lib/authz";
import { INSPECTION_STATE_LABELS, INSPECTION_STATE_ORDER, NEEDS_DOING, orderRound, type InspectionState } from "@/lib/inspections/due";
import { MEMBER_STATUS_LABELS } from "@/lib/labels";
import { InspectionStateBadge } from "./state-badge";
import { TriggerForm } from "./trigger-form";

export const metadata: Metadata = { title: "Inspections" };

export default async function InspectionRoundPage({
  params, searchParams,
}: { params: Promise<{ siteId: string }>; searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const { siteId } = await params;
  const q = await searchParams;
  const { site, may } = await loadSitePage(siteId);
  if (!may("inspect")) return <Forbidden what="Inspections are recorded by site engineers, supervisors and coordinators." />;
  const zoneId = typeof q.zone === "string" && isUuid(q.zone) ? q.zone : null;
  const schemeId = typeof q.scheme === "string" && isUuid(q.scheme) ? q.scheme : null;
  const showAll = q.show === "all";
  const [rows, filters, triggers] = await Promise.all([
    listInspectionRound({ siteIds: [site.id], statuses: ["submitted", "loaded", "out_of_service"], zoneId, schemeId }),
    listRoundFilters({ siteId: site.id }),
    listRecentTriggers({ siteId: site.id }),
  ]);
  const now = new Date();
  const tz = site.timezone;
  const withState = orderRound(rows, now);
  const counts = Object.fromEntries(INSPECTION_STATE_ORDER.map((s) => [s, withState.filter((r) => r.due.state === s).length])) as Record<InspectionState, number>;
  const shown = showAll ? withState : withState.filter((r) => NEEDS_DOING.includes(r.due.state));
  function qs(extra: Record<string, string | null>) {
    const p = new URLSearchParams();
    const all = { zone: zoneId, scheme: schemeId, show: showAll ? "all" : null, ...extra };
    for (const [k, v] of Object.entries(all)) if (v) p.set(k, v);
    const s = p.toString();
    return s ? `?${s}` : "";
  }
  // Carried to each member's checklist, so "next due" after saving stays in the same zone and scheme.
  const roundQs = qs({ show: null });
  const completed = typeof q.complete === "string" ? q.complete.slice(0, 40) : null;
  const toDo = withState.filter((r) => NEEDS_DOING.includes(r.due.state)).length;

  return (
    <div className="flex flex-col gap-4">
      <div>
        <div className="flex flex-wrap items-center justify-between gap-2">
          <h1 className="text-2xl font-bold">Inspection round</h1>
          <PrintButton label="Print the round" />
        </div>
        <p className="text-ink-soft">
          Every member is inspected at least every {site.inspectionIntervalDays} days, and again after any incident or adverse weather. Plumb tolerance on this site:{" "}
          {site.plumbToleranceMm} mm.
        </p>
      </div>

      {completed ? (
        <p role="status" className="flex items-center gap-2 rounded-lg border-2 border-ok bg-ok-soft p-3 font-semibold print:hidden">
          <Icon name="ok" /> Recorded {completed} — round complete{toDo ? `, apart from ${toDo} listed below` : ": nothing else here is due"}.
        </p>
      ) : null}

      <form method="get" className="print:hidden grid gap-2 rounded-xl border-2 border-ink/15 bg-paper-raised p-3 sm:grid-cols-[1fr_1fr_auto]" aria-label="Filter the round">
        <label className="flex min-w-0 flex-col gap-1 text-sm font-semibold">
          Zone
          <select name="zone" defaultValue={zoneId ?? ""} className="min-h-touch w-full min-w-0 rounded-lg border-2 border-ink/40 bg-paper-raised px-2 text-base font-normal">
            <option value="">All zones</option>
            {filters.zones.map((z) => (
              <option key={z.id} value={z.id}>
                {z.name}
              </option>
            ))}
          </select>
        </label>
        <label className="flex min-w-0 flex-col gap-1 text-sm font-semibold">
          Scheme
          <select name="scheme" defaultValue={schemeId ?? ""} className="min-h-touch w-full min-w-0 rounded-lg border-2 border-ink/40 bg-paper-raised px-2 text-base font-normal">
            <option value="">All schemes</option>
            {filters.schemes.map((s) => (
              <option key={s.id} value={s.id}>
                {s.reference} — {s.title}
              </option>
            ))}
          </select>
        </label>
        {showAll ? <input type="hidden" name="show" value="all" /> : null}
        <button type="submit" className="min-h-touch self-end rounded-lg border-2 border-ink/70 px-4 font-semibold hover:bg-paper-sunk">
          Show
        </button>
      </form>

      <ul className="flex flex-wrap gap-2" aria-label="Members by inspection state">
        {INSPECTION_STATE_ORDER.map((s) => (
          <li key={s} className="flex items-center gap-2 rounded-lg bg-paper-sunk px-2 py-1" data-testid={`round-count-${s}`}>
            <InspectionStateBadge state={s} /> <span className="tabular font-bold">{counts[s]}</span>
          </li>
        ))}
      </ul>

      <section aria-labelledby="round-h" className="flex flex-col gap-2">
        <div className="flex flex-wrap items-center justify-between gap-2">
          <h2 id="round-h" className="text-lg font-bold">
            {showAll ? `All members (${shown.length})` : `To inspect (${shown.length})`}
          </h2>
          <Link href={`/sites/${site.id}/inspections${qs({ show: showAll ? null : "all" })}`} className="flex min-h-touch items-center text-brand underline print:hidden">
            {showAll ? "Show only what needs inspecting" : `Show all, including ${counts.in_date} in date`}
          </Link>
        </div>
        {shown.length === 0 ? (
          <p className="flex items-center gap-2 rounded-lg bg-ok-soft p-3 font-semibold text-ok">
            <Icon name="ok" /> Nothing is due: every member here is in date.
          </p>
        ) : (
          <ul className="flex flex-col gap-2">
            {shown.map((r) => (
              <li key={r.memberId} className="flex flex-wrap items-center gap-3 rounded-xl border-2 border-ink/15 bg-paper-raised p-3 print:flex-nowrap print:break-inside-avoid print:rounded-none print:border-0 print:border-b print:p-1" data-testid="round-item" data-tag={r.tag}>
                <div className="min-w-0 flex-1">
                  <p className="flex flex-wrap items-center gap-2">
                    <span className="text-lg font-bold">{r.tag}</span>
                    <InspectionStateBadge state={r.due.state} />
                  </p>
                  <p className="text-sm text-ink-soft">
                    {[r.zoneName, r.schemeReference, MEMBER_STATUS_LABELS[r.status]].filter(Boolean).join(" · ")}
                  </p>
                  <p className="text-sm">
                    {r.due.state === "never"
                      ? "No inspection recorded yet."
                      : r.due.state === "failed"
                        ? `Failed ${formatDateTime(r.lastInspectedAt!, tz)}; out of service until it passes.`
                        : r.due.cause === "trigger" && r.due.state === "due_now"
                          ? `Due now — after: ${r.triggerReason}`
                          : `${r.due.state === "overdue" ? "Was due" : "Due"} ${formatDateTime(r.due.dueAt!, tz)} · last passed ${formatDateTime(r.lastInspectedAt!, tz)}`}
                  </p>
                </div>
                <ButtonLink href={`/sites/${site.id}/members/${r.memberId}/inspect${roundQs}`} variant={NEEDS_DOING.includes(r.due.state) ? "primary" : "secondary"} aria-label={`Inspect ${r.tag}`} className="print:hidden">
                  <Icon name="inspect" className="h-5 w-5" /> Inspect
                </ButtonLink>
                {/* On paper: room to tick the member off on the round. */}
                <span aria-hidden className="hidden shrink-0 text-sm print:inline">
                  Satisfactory ☐ &nbsp; Failed ☐ &nbsp; Initials ________
                </span>
              </li>
            ))}
          </ul>
        )}
      </section>

      {may("triggerInspections") ? (
        <section aria-labelledby="trigger-h" className="print:hidden flex flex-col gap-2 rounded-xl border-2 border-warn/60 bg-warn-soft p-3">
          <h2 id="trigger-h" className="text-lg font-bold">
            After an incident or adverse weather
          </h2>
          <p className="text-sm">Makes every member in the zone (or the whole site) due for inspection now. The site manager and coordinators are alerted.</p>
          <TriggerForm siteId={site.id} zones={filters.zones} />
        </section>
      ) : null}

      {triggers.length ? (
        <section aria-labelledby="triggers-h">
          <h2 id="triggers-h" className="mb-1 font-bold">
            Recent requests to inspect now
          </h2>
          <ul className="text-sm">
            {triggers.map((t) => (
              <li key={t.id}>
                {formatDateTime(t.triggeredAt, tz)} — {t.zoneName ?? "whole site"}: {t.reason} ({t.triggeredByName ?? "unknown"})
              </li>
            ))}
          </ul>
        </section>
      ) : null}
      <p className="sr-only">States: {Object.values(INSPECTION_STATE_LABELS).join(", ")}</p>
    </div>
  );
}
