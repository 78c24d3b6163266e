"use client";
// A scheme's drawings (every revision kept) and check certificates (checker, category, date): sent
// straight to the store, then checked by the server.
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Icon } from "@/components/icons";
import { apiJson, putWithProgress } from "@/lib/client/api";

type Kind = "drawing" | "certificate";

export type SchemeDocumentItem = {
  id: string;
  kind: Kind;
  drawingNumber: string | null;
  revision: string | null;
  checkerName: string | null;
  checkCategory: number | null;
  documentDate: string | null;
  uploadedByName: string | null;
  current: boolean;
};

const FIELD_WORDS: Record<string, string> = {
  checkerName: "Checked by",
  checkCategory: "Check category",
  documentDate: "Date",
  signedImageConfirmed: "Signed page",
  drawingNumber: "Drawing number",
  revision: "Revision",
};

function FileSlot({ siteId, schemeId, kind, url, canEdit, category, documents }: { siteId: string; schemeId: string; kind: Kind; url: string | null; canEdit: boolean; category: number; documents: SchemeDocumentItem[] }) {
  const router = useRouter();
  const [progress, setProgress] = useState<number | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [meta, setMeta] = useState<Record<string, string>>({ checkCategory: String(category) });
  const [signed, setSigned] = useState(false);
  const label = kind === "drawing" ? "Drawing" : "Check certificate";
  const set = (k: string) => (e: { target: { value: string } }) => setMeta((m) => ({ ...m, [k]: e.target.value }));
  const inputCls = "min-h-touch rounded-lg border-2 border-ink/30 bg-paper px-2";
  function details(contentType: string) {
    const t = (k: string) => (meta[k] ?? "").trim() || undefined;
    if (kind === "certificate")
      return {
        checkerName: t("checkerName"),
        checkCategory: t("checkCategory") != null ? Number(t("checkCategory")) : undefined,
        documentDate: t("documentDate"),
        ...(contentType.startsWith("image/") ? { signedImageConfirmed: signed } : {}),
      };
    return { drawingNumber: t("drawingNumber"), revision: t("revision"), documentDate: t("documentDate") };
  }
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
    const done = await apiJson(`/api/v1/sites/${siteId}/schemes/${schemeId}/files/complete`, { body: { kind, key: start.data.key, ...details(contentType) } });
    setProgress(null);
    if (!done.ok) {
      const list = Object.entries(done.error.fields).map(([k, v]) => (FIELD_WORDS[k] ? `${FIELD_WORDS[k]}: ${v}` : v));
      setError(list.length ? list.join(" ") : done.error.message);
    } else router.refresh();
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
      {documents.length ? (
        <ul className="flex flex-col gap-1 text-sm" aria-label={kind === "drawing" ? "Drawing revisions" : "Check certificates"}>
          {documents.map((d) => (
            <li key={d.id} className={d.current ? "font-semibold" : "text-ink-soft"}>
              {kind === "drawing"
                ? `${d.drawingNumber ?? "Drawing"} rev ${d.revision ?? "—"}, ${d.documentDate ?? "—"}`
                : `Category ${d.checkCategory ?? "—"} check by ${d.checkerName ?? "—"}, ${d.documentDate ?? "—"}`}
              {d.current ? " (current)" : " (superseded)"}
            </li>
          ))}
        </ul>
      ) : null}
      {canEdit ? (
        <div className="flex flex-col gap-2">
          {kind === "certificate" ? (
            <>
              <label className="flex flex-col gap-1 text-sm font-semibold">
                Checked by (name on the certificate)
                <input className={inputCls} value={meta.checkerName ?? ""} onChange={set("checkerName")} />
              </label>
              <label className="flex flex-col gap-1 text-sm font-semibold">
                Design check category
                <select className={inputCls} value={meta.checkCategory ?? ""} onChange={set("checkCategory")}>
                  {[0, 1, 2, 3].map((c) => (
                    <option key={c} value={c}>
                      Category {c}
                    </option>
                  ))}
                </select>
              </label>
              <label className="flex flex-col gap-1 text-sm font-semibold">
                Date of the check
                <input type="date" className={inputCls} value={meta.documentDate ?? ""} onChange={set("documentDate")} />
              </label>
              <label className="flex min-h-touch items-center gap-2 text-sm">
                <input type="checkbox" className="h-6 w-6" checked={signed} onChange={(e) => setSigned(e.target.checked)} />
                If I upload an image: it is a photo or scan of the whole signed certificate
              </label>
            </>
          ) : (
            <>
              <label className="flex flex-col gap-1 text-sm font-semibold">
                Drawing number
                <input className={inputCls} value={meta.drawingNumber ?? ""} onChange={set("drawingNumber")} />
              </label>
              <label className="flex flex-col gap-1 text-sm font-semibold">
                Revision (leave empty for the next letter)
                <input className={inputCls} value={meta.revision ?? ""} onChange={set("revision")} />
              </label>
              <label className="flex flex-col gap-1 text-sm font-semibold">
                Revision date (empty: today)
                <input type="date" className={inputCls} value={meta.documentDate ?? ""} onChange={set("documentDate")} />
              </label>
            </>
          )}
        </div>
      ) : null}
      {canEdit ? (
        <label className="flex min-h-touch cursor-pointer items-center justify-center gap-2 rounded-lg border-2 border-dashed border-brand px-3 font-semibold text-brand">
          <Icon name="add" /> {kind === "drawing" ? (url ? "Add a revision of the drawing" : "Upload the drawing") : url ? "Upload a new check certificate" : "Upload the check certificate"} (PDF or image)
          <input type="file" accept="application/pdf,image/*" className="sr-only" aria-label={`Upload ${label.toLowerCase()}`} onChange={(e) => void onFile(e.target.files?.[0])} />
        </label>
      ) : null}
      {progress != null ? <progress max={1} value={progress} aria-label={`Uploading ${label.toLowerCase()}`} className="h-3 w-full" /> : null}
      {error ? <p role="alert" className="text-sm font-semibold text-bad">⚠ {error}</p> : null}
    </div>
  );
}

export function SchemeFiles(props: { siteId: string; schemeId: string; drawingUrl: string | null; certificateUrl: string | null; canEdit: boolean; category: number; documents: SchemeDocumentItem[] }) {
  const of = (k: Kind) => props.documents.filter((d) => d.kind === k);
  return (
    <div className="grid gap-3 sm:grid-cols-2">
      <FileSlot siteId={props.siteId} schemeId={props.schemeId} kind="drawing" url={props.drawingUrl} canEdit={props.canEdit} category={props.category} documents={of("drawing")} />
      <FileSlot siteId={props.siteId} schemeId={props.schemeId} kind="certificate" url={props.certificateUrl} canEdit={props.canEdit} category={props.category} documents={of("certificate")} />
    </div>
  );
}
