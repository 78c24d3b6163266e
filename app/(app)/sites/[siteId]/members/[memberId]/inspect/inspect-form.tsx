"use client";
// The inspection checklist on a phone: each item pass or fail with a note, photos, the overall
// result. What is typed is kept on the device until the server has it.
import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useEffect, useRef, useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { Icon } from "@/components/icons";
import { useLocalDraft } from "@/components/use-local-draft";
import { useServerErrors } from "@/components/use-server-errors";
import { newClientId, submitOrQueue } from "@/lib/client/outbox/submit";
import { PhotoUploader, type QueuedFile, type UploadedPhoto } from "@/components/register/photo-uploader";
import { Button, ButtonLink } from "@/components/ui/button";
import { describedBy } from "@/components/ui/field";
import { formatDateTime } from "@/lib/format-date";
import { INSPECTION_CHECKS } from "@/lib/inspections/checklist";
import { inspectionSchema, type InspectionInput } from "@/lib/validations/inspection";

/** Photo and plumb-reading problems are said above the submit button, not on a checklist field. */
const inspectFieldOf = (k: string): string => (k === "photoIds" || k.startsWith("plumb") ? "_" : k);

type FormIn = z.input<typeof inspectionSchema>;
/** The plumb reading as typed (in the site's units), converted to the API's degrees or mm on submit. */
type Plumb = { mode: "deg" | "offset"; deg: string; offset: string; over: string };
type Draft = { values: FormIn; photos: UploadedPhoto[]; plumb?: Plumb };
const emptyPlumb = (): Plumb => ({ mode: "deg", deg: "", offset: "", over: "" });

/** The typed plumb reading as API fields, or the sentence saying what is wrong with it (in the site's units). */
function plumbFields(p: Plumb, us: boolean): { ok: true; value: { plumbDeg?: number; plumbOffsetMm?: number; plumbOverMm?: number } } | { ok: false; error: string } {
  const unit = us ? "in" : "mm";
  const num = (t: string) => (t.trim() === "" ? undefined : Number(t.trim().replace(",", ".")));
  if (p.mode === "deg") {
    const deg = num(p.deg);
    if (deg === undefined) return { ok: true, value: {} };
    if (!Number.isFinite(deg) || deg < 0 || deg > 45) return { ok: false, error: `Out of plumb: give the angle from vertical in degrees, from 0 to 45 (got "${p.deg}").` };
    return { ok: true, value: { plumbDeg: deg } };
  }
  const offset = num(p.offset);
  const over = num(p.over);
  if (offset === undefined) return over === undefined ? { ok: true, value: {} } : { ok: false, error: `Out of plumb: give the offset (${unit}) measured over that height.` };
  if (!Number.isFinite(offset) || offset < 0) return { ok: false, error: `Out of plumb: give the offset as a number of ${unit}, 0 or more (got "${p.offset}").` };
  if (over !== undefined && (!Number.isFinite(over) || over <= 0)) return { ok: false, error: `Out of plumb: the height the offset was measured over must be more than 0 ${unit} (got "${p.over}").` };
  const toMm = (v: number) => (us ? v * 25.4 : v);
  return { ok: true, value: { plumbOffsetMm: toMm(offset), ...(over !== undefined ? { plumbOverMm: toMm(over) } : {}) } };
}

const emptyValues = (): FormIn => ({
  result: undefined as unknown as "pass",
  items: INSPECTION_CHECKS.map((c) => ({ check: c.key, result: undefined as unknown as "pass", note: "" })),
  notes: "",
  photoIds: [],
});

type Recheck = { outOfPlumbDeg: number; check: { pass: boolean; utilisation: number | null } } | null;
type Saved = { result: "pass" | "fail"; memberStatus: string; removedFromPermits: { label: string }[]; nextDueAt: string | null; queued?: boolean; leaving?: boolean; recheck?: Recheck };

/** The round's next member due, after this one (null when nothing else is due). */
type NextDue = { memberId: string; tag: string } | null;

