"use client";
// "All satisfactory" for the members chosen in the register: a confirm step saying how many and
// what is recorded, then one request that records each as its own satisfactory inspection (all or
// nothing). Refusals are listed member by member; nothing is recorded then.
import Link from "next/link";
import { useState } from "react";
import { useQueryClient } from "@tanstack/react-query";
import { Icon } from "@/components/icons";
import { buttonClass } from "@/components/ui/button";
import { apiJson } from "@/lib/client/api";
import { newClientId } from "@/lib/client/outbox/submit";
import { MAX_BULK_INSPECTIONS } from "@/lib/validations/inspection";

type Answer = { recorded: number; items: { tag: string; nextDueAt: string | null }[] };
type Outcome = { ok: true; text: string } | { ok: false; message: string; reasons: string[] };

export function BulkSatisfactory({ siteId, selectedIds, onDone }: { siteId: string; selectedIds: string[]; onDone: () => void }) {
  const queryClient = useQueryClient();
  const [confirming, setConfirming] = useState(false);
  const [busy, setBusy] = useState(false);
  const [outcome, setOutcome] = useState<Outcome | null>(null);
  // One id per confirmed batch: a retry after a lost answer records nothing twice.
  const [clientId, setClientId] = useState<string | null>(null);
  const n = selectedIds.length;
  const members = `${n} member${n === 1 ? "" : "s"}`;

  async function record() {
    setBusy(true);
    const id = clientId ?? newClientId();
    setClientId(id);
    const r = await apiJson<Answer>(`/api/v1/sites/${siteId}/inspections/bulk`, { body: { memberIds: selectedIds, result: "pass", clientId: id } });
    setBusy(false);
    setConfirming(false);
    if (!r.ok) {
      // Fields are keyed memberIds.<i> and each sentence names its member.
      setOutcome({ ok: false, message: r.error.message, reasons: Object.values(r.error.fields) });
      if (!r.error.offline) setClientId(null);
      return;
    }
    setClientId(null);
    const due = r.data.items[0]?.nextDueAt;
    setOutcome({
      ok: true,
      text: `Recorded ${r.data.items.length} satisfactory inspection${r.data.items.length === 1 ? "" : "s"} (${r.data.items.map((i) => i.tag).join(", ")})${
        due ? `; next due ${new Date(due).toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "short" })}` : ""
      }.`,
    });
    onDone();
    await queryClient.invalidateQueries({ queryKey: ["members", siteId] });
  }

  return (
    <>
      {n > 0 && !confirming ? (
        <button
          type="button"
          className={buttonClass("secondary", "text-sm")}
          disabled={n > MAX_BULK_INSPECTIONS}
          onClick={() => {
            setOutcome(null);
            setConfirming(true);
          }}
        >
          <Icon name="ok" className="h-4 w-4" /> All satisfactory
        </button>
      ) : null}
      {n > MAX_BULK_INSPECTIONS ? <span className="text-sm text-bad">At most {MAX_BULK_INSPECTIONS} members are recorded at once; choose fewer.</span> : null}
      {confirming ? (
        <div role="alertdialog" aria-labelledby="bulk-confirm-h" aria-describedby="bulk-confirm-p" className="flex w-full flex-col gap-2 rounded-lg border-2 border-ok bg-ok-soft p-3">
          <p id="bulk-confirm-h" className="font-bold">
            Record {members} as inspected and satisfactory?
          </p>
          <p id="bulk-confirm-p" className="text-sm">
            Each of the {members} is recorded as its own satisfactory inspection — every checklist item satisfactory — by you, now, and its next inspection
            falls due from today. Do this only after looking at each of them on site; record anything wrong on that member&apos;s own checklist.
          </p>
          <div className="flex flex-wrap gap-2">
            <button type="button" className={buttonClass("primary", "text-sm")} onClick={() => void record()} disabled={busy}>
              {busy ? "Recording…" : `Record ${members} satisfactory`}
            </button>
            <button type="button" className={buttonClass("ghost", "text-sm")} onClick={() => setConfirming(false)} disabled={busy}>
              Cancel
            </button>
          </div>
        </div>
      ) : null}
      {outcome?.ok ? (
        <p role="status" className="flex w-full flex-wrap items-center gap-2 font-semibold text-ok">
          <Icon name="ok" className="h-5 w-5" /> {outcome.text}{" "}
          <Link href={`/sites/${siteId}/inspections`} className="text-brand underline">
            The inspection round
          </Link>
        </p>
      ) : null}
      {outcome && !outcome.ok ? (
        <div role="alert" className="w-full rounded-lg border-2 border-bad bg-bad-soft p-2 text-sm font-semibold text-bad">
          <p>{outcome.message}</p>
          {outcome.reasons.length ? (
            <ul className="list-inside list-disc font-normal">
              {outcome.reasons.map((r) => (
                <li key={r}>{r}</li>
              ))}
            </ul>
          ) : null}
        </div>
      ) : null}
    </>
  );
}
