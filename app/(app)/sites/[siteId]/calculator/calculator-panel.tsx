"use client";

import { Icon } from "@/components/icons";
import { zodResolver } from "@hookform/resolvers/zod";
import { useEffect, useMemo, useRef, useState } from "react";
import { useLocalDraft } from "@/components/use-local-draft";
import { apiJson } from "@/lib/client/api";
import { typeToForm, type LibraryType } from "@/lib/calculator/from-type";
import { plausibilityWarnings, speakUnits, switchUnits, type UnitSwitchMemory } from "@/lib/calculator/units-speech";
import { useForm, type UseFormRegister } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { describedBy, Field, inputClass } from "@/components/ui/field";
import { fieldForPath, formToRequest, unitLabels } from "@/lib/calculator/form-request";
import { calculate, capacityCurve, CHECK_METHODS, END_CONDITIONS, METHODS, SOILS, STEEL_GRADES, TIMBER_CLASSES } from "@/lib/engineering";
import type { CalculationResult, MethodId } from "@/lib/engineering";
import { CALCULATOR_DEFAULTS, calculatorFormSchema, type CalculatorForm } from "@/lib/validations/calculator";
import { CapacityChart } from "@/components/capacity-chart";
import { ResultView } from "./result-view";

type Props = { siteId: string; defaultUnits: "si" | "us"; defaultDesignCode: "en1993" | "aisc360-lrfd" | "aisc360-asd" };

const SECTION_METHODS: MethodId[] = ["euler", "en1993", "aisc360-lrfd", "aisc360-asd", "en1995", "nds", "point-brace", "out-of-plumb", "raking-combined"];
const STEEL_METHODS: MethodId[] = ["en1993", "aisc360-lrfd", "aisc360-asd", "out-of-plumb", "raking-combined"];
const ALL_METHODS = [...METHODS, ...CHECK_METHODS];
const CURVE_METHODS: string[] = METHODS.map((m) => m.id);

