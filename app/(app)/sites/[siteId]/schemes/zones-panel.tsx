"use client";
// The site's zones: a list with an inline editor and a form to add one.
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Icon } from "@/components/icons";
import { apiJson } from "@/lib/client/api";
import { Button } from "@/components/ui/button";
import { Field, inputClass } from "@/components/ui/field";

type Zone = { id: string; name: string; level: string | null; grid: string | null; area: string | null; memberCount: number };

function ZoneEditor({ siteId, zone, onDone }: { siteId: string; zone?: Zone; onDone: () => void }) {
  const prefix = zone ? `zone-${zone.id}` : "zone-new";
  const [v, setV] = useState({ name: zone?.name ?? "", level: zone?.level ?? "", grid: zone?.grid ?? "", area: zone?.area ?? "" });
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [busy, setBusy] = useState(false);
  async function save(e: React.FormEvent) {
    e.preventDefault();
    setBusy(true);
    const r = zone
      ? await apiJson(`/api/v1/sites/${siteId}/zones/${zone.id}`, { method: "PATCH", body: v })
      : await apiJson(`/api/v1/sites/${siteId}/zones`, { body: v });
    setBusy(false);
    if (!r.ok) {
      setErrors(Object.keys(r.error.fields).length ? r.error.fields : { name: r.error.message });
      return;
    }
    setErrors({});
    if (!zone) setV({ name: "", level: "", grid: "", area: "" });
    onDone();
  }
  const field = (k: keyof typeof v, label: string) => (
    <Field id={`${prefix}-${k}`} label={label} error={errors[k]}>
      <input id={`${prefix}-${k}`} className={inputClass} value={v[k]} aria-invalid={!!errors[k]} aria-describedby={errors[k] ? `${prefix}-${k}-error` : undefined} onChange={(e) => setV({ ...v, [k]: e.target.value })} />
    </Field>
  );
  return (
    <form onSubmit={save} noValidate className="grid grid-cols-1 gap-2 sm:grid-cols-5 sm:items-end" aria-label={zone ? `Edit zone ${zone.name}` : "Add a zone"}>
      <div className="sm:col-span-2">{field("name", "Zone name")}</div>
      {field("level", "Level")}
      {field("grid", "Grid")}
      {field("area", "Area")}
      <Button type="submit" disabled={busy} className="sm:col-span-5">{zone ? "Save zone" : "Add zone"}</Button>
    </form>
  );
}

export function ZonesPanel({ siteId, zones, canEdit }: { siteId: string; zones: Zone[]; canEdit: boolean }) {
  const router = useRouter();
  const [editing, setEditing] = useState<string | null>(null);
  return (
    <section aria-labelledby="zones-h" className="flex flex-col gap-3 rounded-xl border-2 border-ink/15 bg-paper-raised p-4">
      <h2 id="zones-h" className="text-lg font-bold">Zones</h2>
      <ul className="flex flex-col gap-2">
        {zones.map((z) => (
          <li key={z.id} className="rounded-lg border-2 border-ink/10 p-2">
            {editing === z.id ? (
              <ZoneEditor siteId={siteId} zone={z} onDone={() => { setEditing(null); router.refresh(); }} />
            ) : (
              <div className="flex flex-wrap items-center justify-between gap-2">
                <span>
                  <span className="block font-semibold">{z.name}</span>
                  <span className="text-sm text-ink-soft">{[z.level, z.grid, z.area].filter(Boolean).join(" · ") || "—"} · {z.memberCount} member{z.memberCount === 1 ? "" : "s"}</span>
                </span>
                <a href={`/sites/${siteId}/zones/${z.id}/plan`} className="flex min-h-touch items-center gap-1 rounded-lg px-3 font-semibold text-brand underline">
                  Plan <span className="sr-only">of {z.name}</span>
                </a>
                {canEdit ? (
                  <button type="button" className="flex min-h-touch items-center gap-1 rounded-lg px-3 font-semibold text-brand hover:bg-paper-sunk" onClick={() => setEditing(z.id)}>
                    Edit <span className="sr-only">{z.name}</span>
                  </button>
                ) : null}
              </div>
            )}
          </li>
        ))}
      </ul>
      {canEdit ? (
        <details className="rounded-lg border-2 border-dashed border-brand p-2">
          <summary className="flex min-h-touch cursor-pointer items-center gap-2 font-semibold text-brand"><Icon name="add" /> Add a zone</summary>
          <ZoneEditor siteId={siteId} onDone={() => router.refresh()} />
        </details>
      ) : null}
    </section>
  );
}
