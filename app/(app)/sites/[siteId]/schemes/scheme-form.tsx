"use client";
// Create or edit a scheme: the design a group of members belongs to.
import { useRouter } from "next/navigation";
import { useCallback, useState } from "react";
import { useForm, type Resolver } from "react-hook-form";
import { Icon } from "@/components/icons";
import { useServerErrors } from "@/components/use-server-errors";
import { speakUnits } from "@/lib/calculator/units-speech";
import { apiJson } from "@/lib/client/api";
import { Button } from "@/components/ui/button";
import { describedBy, Field, inputClass } from "@/components/ui/field";
import { CautionNotice } from "@/components/caution-notice";
import { fromKnPerM2, parsePressure } from "@/lib/units";
import type { SchemeBackprop } from "@/db/schema";
import { SCHEME_CATEGORIES, schemeSchema } from "@/lib/validations/scheme";

type Values = {
  reference: string; title: string; designerName: string; category: string; designLoad: string; designSpacingX: string; designSpacingY: string;
  slabThickness: string; concreteDensity: string; formwork: string; construction: string; validFrom: string; validUntil: string;
  /** Back-propping: "" (none) or 1–6 levels of props, and the loads at casting in the site's area-load unit. */
  bpLevels: string; bpFormwork: string; bpConstruction: string; bpCycles: string;
};
export type SchemeFormExisting = {
  id: string; reference: string; title: string; designerName: string; category: number; designLoadN: number | null; designSpacingXMm: number | null; designSpacingYMm: number | null;
  slabThicknessMm: number | null; concreteDensityKnM3: number | null; formworkKnM2: number | null; constructionKnM2: number | null; validFrom: string | null; validUntil: string | null;
  backprop: SchemeBackprop | null;
};

const n = (s: string) => (s.trim() === "" ? null : Number(s));
const t = (v: number | null | undefined, scale = 1) => (v == null ? "" : String(Math.round((v / scale) * 1000) / 1000));
const FIELD: Record<string, keyof Values> = {
  designLoadN: "designLoad", designSpacingXMm: "designSpacingX", designSpacingYMm: "designSpacingY", slabThicknessMm: "slabThickness",
  concreteDensityKnM3: "concreteDensity", formworkKnM2: "formwork", constructionKnM2: "construction",
  backprop: "bpLevels", "backprop.shoredLevels": "bpLevels", "backprop.formworkKPa": "bpFormwork", "backprop.constructionKPa": "bpConstruction", "backprop.cycles": "bpCycles",
};
const schemeFieldOf = (k: string): string => FIELD[k] ?? k;
/** The schema speaks the API's N; this form types the design load in kN. */
const speakSi = (m: string) => speakUnits(m, "si");

type Units = "si" | "us";
const areaUnit = (u: Units) => (u === "us" ? "psf" : "kN/m2") as "psf" | "kN/m2";
const areaLabel = (u: Units) => (u === "us" ? "psf" : "kN/m²");

/** An area load typed in the site's unit (or with its own, "0.5 kN/m²", "10 psf") → kN/m²; NaN when unreadable (the schema then says so). */
function kPaOf(text: string, u: Units): number | undefined {
  if (text.trim() === "") return undefined;
  const r = parsePressure(text, areaUnit(u));
  return r.ok ? r.value : NaN;
}

function backpropPayload(v: Values, u: Units) {
  if (v.bpLevels === "") return null;
  const f = kPaOf(v.bpFormwork, u);
  const c = kPaOf(v.bpConstruction, u);
  return {
    shoredLevels: Number(v.bpLevels),
    ...(f !== undefined ? { formworkKPa: f } : {}),
    ...(c !== undefined ? { constructionKPa: c } : {}),
    ...(v.bpCycles.trim() !== "" ? { cycles: Number(v.bpCycles) } : {}),
  };
}