export function CalculatorPanel({ siteId, defaultUnits, defaultDesignCode }: Props) {
  const [outcome, setOutcome] = useState<{ result: CalculationResult; request: Record<string, unknown>; units: "si" | "us" } | null>(null);
  const [formError, setFormError] = useState<string | null>(null);
  const resultRef = useRef<HTMLDivElement>(null);
  // On a phone the result is below the form: bring it into view after each calculation.
  useEffect(() => {
    if (outcome?.result.ok && window.matchMedia("(max-width: 1023px)").matches) resultRef.current?.scrollIntoView({ behavior: "smooth", block: "start" });
  }, [outcome]);
  const form = useForm<CalculatorForm>({
    resolver: zodResolver(calculatorFormSchema),
    defaultValues: { ...CALCULATOR_DEFAULTS, units: defaultUnits, method: "en1065", designBasis: defaultDesignCode === "aisc360-asd" ? "asd" : "lrfd" },
  });
  const { register, handleSubmit, watch, setError, formState, getValues, reset } = form;
  // What was typed stays on this device, so a reload (or a dropped signal) keeps the inputs.
  const draft = useLocalDraft<CalculatorForm>(
    `strutwise:calculator:${siteId}`,
    (d) => reset(d),
    (raw) => {
      if (!raw || typeof raw !== "object") return null;
      const merged = { ...CALCULATOR_DEFAULTS, ...(raw as Partial<CalculatorForm>) };
      // A draft from an older form (unknown method, a non-text value) is ignored rather than half-restored.
      const sound = ALL_METHODS.some((m) => m.id === merged.method) && (merged.units === "si" || merged.units === "us") && Object.values(merged).every((v) => typeof v === "string");
      return sound ? merged : null;
    },
  );
  const { ready: draftReady, save: saveDraft } = draft;
  useEffect(() => {
    if (!draftReady) return;
    const sub = watch((v) => saveDraft(v as CalculatorForm));
    return () => sub.unsubscribe();
  }, [draftReady, watch, saveDraft]);
  const unitMemory = useRef<UnitSwitchMemory | null>(null);
  // Changing the units re-expresses every typed value (4000 mm becomes 157.48 in), never re-reads it.
  const changeUnits = (to: "si" | "us") => {
    const current = getValues();
    if (current.units === to) return;
    const next = switchUnits(current, to, unitMemory.current);
    unitMemory.current = next.memory;
    reset(next.values, { keepDefaultValues: true });
    setOutcome(null);
    setFormError(null);
  };
  const plausible = plausibilityWarnings(watch());
  const [library, setLibrary] = useState<LibraryType[] | null>(null);
  const [fromType, setFromType] = useState<string | null>(null);
  useEffect(() => {
    let live = true;
    void apiJson<{ items: LibraryType[] }>(`/api/v1/sites/${siteId}/member-types`).then((r) => {
      if (live) setLibrary(r.ok ? r.data.items.filter((t) => typeToForm(t, CALCULATOR_DEFAULTS, defaultDesignCode) !== null) : []);
    });
    return () => {
      live = false;
    };
  }, [siteId, defaultDesignCode]);
  const startFromType = (id: string) => {
    const type = library?.find((t) => t.id === id);
    if (!type) return;
    const values = typeToForm(type, getValues(), defaultDesignCode);
    if (!values) return;
    unitMemory.current = null;
    reset(values, { keepDefaultValues: true });
    setFromType(type.name);
    setOutcome(null);
    setFormError(null);
  };
  const errors = formState.errors;
  const method = watch("method");
  const units = watch("units");
  const shape = watch("shape");
  const u = unitLabels(units);
  const plumbTarget = watch("plumbTarget");
  const checkCode = watch("checkCode");
  const info = ALL_METHODS.find((m) => m.id === method)!;
  const plumbProp = method === "out-of-plumb" && plumbTarget === "prop";
  const showSection = SECTION_METHODS.includes(method) && !plumbProp;
  const lengthless = method === "base-bearing" || method === "backprop-sequence";
  const shapes = info.sectionShapes;

  const onSubmit = handleSubmit((values) => {
    setFormError(null);
    const { request, fieldErrors } = formToRequest(values);
    const local = Object.entries(fieldErrors);
    if (local.length) {
      for (const [f, message] of local) setError(f as keyof CalculatorForm, { message });
      setOutcome(null);
      return;
    }
    const result = calculate(request);
    if (!result.ok) {
      const general: string[] = [];
      for (const e of result.errors) {
        const f = fieldForPath(e.field);
        const message = speakUnits(e.message, values.units);
        if (f) setError(f, { message });
        else general.push(message);
      }
      setFormError(general.length ? general.join(" ") : "Some values need attention; see the fields marked below.");
    }
    // Warnings are written in SI by the engine; say them in the form's units.
    const spoken = result.ok ? { ...result, warnings: result.warnings.map((w) => speakUnits(w, values.units)) } : result;
    setOutcome({ result: spoken, request, units: values.units });
  });

  const curve = useMemo(() => {
    if (!outcome || !outcome.result.ok) return null;
    const req = outcome.request;
    if (!CURVE_METHODS.includes(String(req.method))) return null;
    const L = req.lengthMm as number;
    let from = L * 0.5;
    let to = L * 1.5;
    if (req.method === "en1065") {
      from = (req.minExtensionMm as number | undefined) ?? L * 0.6;
      to = (req.maxExtensionMm as number | undefined) ?? L;
    }
    if (req.method === "supplier-table") {
      const t = req.table as { lengthMm: number }[];
      from = t[0]!.lengthMm;
      to = t[t.length - 1]!.lengthMm;
    }
    const us = outcome.units === "us";
    const points = capacityCurve(req, from, to, 60);
    const operating = req.loadN !== undefined ? { lengthMm: L, loadN: req.loadN as number } : null;
    return { points, operating, lengthUnit: us ? "ft" : "m", forceUnit: us ? "kip" : "kN" } as const;
  }, [outcome]);

  return (
    <div className="grid gap-6 lg:grid-cols-[minmax(0,24rem)_1fr]">
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4 rounded-xl border-2 border-ink/15 bg-paper-raised p-4" aria-label="Calculation inputs">
        {library && library.length ? (
          <Field id="fromType" label="Start from a library type (optional)" hint={fromType ? `Inputs filled from the library type “${fromType}”; change any value before calculating.` : "Fills the method and the type's section, material or range."}>
            <select id="fromType" className={inputClass} value="" onChange={(e) => startFromType(e.target.value)}>
              <option value="">— choose a type —</option>
              {library.map((t) => (
                <option key={t.id} value={t.id}>
                  {t.name}
                </option>
              ))}
            </select>
          </Field>
        ) : null}
        <Field id="method" label="Method" hint={info.description}>
          <select id="method" className={inputClass} {...register("method")}>
            <optgroup label="Member capacity">
              {METHODS.map((m) => (
                <option key={m.id} value={m.id}>
                  {m.label}
                </option>
              ))}
            </optgroup>
            <optgroup label="Checks around the member">
              {CHECK_METHODS.map((m) => (
                <option key={m.id} value={m.id}>
                  {m.label}
                </option>
              ))}
            </optgroup>
          </select>
        </Field>
        <fieldset className="flex gap-2" aria-label="Units">
          <legend className="mb-1 text-sm font-semibold">Units</legend>
          {(["si", "us"] as const).map((v) => (
            <label key={v} className="flex min-h-touch flex-1 cursor-pointer items-center justify-center gap-2 rounded-lg border-2 border-ink/30 px-3 has-[:checked]:border-brand has-[:checked]:bg-brand-soft">
              <input type="radio" name="units" value={v} checked={units === v} onChange={() => changeUnits(v)} />
              {v === "si" ? "SI (mm, kN, MPa)" : "US (in, kip, ksi)"}
            </label>
          ))}
        </fieldset>
        {method === "out-of-plumb" ? (
          <Field id="plumbTarget" label="Member">
            <select id="plumbTarget" className={inputClass} {...register("plumbTarget")}>
              <option value="steel">Steel tube or section</option>
              <option value="prop">EN 1065 adjustable prop</option>
            </select>
          </Field>
        ) : null}
        {!lengthless ? (
          <Text
            id="length"
            label={method === "en1065" || method === "supplier-table" || plumbProp ? `Extension (${u.length})` : method === "raking-combined" ? `Raker length head to foot (${u.length})` : `Length between restraints (${u.length})`}
            reg={register}
            error={errors.length?.message}
            warn={plausible.length}
            hint={units === "us" ? `e.g. 9' 6" or 114 in` : "e.g. 2850 or 2.85 m"}
          />
        ) : null}
        {["out-of-plumb", "raking-combined"].includes(method) && !plumbProp ? (
          <Field id="checkCode" label="Design code">
            <select id="checkCode" className={inputClass} {...register("checkCode")}>
              <option value="en1993">EN 1993-1-1 §6.3.3</option>
              <option value="aisc360">AISC 360-16 §H1</option>
            </select>
          </Field>
        ) : null}

        {showSection ? (
          <>
            <Field id="ends" label="End conditions" hint="Recommended design K from the method's own code (AISC Table C-A-7.1, NDS Appendix G, BS 5950-1 / BS 5268-2 practice for Eurocodes) unless you give K.">
              <select id="ends" className={inputClass} {...register("ends")}>
                <option value="">Both ends pinned (default)</option>
                {END_CONDITIONS.map((e) => (
                  <option key={e.id} value={e.id}>
                    {e.label} — K {e.designK}
                  </option>
                ))}
              </select>
            </Field>
            <Text id="k" label="Effective length factor K (optional)" reg={register} error={errors.k?.message} />
            <Field id="shape" label="Section">
              <select id="shape" className={inputClass} {...register("shape")}>
                {shapes.map((s) => (
                  <option key={s} value={s}>
                    {{ chs: "Circular hollow (tube)", rhs: "Rectangular hollow", rect: "Solid rectangle", round: "Solid round", given: "Given A and I" }[s]}
                  </option>
                ))}
              </select>
            </Field>
            {shape === "chs" || shape === "round" ? <Text id="d" label={`Outside diameter D (${u.dim})`} reg={register} error={errors.d?.message} /> : null}
            {shape === "rhs" || shape === "rect" ? (
              <>
                <Text id="b" label={`Width b (${u.dim})`} reg={register} error={errors.b?.message} />
                <Text id="h" label={`Depth h (${u.dim})`} reg={register} error={errors.h?.message} />
              </>
            ) : null}
            {shape === "chs" || shape === "rhs" ? <Text id="t" label={`Wall thickness t (${u.dim})`} reg={register} error={errors.t?.message} /> : null}
            {shape === "given" ? (
              <>
                <Text id="area" label={`Area A (${u.area})`} reg={register} error={errors.area?.message} />
                <Text id="iMin" label={`Least second moment of area I (${u.inertia})`} reg={register} error={errors.iMin?.message} />
              </>
            ) : null}
          </>
        ) : null}

        {STEEL_METHODS.includes(method) && !plumbProp ? (
          <>
            <Field id="steelGrade" label="Steel grade" hint="Or type fy below to override.">
              <select id="steelGrade" className={inputClass} {...register("steelGrade")}>
                <option value="">— choose —</option>
                {STEEL_GRADES.map((g) => (
                  <option key={g.id} value={g.id}>
                    {g.label}
                  </option>
                ))}
              </select>
            </Field>
            <Text id="fy" label={`Yield strength fy (${u.stress})`} reg={register} error={errors.fy?.message} warn={plausible.fy} />
            {(method.startsWith("aisc") || (STEEL_METHODS.includes(method) && checkCode === "aisc360")) && (shape === "chs" || shape === "rhs") ? (
              <Field id="hssWeld" label="Tube welding" hint="AISC 360-16 §B4.2: design wall 0.93t for ERW, 1.0t for submerged-arc welded.">
                <select id="hssWeld" className={inputClass} {...register("hssWeld")}>
                  <option value="">Electric-resistance welded (default)</option>
                  <option value="erw">Electric-resistance welded</option>
                  <option value="saw">Submerged-arc welded</option>
                </select>
              </Field>
            ) : null}
          </>
        ) : null}
        {["out-of-plumb", "raking-combined"].includes(method) && !plumbProp && checkCode === "en1993" ? (
          <Field id="formed" label="How the section was made" hint="Chooses the buckling curve (EN 1993-1-1 Table 6.2) and the corner radii.">
            <select id="formed" className={inputClass} {...register("formed")}>
              <option value="">Not stated</option>
              <option value="hot-finished">Hot-finished</option>
              <option value="cold-formed">Cold-formed</option>
            </select>
          </Field>
        ) : null}
        {method === "out-of-plumb" ? (
          <>
            <Text id="plumbDeg" label="Out of plumb, angle (degrees)" reg={register} error={errors.plumbDeg?.message} hint="From the inspection, e.g. 3. Or give the offset below." />
            <Text id="plumbOffset" label={`Out of plumb, offset of head over base (${u.dim})`} reg={register} error={errors.plumbOffset?.message} />
          </>
        ) : null}
        {["out-of-plumb", "raking-combined"].includes(method) ? (
          <Text id="eccentricity" label={`Load eccentricity at the ends (${u.dim}, optional)`} reg={register} error={errors.eccentricity?.message} />
        ) : null}
        {method === "raking-combined" ? (
          <>
            <Text id="angle" label="Raker angle from horizontal (degrees)" reg={register} error={errors.angle?.message} />
            <Text id="selfWeight" label={`Self-weight (${u.lineLoad}, optional)`} reg={register} error={errors.selfWeight?.message} hint="Taken from the steel area when left empty." />
          </>
        ) : null}
        {method === "base-bearing" ? (
          <>
            <Text id="basePlateB" label={`Base plate width (${u.dim})`} reg={register} error={errors.basePlateB?.message} />
            <Text id="basePlateL" label={`Base plate length (${u.dim})`} reg={register} error={errors.basePlateL?.message} />
            <Text id="solePlateB" label={`Sole plate width (${u.dim}, optional)`} reg={register} error={errors.solePlateB?.message} />
            <Text id="solePlateL" label={`Sole plate length (${u.dim}, optional)`} reg={register} error={errors.solePlateL?.message} />
            <Text id="solePlateT" label={`Sole plate thickness (${u.dim}, optional)`} reg={register} error={errors.solePlateT?.message} />
            <Field id="soil" label="Ground" hint="Presumptive values for a first check (common practice); a site investigation governs.">
              <select id="soil" className={inputClass} {...register("soil")}>
                <option value="">— typed pressure or slab below —</option>
                {Object.entries(SOILS).map(([id, s]) => (
                  <option key={id} value={id}>
                    {s.label} ({units === "us" ? `${Math.round(s.kPa / 0.04788)} psf` : `${s.kPa} kPa`})
                  </option>
                ))}
              </select>
            </Field>
            <Text id="allowablePressure" label={`Allowable bearing pressure (${u.pressure}, optional)`} reg={register} error={errors.allowablePressure?.message} />
            <Text id="slabEffDepth" label={`Slab below: effective depth d (${u.dim}, back-props only)`} reg={register} error={errors.slabEffDepth?.message} />
            <Text id="fck" label={`Slab concrete strength f_ck / f'c (${u.concrete})`} reg={register} error={errors.fck?.message} />
            <Field id="punchingCode" label="Punching check">
              <select id="punchingCode" className={inputClass} {...register("punchingCode")}>
                <option value="en1992">EN 1992-1-1 §6.4</option>
                <option value="aci318">ACI 318-19 §22.6</option>
              </select>
            </Field>
            <Text id="plumbDeg" label="Prop out of plumb, angle (degrees, optional)" reg={register} error={errors.plumbDeg?.message} hint="The horizontal force at the base is worked out from the lean. Or give the offset below." />
            <Text id="plumbOffset" label={`Prop out of plumb, offset of head over base (${u.dim}, optional)`} reg={register} error={errors.plumbOffset?.message} />
            <Text id="length" label={`Prop length, for the offset (${u.length})`} reg={register} error={errors.length?.message} />
            <Text id="friction" label="Friction coefficient at the base (optional)" reg={register} error={errors.friction?.message} hint="Checks sliding of a leaning prop's base; none is assumed." />
          </>
        ) : null}
        {method === "backprop-sequence" ? (
          <>
            <Text id="shoredLevels" label="Levels of props in use at once (1–6)" reg={register} error={errors.shoredLevels?.message} />
            <Text id="slabSelfWeight" label={`Slab self-weight (${u.pressure})`} reg={register} error={errors.slabSelfWeight?.message} />
            <Text id="formworkLoad" label={`Formwork self-weight (${u.pressure}, optional)`} reg={register} error={errors.formworkLoad?.message} />
            <Text id="constructionLoad" label={`Construction load while casting (${u.pressure}, optional)`} reg={register} error={errors.constructionLoad?.message} />
            <Text id="cycles" label="Casting cycles to follow (optional)" reg={register} error={errors.cycles?.message} />
          </>
        ) : null}
        {method === "en1993" ? (
          <>
            <Field id="formed" label="How the section was made" hint="Chooses the buckling curve (EN 1993-1-1 Table 6.2) unless you pick one.">
              <select id="formed" className={inputClass} {...register("formed")}>
                <option value="">Not stated</option>
                <option value="hot-finished">Hot-finished</option>
                <option value="cold-formed">Cold-formed</option>
              </select>
            </Field>
            <Field id="curve" label="Buckling curve (optional)">
              <select id="curve" className={inputClass} {...register("curve")}>
                <option value="">From the section (Table 6.2)</option>
                {["a0", "a", "b", "c", "d"].map((c) => (
                  <option key={c} value={c}>
                    {c}
                  </option>
                ))}
              </select>
            </Field>
            <Text id="gammaM1" label="γM1 (default 1.0)" reg={register} error={errors.gammaM1?.message} />
          </>
        ) : null}
        {["euler", "en1993", "aisc360-lrfd", "aisc360-asd", "point-brace"].includes(method) ? (
          <Text id="e" label={`Modulus E (${u.stress}, optional)`} reg={register} error={errors.e?.message} warn={plausible.e} />
        ) : null}

        {method === "en1995" ? (
          <>
            <Field id="strengthClass" label="Strength class (EN 338 / EN 14080)">
              <select id="strengthClass" className={inputClass} {...register("strengthClass")}>
                <option value="">— choose —</option>
                {TIMBER_CLASSES.map((c) => (
                  <option key={c.id} value={c.id}>
                    {c.id}
                  </option>
                ))}
              </select>
            </Field>
            <Text id="fc0k" label={`Compression strength f_c,0,k (${u.timberStress}, optional: overrides the class)`} reg={register} error={errors.fc0k?.message} warn={plausible.fc0k} />
            <Text id="e005" label={`Modulus E0,05 (${u.timberStress}, optional: overrides the class)`} reg={register} error={errors.e005?.message} warn={plausible.e005} />
            <Text id="kmod" label="kmod (optional)" reg={register} error={errors.kmod?.message} />
            <Text id="gammaM" label="γM (optional)" reg={register} error={errors.gammaM?.message} />
          </>
        ) : null}
        {method === "nds" ? (
          <>
            <Text id="fcStar" label={`Fc* adjusted (${u.timberStress})`} reg={register} error={errors.fcStar?.message} warn={plausible.fcStar} />
            <Text id="eMin" label={`Emin' adjusted (${u.timberStress})`} reg={register} error={errors.eMin?.message} warn={plausible.eMin} />
            <Field id="timberType" label="Timber type">
              <select id="timberType" className={inputClass} {...register("timberType")}>
                <option value="">Sawn (c = 0.8)</option>
                <option value="round">Round pole (c = 0.85)</option>
                <option value="glulam">Glulam (c = 0.9)</option>
              </select>
            </Field>
          </>
        ) : null}
        {method === "en1065" || plumbProp ? (
          <>
            <Field id="propClass" label="EN 1065 class">
              <select id="propClass" className={inputClass} {...register("propClass")}>
                {["A", "B", "C", "D", "E"].map((c) => (
                  <option key={c} value={c}>
                    Class {c}
                  </option>
                ))}
              </select>
            </Field>
            <Text id="maxExtension" label={`Maximum extension (${u.dim})`} reg={register} error={errors.maxExtension?.message} />
            <Text id="minExtension" label={`Minimum extension (${u.dim}, as marked on the prop)`} reg={register} error={errors.minExtension?.message} />
          </>
        ) : null}
        {method === "supplier-table" ? (
          <Field id="supplierInterpolation" label="Between rows" hint="Capacity falls with about 1/L², so a straight line between rows would overstate it.">
            <select id="supplierInterpolation" className={inputClass} {...register("supplierInterpolation")}>
              <option value="inverse-square">Interpolate linearly in 1/L²</option>
              <option value="lower-row">Take the lower row</option>
            </select>
          </Field>
        ) : null}
        {method === "supplier-table" ? (
          <Field id="table" label={`Supplier table: one row per line, "length (${u.dim}), safe load (${u.force})"`} error={errors.table?.message}>
            <textarea
              id="table"
              rows={5}
              className={`${inputClass} font-mono`}
              placeholder={units === "us" ? "60, 22\n100, 18\n140, 12" : "1500, 100\n2500, 85\n3500, 62"}
              aria-invalid={!!errors.table}
              aria-describedby={describedBy("table", errors.table?.message)}
              {...register("table")}
            />
          </Field>
        ) : null}
        {method === "point-brace" ? (
          <>
            <Text id="braces" label="Number of equally spaced braces" reg={register} error={errors.braces?.message} />
            <Field id="designBasis" label="AISC Appendix 6 basis">
              <select id="designBasis" className={inputClass} {...register("designBasis")}>
                <option value="lrfd">LRFD (φ = 0.75)</option>
                <option value="asd">ASD (Ω = 2.00)</option>
              </select>
            </Field>
          </>
        ) : null}
        {method !== "backprop-sequence" ? (
          <Text
            id="load"
            label={`Load to compare (${u.force}${["point-brace", "out-of-plumb", "base-bearing", "raking-combined"].includes(method) ? ", required" : ", optional"})`}
            reg={register}
            error={errors.load?.message}
            hint={loadHint(info.basis)}
          />
        ) : null}
        {formError ? (
          <p role="alert" className="rounded-lg border-2 border-bad bg-bad-soft p-3 font-semibold text-bad">
            <Icon name="bad" className="mr-1 inline h-5 w-5 align-text-bottom" />
            {formError}
          </p>
        ) : null}
        <Button type="submit">Calculate</Button>
      </form>

      <div ref={resultRef} className="flex min-w-0 scroll-mt-16 flex-col gap-4">
        {outcome?.result.ok ? (
          <>
            <ResultView result={outcome.result} units={outcome.units} />
            {curve && curve.points.length > 1 ? <CapacityChart {...curve} axis="Length" title="Capacity against length" /> : null}
          </>
        ) : (
          <p className="rounded-xl border-2 border-dashed border-ink/30 p-6 text-ink-soft">
            Enter the member and press Calculate. The capacity, utilisation and every step of the working appear here.
          </p>
        )}
      </div>
    </div>
  );
}

