"use client";
// QR label sheets from the register: for the members chosen, or for everything the filters show,
// starting at the first free label of a part-used sheet.
import { useState } from "react";
import { buttonClass } from "@/components/ui/button";

/** Labels for members chosen one by one are sent in one request; more than this is a filter's job. */
export const MAX_LABELS = 500;
const COLS = 3;
const CELLS = 21;

export function useLabelSheet(siteId: string) {
  const [error, setError] = useState<string>();
  const [busy, setBusy] = useState(false);

  async function download(memberIds: string[], start: number) {
    setError(undefined);
    setBusy(true);
    try {
      const res = await fetch(`/api/v1/sites/${siteId}/labels`, {
        method: "POST",
        headers: { "content-type": "application/json" },
        body: JSON.stringify({ memberIds, start }),
      });
      if (!res.ok) {
        const body = (await res.json().catch(() => null)) as { error?: { message?: string; fields?: Record<string, string> } } | null;
        setError(body?.error?.fields?.start ?? body?.error?.message ?? `The label sheet could not be made (HTTP ${res.status}).`);
        return;
      }
      const url = URL.createObjectURL(await res.blob());
      const a = document.createElement("a");
      a.href = url;
      a.download = `labels-${memberIds.length}.pdf`;
      document.body.appendChild(a);
      a.click();
      a.remove();
      setTimeout(() => URL.revokeObjectURL(url), 60_000);
    } catch {
      setError("The label sheet could not be downloaded; check the connection and try again.");
    } finally {
      setBusy(false);
    }
  }

  return { download, busy, error };
}

const where = (n: number) => `row ${Math.ceil(n / COLS)}, column ${((n - 1) % COLS) + 1}`;

/**
 * Where the first label goes on a part-used sheet: a picture of the sheet (3 across, 7 down), the
 * labels already used shaded. Radio buttons underneath, so keys and screen readers work as usual.
 */
export function LabelStartPicker({ value, onChange }: { value: number; onChange: (n: number) => void }) {
  return (
    <details className="rounded-lg border-2 border-ink/15 bg-paper-raised px-2 py-1 text-sm">
      <summary className="flex min-h-touch cursor-pointer items-center font-semibold" data-testid="label-start-summary">
        {value === 1 ? "New sheet: start at label 1" : `Part-used sheet: start at label ${value}`}
      </summary>
      <fieldset className="pb-2">
        <legend className="mb-1 max-w-64 text-ink-soft">First free label on the sheet, counted left to right, top to bottom. Labels before it stay blank.</legend>
        <div className="grid w-fit grid-cols-3 gap-1 rounded border border-ink/30 bg-paper p-1.5" role="presentation">
          {Array.from({ length: CELLS }, (_, i) => i + 1).map((n) => {
            const used = n < value;
            return (
              <label
                key={n}
                title={`Label ${n} (${where(n)})`}
                className={`relative flex h-7 w-12 cursor-pointer items-center justify-center rounded-sm border text-xs tabular-nums has-[:focus-visible]:outline has-[:focus-visible]:outline-2 has-[:focus-visible]:outline-brand ${
                  n === value ? "border-brand bg-brand font-bold text-white" : used ? "border-ink/20 bg-ink/15 text-ink-soft line-through" : "border-ink/40 bg-paper-raised text-ink"
                }`}
              >
                <input type="radio" name="label-start" value={n} checked={n === value} onChange={() => onChange(n)} className="sr-only" aria-label={`Label ${n}`} aria-describedby={`label-start-${n}`} />
                <span aria-hidden="true">{n}</span>
                <span id={`label-start-${n}`} className="sr-only">
                  {`${where(n)}${used ? ", already used" : ""}`}
                </span>
              </label>
            );
          })}
        </div>
      </fieldset>
    </details>
  );
}

/** With nothing chosen: labels for every member the filters show (a GET the browser downloads). */
export function LabelsForFiltered({ siteId, filterQs, total, start }: { siteId: string; filterQs: string; total: number | undefined; start: number }) {
  const unusable = total !== undefined && (total === 0 || total > MAX_LABELS);
  const qs = [filterQs, start > 1 ? `start=${start}` : ""].filter(Boolean).join("&");
  return (
    <>
      <a
        className={buttonClass("secondary", "text-sm")}
        href={`/api/v1/sites/${siteId}/labels${qs ? `?${qs}` : ""}`}
        aria-disabled={unusable}
        onClick={(e) => {
          if (unusable) e.preventDefault();
        }}
      >
        Labels for all {total !== undefined ? total.toLocaleString("en-GB") : ""} shown
      </a>
      <span className="text-sm text-ink-soft">
        {total !== undefined && total > MAX_LABELS ? `Narrow the filters to ${MAX_LABELS} or fewer, or choose members.` : "Or choose members with the check boxes."}
      </span>
    </>
  );
}
