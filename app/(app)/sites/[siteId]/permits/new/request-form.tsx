"use client";
// Requesting a permit on a phone: kind, scope, (for striking) the evidence, one main action.
// What is typed stays on the phone until the server has the request.
import { useRouter, useSearchParams } from "next/navigation";
import { useCallback, useEffect, useMemo, useState } from "react";
import { get, useFieldArray, useForm, type Resolver } from "react-hook-form";
import { Icon } from "@/components/icons";
import { useLocalDraft } from "@/components/use-local-draft";
import { useServerErrors } from "@/components/use-server-errors";
import { apiJson } from "@/lib/client/api";
import { Button } from "@/components/ui/button";
import { Field, describedBy, inputClass } from "@/components/ui/field";
import { PERMIT_KIND_LABELS, permitRequestSchema, type PermitRequestInput } from "@/lib/validations/permit";

export type Candidate = {
  id: string;
  tag: string;
  status: "draft" | "submitted" | "loaded" | "struck" | "out_of_service";
  zoneId: string | null;
  zoneName: string | null;
  schemeId: string | null;
  schemeReference: string | null;
  utilisationText: string;
  checkPass: boolean | null;
  blockedForLoad: string | null;
  blockedForStrike: string | null;
  readyPhotos: number;
  inspectionOk: boolean;
};
export type Option = { id: string; label: string };

type FormValues = {
  kind: "load" | "strike";
  scope: "members" | "scheme-zone";
  memberIds: string[];
  schemeId: string;
  zoneId: string;
  note: string;
  basis: "strength" | "designer";
  concreteAgeDays: string;
  requiredStrengthMpa: string;
  results: { specimen: "cube" | "cylinder"; strengthMpa: string }[];
  instruction: string;
  reference: string;
};

const EMPTY: FormValues = {
  kind: "load",
  scope: "members",
  memberIds: [],
  schemeId: "",
  zoneId: "",
  note: "",
  basis: "strength",
  concreteAgeDays: "",
  requiredStrengthMpa: "",
  results: [{ specimen: "cube", strengthMpa: "" }],
  instruction: "",
  reference: "",
};

/** A lone checkbox gives react-hook-form a string (or false), several give an array. */
const idsOf = (v: unknown): string[] => (Array.isArray(v) ? v : typeof v === "string" && v ? [v] : []);

const num = (s: string) => (s.trim() === "" ? undefined : Number(s.trim()));

function toInput(v: FormValues): PermitRequestInput {
  const evidence =
    v.kind !== "strike"
      ? undefined
      : v.basis === "strength"
        ? {
            basis: "strength" as const,
            concreteAgeDays: num(v.concreteAgeDays) as number,
            requiredStrengthMpa: num(v.requiredStrengthMpa) as number,
            results: v.results.map((r) => ({ specimen: r.specimen, strengthMpa: num(r.strengthMpa) as number })),
            note: undefined,
          }
        : { basis: "designer" as const, instruction: v.instruction, reference: v.reference.trim() || undefined };
  return {
    kind: v.kind,
    scope: v.scope,
    memberIds: v.scope === "members" ? idsOf(v.memberIds) : undefined,
    schemeId: v.scope === "scheme-zone" ? v.schemeId : undefined,
    zoneId: v.scope === "scheme-zone" ? v.zoneId : undefined,
    note: v.note.trim() || undefined,
    evidence,
  };
}

/** Where an API or schema error lands in this form. */
function fieldOf(path: string): string {
  if (path === "evidence") return "basis";
  if (path.startsWith("evidence.")) return path.slice("evidence.".length);
  return path;
}

const draftKey = (siteId: string) => `strutwise:permit-request:${siteId}`;

