"use client";
// Create or edit a member type of any kind. Supplier tables are typed row by row or pasted as
// CSV, checked with the same schema the server uses, and drawn as a chart while they are typed.
import { useRouter } from "next/navigation";
import { useCallback, useState } from "react";
import { useFieldArray, useForm, type Resolver } from "react-hook-form";
import { CartesianGrid, Line, LineChart, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import { Icon } from "@/components/icons";
import { useServerErrors } from "@/components/use-server-errors";
import { speakUnits } from "@/lib/calculator/units-speech";
import { apiJson } from "@/lib/client/api";
import { Button } from "@/components/ui/button";
import { describedBy, Field, inputClass } from "@/components/ui/field";
import {
  FORMED, MEMBER_TYPE_KIND_LABELS, MEMBER_TYPE_KINDS, memberTypeSchema, parseTableCsv, PROP_CLASSES, STEEL_GRADE_IDS, TIMBER_CLASS_IDS, TIMBER_TYPES,
  type MemberTypeKind,
} from "@/lib/validations/member-type";

type Row = { length: string; load: string };
type Values = {
  kind: MemberTypeKind; name: string; supplier: string; notes: string;
  propClass: string; minExtension: string; maxExtension: string;
  rows: Row[];
  shape: string; dMm: string; tMm: string; bMm: string; hMm: string; areaMm2: string; iMinMm4: string;
  grade: string; formed: string; strengthClass: string; timberType: string;
};

type Existing = { id: string; name: string; kind: MemberTypeKind; supplier: string | null; notes: string | null; params: Record<string, unknown>; minExtensionMm: number | null; maxExtensionMm: number | null };

const n = (s: string) => (s.trim() === "" ? undefined : Number(s));
const str = (v: unknown) => (v == null ? "" : String(v));

function initialValues(e?: Existing): Values {
  const p = (e?.params ?? {}) as Record<string, unknown>;
  const section = (p.section ?? {}) as Record<string, unknown>;
  const table = (p.table ?? []) as { lengthMm: number; safeLoadN: number }[];
  return {
    kind: e?.kind ?? "en1065-prop",
    name: e?.name ?? "",
    supplier: e?.supplier ?? "",
    notes: e?.notes ?? "",
    propClass: str(p.propClass) || "D",
    minExtension: str(e?.minExtensionMm),
    maxExtension: str(e?.maxExtensionMm),
    rows: table.length ? table.map((r) => ({ length: String(r.lengthMm), load: String(r.safeLoadN / 1000) })) : [{ length: "", load: "" }, { length: "", load: "" }],
    shape: str(section.shape) || (e?.kind === "timber-section" ? "rect" : "chs"),
    dMm: str(section.dMm), tMm: str(section.tMm), bMm: str(section.bMm), hMm: str(section.hMm), areaMm2: str(section.areaMm2), iMinMm4: str(section.iMinMm4),
    grade: str(p.grade) || "S355",
    formed: str(p.formed) || "hot-finished",
    strengthClass: str(p.strengthClass) || "C24",
    timberType: str(p.timberType),
  };
}

/** The API payload (SI: mm, N) from the form's text. */
function toPayload(v: Values): Record<string, unknown> {
  const common = { kind: v.kind, name: v.name, supplier: v.supplier.trim() || null, notes: v.notes.trim() || null };
  switch (v.kind) {
    case "en1065-prop":
      return { ...common, params: { propClass: v.propClass }, minExtensionMm: n(v.minExtension), maxExtensionMm: n(v.maxExtension) };
    case "supplier-table":
    case "trench-strut":
      return {
        ...common,
        params: { table: v.rows.filter((r) => r.length.trim() || r.load.trim()).map((r) => ({ lengthMm: n(r.length), safeLoadN: r.load.trim() === "" ? undefined : Number(r.load) * 1000 })) },
      };
    case "steel-section": {
      const section =
        v.shape === "chs" ? { shape: "chs", dMm: n(v.dMm), tMm: n(v.tMm) }
        : v.shape === "rhs" ? { shape: "rhs", bMm: n(v.bMm), hMm: n(v.hMm), tMm: n(v.tMm) }
        : v.shape === "rect" ? { shape: "rect", bMm: n(v.bMm), hMm: n(v.hMm) }
        : v.shape === "round" ? { shape: "round", dMm: n(v.dMm) }
        : { shape: "given", areaMm2: n(v.areaMm2), iMinMm4: n(v.iMinMm4) };
      return { ...common, params: { section, grade: v.grade, formed: v.formed } };
    }
    case "timber-section": {
      const section = v.shape === "round" ? { shape: "round", dMm: n(v.dMm) } : { shape: "rect", bMm: n(v.bMm), hMm: n(v.hMm) };
      return { ...common, params: { section, strengthClass: v.strengthClass, ...(v.timberType ? { timberType: v.timberType } : {}) } };
    }
  }
}

/** The schema speaks the API's N; this form types safe loads in kN. */
const speakSi = (m: string) => speakUnits(m, "si");

/** API error path → form field. */
function fieldFor(path: string): string {
  const m = /^params\.table\.(\d+)\.(lengthMm|safeLoadN)$/.exec(path);
  if (m) return `rows.${m[1]}.${m[2] === "lengthMm" ? "length" : "load"}`;
  if (path.startsWith("params.table")) return "rows";
  const map: Record<string, string> = { minExtensionMm: "minExtension", maxExtensionMm: "maxExtension", "params.propClass": "propClass", "params.grade": "grade", "params.formed": "formed", "params.strengthClass": "strengthClass", "params.section": "shape", "params.timberType": "timberType" };
  if (map[path]) return map[path]!;
  const s = /^params\.section\.(\w+)$/.exec(path);
  if (s) return s[1]!;
  return path === "params" ? "name" : path;
}

function errorsOf(all: Record<string, string>) {
  const out: Record<string, unknown> = {};
  for (const [path, message] of Object.entries(all)) {
    const parts = path.split(".");
    let node = out as Record<string, unknown>;
    parts.forEach((p, i) => {
      if (i === parts.length - 1) node[p] = { type: "validate", message };
      else node = (node[p] ??= /^\d+$/.test(parts[i + 1]!) ? [] : {}) as Record<string, unknown>;
    });
  }
  return out;
}

export function MemberTypeForm({ siteId, existing, usedBy = 0 }: { siteId: string; existing?: Existing; usedBy?: number }) {
  const router = useRouter();
  const resolver: Resolver<Values> = useCallback(async (values) => {
    const r = memberTypeSchema.safeParse(toPayload({ ...values, kind: existing?.kind ?? values.kind }));
    if (r.success) return { values, errors: {} };
    const all: Record<string, string> = {};
    for (const i of r.error.issues) {
      const k = fieldFor(i.path.map(String).join("."));
      if (!(k in all)) all[k] = speakSi(i.message);
    }
    return { values: {}, errors: errorsOf(all) as never };
  }, [existing?.kind]);
  const { register, control, handleSubmit, watch, setError, formState, setValue } = useForm<Values>({ defaultValues: initialValues(existing), resolver });
  const placeErrors = useServerErrors(setError, { fieldOf: fieldFor, speak: speakSi });
  const { fields, append, remove, replace } = useFieldArray({ control, name: "rows" });
  const [csv, setCsv] = useState("");
  const [csvErrors, setCsvErrors] = useState<string[]>([]);
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const [kind, shape, rows] = watch(["kind", "shape", "rows"]);
  const e = formState.errors as Record<string, { message?: string } | undefined> & { rows?: ({ length?: { message?: string }; load?: { message?: string } } | undefined)[] & { message?: string } };
  const err = (k: keyof Values) => (formState.errors[k] as { message?: string } | undefined)?.message;

  const input = (id: keyof Values, label: string, hint?: string, mode: "decimal" | "text" = "decimal") => (
    <Field id={id} label={label} error={err(id)} hint={hint}>
      <input id={id} className={`${inputClass} tabular`} inputMode={mode} autoComplete="off" aria-invalid={!!err(id)} aria-describedby={describedBy(id, err(id), !!hint)} {...register(id)} />
    </Field>
  );
  const select = (id: keyof Values, label: string, options: readonly (string | { value: string; label: string })[]) => (
    <Field id={id} label={label} error={err(id)}>
      <select id={id} className={inputClass} aria-invalid={!!err(id)} aria-describedby={describedBy(id, err(id))} {...register(id)}>
        {options.map((o) => (typeof o === "string" ? <option key={o} value={o}>{o}</option> : <option key={o.value} value={o.value}>{o.label}</option>))}
      </select>
    </Field>
  );

  function readCsv() {
    const r = parseTableCsv(csv);
    setCsvErrors(r.errors);
    if (r.errors.length === 0 && r.rows.length) replace(r.rows.map((x) => ({ length: String(x.lengthMm), load: String(x.safeLoadN / 1000) })));
  }

  const onSubmit = handleSubmit(async (values) => {
    setMessage(null);
    const payload = toPayload({ ...values, kind: existing?.kind ?? values.kind });
    const r = existing
      ? await apiJson<{ recheckedMembers: number }>(`/api/v1/sites/${siteId}/member-types/${existing.id}`, { method: "PATCH", body: payload })
      : await apiJson<{ memberType: { id: string } }>(`/api/v1/sites/${siteId}/member-types`, { body: payload });
    if (!r.ok) {
      placeErrors(r.error);
      setMessage({ ok: false, text: Object.keys(r.error.fields).length ? "Some values need attention; nothing was saved." : r.error.message });
      return;
    }
    if (existing) {
      const n = (r.data as { recheckedMembers: number }).recheckedMembers;
      setMessage({ ok: true, text: `Saved. ${n} member${n === 1 ? "" : "s"} using this type ${n === 1 ? "was" : "were"} re-checked.` });
      router.refresh();
    } else router.push(`/sites/${siteId}/library`);
  });

  async function onDelete() {
    if (!existing) return;
    if (!window.confirm(`Delete "${existing.name}" from the library?`)) return;
    const r = await apiJson(`/api/v1/sites/${siteId}/member-types/${existing.id}`, { method: "DELETE" });
    if (!r.ok) setMessage({ ok: false, text: r.error.message });
    else router.push(`/sites/${siteId}/library`);
  }

  const chart = rows
    .map((r) => ({ x: Number(r.length), y: Number(r.load) }))
    .filter((p) => p.x > 0 && p.y > 0 && Number.isFinite(p.x) && Number.isFinite(p.y))
    .sort((a, b) => a.x - b.x);

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4" aria-label={existing ? "Edit member type" : "New member type"}>
      <Field id="kind" label="Kind of member" error={err("kind")} hint={existing ? "A type's kind cannot change." : undefined}>
        <select id="kind" className={inputClass} disabled={!!existing} {...register("kind", { onChange: (ev) => setValue("shape", ev.target.value === "timber-section" ? "rect" : "chs") })}>
          {MEMBER_TYPE_KINDS.map((k) => <option key={k} value={k}>{MEMBER_TYPE_KIND_LABELS[k]}</option>)}
        </select>
      </Field>
      {input("name", "Name", "As people on site call it, e.g. Class D prop 1.98–3.35 m", "text")}
      {input("supplier", "Supplier or source (optional)", undefined, "text")}

      {kind === "en1065-prop" ? (
        <>
          {select("propClass", "EN 1065 class", PROP_CLASSES)}
          <div className="grid grid-cols-2 gap-2">
            {input("minExtension", "Minimum extension (mm)")}
            {input("maxExtension", "Maximum extension (mm)")}
          </div>
        </>
      ) : null}

      {kind === "supplier-table" || kind === "trench-strut" ? (
        <fieldset className="flex flex-col gap-2">
          <legend className="mb-1 font-semibold">Supplier&apos;s load table (length in mm, safe working load in kN)</legend>
          {e.rows?.message ? <p role="alert" className="text-sm font-semibold text-bad">⚠ {e.rows.message}</p> : null}
          <table className="w-full text-left">
            <thead><tr><th scope="col" className="p-1 text-sm">Length (mm)</th><th scope="col" className="p-1 text-sm">Safe load (kN)</th><th scope="col"><span className="sr-only">Remove</span></th></tr></thead>
            <tbody>
              {fields.map((f, i) => {
                const le = e.rows?.[i]?.length?.message;
                const lo = e.rows?.[i]?.load?.message;
                return (
                  <tr key={f.id} className="align-top">
                    <td className="p-1">
                      <input aria-label={`Row ${i + 1} length (mm)`} className={`${inputClass} tabular`} inputMode="decimal" aria-invalid={!!le} {...register(`rows.${i}.length` as const)} />
                      {le ? <p role="alert" className="text-sm text-bad">⚠ {le}</p> : null}
                    </td>
                    <td className="p-1">
                      <input aria-label={`Row ${i + 1} safe load (kN)`} className={`${inputClass} tabular`} inputMode="decimal" aria-invalid={!!lo} {...register(`rows.${i}.load` as const)} />
                      {lo ? <p role="alert" className="text-sm text-bad">⚠ {lo}</p> : null}
                    </td>
                    <td className="p-1">
                      <button type="button" aria-label={`Remove row ${i + 1}`} className="flex min-h-touch min-w-touch items-center justify-center rounded-lg hover:bg-paper-sunk" onClick={() => remove(i)}>
                        <Icon name="bad" className="h-5 w-5" />
                      </button>
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
          <Button type="button" variant="secondary" onClick={() => append({ length: "", load: "" })}>
            <Icon name="add" /> Add a row
          </Button>
          <details className="rounded-lg border-2 border-ink/15 p-2">
            <summary className="min-h-touch cursor-pointer content-center font-semibold">Paste the table as CSV</summary>
            <label htmlFor="csv" className="text-sm">One row per line: length (mm), safe load (kN). A header line is skipped.</label>
            <textarea id="csv" rows={6} className={`${inputClass} font-mono`} value={csv} onChange={(ev) => setCsv(ev.target.value)} placeholder={"length_mm,safe_load_kn\n1500,100\n2500,85"} />
            {csvErrors.length ? <ul role="alert" className="text-sm font-semibold text-bad">{csvErrors.map((x, i) => <li key={i}>⚠ {x}</li>)}</ul> : null}
            <Button type="button" variant="secondary" className="mt-2" onClick={readCsv}>Use these rows</Button>
          </details>
          {chart.length >= 2 ? (
            <figure className="h-56 w-full" aria-label="Safe load against length">
              <ResponsiveContainer width="100%" height="100%">
                <LineChart data={chart} margin={{ top: 8, right: 16, bottom: 20, left: 0 }}>
                  <CartesianGrid strokeDasharray="3 3" stroke="#c9c6bd" />
                  <XAxis dataKey="x" type="number" domain={["dataMin", "dataMax"]} label={{ value: "Length (mm)", position: "insideBottom", offset: -10 }} />
                  <YAxis width={48} label={{ value: "kN", angle: -90, position: "insideLeft" }} />
                  <Tooltip formatter={(v) => [`${v} kN`, "Safe load"]} labelFormatter={(v) => `${v} mm`} />
                  <Line type="linear" dataKey="y" stroke="#1d4f91" strokeWidth={3} isAnimationActive={false} />
                </LineChart>
              </ResponsiveContainer>
            </figure>
          ) : null}
        </fieldset>
      ) : null}

      {kind === "steel-section" ? (
        <>
          {select("shape", "Section shape", [
            { value: "chs", label: "Circular hollow section (CHS)" },
            { value: "rhs", label: "Rectangular/square hollow section (RHS/SHS)" },
            { value: "rect", label: "Solid rectangular bar" },
            { value: "round", label: "Solid round bar" },
            { value: "given", label: "Given properties (I-section or other)" },
          ])}
          <div className="grid grid-cols-2 gap-2">
            {shape === "chs" ? <>{input("dMm", "Outside diameter (mm)")}{input("tMm", "Wall thickness (mm)")}</> : null}
            {shape === "rhs" ? <>{input("bMm", "Width (mm)")}{input("hMm", "Depth (mm)")}{input("tMm", "Wall thickness (mm)")}</> : null}
            {shape === "rect" ? <>{input("bMm", "Width (mm)")}{input("hMm", "Depth (mm)")}</> : null}
            {shape === "round" ? input("dMm", "Diameter (mm)") : null}
            {shape === "given" ? <>{input("areaMm2", "Area (mm²)")}{input("iMinMm4", "Least second moment of area (mm⁴)")}</> : null}
          </div>
          {select("grade", "Steel grade", STEEL_GRADE_IDS)}
          {select("formed", "How it was formed", FORMED.map((f) => ({ value: f, label: f === "hot-finished" ? "Hot-finished (EN 10210)" : "Cold-formed (EN 10219)" })))}
        </>
      ) : null}

      {kind === "timber-section" ? (
        <>
          {select("shape", "Section", [{ value: "rect", label: "Rectangular" }, { value: "round", label: "Round" }])}
          <div className="grid grid-cols-2 gap-2">
            {shape === "round" ? input("dMm", "Diameter (mm)") : <>{input("bMm", "Width (mm)")}{input("hMm", "Depth (mm)")}</>}
          </div>
          {select("strengthClass", "Strength class", TIMBER_CLASS_IDS)}
          {select("timberType", "Timber type", [{ value: "", label: "As the strength class says" }, ...TIMBER_TYPES.map((t) => ({ value: t, label: t }))])}
        </>
      ) : null}

      <Field id="notes" label="Notes (optional)" error={err("notes")}>
        <textarea id="notes" rows={2} className={inputClass} {...register("notes")} />
      </Field>
      {message ? (
        <p role={message.ok ? "status" : "alert"} className={`flex items-start gap-2 rounded-lg border-2 p-3 font-semibold ${message.ok ? "border-ok bg-ok-soft text-ok" : "border-bad bg-bad-soft text-bad"}`}>
          <Icon name={message.ok ? "ok" : "bad"} className="mt-0.5 h-5 w-5 shrink-0" /> {message.text}
        </p>
      ) : null}
      <Button type="submit" disabled={formState.isSubmitting}>
        {formState.isSubmitting ? "Saving…" : existing ? (usedBy ? `Save and re-check ${usedBy} member${usedBy === 1 ? "" : "s"}` : "Save changes") : "Add to the library"}
      </Button>
      {existing ? (
        <Button type="button" variant="danger" onClick={onDelete}>
          Delete this type
        </Button>
      ) : null}
    </form>
  );
}
