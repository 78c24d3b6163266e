"use client";
// What can be done with the members chosen in the register: QR labels, a permit request for them,
// or recording them all as inspected and satisfactory.
import Link from "next/link";
import { useState } from "react";
import { buttonClass } from "@/components/ui/button";
import { BulkSatisfactory } from "./register-bulk-inspect";
import { LabelsForFiltered, LabelStartPicker, MAX_LABELS, useLabelSheet } from "./register-labels";

/** Ids in a permit-request link: a request takes at most this many members from the register at once. */
export const MAX_PERMIT_PREFILL = 200;

export function RegisterSelection({
  siteId, selectedIds, onClear, filterQs, total, canRequestPermit, canInspect,
}: { siteId: string; selectedIds: string[]; onClear: () => void; filterQs: string; total: number | undefined; canRequestPermit: boolean; canInspect: boolean }) {
  const labels = useLabelSheet(siteId);
  // The first free label of a part-used sheet, kept while members are chosen and cleared.
  const [start, setStart] = useState(1);
  const n = selectedIds.length;
  return (
    <div className="order-last flex flex-wrap items-center gap-2 rounded-lg bg-paper-sunk p-2 md:order-none print:hidden" role="group" aria-label="Chosen members">
      {n > 0 ? (
        <>
          <span className="text-sm font-semibold" data-testid="selection-count">
            {n} chosen:
          </span>
          <button type="button" className={buttonClass("primary", "text-sm")} onClick={() => labels.download(selectedIds, start)} disabled={labels.busy || n > MAX_LABELS}>
            {labels.busy ? "Making labels…" : `QR labels for ${n}`}
          </button>
          {canRequestPermit ? (
            n <= MAX_PERMIT_PREFILL ? (
              <Link className={buttonClass("secondary", "text-sm")} href={`/sites/${siteId}/permits/new?memberIds=${selectedIds.join(",")}`}>
                Request a permit
              </Link>
            ) : (
              <span className="text-sm text-bad">A permit request takes at most {MAX_PERMIT_PREFILL} members from here; choose fewer or use a scheme and zone.</span>
            )
          ) : null}
          <button type="button" className={buttonClass("ghost", "text-sm")} onClick={onClear}>
            Clear choice
          </button>
          {n > MAX_LABELS ? <span className="text-sm text-bad">At most {MAX_LABELS} labels per sheet.</span> : null}
        </>
      ) : (
        <>
          <span className="text-sm font-semibold">QR labels:</span>
          <LabelsForFiltered siteId={siteId} filterQs={filterQs} total={total} start={start} />
        </>
      )}
      <LabelStartPicker value={start} onChange={setStart} />
      {canInspect ? <BulkSatisfactory siteId={siteId} selectedIds={selectedIds} onDone={onClear} /> : null}
      {labels.error ? (
        <p role="alert" className="w-full font-semibold text-bad">
          {labels.error}
        </p>
      ) : null}
    </div>
  );
}
