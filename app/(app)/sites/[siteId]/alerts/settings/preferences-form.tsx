"use client";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Icon } from "@/components/icons";
import { apiJson } from "@/lib/client/api";
import { Button } from "@/components/ui/button";
import { DELIVERIES, DELIVERY_LABELS, type AlertKind, type Delivery } from "@/lib/alerts/kinds";

type Row = { kind: AlertKind; label: string; delivery: Delivery; receives: boolean; locked: boolean; who: string };

export function PreferencesForm({ rows }: { rows: Row[] }) {
  const router = useRouter();
  const [values, setValues] = useState<Record<string, Delivery>>(() => Object.fromEntries(rows.map((r) => [r.kind, r.delivery])));
  const [status, setStatus] = useState<{ ok: boolean; text: string } | null>(null);
  const [busy, setBusy] = useState(false);

  async function save(e: React.FormEvent) {
    e.preventDefault();
    setBusy(true);
    const r = await apiJson("/api/v1/me/alert-preferences", {
      method: "PUT",
      body: { preferences: rows.map((row) => ({ kind: row.kind, delivery: values[row.kind] })) },
    });
    setBusy(false);
    if (r.ok) {
      setStatus({ ok: true, text: "Saved." });
      router.refresh();
    } else setStatus({ ok: false, text: Object.values(r.error.fields)[0] ?? r.error.message });
  }

  return (
    <form onSubmit={save} className="flex flex-col gap-3">
      {rows.map((row) => (
        <fieldset key={row.kind} className="rounded-xl border-2 border-ink/15 bg-paper-raised p-3" data-testid={`pref-${row.kind}`}>
          <legend className="px-1 font-bold">{row.label}</legend>
          <p className="mb-2 text-sm text-ink-soft">
            Sent to the {row.who}.{row.receives ? "" : " Your role on this site does not receive these here."}
          </p>
          {row.locked ? (
            <p className="flex items-center gap-2 text-sm font-semibold">
              <Icon name="warn" className="h-4 w-4" /> Always e-mailed to you at once as site manager. Your choice below applies to your other roles.
            </p>
          ) : null}
          <div className="grid gap-2 sm:grid-cols-3">
            {DELIVERIES.map((d) => (
              <label key={d} className={`flex min-h-touch cursor-pointer items-center gap-2 rounded-lg border-2 px-3 ${values[row.kind] === d ? "border-brand bg-brand-soft font-semibold" : "border-ink/30"}`}>
                <input type="radio" name={row.kind} value={d} checked={values[row.kind] === d} onChange={() => setValues((v) => ({ ...v, [row.kind]: d }))} className="h-5 w-5" />
                {DELIVERY_LABELS[d]}
              </label>
            ))}
          </div>
        </fieldset>
      ))}
      <div className="flex items-center gap-3">
        <Button type="submit" disabled={busy}>
          {busy ? "Saving…" : "Save"}
        </Button>
        {status ? (
          <p role={status.ok ? "status" : "alert"} className={`flex items-center gap-1 font-semibold ${status.ok ? "text-ok" : "text-bad"}`}>
            <Icon name={status.ok ? "ok" : "bad"} className="h-5 w-5" /> {status.text}
          </p>
        ) : null}
      </div>
    </form>
  );
}
