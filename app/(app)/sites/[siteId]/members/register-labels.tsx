"use client";
// QR label sheets from the register: for the members chosen, or for everything the filters show.
import { useState } from "react";
import { buttonClass } from "@/components/ui/button";

/** Labels for members chosen one by one are sent in one request; more than this is a filter's job. */
export const MAX_LABELS = 500;

export function useLabelSheet(siteId: string) {
  const [error, setError] = useState<string>();
  const [busy, setBusy] = useState(false);

  async function download(memberIds: string[]) {
    setError(undefined);
    setBusy(true);
    try {
      const res = await fetch(`/api/v1/sites/${siteId}/labels`, {
        method: "POST",
        headers: { "content-type": "application/json" },
        body: JSON.stringify({ memberIds }),
      });
      if (!res.ok) {
        const body = (await res.json().catch(() => null)) as { error?: { message?: string } } | null;
        setError(body?.error?.message ?? `The label sheet could not be made (HTTP ${res.status}).`);
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

/** With nothing chosen: labels for every member the filters show (a GET the browser downloads). */
export function LabelsForFiltered({ siteId, filterQs, total }: { siteId: string; filterQs: string; total: number | undefined }) {
  const unusable = total !== undefined && (total === 0 || total > MAX_LABELS);
  return (
    <>
      <a
        className={buttonClass("secondary", "text-sm")}
        href={`/api/v1/sites/${siteId}/labels${filterQs ? `?${filterQs}` : ""}`}
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