function loadHint(basis: string) {
  if (basis === "design-resistance") return "A factored (design) load: this method gives a design resistance.";
  if (basis === "available-strength") return "A factored (LRFD) load: this method gives the design strength φcPn.";
  if (basis === "allowable-strength") return "A working (unfactored) load: this method gives an allowable strength.";
  if (basis === "safe-working-load") return "A working (unfactored) load: this method gives a safe working load.";
  if (basis === "bearing-resistance") return "The load on the base: working load for ground bearing, design (factored) load for punching of a slab.";
  if (basis === "brace-requirement") return "The member's required axial strength: the braces are sized from it.";
  return "The load to compare with the elastic critical load (no safety margin).";
}

function Text({
  id, label, reg, error, hint, warn,
}: { id: keyof CalculatorForm; label: string; reg: UseFormRegister<CalculatorForm>; error?: string; hint?: string; warn?: string }) {
  return (
    <div className="flex flex-col gap-1">
    <Field id={id} label={label} error={error} hint={hint}>
      <input
        id={id}
        inputMode="decimal"
        autoComplete="off"
        className={inputClass}
        aria-invalid={!!error}
        aria-describedby={describedBy(id, error, !!hint)}
        {...reg(id)}
      />
    </Field>
    {warn && !error ? (
      <p id={`${id}-warning`} role="status" className="flex items-start gap-1 rounded-lg border-2 border-warn bg-warn-soft p-2 text-sm">
        <Icon name="warn" className="h-4 w-4 shrink-0 text-warn" />
        {warn}
      </p>
    ) : null}
    </div>
  );
}