export function InspectForm({
  siteId, memberId, tag, status, plumbToleranceMm, intervalDays, next, roundQuery, timeZone, unitSystem = "si",
}: { siteId: string; memberId: string; tag: string; status: string; plumbToleranceMm: number; intervalDays: number; next: NextDue; roundQuery: string; timeZone: string; unitSystem?: "si" | "us" }) {
  const us = unitSystem === "us";
  const [plumb, setPlumb] = useState<Plumb>(emptyPlumb());
  const router = useRouter();
  const draftKey = `strutwise:inspection-draft:${memberId}`;
  const [photos, setPhotos] = useState<UploadedPhoto[]>([]);
  const [photosBusy, setPhotosBusy] = useState(false);
  const [restored, setRestored] = useState(false);
  const [uploaderKey, setUploaderKey] = useState(0);
  const [formError, setFormError] = useState<string | null>(null);
  const [saved, setSaved] = useState<Saved | null>(null);
  const [allSaid, setAllSaid] = useState<string | null>(null);
  const queuedPhotos = useRef<QueuedFile[]>([]);
  const {
    register, handleSubmit, watch, reset, setValue, setError, formState: { errors, isSubmitting },
  } = useForm<FormIn, unknown, InspectionInput>({ resolver: zodResolver(inspectionSchema), defaultValues: emptyValues() });

  // Restore a draft typed earlier on this device.
  const draft = useLocalDraft<Draft>(draftKey, (d) => {
    reset(d.values);
    setPhotos(d.photos ?? []);
    setPlumb(d.plumb ?? emptyPlumb());
    setUploaderKey((k) => k + 1);
    setRestored(true);
  });
  const { ready: loaded, save: saveDraft } = draft;
  const placeErrors = useServerErrors(setError, { fieldOf: inspectFieldOf });

  const values = watch();
  useEffect(() => {
    if (!loaded || saved) return;
    const touched = values.result || values.notes || photos.length || (values.items ?? []).some((i) => i.result || i.note) || plumb.deg || plumb.offset || plumb.over;
    if (touched) saveDraft({ values, photos, plumb });
  }, [values, photos, plumb, loaded, saveDraft, saved]);

  const anyFailed = (values.items ?? []).some((i) => i.result === "fail");
  useEffect(() => {
    if (anyFailed && values.result !== "fail") setValue("result", "fail");
  }, [anyFailed, values.result, setValue]);

  const roundHref = `/sites/${siteId}/inspections${roundQuery ? `?${roundQuery}` : ""}`;
  /** The next member due on the round, with a word about the one just recorded; or the round, complete. */
  function afterSaving(returned: boolean) {
    const p = new URLSearchParams(roundQuery);
    if (next) {
      p.set("recorded", tag);
      if (returned) p.set("returned", "1");
      return `/sites/${siteId}/members/${next.memberId}/inspect?${p}`;
    }
    p.set("complete", tag);
    return `/sites/${siteId}/inspections?${p}`;
  }

  /** "All satisfactory": every item passes, and so the member — except an item already marked failed, which stays failed (and still needs its note). */
  function allSatisfactory() {
    let kept = 0;
    INSPECTION_CHECKS.forEach((_, i) => {
      if (values.items?.[i]?.result === "fail") kept += 1;
      else setValue(`items.${i}.result` as const, "pass", { shouldDirty: true });
    });
    if (!kept) setValue("result", "pass", { shouldDirty: true });
    setAllSaid(
      kept
        ? `${INSPECTION_CHECKS.length - kept} items marked satisfactory; ${kept} failed item${kept === 1 ? " is" : "s are"} kept as failed and still need${kept === 1 ? "s" : ""} a note.`
        : `All ${INSPECTION_CHECKS.length} items and the overall result marked satisfactory. Change any item that is not, then record the inspection.`,
    );
  }

  async function onSubmit(form: InspectionInput) {
    setFormError(null);
    const reading = plumbFields(plumb, us);
    if (!reading.ok) {
      setFormError(reading.error);
      return;
    }
    const input: InspectionInput = { ...form, ...reading.value };
    // With no signal (or a request lost on a weak one) the inspection waits in the outbox and is sent once.
    const r = await submitOrQueue<{ inspection: { nextDueAt: string | null; result: "pass" | "fail" }; member: { status: string }; removedFromPermits: { label: string }[]; recheck: Recheck }>({
      kind: "inspection",
      siteId,
      label: `Inspection of ${tag} (${input.result === "pass" ? "pass" : "fail"})`,
      path: `/api/v1/members/${memberId}/inspections`,
      presignPath: `/api/v1/members/${memberId}/photos`,
      body: { ...input, clientId: newClientId() },
      photoIds: photos.map((p) => p.photoId),
      photos: queuedPhotos.current,
    });
    if (!r.sent && r.queued) {
      draft.clear();
      setSaved({ result: input.result, memberStatus: "", removedFromPermits: [], nextDueAt: null, queued: true });
      return;
    }
    if (!r.sent) {
      const { unplaced } = placeErrors(r.error);
      if (unplaced.length) setFormError(unplaced.join(" "));
      return;
    }
    draft.clear();
    setPlumb(emptyPlumb());
    // A pass with no plumb re-check to read: straight on to the next member due (the round in three
    // taps a member). A failure — including one the plumb re-check made — or a re-check to read
    // stays on this screen, which says what it did (out of service, permits, who was told).
    if (r.data.inspection.result === "pass" && !r.data.recheck) {
      setSaved({ result: "pass", memberStatus: r.data.member.status, removedFromPermits: [], nextDueAt: r.data.inspection.nextDueAt, leaving: true });
      router.push(afterSaving(status === "out_of_service" && r.data.member.status !== "out_of_service"));
      return;
    }
    setSaved({ result: r.data.inspection.result, memberStatus: r.data.member.status, removedFromPermits: r.data.removedFromPermits, nextDueAt: r.data.inspection.nextDueAt, recheck: r.data.recheck });
    router.refresh();
  }

  if (saved?.queued) {
    return (
      <section role="status" aria-live="polite" className="flex flex-col gap-3 rounded-xl border-2 border-warn bg-warn-soft p-4">
        <p className="text-lg font-bold">Inspection of {tag} saved on this phone — waiting to send</p>
        <p>No signal just now. It is kept on this phone and sent once when the connection returns; the member&apos;s status changes when the server has it.</p>
        <div className="flex flex-wrap gap-2">
          {next ? <ButtonLink href={afterSaving(false)}>Next: {next.tag}</ButtonLink> : null}
          <ButtonLink href={roundHref} variant={next ? "secondary" : "primary"}>Back to the inspection round</ButtonLink>
        </div>
      </section>
    );
  }

  if (saved?.leaving) {
    return (
      <section role="status" aria-live="polite" className="flex flex-col gap-2 rounded-xl border-2 border-ok bg-ok-soft p-4">
        <p className="flex items-center gap-2 text-lg font-bold text-ok">
          <Icon name="ok" /> Recorded {tag} — {next ? `next: ${next.tag}` : "round complete"}
        </p>
        <p>{next ? `Opening the checklist for ${next.tag}…` : "Back to the round…"}</p>
      </section>
    );
  }

  if (saved) {
    const pass = saved.result === "pass";
    return (
      <section role="status" aria-live="polite" className={`flex flex-col gap-3 rounded-xl border-2 p-4 ${pass ? "border-ok bg-ok-soft" : "border-bad bg-bad-soft"}`}>
        <p className={`flex items-center gap-2 text-lg font-bold ${pass ? "text-ok" : "text-bad"}`}>
          <Icon name={pass ? "ok" : "bad"} /> Inspection recorded: {tag} {pass ? "passed" : "failed"}
        </p>
        {saved.recheck ? (
          <p data-testid="plumb-recheck">
            Re-checked {Number(saved.recheck.outOfPlumbDeg.toFixed(2))}° out of plumb: utilisation{" "}
            {saved.recheck.check.utilisation == null ? "—" : `${Math.round(saved.recheck.check.utilisation * 100)} %`},{" "}
            {saved.recheck.check.pass ? "still passes its capacity check." : recheckFailText(saved.result)}
          </p>
        ) : null}
        {pass ? (
          <p>
            Next inspection due{" "}
            {saved.nextDueAt ? formatDateTime(saved.nextDueAt, timeZone) : `in ${intervalDays} days`}.
            {saved.memberStatus === "submitted" ? " The member is back in service (submitted); it needs a new permit before it is loaded." : ""}
          </p>
        ) : (
          <p>
            {tag} is now out of service
            {saved.removedFromPermits.length ? ` and has been removed from ${saved.removedFromPermits.map((p) => p.label).join(", ")}; the permit's recipients have been e-mailed` : ""}. The site manager and
            coordinator have been alerted. Do not load it until it passes a re-inspection.
          </p>
        )}
        <div className="flex flex-wrap gap-2">
          {next ? <ButtonLink href={afterSaving(false)}>Next due: {next.tag}</ButtonLink> : null}
          <ButtonLink href={roundHref} variant={next ? "secondary" : "primary"}>Back to the inspection round</ButtonLink>
          <Button type="button" variant="secondary" onClick={() => { reset(emptyValues()); setPlumb(emptyPlumb()); setPhotos([]); setUploaderKey((k) => k + 1); setSaved(null); }}>
            Record another inspection
          </Button>
        </div>
      </section>
    );
  }

  const itemErrors = errors.items as unknown as ({ result?: { message?: string }; note?: { message?: string } } | undefined)[] | undefined;

  return (
    <form onSubmit={handleSubmit(onSubmit)} noValidate className="flex flex-col gap-4" aria-label={`Inspection of ${tag}`}>
      {restored ? (
        <p role="status" className="flex items-center gap-2 rounded-lg border-2 border-brand/40 bg-brand-soft p-2 text-sm">
          <Icon name="ok" className="h-4 w-4" /> Your unsent answers for {tag} were restored from this device.
        </p>
      ) : null}
      <fieldset className="flex flex-col gap-3">
        <legend className="mb-2 text-lg font-bold">Checklist</legend>
        <Button type="button" variant="secondary" onClick={allSatisfactory} className="w-full border-ok text-lg">
          <Icon name="ok" /> All satisfactory
        </Button>
        {allSaid ? (
          <p role="status" className="text-sm font-semibold">
            {allSaid}
          </p>
        ) : null}
        {INSPECTION_CHECKS.map((c, i) => {
          const id = `item-${c.key}`;
          const err = itemErrors?.[i];
          const value = values.items?.[i]?.result;
          return (
            <div key={c.key} role="group" aria-labelledby={`${id}-label`} className="rounded-xl border-2 border-ink/15 bg-paper-raised p-3">
              <p id={`${id}-label`} className="font-semibold">
                {c.label}
              </p>
              {c.key === "plumb" ? (
                <>
                  <p className="text-sm text-ink-soft">Site tolerance: out of plumb by no more than {plumbToleranceMm} mm.</p>
                  <PlumbReading plumb={plumb} onChange={setPlumb} us={us} />
                </>
              ) : null}
              <input type="hidden" {...register(`items.${i}.check` as const)} />
              <div className="mt-2 grid grid-cols-2 gap-2">
                {(["pass", "fail"] as const).map((r) => (
                  <label
                    key={r}
                    className={`flex min-h-touch cursor-pointer items-center justify-center gap-2 rounded-lg border-2 font-semibold ${
                      value === r ? (r === "pass" ? "border-ok bg-ok text-white" : "border-bad bg-bad text-white") : "border-ink/40 bg-paper-raised"
                    }`}
                  >
                    <input type="radio" value={r} className="sr-only" {...register(`items.${i}.result` as const)} aria-describedby={err?.result ? `${id}-error` : undefined} />
                    <Icon name={r === "pass" ? "ok" : "bad"} className="h-5 w-5" /> {r === "pass" ? "Pass" : "Fail"}
                    <span className="sr-only"> — {c.label}</span>
                  </label>
                ))}
              </div>
              {err?.result?.message ? (
                <p id={`${id}-error`} role="alert" className="mt-1 text-sm font-semibold text-bad">
                  <span aria-hidden>⚠</span> Choose pass or fail.
                </p>
              ) : null}
              {value === "fail" || values.items?.[i]?.note ? (
                <div className="mt-2 flex flex-col gap-1">
                  <label htmlFor={`${id}-note`} className="text-sm font-semibold">
                    Note{value === "fail" ? " (what is wrong)" : ""}
                  </label>
                  <input
                    id={`${id}-note`}
                    className="min-h-touch w-full rounded-lg border-2 border-ink/40 bg-paper-raised px-3 py-2 aria-[invalid=true]:border-bad"
                    aria-invalid={Boolean(err?.note)}
                    aria-describedby={describedBy(`${id}-note`, err?.note?.message)}
                    {...register(`items.${i}.note` as const)}
                  />
                  {err?.note?.message ? (
                    <p id={`${id}-note-error`} role="alert" className="text-sm font-semibold text-bad">
                      <span aria-hidden>⚠</span> {err.note.message}
                    </p>
                  ) : null}
                </div>
              ) : null}
            </div>
          );
        })}
      </fieldset>

      <PhotoUploader
        key={uploaderKey}
        presignPath={`/api/v1/members/${memberId}/photos`}
        initial={photos}
        label="Photos of the member (optional)"
        onChange={(ready, busy, waiting) => {
          queuedPhotos.current = waiting;
          setPhotos(ready);
          setPhotosBusy(busy);
        }}
      />

      <div className="flex flex-col gap-1">
        <label htmlFor="notes" className="text-sm font-semibold">
          Notes (optional)
        </label>
        <textarea
          id="notes"
          rows={3}
          className="w-full rounded-lg border-2 border-ink/40 bg-paper-raised px-3 py-2"
          aria-invalid={Boolean(errors.notes)}
          aria-describedby={describedBy("notes", errors.notes?.message)}
          {...register("notes")}
        />
        {errors.notes?.message ? (
          <p id="notes-error" role="alert" className="text-sm font-semibold text-bad">
            <span aria-hidden>⚠</span> {errors.notes.message}
          </p>
        ) : null}
      </div>

      <fieldset className="flex flex-col gap-2 rounded-xl border-2 border-ink/30 bg-paper-raised p-3" aria-describedby={errors.result ? "result-error" : undefined}>
        <legend className="px-1 text-lg font-bold">Overall result</legend>
        <div className="grid grid-cols-2 gap-2">
          {(["pass", "fail"] as const).map((r) => (
            <label
              key={r}
              className={`flex min-h-touch cursor-pointer items-center justify-center gap-2 rounded-lg border-2 text-lg font-bold ${
                values.result === r ? (r === "pass" ? "border-ok bg-ok text-white" : "border-bad bg-bad text-white") : "border-ink/40"
              } ${r === "pass" && anyFailed ? "opacity-50" : ""}`}
            >
              <input type="radio" value={r} className="sr-only" disabled={r === "pass" && anyFailed} {...register("result")} />
              <Icon name={r === "pass" ? "ok" : "bad"} /> {r === "pass" ? "Passed" : "Failed"}
            </label>
          ))}
        </div>
        {anyFailed ? <p className="text-sm">An item failed, so the member fails: it will be taken out of service and out of any permit.</p> : null}
        {errors.result?.message ? (
          <p id="result-error" role="alert" className="text-sm font-semibold text-bad">
            <span aria-hidden>⚠</span> {errors.result.message}
          </p>
        ) : null}
      </fieldset>

      {formError ? (
        <p role="alert" className="flex items-start gap-2 rounded-lg border-2 border-bad bg-bad-soft p-3 font-semibold text-bad">
          <Icon name="bad" className="h-5 w-5 shrink-0" /> {formError}
        </p>
      ) : null}
      <Button type="submit" disabled={isSubmitting || photosBusy} className="w-full text-lg">
        {isSubmitting ? "Saving…" : photosBusy ? "Waiting for photos…" : "Record inspection"}
      </Button>
      <Link href={roundHref} className="text-center text-brand underline">
        Back to the round
      </Link>
    </form>
  );
}