export function RequestForm({ siteId, candidates, schemes, zones }: { siteId: string; candidates: Candidate[]; schemes: Option[]; zones: Option[] }) {
  const router = useRouter();
  const resolver: Resolver<FormValues> = useCallback(async (values) => {
    const parsed = permitRequestSchema.safeParse(toInput(values));
    if (parsed.success) return { values, errors: {} };
    const errors: Record<string, { type: string; message: string }> = {};
    for (const i of parsed.error.issues) {
      const key = fieldOf(i.path.map(String).join("."));
      if (!errors[key]) errors[key] = { type: "validate", message: i.message };
    }
    // zod skips the cross-field rules while another field is invalid; say every missing choice at once.
    if (values.scope === "members" && idsOf(values.memberIds).length === 0) errors.memberIds ??= { type: "validate", message: "Choose at least one member." };
    if (values.scope === "scheme-zone" && !values.schemeId) errors.schemeId ??= { type: "validate", message: "Choose a scheme." };
    if (values.scope === "scheme-zone" && !values.zoneId) errors.zoneId ??= { type: "validate", message: "Choose a zone." };
    // react-hook-form reads nested errors ("results.0.strengthMpa") as objects.
    const nested: Record<string, unknown> = {};
    for (const [k, e] of Object.entries(errors)) {
      const parts = k.split(".");
      let at = nested;
      parts.slice(0, -1).forEach((p) => {
        at[p] = (at[p] as Record<string, unknown>) ?? {};
        at = at[p] as Record<string, unknown>;
      });
      at[parts[parts.length - 1]!] = e;
    }
    return { values: {}, errors: nested as never };
  }, []);
  const { register, handleSubmit, watch, reset, setError, setValue, getValues, control, formState } = useForm<FormValues>({ defaultValues: EMPTY, resolver });
  const results = useFieldArray({ control, name: "results" });
  const [formError, setFormError] = useState<string | null>(null);
  const [restored, setRestored] = useState(false);
  const [prefillNote, setPrefillNote] = useState<string | null>(null);
  const prefillIds = useSearchParams().get("memberIds");
  const placeErrors = useServerErrors(setError, { fieldOf });
  const [filter, setFilter] = useState("");
  const v = watch();
  const err = (name: string): string | undefined => (get(formState.errors, name) as { message?: string } | undefined)?.message;

  const draft = useLocalDraft<Partial<FormValues>>(draftKey(siteId), (d) => {
    reset({ ...EMPTY, ...d });
    setRestored(true);
  });
  const { ready, save: saveDraft } = draft;

  // Members chosen in the register (?memberIds=a,b): chosen here, for the kind of permit they can all be in.
  useEffect(() => {
    if (!ready || !prefillIds) return;
    const wanted = new Set(prefillIds.split(","));
    const chosen = candidates.filter((c) => wanted.has(c.id));
    if (!chosen.length) return;
    const kind = chosen.some((c) => c.status === "draft") || !chosen.every((c) => ["loaded", "out_of_service"].includes(c.status)) ? "load" : "strike";
    const fits = (c: Candidate) => (kind === "load" ? ["draft", "submitted"].includes(c.status) && !c.blockedForLoad : !c.blockedForStrike);
    const left = chosen.filter((c) => !fits(c));
    reset({ ...getValues(), kind, scope: "members", memberIds: chosen.filter(fits).map((c) => c.id) });
    setPrefillNote(
      `${chosen.length - left.length} of the ${chosen.length} members chosen in the register ${chosen.length - left.length === 1 ? "is" : "are"} in this request.` +
        (left.length ? ` Left out: ${left.map((c) => `${c.tag} (${(kind === "load" ? c.blockedForLoad : c.blockedForStrike) ?? "cannot be in this kind of permit"})`).join(", ")}.` : ""),
    );
    // eslint-disable-next-line react-hooks/exhaustive-deps -- once, when the form opens
  }, [ready]);

  useEffect(() => {
    if (!ready) return;
    const sub = watch((values) => saveDraft(values as Partial<FormValues>));
    return () => sub.unsubscribe();
  }, [ready, saveDraft, watch]);

  const blockedFor = (c: Candidate) => (v.kind === "load" ? c.blockedForLoad : c.blockedForStrike);
  const shown = useMemo(() => {
    const f = filter.trim().toLowerCase();
    return candidates.filter(
      (c) =>
        (v.kind === "load" ? ["draft", "submitted"].includes(c.status) : ["loaded", "submitted", "out_of_service"].includes(c.status)) &&
        (!f || c.tag.toLowerCase().includes(f) || (c.zoneName ?? "").toLowerCase().includes(f)),
    );
  }, [candidates, filter, v.kind]);
  const schemeZoneMembers = useMemo(
    () =>
      candidates.filter(
        (c) =>
          c.schemeId === v.schemeId &&
          c.zoneId === v.zoneId &&
          (v.kind === "load" ? ["draft", "submitted"].includes(c.status) : ["loaded", "submitted", "out_of_service"].includes(c.status)),
      ),
    [candidates, v.schemeId, v.zoneId, v.kind],
  );

  // Switching kind drops members that cannot be in the other kind of permit.
  useEffect(() => {
    const allowed = new Set(shown.filter((c) => !blockedFor(c)).map((c) => c.id));
    const chosen = idsOf(v.memberIds);
    const kept = chosen.filter((id) => allowed.has(id) || !candidates.some((c) => c.id === id));
    if (kept.length !== chosen.length && !filter) setValue("memberIds", kept);
    // eslint-disable-next-line react-hooks/exhaustive-deps -- only when the kind changes
  }, [v.kind]);

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    const r = await apiJson<{ permit: { id: string } }>(`/api/v1/sites/${siteId}/permits`, { body: toInput(values) });
    if (!r.ok) {
      setFormError(r.error.message);
      placeErrors(r.error);
      return;
    }
    draft.clear();
    router.push(`/sites/${siteId}/permits/${r.data.permit.id}`);
  });

  const radioCard = (checked: boolean) =>
    `flex min-h-touch cursor-pointer items-start gap-3 rounded-xl border-2 p-3 ${checked ? "border-brand bg-brand-soft" : "border-ink/25 bg-paper-raised"}`;

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5" aria-label="Permit request">
      {restored ? (
        <p role="status" className="rounded-lg border-2 border-brand bg-brand-soft p-3 text-sm">
          Your unsent request was restored from this device.{" "}
          <button
            type="button"
            className="font-semibold underline"
            onClick={() => {
              reset(EMPTY);
              draft.clear();
              setRestored(false);
            }}
          >
            Start again
          </button>
        </p>
      ) : null}

      {prefillNote ? (
        <p role="status" className="rounded-lg border-2 border-brand bg-brand-soft p-3 text-sm" data-testid="prefill-note">
          {prefillNote}
        </p>
      ) : null}

      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 text-lg font-bold">1. What for?</legend>
        {(["load", "strike"] as const).map((k) => (
          <label key={k} className={radioCard(v.kind === k)}>
            <input type="radio" value={k} {...register("kind")} className="mt-1 h-5 w-5" />
            <span>
              <span className="block font-bold">{PERMIT_KIND_LABELS[k]}</span>
              <span className="text-sm text-ink-soft">
                {k === "load" ? "Release members to carry load (pour, stacking, back-propping)." : "Release members to be removed; record the concrete results or the designer's instruction."}
              </span>
            </span>
          </label>
        ))}
      </fieldset>

      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 text-lg font-bold">2. Which members?</legend>
        <div className="grid grid-cols-1 gap-2 sm:grid-cols-2">
          <label className={radioCard(v.scope === "members")}>
            <input type="radio" value="members" {...register("scope")} className="mt-1 h-5 w-5" />
            <span className="font-bold">Choose members</span>
          </label>
          <label className={radioCard(v.scope === "scheme-zone")}>
            <input type="radio" value="scheme-zone" {...register("scope")} className="mt-1 h-5 w-5" />
            <span className="font-bold">All members of a scheme in a zone</span>
          </label>
        </div>

        {v.scope === "members" ? (
          <div className="flex flex-col gap-2">
            <Field id="member-filter" label="Find by tag or zone">
              <input id="member-filter" className={inputClass} value={filter} onChange={(e) => setFilter(e.target.value)} placeholder="e.g. L2-P0" inputMode="search" />
            </Field>
            <p className="text-sm text-ink-soft" aria-live="polite">
              <span className="tabular font-bold text-ink">{idsOf(v.memberIds).length}</span> chosen · {shown.length} shown
            </p>
            {err("memberIds") ? (
              <p id="memberIds-error" role="alert" className="flex items-start gap-1 rounded-lg border-2 border-bad bg-bad-soft p-2 text-sm font-semibold text-bad">
                <Icon name="bad" className="h-5 w-5 shrink-0" /> {err("memberIds")}
              </p>
            ) : null}
            <ul className="flex max-h-[28rem] flex-col gap-1 overflow-y-auto rounded-xl border-2 border-ink/15 bg-paper-raised p-1" aria-label="Members" aria-describedby={err("memberIds") ? "memberIds-error" : undefined}>
              {shown.length === 0 ? <li className="p-3 text-ink-soft">No members {filter ? "match" : `can be in a ${PERMIT_KIND_LABELS[v.kind].toLowerCase()} now`}.</li> : null}
              {shown.map((c) => {
                const blocked = blockedFor(c);
                return (
                  <li key={c.id}>
                    <label className={`flex min-h-touch items-center gap-3 rounded-lg px-2 py-1 ${blocked ? "opacity-80" : "cursor-pointer hover:bg-paper-sunk"}`}>
                      <input type="checkbox" value={c.id} disabled={!!blocked} {...register("memberIds")} className="h-6 w-6 shrink-0" aria-describedby={`cand-${c.id}`} />
                      <span className="min-w-0 flex-1">
                        <span className="block font-bold">{c.tag}</span>
                        <span id={`cand-${c.id}`} className="block text-sm text-ink-soft">
                          {blocked ? (
                            <span className="inline-flex items-center gap-1 font-semibold text-bad">
                              <Icon name="bad" className="h-4 w-4" /> {blocked}
                            </span>
                          ) : (
                            <>
                              {c.zoneName ?? "No zone"} · {c.utilisationText}
                              {v.kind === "load" && c.readyPhotos === 0 ? " · no photo yet" : ""}
                              {v.kind === "load" && !c.inspectionOk ? " · inspection needed" : ""}
                            </>
                          )}
                        </span>
                      </span>
                    </label>
                  </li>
                );
              })}
            </ul>
          </div>
        ) : (
          <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">
            <Field id="schemeId" label="Scheme" error={err("schemeId")}>
              <select id="schemeId" className={inputClass} {...register("schemeId")} aria-invalid={!!err("schemeId")} aria-describedby={describedBy("schemeId", err("schemeId"))}>
                <option value="">Choose a scheme</option>
                {schemes.map((s) => (
                  <option key={s.id} value={s.id}>
                    {s.label}
                  </option>
                ))}
              </select>
            </Field>
            <Field id="zoneId" label="Zone" error={err("zoneId")}>
              <select id="zoneId" className={inputClass} {...register("zoneId")} aria-invalid={!!err("zoneId")} aria-describedby={describedBy("zoneId", err("zoneId"))}>
                <option value="">Choose a zone</option>
                {zones.map((z) => (
                  <option key={z.id} value={z.id}>
                    {z.label}
                  </option>
                ))}
              </select>
            </Field>
            {v.schemeId && v.zoneId ? (
              <p className="text-sm sm:col-span-2" aria-live="polite">
                <span className="tabular font-bold">{schemeZoneMembers.length}</span> member{schemeZoneMembers.length === 1 ? "" : "s"} in scope
                {schemeZoneMembers.some((c) => blockedFor(c)) ? (
                  <span className="mt-1 flex items-start gap-1 font-semibold text-bad">
                    <Icon name="bad" className="h-4 w-4 shrink-0" /> Cannot be requested:{" "}
                    {schemeZoneMembers
                      .filter((c) => blockedFor(c))
                      .map((c) => `${c.tag} (${blockedFor(c)})`)
                      .join(", ")}
                  </span>
                ) : null}
              </p>
            ) : null}
          </div>
        )}
      </fieldset>

      {v.kind === "strike" ? (
        <fieldset className="flex flex-col gap-3">
          <legend className="mb-1 text-lg font-bold">3. Evidence the permanent works can carry themselves</legend>
          <div className="grid grid-cols-1 gap-2 sm:grid-cols-2">
            <label className={radioCard(v.basis === "strength")}>
              <input type="radio" value="strength" {...register("basis")} className="mt-1 h-5 w-5" />
              <span className="font-bold">Concrete strength results</span>
            </label>
            <label className={radioCard(v.basis === "designer")}>
              <input type="radio" value="designer" {...register("basis")} className="mt-1 h-5 w-5" />
              <span className="font-bold">Designer&apos;s instruction</span>
            </label>
          </div>
          {err("basis") ? (
            <p role="alert" className="text-sm font-semibold text-bad">
              ⚠ {err("basis")}
            </p>
          ) : null}
          {v.basis === "strength" ? (
            <div className="flex flex-col gap-3">
              <div className="grid grid-cols-2 gap-3">
                <Field id="concreteAgeDays" label="Concrete age (days)" error={err("concreteAgeDays")}>
                  <input id="concreteAgeDays" inputMode="numeric" className={inputClass} {...register("concreteAgeDays")} aria-invalid={!!err("concreteAgeDays")} aria-describedby={describedBy("concreteAgeDays", err("concreteAgeDays"))} />
                </Field>
                <Field id="requiredStrengthMpa" label="Required striking strength (MPa)" error={err("requiredStrengthMpa")}>
                  <input id="requiredStrengthMpa" inputMode="decimal" className={inputClass} {...register("requiredStrengthMpa")} aria-invalid={!!err("requiredStrengthMpa")} aria-describedby={describedBy("requiredStrengthMpa", err("requiredStrengthMpa"))} />
                </Field>
              </div>
              <p className="font-semibold">Results</p>
              {results.fields.map((f, i) => (
                <div key={f.id} className="grid grid-cols-[7rem_1fr_auto] items-end gap-2">
                  <Field id={`results-${i}-specimen`} label={`Specimen ${i + 1}`}>
                    <select id={`results-${i}-specimen`} className={inputClass} {...register(`results.${i}.specimen` as const)}>
                      <option value="cube">Cube</option>
                      <option value="cylinder">Cylinder</option>
                    </select>
                  </Field>
                  <Field id={`results-${i}-strength`} label="Strength (MPa)" error={err(`results.${i}.strengthMpa`)}>
                    <input
                      id={`results-${i}-strength`}
                      inputMode="decimal"
                      className={inputClass}
                      {...register(`results.${i}.strengthMpa` as const)}
                      aria-invalid={!!err(`results.${i}.strengthMpa`)}
                      aria-describedby={describedBy(`results-${i}-strength`, err(`results.${i}.strengthMpa`))}
                    />
                  </Field>
                  <Button type="button" variant="secondary" onClick={() => results.remove(i)} disabled={results.fields.length === 1} aria-label={`Remove result ${i + 1}`}>
                    <Icon name="bad" className="h-5 w-5" />
                  </Button>
                </div>
              ))}
              {err("results") ? <p role="alert" className="text-sm font-semibold text-bad">⚠ {err("results")}</p> : null}
              <Button type="button" variant="secondary" onClick={() => results.append({ specimen: "cube", strengthMpa: "" })} disabled={results.fields.length >= 12}>
                <Icon name="add" /> Add a result
              </Button>
            </div>
          ) : (
            <div className="flex flex-col gap-3">
              <Field id="instruction" label="The designer's instruction (quote it)" error={err("instruction")}>
                <textarea id="instruction" rows={4} className={inputClass} {...register("instruction")} aria-invalid={!!err("instruction")} aria-describedby={describedBy("instruction", err("instruction"))} />
              </Field>
              <Field id="reference" label="Reference (e-mail, drawing or letter)" error={err("reference")}>
                <input id="reference" className={inputClass} {...register("reference")} />
              </Field>
            </div>
          )}
        </fieldset>
      ) : null}

      <Field id="note" label={`${v.kind === "strike" ? "4" : "3"}. Note for the coordinator (optional)`} error={err("note")}>
        <textarea id="note" rows={3} className={inputClass} {...register("note")} placeholder="e.g. Bays 1 and 2 ready for the pour on Thursday" />
      </Field>

      {formError ? (
        <p role="alert" className="flex items-start gap-2 rounded-lg border-2 border-bad bg-bad-soft p-3 font-semibold text-bad">
          <Icon name="bad" className="h-5 w-5 shrink-0" /> {formError}
        </p>
      ) : null}

      <div className="sticky bottom-24 z-10 md:bottom-4">
        <Button type="submit" className="w-full text-lg shadow-lg" disabled={formState.isSubmitting}>
          {formState.isSubmitting ? "Sending…" : `Send the ${PERMIT_KIND_LABELS[v.kind].toLowerCase()} request`}
        </Button>
      </div>
    </form>
  );
}
