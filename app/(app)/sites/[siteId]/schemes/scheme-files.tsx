"use client";
// A scheme's drawing and check certificate: sent straight to the store, then checked by the server.
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Icon } from "@/components/icons";
import { apiJson, putWithProgress } from "@/lib/client/api";

type Kind = "drawing" | "certificate";

function FileSlot({ siteId, schemeId, kind, url, canEdit }: { siteId: string; schemeId: string; kind: Kind; url: string | null; canEdit: boolean }) {
  const router = useRouter();
  const [progress, setProgress] = useState<number | null>(null);
  const [error, setError] = useState<string | null>(null);
  const label = kind === "drawing" ? "Drawing" : "Check certificate";
  async function onFile(file: File | undefined) {
    if (!file) return;
    setError(null);
    setProgress(0);
    const contentType = file.type || "application/pdf";
    const start = await apiJson<{ key: string; uploadUrl: string }>(`/api/v1/sites/${siteId}/schemes/${schemeId}/files`, { body: { kind, contentType, size: file.size } });
    if (!start.ok) {
      setProgress(null);
      setError(Object.values(start.error.fields)[0] ?? start.error.message);
      return;
    }
    try {
      await putWithProgress(start.data.uploadUrl, file, contentType, setProgress);
    } catch (e) {
      setProgress(null);
      setError((e as Error).message);
      return;
    }
    const done = await apiJson(`/api/v1/sites/${siteId}/schemes/${schemeId}/files/complete`, { body: { kind, key: start.data.key } });
    setProgress(null);
    if (!done.ok) setError(Object.values(done.error.fields)[0] ?? done.error.message);
    else router.refresh();
  }
  return (
    <div className="flex flex-col gap-2 rounded-lg border-2 border-ink/15 p-3">
      <p className="font-semibold">{label}</p>
      {url ? (
        <a href={url} target="_blank" rel="noreferrer" className="flex min-h-touch items-center gap-2 font-semibold text-brand underline">
          <Icon name="permit" /> Open the {label.toLowerCase()}
        </a>
      ) : (
        <p className="flex items-center gap-2 text-warn"><Icon name="warn" /> Not uploaded yet</p>
      )}
      {canEdit ? (
        <label className="flex min-h-touch cursor-pointer items-center justify-center gap-2 rounded-lg border-2 border-dashed border-brand px-3 font-semibold text-brand">
          <Icon name="add" /> {url ? "Replace" : "Upload"} {label.toLowerCase()} (PDF or image)
          <input type="file" accept="application/pdf,image/*" className="sr-only" aria-label={`Upload ${label.toLowerCase()}`} onChange={(e) => void onFile(e.target.files?.[0])} />
        </label>
      ) : null}
      {progress != null ? <progress max={1} value={progress} aria-label={`Uploading ${label.toLowerCase()}`} className="h-3 w-full" /> : null}
      {error ? <p role="alert" className="text-sm font-semibold text-bad">⚠ {error}</p> : null}
    </div>
  );
}

export function SchemeFiles(props: { siteId: string; schemeId: string; drawingUrl: string | null; certificateUrl: string | null; canEdit: boolean }) {
  return (
    <div className="grid gap-3 sm:grid-cols-2">
      <FileSlot siteId={props.siteId} schemeId={props.schemeId} kind="drawing" url={props.drawingUrl} canEdit={props.canEdit} />
      <FileSlot siteId={props.siteId} schemeId={props.schemeId} kind="certificate" url={props.certificateUrl} canEdit={props.canEdit} />
    </div>
  );
}
