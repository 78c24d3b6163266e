"use client";
// Edits a member (PATCH). A change that affects capacity re-checks it; the new result shows at once.
// With no signal the edit waits on the phone with the version it was made against; if the member
// changes on the server meanwhile, the header's list shows both and the person chooses.
import { useRouter } from "next/navigation";
import { useCallback, useEffect, useRef, useState } from "react";
import { useForm } from "react-hook-form";
import { Icon } from "@/components/icons";
import { PlanPlacePicker, type PlanPlace } from "@/components/plan/plan-place-picker";
import { useServerErrors } from "@/components/use-server-errors";
import { submitOrQueue } from "@/lib/client/outbox/submit";
import { CheckResult, type CheckSummary } from "@/components/register/check-result";
import { MemberFields, type SchemeOption, type TypeOption, type ZoneOption } from "@/components/register/member-fields";
import { EMPTY_MEMBER_FORM, FIELD_OF, forceText, lengthText, toMemberInput, type MemberFormValues, type UnitSystem } from "@/components/register/member-form-values";
import { Button } from "@/components/ui/button";
import { describedBy, Field, inputClass } from "@/components/ui/field";
import { speakUnits } from "@/lib/calculator/units-speech";
import { MEMBER_STATUS_LABELS } from "@/lib/labels";

const editFieldOf = (k: string): string => FIELD_OF[k] ?? k;

type EditValues = MemberFormValues & { status: string };

