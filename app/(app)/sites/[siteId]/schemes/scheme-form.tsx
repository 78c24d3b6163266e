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
import { SCHEME_CATEGORIES, schemeSchema } from "@/lib/validations/scheme";

type Values = {
  reference: string; title: string; designerName: string; category: string; designLoad: string; designSpacingX: string; designSpacingY: string;
  slabThickness: string; concreteDensity: string; formwork: string; construction: string; validFrom: string; validUntil: string;
};
export type SchemeFormExisting = {
  id: string; reference: string; title: string; designerName: string; category: number; designLoadN: number | null; designSpacingXMm: number | null; designSpacingYMm: number | null;
  slabThicknessMm: number | null; concreteDensityKnM3: number | null; formworkKnM2: number | null; constructionKnM2: number | null; validFrom: string | null; validUntil: string | null;
};

const n = (s: string) => (s.trim() === "" ? null : Number(s));
const t = (v: number | null | undefined, scale = 1) => (v == null ? "" : String(Math.round((v / scale) * 1000) / 1000));
const FIELD: Record<string, keyof Values> = {
  designLoadN: "designLoad", designSpacingXMm: "designSpacingX", designSpacingYMm: "designSpacingY", slabThicknessMm: "slabThickness",
  concreteDensityKnM3: "concreteDensity", formworkKnM2: "formwork", constructionKnM2: "construction",
};
const schemeFieldOf = (k: string): string => FIELD[k] ?? k;
/** The schema speaks the API's N; this form types the design load in kN. */
const speakSi = (m: string) => speakUnits(m, "si");

function toPayload(v: Values) {
  return {
    reference: v.reference, title: v.title, designerName: v.designerName, category: v.category === "" ? undefined : Number(v.category),
    designLoadN: v.designLoad.trim() === "" ? null : Number(v.designLoad) * 1000, designSpacingXMm: n(v.designSpacingX), designSpacingYMm: n(v.designSpacingY),
    slabThicknessMm: n(v.slabThickness), concreteDensityKnM3: n(v.concreteDensity), formworkKnM2: n(v.formwork), constructionKnM2: n(v.construction),
    validFrom: v.validFrom || null, validUntil: v.validUntil || null,
  };
}

export function SchemeForm({ siteId, existing, defaultDesigner = "" }: { siteId: string; existing?: SchemeFormExisting; defaultDesigner?: string }) {
  const router = useRouter();
  const resolver: Resolver<Values> = useCallback(async (values) => {
    const r = schemeSchema.safeParse(toPayload(values));
    if (r.success) return { values, errors: {} };
    const errors: Record<string, { type: string; message: string }> = {};
    for (const i of r.error.issues) {
      const k = FIELD[String(i.path[0])] ?? String(i.path[0]);
      errors[k] ??= { type: "validate", message: speakSi(i.message) };
    }
    return { values: {}, errors };
  }, []);
  const { register, handleSubmit, setError, formState } = useForm<Values>({
    resolver,
    defaultValues: {
      reference: existing?.reference ?? "", title: existing?.title ?? "", designerName: existing?.designerName ?? defaultDesigner, category: existing ? String(existing.category) : "1",
      designLoad: t(existing?.designLoadN, 1000), designSpacingX: t(existing?.designSpacingXMm), designSpacingY: t(existing?.designSpacingYMm), slabThickness: t(existing?.slabThicknessMm),
      concreteDensity: t(existing?.concreteDensityKnM3), formwork: t(existing?.formworkKnM2), construction: t(existing?.constructionKnM2),
      validFrom: existing?.validFrom?.slice(0, 10) ?? "", validUntil: existing?.validUntil?.slice(0, 10) ?? "",
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
      ? await apiJson<{ scheme: { id: string } }>(`/api/v1/sites/${siteId}/schemes/${existing.id}`, { method: "PATCH", body: toPayload(values) })
      : await apiJson<{ scheme: { id: string } }>(`/api/v1/sites/${siteId}/schemes`, { body: toPayload(values) });
    if (!r.ok) {
      placeErrors(r.error);
      setMessage({ ok: false, text: Object.keys(r.error.fields).length ? "Some values need attention; nothing was saved." : r.error.message });
      return;
    }
    if (existing) {
      setMessage({ ok: true, text: "Saved." });
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
