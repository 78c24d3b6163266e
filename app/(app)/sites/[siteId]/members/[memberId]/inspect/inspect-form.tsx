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

/** Photo problems are said above the form, beside the uploader, not on a field. */
const inspectFieldOf = (k: string): string => (k === "photoIds" ? "_" : k);

type FormIn = z.input<typeof inspectionSchema>;
type Draft = { values: FormIn; photos: UploadedPhoto[] };

const emptyValues = (): FormIn => ({
  result: undefined as unknown as "pass",
  items: INSPECTION_CHECKS.map((c) => ({ check: c.key, result: undefined as unknown as "pass", note: "" })),
  notes: "",
  photoIds: [],
});

type Saved = { result: "pass" | "fail"; memberStatus: string; removedFromPermits: { label: string }[]; nextDueAt: string | null; queued?: boolean };

export function InspectForm({
  siteId, memberId, tag, plumbToleranceMm, intervalDays, timeZone,
}: { siteId: string; memberId: string; tag: string; plumbToleranceMm: number; intervalDays: number; timeZone: string }) {
  const router = useRouter();
  const draftKey = `strutwise:inspection-draft:${memberId}`;
  const [photos, setPhotos] = useState<UploadedPhoto[]>([]);
  const [photosBusy, setPhotosBusy] = useState(false);
  const [restored, setRestored] = useState(false);
  const [uploaderKey, setUploaderKey] = useState(0);
  const [formError, setFormError] = useState<string | null>(null);
  const [saved, setSaved] = useState<Saved | null>(null);
  const queuedPhotos = useRef<QueuedFile[]>([]);
  const {
    register, handleSubmit, watch, reset, setValue, setError, formState: { errors, isSubmitting },
  } = useForm<FormIn, unknown, InspectionInput>({ resolver: zodResolver(inspectionSchema), defaultValues: emptyValues() });

  // Restore a draft typed earlier on this device.
  const draft = useLocalDraft<Draft>(draftKey, (d) => {
    reset(d.values);
    setPhotos(d.photos ?? []);
    setUploaderKey((k) => k + 1);
    setRestored(true);
  });
  const { ready: loaded, save: saveDraft } = draft;
  const placeErrors = useServerErrors(setError, { fieldOf: inspectFieldOf });

  const values = watch();
  useEffect(() => {
    if (!loaded || saved) return;
    const touched = values.result || values.notes || photos.length || (values.items ?? []).some((i) => i.result || i.note);
    if (touched) saveDraft({ values, photos });
  }, [values, photos, loaded, saveDraft, saved]);

  const anyFailed = (values.items ?? []).some((i) => i.result === "fail");
  useEffect(() => {
    if (anyFailed && values.result !== "fail") setValue("result", "fail");
  }, [anyFailed, values.result, setValue]);

  async function onSubmit(input: InspectionInput) {
    setFormError(null);
    // With no signal (or a request lost on a weak one) the inspection waits in the outbox and is sent once.
    const r = await submitOrQueue<{ inspection: { nextDueAt: string | null }; member: { status: string }; removedFromPermits: { label: string }[] }>({
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
    setSaved({ result: input.result, memberStatus: r.data.member.status, removedFromPermits: r.data.removedFromPermits, nextDueAt: r.data.inspection.nextDueAt });
    router.refresh();
  }

  if (saved?.queued) {
    return (
      <section role="status" aria-live="polite" className="flex flex-col gap-3 rounded-xl border-2 border-warn bg-warn-soft p-4">
        <p className="text-lg font-bold">Inspection of {tag} saved on this phone — waiting to send</p>
        <p>No signal just now. It is kept on this phone and sent once when the connection returns; the member&apos;s status changes when the server has it.</p>
        <ButtonLink href={`/sites/${siteId}/inspections`}>Back to the inspection round</ButtonLink>
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
          <ButtonLink href={`/sites/${siteId}/inspections`}>Back to the inspection round</ButtonLink>
          <Button type="button" variant="secondary" onClick={() => { reset(emptyValues()); setPhotos([]); setUploaderKey((k) => k + 1); setSaved(null); }}>
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
        {INSPECTION_CHECKS.map((c, i) => {
          const id = `item-${c.key}`;
          const err = itemErrors?.[i];
          const value = values.items?.[i]?.result;
          return (
            <div key={c.key} role="group" aria-labelledby={`${id}-label`} className="rounded-xl border-2 border-ink/15 bg-paper-raised p-3">
              <p id={`${id}-label`} className="font-semibold">
                {c.label}
              </p>
              {c.key === "plumb" ? <p className="text-sm text-ink-soft">Site tolerance: out of plumb by no more than {plumbToleranceMm} mm.</p> : null}
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
      <Link href={`/sites/${siteId}/inspections`} className="text-center text-brand underline">
        Back to the round
      </Link>
    </form>
  );
}
