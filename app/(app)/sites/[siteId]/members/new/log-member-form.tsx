"use client";
// Logging a member on a phone: one form, one main action. Everything typed (and the ids of the
// photos already uploaded) is kept on the phone until the server has saved the member.
import Link from "next/link";
import { useCallback, useEffect, useRef, useState } from "react";
import { useForm, type Resolver } from "react-hook-form";
import { Icon } from "@/components/icons";
import { PlanPlacePicker, type PlanPlace } from "@/components/plan/plan-place-picker";
import { useLocalDraft } from "@/components/use-local-draft";
import { useServerErrors } from "@/components/use-server-errors";
import { onSent } from "@/lib/client/outbox/store";
import { newClientId, submitOrQueue } from "@/lib/client/outbox/submit";
import { provisionalCheck, type OfflineCheckData } from "@/lib/register/provisional-check";
import { CheckResult, type CheckSummary } from "@/components/register/check-result";
import { MemberFields, type SchemeOption, type TypeOption, type ZoneOption } from "@/components/register/member-fields";
import { EMPTY_MEMBER_FORM, FIELD_OF, toMemberInput, type MemberFormValues, type UnitSystem } from "@/components/register/member-form-values";
import { PhotoUploader, type QueuedFile, type UploadedPhoto } from "@/components/register/photo-uploader";
import { Button, buttonClass } from "@/components/ui/button";
import { speakUnits } from "@/lib/calculator/units-speech";
import { memberCreateSchema } from "@/lib/validations/member";

type Saved = { member: { id: string; tag: string; loadN: number; status: string }; check: CheckSummary };
/** An entry waiting on this phone, with the check the phone ran itself. */
type Queued = { id: string; tag: string; provisional: { check: CheckSummary; loadN: number } | null };
type Draft = { values: MemberFormValues; photos: UploadedPhoto[]; place?: PlanPlace; savedAt: string };

function draftKey(siteId: string) {
  return `strutwise:log-member:${siteId}`;
}

const asDraft = (raw: unknown): Draft | null => (raw && typeof raw === "object" && (raw as Draft).values ? (raw as Draft) : null);
const isFormField = (k: string) => k in EMPTY_MEMBER_FORM;
const formFieldOf = (k: string): string => FIELD_OF[k] ?? k;

