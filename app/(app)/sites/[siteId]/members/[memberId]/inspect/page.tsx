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
import { inspectionState } from "@/lib/inspections/due";
import { MEMBER_STATUS_LABELS } from "@/lib/labels";
import { InspectionStateBadge, ResultBadge } from "../../../inspections/state-badge";
import { InspectForm } from "./inspect-form";

export const metadata: Metadata = { title: "Inspect member" };

export default async function InspectPage({ params }: { params: Promise<{ siteId: string; memberId: string }> }) {
  const { siteId, memberId } = await params;
  const { site, may } = await loadSitePage(siteId);
  if (!isUuid(memberId)) notFound();
  const member = await getMemberForInspection({ memberId, siteId: site.id });
  if (!member) notFound();
  const [history, [round]] = await Promise.all([
    listInspections({ memberId: member.id }),
    listInspectionRound({ siteIds: [site.id], statuses: [member.status] }).then((rows) => rows.filter((r) => r.memberId === member.id)),
  ]);
  const tz = site.timezone;
  const state = round ? inspectionState(round, new Date(), site.inspectionIntervalDays) : null;

  return (
    <div className="flex flex-col gap-4">
      <div>
        <p className="text-sm text-ink-soft">
          <Link href={`/sites/${site.id}/inspections`} className="underline">
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
        <InspectForm siteId={site.id} memberId={member.id} tag={member.tag} plumbToleranceMm={site.plumbToleranceMm} intervalDays={site.inspectionIntervalDays} timeZone={site.timezone} />
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
