import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { CautionNotice } from "@/components/caution-notice";
import { Forbidden } from "@/components/forbidden";
import { Icon } from "@/components/icons";
import { getMemberForInspection, listInspectionRound, listInspections } from "@/db/queries/inspections";
import { formatDateTime } from "@/lib/format-date";
import { loadSitePage } from "@/lib/auth/site-page";
import { isUuid } from "@/lib/authz";
import { checkLabel } from "@/lib/inspections/checklist";
import { inspectionState, NEEDS_DOING, orderRound } from "@/lib/inspections/due";
import { MEMBER_STATUS_LABELS } from "@/lib/labels";
import { InspectionStateBadge, ResultBadge } from "../../../inspections/state-badge";
import { InspectForm } from "./inspect-form";

export const metadata: Metadata = { title: "Inspect member" };

export default async function InspectPage({
  params, searchParams,
}: { params: Promise<{ siteId: string; memberId: string }>; searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const { siteId, memberId } = await params;
  const q = await searchParams;
  const { site, may } = await loadSitePage(siteId);
  if (!isUuid(memberId)) notFound();
  const member = await getMemberForInspection({ memberId, siteId: site.id });
  if (!member) notFound();
  // The round this checklist was opened from (its zone and scheme filter), for "next due" after saving.
  const zoneId = typeof q.zone === "string" && isUuid(q.zone) ? q.zone : null;
  const schemeId = typeof q.scheme === "string" && isUuid(q.scheme) ? q.scheme : null;
  const roundParams = new URLSearchParams();
  if (zoneId) roundParams.set("zone", zoneId);
  if (schemeId) roundParams.set("scheme", schemeId);
  const roundQuery = roundParams.toString();
  const [history, [round], queue] = await Promise.all([
    listInspections({ memberId: member.id }),
    listInspectionRound({ siteIds: [site.id], statuses: [member.status] }).then((rows) => rows.filter((r) => r.memberId === member.id)),
    listInspectionRound({ siteIds: [site.id], statuses: ["submitted", "loaded", "out_of_service"], zoneId, schemeId }),
  ]);
  const now = new Date();
  const tz = site.timezone;
  const state = round ? inspectionState(round, now, site.inspectionIntervalDays) : null;
  const nextRow = orderRound(queue, now).find((r) => r.memberId !== member.id && NEEDS_DOING.includes(r.due.state));
  const next = nextRow ? { memberId: nextRow.memberId, tag: nextRow.tag } : null;
  // Arrived here from saving the previous member's checklist.
  const recorded = typeof q.recorded === "string" ? q.recorded.slice(0, 40) : null;

  return (
    <div className="flex flex-col gap-4">
      {recorded ? (
        <p role="status" className="flex flex-wrap items-center gap-2 rounded-lg border-2 border-ok bg-ok-soft p-3 font-semibold" data-testid="recorded-next">
          <Icon name="ok" /> Recorded {recorded} — next: {member.tag}
          {q.returned === "1" ? <span className="w-full text-sm font-normal">{recorded} is back in service (submitted); it needs a new permit before it is loaded.</span> : null}
        </p>
      ) : null}
      <div>
        <p className="text-sm text-ink-soft">
          <Link href={`/sites/${site.id}/inspections${roundQuery ? `?${roundQuery}` : ""}`} className="underline">
            Inspections
          </Link>{" "}
          ›{" "}
          <Link href={`/sites/${site.id}/members/${member.id}`} className="underline">
            {member.tag}
          </Link>
        </p>
        <h1 className="text-2xl font-bold">Inspect {member.tag}</h1>
        <p className="text-ink-soft">
          {member.memberTypeName}
          {member.zoneName ? ` · ${member.zoneName}` : ""} · {MEMBER_STATUS_LABELS[member.status]}
        </p>
        {state ? (
          <p className="mt-2 flex flex-wrap items-center gap-2">
            <InspectionStateBadge state={state.state} />
            {state.dueAt && state.state !== "failed" ? <span className="text-sm">Due {formatDateTime(state.dueAt, tz)}</span> : null}
            {round?.triggerReason && state.cause === "trigger" ? <span className="text-sm">After: {round.triggerReason}</span> : null}
          </p>
        ) : null}
      </div>

      {member.status === "struck" ? (
        <p role="status" className="rounded-lg border-2 border-ink/20 bg-paper-sunk p-3">
          This member has been struck; there is nothing to inspect.
        </p>
      ) : may("inspect") ? (
        <InspectForm
          key={member.id}
          siteId={site.id}
          memberId={member.id}
          tag={member.tag}
          status={member.status}
          plumbToleranceMm={site.plumbToleranceMm}
          intervalDays={site.inspectionIntervalDays}
          unitSystem={site.unitSystem}
          timeZone={site.timezone}
          next={next}
          roundQuery={roundQuery}
        />
      ) : (
        <Forbidden what="Recording inspections is for site engineers, supervisors and coordinators." />
      )}

      <section aria-labelledby="history-h" className="flex flex-col gap-2">
        <h2 id="history-h" className="text-lg font-bold">
          Inspection history
        </h2>
        {history.length === 0 ? (
          <p className="text-ink-soft">Not inspected yet.</p>
        ) : (
          <ol className="flex flex-col gap-2">
            {history.map((h) => (
              <li key={h.id} className="rounded-xl border-2 border-ink/15 bg-paper-raised p-3" data-testid="inspection-history-item">
                <div className="flex flex-wrap items-center gap-2">
                  <ResultBadge result={h.result} />
                  <span className="font-semibold">{formatDateTime(h.inspectedAt, tz)}</span>
                  <span className="text-ink-soft">by {h.inspectorName ?? "unknown"}</span>
                  {h.nextDueAt ? <span className="text-sm text-ink-soft">· next due {formatDateTime(h.nextDueAt, tz)}</span> : null}
                  {h.photoIds.length ? (
                    <span className="inline-flex items-center gap-1 text-sm text-ink-soft">
                      <Icon name="inspect" className="h-4 w-4" /> {h.photoIds.length} photo{h.photoIds.length === 1 ? "" : "s"}
                    </span>
                  ) : null}
                </div>
                {h.items.filter((i) => i.result === "fail").length ? (
                  <ul className="mt-2 list-inside list-disc text-sm">
                    {h.items
                      .filter((i) => i.result === "fail")
                      .map((i) => (
                        <li key={i.check}>
                          <strong>{checkLabel(i.check)}</strong>: failed{i.note ? ` — ${i.note}` : ""}
                        </li>
                      ))}
                  </ul>
                ) : null}
                {h.notes ? <p className="mt-1 text-sm">{h.notes}</p> : null}
              </li>
            ))}
          </ol>
        )}
      </section>
      <CautionNotice compact />
    </div>
  );
}