function recheckFailText(result: "pass" | "fail") {
  return result === "fail" ? "it fails its capacity check at this lean, so the inspection is recorded as failed." : "it fails its capacity check at this lean.";
}

/** The measured lean, typed as an angle or as an offset over a height; it re-checks the member at that lean. */
function PlumbReading({ plumb, onChange, us }: { plumb: Plumb; onChange: (p: Plumb) => void; us: boolean }) {
  const unit = us ? "in" : "mm";
  const input = "min-h-touch w-full rounded-lg border-2 border-ink/40 bg-paper-raised px-3 py-2";
  return (
    <fieldset className="mt-2 flex flex-col gap-2 rounded-lg border border-ink/20 p-2">
      <legend className="px-1 text-sm font-semibold">Measured lean (optional: the member is re-checked at it)</legend>
      <div className="flex flex-wrap gap-3 text-sm">
        {(["deg", "offset"] as const).map((m) => (
          <label key={m} className="flex min-h-touch items-center gap-2">
            <input type="radio" name="plumb-mode" checked={plumb.mode === m} onChange={() => onChange({ ...plumb, mode: m })} />
            {m === "deg" ? "Angle (degrees)" : `Offset (${unit})`}
          </label>
        ))}
      </div>
      {plumb.mode === "deg" ? (
        <label className="flex flex-col gap-1 text-sm">
          Out of plumb, degrees from vertical
          <input inputMode="decimal" className={input} value={plumb.deg} onChange={(e) => onChange({ ...plumb, deg: e.target.value })} aria-label="Out of plumb, degrees from vertical" />
        </label>
      ) : (
        <div className="grid grid-cols-1 gap-2 sm:grid-cols-2">
          <label className="flex flex-col gap-1 text-sm">
            Offset ({unit})
            <input inputMode="decimal" className={input} value={plumb.offset} onChange={(e) => onChange({ ...plumb, offset: e.target.value })} aria-label={`Out of plumb offset (${unit})`} />
          </label>
          <label className="flex flex-col gap-1 text-sm">
            Measured over a height of ({unit}; blank = the member&apos;s length)
            <input inputMode="decimal" className={input} value={plumb.over} onChange={(e) => onChange({ ...plumb, over: e.target.value })} aria-label={`Height the offset was measured over (${unit})`} />
          </label>
        </div>
      )}
    </fieldset>
  );
}
