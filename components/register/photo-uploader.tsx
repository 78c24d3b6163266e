"use client";
// Photos from the phone camera, each sent straight to the store with a presigned PUT and a
// progress bar, then confirmed by the server. A failed upload keeps its file for a retry, and the
// rest of the form is untouched.
import { useCallback, useEffect, useRef, useState } from "react";
import { Icon } from "@/components/icons";
import { apiJson, putWithProgress } from "@/lib/client/api";

const MAX_BYTES = 15 * 1024 * 1024;

export type UploadedPhoto = { photoId: string; name: string; thumbnailUrl: string | null };
/** A photo taken with no signal: sent from the outbox with its entry. */
export type QueuedFile = { name: string; blob: Blob };

type Item = {
  key: string;
  name: string;
  file: File | null;
  status: "uploading" | "checking" | "ready" | "failed" | "queued";
  progress: number;
  error?: string;
  photoId?: string;
  thumbnailUrl?: string | null;
};

export function PhotoUploader({
  presignPath, initial = [], onChange, label = "Photos",
}: {
  /** POST { contentType, size } → { photoId, uploadUrl } */
  presignPath: string;
  initial?: UploadedPhoto[];
  onChange?: (ready: UploadedPhoto[], busy: boolean, queued: QueuedFile[]) => void;
  label?: string;
}) {
  const [items, setItems] = useState<Item[]>(() =>
    initial.map((p) => ({ key: p.photoId, name: p.name, file: null, status: "ready", progress: 1, photoId: p.photoId, thumbnailUrl: p.thumbnailUrl })),
  );
  const inputRef = useRef<HTMLInputElement>(null);

  const commit = useCallback((update: (prev: Item[]) => Item[]) => setItems(update), []);
  const onChangeRef = useRef(onChange);
  onChangeRef.current = onChange;
  useEffect(() => {
    onChangeRef.current?.(
      items.filter((i) => i.status === "ready" && i.photoId).map((i) => ({ photoId: i.photoId!, name: i.name, thumbnailUrl: i.thumbnailUrl ?? null })),
      items.some((i) => i.status === "uploading" || i.status === "checking"),
      items.filter((i) => i.status === "queued" && i.file).map((i) => ({ name: i.name, blob: i.file! })),
    );
  }, [items]);

  const patch = useCallback((key: string, p: Partial<Item>) => commit((prev) => prev.map((i) => (i.key === key ? { ...i, ...p } : i))), [commit]);

  const upload = useCallback(
    async (key: string, file: File) => {
      patch(key, { status: "uploading", progress: 0, error: undefined });
      if (file.size > MAX_BYTES) {
        patch(key, { status: "failed", error: `This photo is ${(file.size / 1048576).toFixed(1)} MB; the limit is 15 MB. Take it at a lower resolution.` });
        return;
      }
      const contentType = file.type && file.type.startsWith("image/") ? file.type : "image/jpeg";
      // No signal: the photo waits on the phone and goes with the entry from the outbox.
      if (!navigator.onLine) return patch(key, { status: "queued" });
      const start = await apiJson<{ photoId: string; uploadUrl: string }>(presignPath, { body: { contentType, size: file.size } });
      if (!start.ok && start.error.offline) return patch(key, { status: "queued" });
      if (!start.ok) {
        patch(key, { status: "failed", error: Object.values(start.error.fields)[0] ?? start.error.message });
        return;
      }
      try {
        await putWithProgress(start.data.uploadUrl, file, contentType, (f) => patch(key, { progress: f }));
      } catch (e) {
        if (!navigator.onLine) return patch(key, { status: "queued" });
        patch(key, { status: "failed", error: (e as Error).message });
        return;
      }
      patch(key, { status: "checking", progress: 1 });
      const done = await apiJson<{ photo: { id: string; thumbnailUrl: string | null } }>(`/api/v1/photos/${start.data.photoId}/complete`, { body: {} });
      if (!done.ok) {
        patch(key, { status: "failed", error: done.error.fields.photo ?? done.error.message });
        return;
      }
      patch(key, { status: "ready", photoId: done.data.photo.id, thumbnailUrl: done.data.photo.thumbnailUrl });
    },
    [patch, presignPath],
  );

  function onFiles(files: FileList | null) {
    if (!files) return;
    const added: Item[] = [...files].map((file, n) => ({ key: `${Date.now()}-${n}-${file.name}`, name: file.name, file, status: "uploading", progress: 0 }));
    commit((prev) => [...prev, ...added]);
    for (const it of added) void upload(it.key, it.file!);
    if (inputRef.current) inputRef.current.value = "";
  }

  return (
    <fieldset className="flex flex-col gap-2">
      <legend className="mb-1 text-sm font-semibold">{label}</legend>
      <label className="flex min-h-touch cursor-pointer items-center justify-center gap-2 rounded-lg border-2 border-dashed border-brand bg-brand-soft px-4 py-3 font-semibold text-brand">
        <Icon name="add" /> Take or add photos
        <input
          ref={inputRef}
          type="file"
          accept="image/*"
          capture="environment"
          multiple
          className="sr-only"
          aria-label="Take or add photos"
          onChange={(e) => onFiles(e.target.files)}
        />
      </label>
      {items.length > 0 ? (
        <ul className="flex flex-col gap-2" aria-label="Photos in this entry">
          {items.map((it) => (
            <li key={it.key} className="flex items-center gap-3 rounded-lg border-2 border-ink/15 bg-paper-raised p-2" data-testid="photo-item" data-status={it.status}>
              {it.thumbnailUrl ? (
                <img src={it.thumbnailUrl} alt={`Photo ${it.name}`} className="h-14 w-14 shrink-0 rounded object-cover" />
              ) : (
                <div className="flex h-14 w-14 shrink-0 items-center justify-center rounded bg-paper-sunk text-ink-soft" aria-hidden>
                  <Icon name={it.status === "failed" ? "bad" : "inspect"} />
                </div>
              )}
              <div className="min-w-0 flex-1">
                <p className="truncate text-sm font-semibold">{it.name}</p>
                {it.status === "uploading" ? (
                  <>
                    <progress className="h-3 w-full" max={1} value={it.progress} aria-label={`Uploading ${it.name}`} />
                    <p className="text-xs tabular">Uploading… {Math.round(it.progress * 100)} %</p>
                  </>
                ) : it.status === "checking" ? (
                  <p className="text-sm">Checking the photo…</p>
                ) : it.status === "queued" ? (
                  <p className="text-sm font-semibold">No signal: kept on this phone, sent with the entry</p>
                ) : it.status === "ready" ? (
                  <p className="flex items-center gap-1 text-sm font-semibold text-ok">
                    <Icon name="ok" className="h-4 w-4" /> Uploaded
                  </p>
                ) : (
                  <p role="alert" className="flex items-start gap-1 text-sm font-semibold text-bad">
                    <Icon name="bad" className="mt-0.5 h-4 w-4 shrink-0" /> {it.error}
                  </p>
                )}
              </div>
              {it.status === "failed" && it.file ? (
                <button type="button" className="min-h-touch rounded-lg border-2 border-ink/60 px-3 font-semibold" onClick={() => void upload(it.key, it.file!)}>
                  Retry
                </button>
              ) : null}
              {it.status === "ready" || it.status === "failed" || it.status === "queued" ? (
                <button
                  type="button"
                  aria-label={`Remove ${it.name}`}
                  className="flex min-h-touch min-w-touch items-center justify-center rounded-lg hover:bg-paper-sunk"
                  onClick={() => commit((prev) => prev.filter((p) => p.key !== it.key))}
                >
                  <Icon name="bad" className="h-5 w-5" />
                </button>
              ) : null}
            </li>
          ))}
        </ul>
      ) : null}
    </fieldset>
  );
}