export function MemberEditForm({
  siteId, memberId, unitSystem, member, zones, schemes, types,
}: {
  siteId: string;
  memberId: string;
  unitSystem: UnitSystem;
  member: {
    tag: string; zoneId: string | null; schemeId: string | null; memberTypeId: string; extensionMm: number; endConditions: string;
    loadSource: "direct" | "slab" | "backprop"; level: number | null; loadN: number; spacingXMm: number | null; spacingYMm: number | null; notes: string | null; status: string;
    planX: number | null; planY: number | null;
    /** The version this form was loaded with: a newer one on the server is refused (409), not overwritten. */
    version: number;
  };
  zones: ZoneOption[];
  schemes: SchemeOption[];
  types: TypeOption[];
}) {
  const router = useRouter();
  const initial: EditValues = {
    ...EMPTY_MEMBER_FORM,
    tag: member.tag,
    zoneId: member.zoneId ?? "",
    schemeId: member.schemeId ?? "",
    memberTypeId: member.memberTypeId,
    extension: lengthText(member.extensionMm, unitSystem),
    endConditions: member.endConditions,
    loadSource: member.loadSource,
    load: forceText(member.loadN, unitSystem),
    level: member.level != null ? String(member.level) : "",
    spacingX: lengthText(member.spacingXMm, unitSystem),
    spacingY: lengthText(member.spacingYMm, unitSystem),
    notes: member.notes ?? "",
    status: member.status,
  };
  const { register, handleSubmit, watch, setError, formState } = useForm<EditValues>({ defaultValues: initial });
  // The API speaks N and mm; this form types kN (or kip and feet-inches).
  const speak = useCallback((m: string) => speakUnits(m, unitSystem), [unitSystem]);
  const placeErrors = useServerErrors(setError, { fieldOf: editFieldOf, speak });
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const [result, setResult] = useState<{ check: CheckSummary; loadN: number } | null>(null);
  const statusError = formState.errors.status?.message;
  const initialPlace: PlanPlace = member.planX != null && member.planY != null ? { x: member.planX, y: member.planY } : null;
  const [place, setPlace] = useState<PlanPlace>(initialPlace);
  const [placeError, setPlaceError] = useState<string | undefined>();
  const zoneId = watch("zoneId");
  const lastZone = useRef(zoneId);
  // A place belongs to one zone's plan: choosing another zone starts with no place on its plan.
  useEffect(() => {
    if (lastZone.current !== zoneId) setPlace(zoneId === initial.zoneId ? initialPlace : null);
    lastZone.current = zoneId;
    // eslint-disable-next-line react-hooks/exhaustive-deps -- only a change of zone resets the place
  }, [zoneId]);
  // Loaded, struck and out of service belong to the lifecycle: an edit cannot leave them
  // (lib/register/member-lifecycle.ts). Draft and submitted may be swapped or taken out of service.
  const editable = ["draft", "submitted"].includes(member.status);
  const lockedHint =
    member.status === "out_of_service"
      ? "Out of service: it returns to service only through a passing inspection, not by editing."
      : member.status === "struck"
        ? "Struck under a permit to strike: its status cannot change."
        : "Loaded under a permit to load: its status follows the permit.";

  const onSubmit = handleSubmit(async (values) => {
    setMessage(null);
    const { input, errors } = toMemberInput(values, unitSystem);
    if (Object.keys(errors).length) {
      for (const [k, m] of Object.entries(errors)) setError(k as keyof EditValues, { type: "parse", message: m });
      return;
    }
    // Send only what changed, so the audit shows exactly that.
    const before: Record<string, unknown> = toMemberInput(initial, unitSystem).input;
    const patch: Record<string, unknown> = {};
    for (const [k, v] of Object.entries(input)) if (JSON.stringify(v) !== JSON.stringify(before[k])) patch[k] = v;
    if (input.loadSource === "direct" && before.loadN !== undefined && input.loadN !== undefined && Math.abs(Number(input.loadN) - member.loadN) < 0.5) delete patch.loadN;
    if (values.status !== member.status) patch.status = values.status;
    if (JSON.stringify(place) !== JSON.stringify(values.zoneId === initial.zoneId ? initialPlace : null)) patch.planPosition = place;
    setPlaceError(undefined);
    if (Object.keys(patch).length === 0) {
      setMessage({ ok: true, text: "Nothing changed." });
      return;
    }
    const r = await submitOrQueue<{ member: { loadN: number }; check: CheckSummary | null }>({
      kind: "edit",
      siteId,
      label: `Edit of ${member.tag}`,
      method: "PATCH",
      path: `/api/v1/members/${memberId}`,
      presignPath: `/api/v1/members/${memberId}/photos`,
      body: { ...patch, baseVersion: member.version },
      display: {
        unitSystem,
        names: Object.fromEntries([...zones.map((z) => [z.id, z.name]), ...schemes.map((s) => [s.id, `${s.reference} — ${s.title}`]), ...types.map((t) => [t.id, t.name])]),
      },
    });
    if (!r.sent && r.queued) {
      setMessage({ ok: true, text: "Saved on this phone — waiting to send. If the member changes on the server meanwhile, you are shown both and asked which to keep." });
      return;
    }
    if (!r.sent && r.error.status === 409 && r.error.fields.baseVersion) {
      // Keep what was typed; the page behind it shows the member as it is now after a refresh.
      setMessage({ ok: false, text: `${r.error.message} Your changes are still in this form: note what you want to keep, then reload to see the member as it is now.` });
      return;
    }
    if (!r.sent) {
      const planField = Object.entries(r.error.fields).find(([k]) => k.startsWith("planPosition"));
      if (planField) setPlaceError(planField[1]);
      placeErrors({ ...r.error, fields: Object.fromEntries(Object.entries(r.error.fields).filter(([k]) => !k.startsWith("planPosition"))) });
      setMessage({ ok: false, text: Object.keys(r.error.fields).length ? "Some values need attention; nothing was changed." : r.error.message });
      return;
    }
    setResult(r.data.check ? { check: r.data.check, loadN: r.data.member.loadN } : null);
    setMessage({ ok: true, text: r.data.check ? "Saved and re-checked." : "Saved." });
    router.refresh();
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4" aria-label="Edit member">
      <MemberFields register={register as never} errors={formState.errors} watch={watch as never} unitSystem={unitSystem} zones={zones} schemes={schemes} types={types} />
      <PlanPlacePicker siteId={siteId} zoneId={zoneId} memberId={memberId} value={place} onChange={setPlace} error={placeError} />
      <Field id="status" label="Status" error={statusError} hint={editable ? "Taking a member out of service is always allowed; only a passing inspection returns it to service." : lockedHint}>
        <select id="status" className={inputClass} disabled={!editable} aria-invalid={!!statusError} aria-describedby={describedBy("status", statusError, true)} {...register("status")}>
          {(editable ? (["draft", "submitted", "out_of_service"] as const) : ([member.status] as const)).map((s) => (
            <option key={s} value={s}>{MEMBER_STATUS_LABELS[s as keyof typeof MEMBER_STATUS_LABELS]}</option>
          ))}
        </select>
      </Field>
      {message ? (
        <p role={message.ok ? "status" : "alert"} className={`flex items-center gap-2 font-semibold ${message.ok ? "text-ok" : "text-bad"}`}>
          <Icon name={message.ok ? "ok" : "bad"} className="h-5 w-5" /> {message.text}
        </p>
      ) : null}
      {result ? <CheckResult check={result.check} loadN={result.loadN} forceUnit={unitSystem === "us" ? "kip" : "kN"} title="New check" /> : null}
      <Button type="submit" disabled={formState.isSubmitting}>{formState.isSubmitting ? "Saving…" : "Save changes"}</Button>
    </form>
  );
}