export function LogMemberForm({
  siteId, unitSystem, prefillTag, zones, schemes, types, offline,
}: { siteId: string; unitSystem: UnitSystem; prefillTag: string; zones: ZoneOption[]; schemes: SchemeOption[]; types: TypeOption[]; offline: OfflineCheckData }) {
  const resolver: Resolver<MemberFormValues> = useCallback(
    async (values) => {
      const { input, errors } = toMemberInput(values, unitSystem);
      const all: Record<string, string> = { ...(errors as Record<string, string>) };
      const parsed = memberCreateSchema.safeParse({ ...input, submit: values.submit });
      if (!parsed.success) {
        for (const i of parsed.error.issues) {
          const key = FIELD_OF[String(i.path[0])] ?? String(i.path[0] ?? "tag");
          // The schema speaks the API's N and mm; the person typed kN (or kip and feet-inches).
          if (!(key in all)) all[key] = speakUnits(i.message, unitSystem);
        }
      }
      if (Object.keys(all).length === 0) return { values, errors: {} };
      return { values: {}, errors: Object.fromEntries(Object.entries(all).map(([k, message]) => [k, { type: "validate", message }])) };
    },
    [unitSystem],
  );
  const { register, handleSubmit, watch, reset, setError, getValues, setFocus, formState } = useForm<MemberFormValues>({
    defaultValues: { ...EMPTY_MEMBER_FORM, tag: prefillTag },
    resolver,
    shouldFocusError: true,
  });
  const [photos, setPhotos] = useState<UploadedPhoto[]>([]);
  const [uploading, setUploading] = useState(false);
  const [restored, setRestored] = useState<string | null>(null);
  const [formError, setFormError] = useState<string | null>(null);
  const [saved, setSaved] = useState<Saved | null>(null);
  const [queued, setQueued] = useState<Queued | null>(null);
  /** Set when the member shown was saved on this phone first and sent later. */
  const [sentLater, setSentLater] = useState(false);
  const queuedPhotos = useRef<QueuedFile[]>([]);
  const [uploaderKey, setUploaderKey] = useState(0);
  const photosRef = useRef(photos);
  photosRef.current = photos;
  const [place, setPlaceState] = useState<PlanPlace>(null);
  const placeRef = useRef<PlanPlace>(null);
  const lastZone = useRef<string | undefined>(undefined);
  const [placeError, setPlaceError] = useState<string | undefined>();
  const resultRef = useRef<HTMLHeadingElement>(null);

  // Restore a draft left by a reload, a lost connection or a flat battery.
  const draft = useLocalDraft<Draft>(
    draftKey(siteId),
    (d) => {
      reset({ ...EMPTY_MEMBER_FORM, ...d.values, tag: d.values.tag || prefillTag });
      setPhotos(d.photos ?? []);
      setPlaceState(d.place ?? null);
      placeRef.current = d.place ?? null;
      lastZone.current = d.values.zoneId;
      setRestored(d.savedAt);
    },
    asDraft,
  );
  const { ready: loaded, save: storeDraft, clear: clearDraft } = draft;
  const speak = useCallback((m: string) => speakUnits(m, unitSystem), [unitSystem]);
  const placeErrors = useServerErrors(setError, { fieldOf: formFieldOf, isField: isFormField, speak });

  const saveDraft = useCallback(() => {
    const values = getValues();
    // A form with nothing typed in it (the photo picker reports as it opens) is no draft: on the
    // next visit the form would say an entry was restored when there was none.
    const blank: MemberFormValues = { ...EMPTY_MEMBER_FORM, tag: prefillTag };
    const untouched = (Object.keys(blank) as (keyof MemberFormValues)[]).every((k) => values[k] === blank[k]);
    if (untouched && photosRef.current.length === 0 && !placeRef.current) return clearDraft();
    storeDraft({ values, photos: photosRef.current, place: placeRef.current, savedAt: new Date().toISOString() });
  }, [getValues, storeDraft, clearDraft, prefillTag]);

  const setPlace = useCallback(
    (p: PlanPlace) => {
      placeRef.current = p;
      setPlaceState(p);
      if (loaded) saveDraft();
    },
    [loaded, saveDraft],
  );
  // A place belongs to one zone's plan: choosing another zone starts with no place.
  const zoneId = watch("zoneId");
  useEffect(() => {
    if (lastZone.current !== undefined && lastZone.current !== zoneId && placeRef.current) setPlace(null);
    lastZone.current = zoneId;
  }, [zoneId, setPlace]);

  useEffect(() => {
    if (!loaded) return;
    const sub = watch(() => saveDraft());
    return () => sub.unsubscribe();
  }, [watch, saveDraft, loaded]);

  const onPhotos = useCallback(
    (ready: UploadedPhoto[], busy: boolean, waiting: QueuedFile[]) => {
      queuedPhotos.current = waiting;
      setPhotos(ready);
      photosRef.current = ready;
      setUploading(busy);
      if (loaded) saveDraft();
    },
    [loaded, saveDraft],
  );

  function discardDraft() {
    draft.clear();
    reset({ ...EMPTY_MEMBER_FORM, tag: prefillTag });
    setPhotos([]);
    setPlace(null);
    setUploaderKey((k) => k + 1);
    setRestored(null);
  }

  // The entry waiting on this phone reaches the server (sent from this tab or another): show the server's check.
  const queuedId = queued?.id;
  useEffect(() => {
    if (!queuedId) return;
    return onSent((id, data) => {
      const answer = data as Partial<Saved> | null;
      if (id !== queuedId || !answer?.member || !answer.check) return;
      setSaved(answer as Saved);
      setSentLater(true);
      setQueued(null);
    });
  }, [queuedId]);

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    setSentLater(false);
    saveDraft();
    const { input } = toMemberInput(values, unitSystem);
    const provisional = provisionalCheck(input, offline);
    // With no signal (or a request lost on a weak one) the entry waits in the outbox and is sent once.
    const r = await submitOrQueue<Saved>({
      kind: "member",
      siteId,
      label: `Member ${values.tag.trim()}`,
      path: `/api/v1/sites/${siteId}/members`,
      presignPath: `/api/v1/sites/${siteId}/photos`,
      body: { ...input, submit: values.submit, clientId: newClientId(), ...(placeRef.current ? { planPosition: placeRef.current } : {}) },
      photoIds: photos.map((p) => p.photoId),
      photos: queuedPhotos.current,
      provisional: provisional ? { capacityN: provisional.check.capacityN, utilisation: provisional.check.utilisation, pass: provisional.check.pass } : undefined,
    });
    if (!r.sent && r.queued) {
      draft.clear();
      setRestored(null);
      setQueued({ id: r.id, tag: values.tag.trim(), provisional });
      return;
    }
    if (!r.sent) {
      const planField = Object.entries(r.error.fields).find(([k]) => k.startsWith("planPosition"));
      setPlaceError(planField?.[1]);
      const { placed, unplaced } = placeErrors({ ...r.error, fields: Object.fromEntries(Object.entries(r.error.fields).filter(([k]) => !k.startsWith("planPosition"))) });
      const first = placed[0] as keyof MemberFormValues | undefined;
      setFormError(unplaced.length ? unplaced.join(" ") : "Some values need attention; see the fields marked below. Nothing was saved yet.");
      if (first && first !== "submit") setFocus(first);
      return;
    }
    draft.clear();
    setRestored(null);
    setSaved(r.data);
    setQueued(null);
    requestAnimationFrame(() => resultRef.current?.focus());
  });

  function logAnother() {
    const keep = getValues();
    reset({ ...EMPTY_MEMBER_FORM, zoneId: keep.zoneId, schemeId: keep.schemeId, memberTypeId: keep.memberTypeId, endConditions: keep.endConditions, loadSource: keep.loadSource, spacingX: keep.spacingX, spacingY: keep.spacingY });
    setPhotos([]);
    setPlace(null);
    queuedPhotos.current = [];
    setUploaderKey((k) => k + 1);
    setSaved(null);
    setQueued(null);
    setSentLater(false);
    requestAnimationFrame(() => setFocus("tag"));
  }

  if (queued !== null) {
    return (
      <div className="flex flex-col gap-4">
        <h2 className="text-xl font-bold" role="status">
          {queued.tag} saved on this phone — waiting to send
        </h2>
        <p>No signal just now. It is kept on this phone (also through a reload or a flat battery) and sent once when the connection returns; the server then checks it and stores the result.</p>
        {queued.provisional ? (
          <div className="flex flex-col gap-2" data-testid="provisional-check">
            <p className="rounded-lg border-2 border-warn bg-warn-soft p-3 font-semibold">
              Provisional — the server&apos;s check is the one stored. This phone checked the member with the library it was loaded with; the server checks it again when it arrives.
            </p>
            <CheckResult check={queued.provisional.check} loadN={queued.provisional.loadN} forceUnit={unitSystem === "us" ? "kip" : "kN"} title="Provisional check (on this phone)" />
          </div>
        ) : (
          <p className="font-semibold">This phone could not check it (its type or scheme was not loaded here); the server checks it when it arrives.</p>
        )}
        <Button type="button" variant="secondary" className="w-full" onClick={logAnother}>
          <Icon name="add" /> Log another member
        </Button>
      </div>
    );
  }

  if (saved) {
    return (
      <div className="flex flex-col gap-4">
        <h2 ref={resultRef} tabIndex={-1} className="text-xl font-bold">
          {saved.member.tag} saved as {saved.member.status === "submitted" ? "submitted" : "a draft"}
        </h2>
        {sentLater ? (
          <p role="status" className="font-semibold" data-testid="server-check-note">
            Sent from this phone. This is the server&apos;s check, the one stored; it replaces the provisional one.
          </p>
        ) : null}
        <CheckResult check={saved.check} loadN={saved.member.loadN} forceUnit={unitSystem === "us" ? "kip" : "kN"} />
        <Link href={`/sites/${siteId}/members/${saved.member.id}`} className={buttonClass("primary", "w-full")}>
          Open the member page
        </Link>
        <Button type="button" variant="secondary" className="w-full" onClick={logAnother}>
          <Icon name="add" /> Log another member
        </Button>
      </div>
    );
  }

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4" aria-label="Log a member">
      {restored ? (
        <div role="status" className="flex flex-wrap items-center justify-between gap-2 rounded-lg border-2 border-brand bg-brand-soft p-3">
          <span className="font-semibold">Your unsaved entry was restored.</span>
          <button type="button" className="min-h-touch rounded-lg px-3 font-semibold text-brand underline" onClick={discardDraft}>
            Discard it
          </button>
        </div>
      ) : null}
      <MemberFields register={register} errors={formState.errors} watch={watch} unitSystem={unitSystem} zones={zones} schemes={schemes} types={types} />
      <PlanPlacePicker siteId={siteId} zoneId={zoneId} value={place} onChange={setPlace} error={placeError} />
      {loaded ? <PhotoUploader key={uploaderKey} presignPath={`/api/v1/sites/${siteId}/photos`} initial={photos} onChange={onPhotos} /> : null}
      <label className="flex min-h-touch items-start gap-3 rounded-lg border-2 border-ink/20 bg-paper-raised p-3">
        <input type="checkbox" className="mt-1 h-5 w-5" aria-describedby={formState.errors.submit ? "submit-error" : undefined} {...register("submit")} />
        <span>
          <span className="font-semibold">Submit it for a permit if it passes</span>
          <span className="block text-sm text-ink-soft">Otherwise it is saved as a draft. A failing member cannot be submitted.</span>
        </span>
      </label>
      {formState.errors.submit ? (
        <p id="submit-error" role="alert" className="flex items-start gap-2 rounded-lg border-2 border-bad bg-bad-soft p-3 font-semibold text-bad">
          <Icon name="bad" className="mt-0.5 h-5 w-5 shrink-0" /> {formState.errors.submit.message}
        </p>
      ) : null}
      {formError ? (
        <p role="alert" className="flex items-start gap-2 rounded-lg border-2 border-bad bg-bad-soft p-3 font-semibold text-bad">
          <Icon name="bad" className="mt-0.5 h-5 w-5 shrink-0" /> {formError}
        </p>
      ) : null}
      <div className="sticky bottom-20 z-10 md:bottom-2">
        <Button type="submit" className="w-full text-lg shadow-lg" disabled={formState.isSubmitting || uploading}>
          {formState.isSubmitting ? "Saving and checking…" : uploading ? "Waiting for photos…" : "Save and check"}
        </Button>
      </div>
    </form>
  );
}