function toPayload(v: Values, u: Units = "si") {
  return {
    reference: v.reference, title: v.title, designerName: v.designerName, category: v.category === "" ? undefined : Number(v.category),
    designLoadN: v.designLoad.trim() === "" ? null : Number(v.designLoad) * 1000, designSpacingXMm: n(v.designSpacingX), designSpacingYMm: n(v.designSpacingY),
    slabThicknessMm: n(v.slabThickness), concreteDensityKnM3: n(v.concreteDensity), formworkKnM2: n(v.formwork), constructionKnM2: n(v.construction),
    backprop: backpropPayload(v, u),
    validFrom: v.validFrom || null, validUntil: v.validUntil || null,
  };
}

export function SchemeForm({ siteId, existing, defaultDesigner = "", unitSystem = "si" }: { siteId: string; existing?: SchemeFormExisting; defaultDesigner?: string; unitSystem?: Units }) {
  const router = useRouter();
  const resolver: Resolver<Values> = useCallback(async (values) => {
    const r = schemeSchema.safeParse(toPayload(values, unitSystem));
    if (r.success) return { values, errors: {} };
    const errors: Record<string, { type: string; message: string }> = {};
    for (const i of r.error.issues) {
      const path = i.path.map(String).join(".");
      const k = FIELD[path] ?? FIELD[String(i.path[0])] ?? String(i.path[0]);
      errors[k] ??= { type: "validate", message: speakSi(i.message) };
    }
    return { values: {}, errors };
  }, [unitSystem]);
  const { register, handleSubmit, setError, formState } = useForm<Values>({
    resolver,
    defaultValues: {
      reference: existing?.reference ?? "", title: existing?.title ?? "", designerName: existing?.designerName ?? defaultDesigner, category: existing ? String(existing.category) : "1",
      designLoad: t(existing?.designLoadN, 1000), designSpacingX: t(existing?.designSpacingXMm), designSpacingY: t(existing?.designSpacingYMm), slabThickness: t(existing?.slabThicknessMm),
      concreteDensity: t(existing?.concreteDensityKnM3), formwork: t(existing?.formworkKnM2), construction: t(existing?.constructionKnM2),
      validFrom: existing?.validFrom?.slice(0, 10) ?? "", validUntil: existing?.validUntil?.slice(0, 10) ?? "",
      bpLevels: existing?.backprop ? String(existing.backprop.shoredLevels) : "",
      bpFormwork: existing?.backprop?.formworkKPa != null ? t(fromKnPerM2(existing.backprop.formworkKPa, areaUnit(unitSystem))) : "",
      bpConstruction: existing?.backprop?.constructionKPa != null ? t(fromKnPerM2(existing.backprop.constructionKPa, areaUnit(unitSystem))) : "",
      bpCycles: existing?.backprop?.cycles != null ? String(existing.backprop.cycles) : "",
    },
  });
  const placeErrors = useServerErrors(setError, { fieldOf: schemeFieldOf, speak: speakSi });
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const err = (k: keyof Values) => formState.errors[k]?.message;
  const input = (id: keyof Values, label: string, hint?: string, type = "text", mode: "decimal" | "text" = "decimal") => (
    <Field id={id} label={label} error={err(id)} hint={hint}>
      <input id={id} type={type} className={`${inputClass} tabular`} inputMode={type === "text" ? mode : undefined} autoComplete="off" aria-invalid={!!err(id)} aria-describedby={describedBy(id, err(id), !!hint)} {...register(id)} />
    </Field>
  );

  const onSubmit = handleSubmit(async (values) => {
    setMessage(null);
    const r = existing
      ? await apiJson<{ scheme: { id: string } }>(`/api/v1/sites/${siteId}/schemes/${existing.id}`, { method: "PATCH", body: toPayload(values, unitSystem) })
      : await apiJson<{ scheme: { id: string } }>(`/api/v1/sites/${siteId}/schemes`, { body: toPayload(values, unitSystem) });
    if (!r.ok) {
      placeErrors(r.error);
      setMessage({ ok: false, text: Object.keys(r.error.fields).length ? "Some values need attention; nothing was saved." : r.error.message });
      return;
    }
    if (existing) {
      const n = (r.data as { rechecked?: number }).rechecked ?? 0;
      setMessage({ ok: true, text: n ? `Saved. ${n} member${n === 1 ? "" : "s"} whose load comes from this scheme ${n === 1 ? "was" : "were"} re-checked.` : "Saved." });
      router.refresh();
    } else router.push(`/sites/${siteId}/schemes/${r.data.scheme.id}`);
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4" aria-label={existing ? "Edit scheme" : "New scheme"}>
      <div className="grid gap-4 sm:grid-cols-2">
        {input("reference", "Reference", "e.g. TW-014", "text", "text")}
        {input("designerName", "Temporary works designer", undefined, "text", "text")}
      </div>
      {input("title", "Title", "What it supports, e.g. Back-propping L1 under L2 pour", "text", "text")}
      <Field id="category" label="Design check category" error={err("category")}>
        <select id="category" className={inputClass} {...register("category")}>
          {SCHEME_CATEGORIES.map((c) => <option key={c.value} value={c.value}>{c.label}</option>)}
        </select>
      </Field>
      <div className="grid grid-cols-1 gap-4 sm:grid-cols-3">
        {input("designLoad", "Design load per member (kN)")}
        {input("designSpacingX", "Design spacing X (mm)")}
        {input("designSpacingY", "Design spacing Y (mm)")}
      </div>
      <fieldset className="grid grid-cols-2 gap-4 rounded-lg border-2 border-ink/15 p-3 sm:grid-cols-4">
        <legend className="px-1 font-semibold">The slab carried (to derive each member&apos;s load)</legend>
        {input("slabThickness", "Slab thickness (mm)")}
        {input("concreteDensity", "Concrete density (kN/m³)", "Blank: 26 (wet, reinforced)")}
        {input("formwork", "Formwork (kN/m²)", "Blank: 0.5")}
        {input("construction", "Construction load (kN/m²)", "Blank: EN 1991-1-6 rule")}
      </fieldset>
      <fieldset className="flex flex-col gap-3 rounded-lg border-2 border-ink/15 p-3" aria-describedby="bp-about">
        <legend className="px-1 font-semibold">Back-propping through the casting cycle (optional)</legend>
        <p id="bp-about" className="text-sm text-ink-soft">
          Loads on each level of props as floors are cast above, by the simplified method of Grundy &amp; Kabaila (1963), as multiples of the slab&apos;s
          self-weight (the slab above). Level 1 is the props right under the slab being cast, level 2 the props under the slab below it, and so on down.
        </p>
        <Field id="bpLevels" label="Levels of props in use at once" error={err("bpLevels")}>
          <select id="bpLevels" className={inputClass} aria-invalid={!!err("bpLevels")} aria-describedby={describedBy("bpLevels", err("bpLevels"))} {...register("bpLevels")}>
            <option value="">No back-propping</option>
            {[1, 2, 3, 4, 5, 6].map((l) => <option key={l} value={String(l)}>{l} level{l === 1 ? "" : "s"}</option>)}
          </select>
        </Field>
        <div className="grid grid-cols-1 gap-4 sm:grid-cols-3">
          {input("bpFormwork", `Formwork at casting (${areaLabel(unitSystem)})`, "Blank: neglected, as in the simplified method", "text")}
          {input("bpConstruction", `Construction load while casting (${areaLabel(unitSystem)})`, "Blank: not included", "text")}
          {input("bpCycles", "Casting cycles to follow", "Blank: 3 × levels + 4", "text")}
        </div>
        <CautionNotice compact />
      </fieldset>
      <div className="grid grid-cols-2 gap-4">
        {input("validFrom", "Valid from", undefined, "date")}
        {input("validUntil", "Valid until", undefined, "date")}
      </div>
      {message ? (
        <p role={message.ok ? "status" : "alert"} className={`flex items-center gap-2 font-semibold ${message.ok ? "text-ok" : "text-bad"}`}>
          <Icon name={message.ok ? "ok" : "bad"} className="h-5 w-5" /> {message.text}
        </p>
      ) : null}
      <Button type="submit" disabled={formState.isSubmitting}>{formState.isSubmitting ? "Saving…" : existing ? "Save changes" : "Create scheme"}</Button>
    </form>
  );
}
