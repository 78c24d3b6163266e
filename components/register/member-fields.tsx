"use client";
// The member's fields, shared by the phone logging form and the member page's edit form.
import type { FieldErrors, UseFormRegister, UseFormWatch } from "react-hook-form";
import { describedBy, Field, inputClass } from "@/components/ui/field";
import { END_CONDITIONS } from "@/lib/engineering/effective-length";
import { deriveSlabLoad } from "@/lib/register/slab-load";
import { deriveBackpropLoad } from "@/lib/register/backprop-load";
import type { SchemeBackprop } from "@/db/schema";
import { formatForce, formatLength, parseLength } from "@/lib/units";
import { units, type MemberFormValues, type UnitSystem } from "./member-form-values";

export type ZoneOption = { id: string; name: string };
export type SchemeOption = {
  id: string;
  reference: string;
  title: string;
  slabThicknessMm: number | null;
  concreteDensityKnM3: number | null;
  formworkKnM2: number | null;
  constructionKnM2: number | null;
  backprop: SchemeBackprop | null;
  designSpacingXMm: number | null;
  designSpacingYMm: number | null;
};
export type TypeOption = { id: string; name: string; kind: string; minExtensionMm: number | null; maxExtensionMm: number | null };

export function MemberFields({
  register, errors, watch, unitSystem, zones, schemes, types, withTag = true,
}: {
  register: UseFormRegister<MemberFormValues>;
  errors: FieldErrors<MemberFormValues>;
  watch: UseFormWatch<MemberFormValues>;
  unitSystem: UnitSystem;
  zones: ZoneOption[];
  schemes: SchemeOption[];
  types: TypeOption[];
  withTag?: boolean;
}) {
  const u = units(unitSystem);
  const lengthUnit = unitSystem === "us" ? "ft" : "mm";
  const forceUnit = unitSystem === "us" ? "kip" : "kN";
  const [typeId, schemeId, loadSource, spacingX, spacingY, level] = watch(["memberTypeId", "schemeId", "loadSource", "spacingX", "spacingY", "level"]);
  const type = types.find((t) => t.id === typeId);
  const scheme = schemes.find((s) => s.id === schemeId);
  const err = (k: keyof MemberFormValues) => errors[k]?.message as string | undefined;

  let slabPreview: React.ReactNode = null;
  if (loadSource === "slab") {
    if (!scheme) slabPreview = <p className="text-sm">Choose the scheme above to derive the load from its slab.</p>;
    else if (scheme.slabThicknessMm == null) slabPreview = <p className="text-sm font-semibold text-bad">Scheme {scheme.reference} gives no slab thickness; enter the load directly.</p>;
    else {
      const x = parseLength(spacingX ?? "", u.length);
      const y = parseLength(spacingY ?? "", u.length);
      if (x.ok && y.ok && x.value > 0 && y.value > 0) {
        const r = deriveSlabLoad({ ...scheme }, x.value, y.value);
        slabPreview = r.ok ? (
          <div className="rounded-lg bg-paper-sunk p-3 text-sm" data-testid="slab-load-preview">
            <p className="text-base font-bold">
              Derived working load: <span className="tabular">{formatForce(r.info.loadPerMemberN, forceUnit)}</span>
            </p>
            <ul className="tabular mt-1 space-y-0.5">
              <li>Slab {formatLength(r.info.slabThicknessMm)} → concrete {r.info.concreteKnM2.toFixed(2)} kN/m²</li>
              <li>+ formwork {r.info.formworkKnM2.toFixed(2)} kN/m² + construction {r.info.constructionKnM2.toFixed(2)} kN/m² = {r.info.totalKnM2.toFixed(2)} kN/m²</li>
              <li>× tributary area {r.info.tributaryAreaM2.toFixed(3)} m² ({formatLength(x.value, lengthUnit)} × {formatLength(y.value, lengthUnit)})</li>
            </ul>
            {r.info.warnings.map((w, i) => (
              <p key={i} className="mt-1 text-warn">⚠ {w}</p>
            ))}
          </div>
        ) : (
          <p className="text-sm font-semibold text-bad">{Object.values(r.fields)[0]}</p>
        );
      } else slabPreview = <p className="text-sm">Enter both as-built spacings to see the derived load.</p>;
    }
  }

  const levels = scheme?.backprop?.shoredLevels ?? 0;
  if (loadSource === "backprop") {
    if (!scheme) slabPreview = <p className="text-sm">Choose the scheme above to derive the load from its back-propping.</p>;
    else if (!scheme.backprop) slabPreview = <p className="text-sm font-semibold text-bad">Scheme {scheme.reference} has no back-propping; choose another load source.</p>;
    else {
      const x = parseLength(spacingX ?? "", u.length);
      const y = parseLength(spacingY ?? "", u.length);
      if (!level) slabPreview = <p className="text-sm">Choose the member&apos;s level of props to see its load.</p>;
      else if (x.ok && y.ok && x.value > 0 && y.value > 0) {
        const r = deriveBackpropLoad(scheme, Number(level), x.value, y.value);
        slabPreview = r.ok ? (
          <div className="rounded-lg bg-paper-sunk p-3 text-sm" data-testid="backprop-load-preview">
            <p className="text-base font-bold">
              Derived working load: <span className="tabular">{formatForce(r.info.loadPerMemberN, forceUnit)}</span>
            </p>
            <ul className="tabular mt-1 space-y-0.5">
              <li>Level {r.info.level}: {r.info.levelRatio.toFixed(2)} × slab self-weight {r.info.slabSelfWeightKPa.toFixed(2)} kN/m² = {r.info.levelKPa.toFixed(2)} kN/m²</li>
              <li>(largest at “{r.info.governingStage}”, Grundy &amp; Kabaila 1963)</li>
              <li>× tributary area {r.info.tributaryAreaM2.toFixed(3)} m² ({formatLength(x.value, lengthUnit)} × {formatLength(y.value, lengthUnit)})</li>
            </ul>
            {r.info.warnings.slice(-1).map((w, i) => (
              <p key={i} className="mt-1 text-warn">⚠ {w}</p>
            ))}
          </div>
        ) : (
          <p className="text-sm font-semibold text-bad">{Object.values(r.fields)[0]}</p>
        );
      } else slabPreview = <p className="text-sm">Enter both as-built spacings to see the derived load.</p>;
    }
  }

  return (
    <>
      {withTag ? (
        <Field id="tag" label="Tag (the code on its label)" error={err("tag")}>
          <input id="tag" className={inputClass} autoCapitalize="characters" autoComplete="off" aria-invalid={!!err("tag")} aria-describedby={describedBy("tag", err("tag"))} {...register("tag")} />
        </Field>
      ) : null}
      <Field id="zoneId" label="Zone" error={err("zoneId")}>
        <select id="zoneId" className={inputClass} aria-invalid={!!err("zoneId")} aria-describedby={describedBy("zoneId", err("zoneId"))} {...register("zoneId")}>
          <option value="">— No zone —</option>
          {zones.map((z) => (
            <option key={z.id} value={z.id}>{z.name}</option>
          ))}
        </select>
      </Field>
      <Field id="schemeId" label="Scheme" error={err("schemeId")}>
        <select id="schemeId" className={inputClass} aria-invalid={!!err("schemeId")} aria-describedby={describedBy("schemeId", err("schemeId"))} {...register("schemeId")}>
          <option value="">— No scheme —</option>
          {schemes.map((s) => (
            <option key={s.id} value={s.id}>{s.reference} — {s.title}</option>
          ))}
        </select>
      </Field>
      <Field id="memberTypeId" label="Member type" error={err("memberTypeId")} hint={type?.minExtensionMm != null && type.maxExtensionMm != null ? `Extends ${formatLength(type.minExtensionMm, lengthUnit)} to ${formatLength(type.maxExtensionMm, lengthUnit)}` : undefined}>
        <select id="memberTypeId" className={inputClass} aria-invalid={!!err("memberTypeId")} aria-describedby={describedBy("memberTypeId", err("memberTypeId"), !!type)} {...register("memberTypeId")}>
          <option value="">— Choose the type —</option>
          {types.map((t) => (
            <option key={t.id} value={t.id}>{t.name}</option>
          ))}
        </select>
      </Field>
      <Field id="extension" label={`Measured extension (${unitSystem === "us" ? "ft-in" : "mm"})`} error={err("extension")} hint={`In ${u.lengthHint}.`}>
        <input id="extension" className={`${inputClass} tabular`} inputMode={unitSystem === "us" ? "text" : "decimal"} autoComplete="off" aria-invalid={!!err("extension")} aria-describedby={describedBy("extension", err("extension"), true)} {...register("extension")} />
      </Field>
      <Field id="endConditions" label="End conditions" error={err("endConditions")}>
        <select id="endConditions" className={inputClass} aria-invalid={!!err("endConditions")} aria-describedby={describedBy("endConditions", err("endConditions"))} {...register("endConditions")}>
          {END_CONDITIONS.map((e) => (
            <option key={e.id} value={e.id}>{e.label}</option>
          ))}
        </select>
      </Field>
      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 text-sm font-semibold">Load the member carries</legend>
        <div className="grid grid-cols-2 gap-2">
          <label className="flex min-h-touch items-center gap-2 rounded-lg border-2 border-ink/30 bg-paper-raised px-3 has-[:checked]:border-brand has-[:checked]:bg-brand-soft">
            <input type="radio" value="direct" className="h-5 w-5" {...register("loadSource")} /> Enter the load
          </label>
          <label className="flex min-h-touch items-center gap-2 rounded-lg border-2 border-ink/30 bg-paper-raised px-3 has-[:checked]:border-brand has-[:checked]:bg-brand-soft">
            <input type="radio" value="slab" className="h-5 w-5" {...register("loadSource")} /> From the slab
          </label>
          {scheme?.backprop || loadSource === "backprop" ? (
            <label className="col-span-2 flex min-h-touch items-center gap-2 rounded-lg border-2 border-ink/30 bg-paper-raised px-3 has-[:checked]:border-brand has-[:checked]:bg-brand-soft">
              <input type="radio" value="backprop" className="h-5 w-5" {...register("loadSource")} /> From back-propping
            </label>
          ) : null}
        </div>
        {err("loadSource") ? <p role="alert" className="text-sm font-semibold text-bad">⚠ {err("loadSource")}</p> : null}
        {loadSource === "direct" ? (
          <Field id="load" label={`Working load (${forceUnit}, unfactored)`} error={err("load")} hint={`In ${u.forceHint}.`}>
            <input id="load" className={`${inputClass} tabular`} inputMode="decimal" autoComplete="off" aria-invalid={!!err("load")} aria-describedby={describedBy("load", err("load"), true)} {...register("load")} />
          </Field>
        ) : (
          <>
          {loadSource === "backprop" ? (
            <Field id="level" label="Level of props" error={err("level")} hint="Level 1 is the props right under the slab being cast; level 2 the props under the slab below it, and so on down.">
              <select id="level" className={inputClass} aria-invalid={!!err("level")} aria-describedby={describedBy("level", err("level"), true)} {...register("level")}>
                <option value="">— Choose the level —</option>
                {Array.from({ length: Math.max(levels, Number(level) || 0) }, (_, i) => i + 1).map((l) => (
                  <option key={l} value={String(l)}>
                    Level {l}{l === 1 ? " — right under the slab being cast" : l === levels ? " — the lowest" : ""}
                  </option>
                ))}
              </select>
            </Field>
          ) : null}
          <div className="grid grid-cols-2 gap-2">
            <Field id="spacingX" label={`As-built spacing X (${unitSystem === "us" ? "ft-in" : "mm"})`} error={err("spacingX")}>
              <input id="spacingX" className={`${inputClass} tabular`} inputMode={unitSystem === "us" ? "text" : "decimal"} autoComplete="off" aria-invalid={!!err("spacingX")} aria-describedby={describedBy("spacingX", err("spacingX"))} {...register("spacingX")} />
            </Field>
            <Field id="spacingY" label={`As-built spacing Y (${unitSystem === "us" ? "ft-in" : "mm"})`} error={err("spacingY")}>
              <input id="spacingY" className={`${inputClass} tabular`} inputMode={unitSystem === "us" ? "text" : "decimal"} autoComplete="off" aria-invalid={!!err("spacingY")} aria-describedby={describedBy("spacingY", err("spacingY"))} {...register("spacingY")} />
            </Field>
          </div>
          </>
        )}
        {slabPreview}
      </fieldset>
      <Field id="notes" label="Notes (optional)" error={err("notes")}>
        <textarea id="notes" rows={2} className={inputClass} aria-invalid={!!err("notes")} aria-describedby={describedBy("notes", err("notes"))} {...register("notes")} />
      </Field>
    </>
  );
}
