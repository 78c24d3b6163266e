"use client";
// Upload (or replace) the zone's plan: an image or a one-page PDF, straight to the store, then
// checked and rendered by the server. For an image, the scale may be given by tapping two points
// on the preview and typing the real distance between them.
import { useRouter } from "next/navigation";
import { useEffect, useState } from "react";
import { Icon } from "@/components/icons";
import { PlanCanvas } from "@/components/plan/plan-canvas";
import { Button } from "@/components/ui/button";
import { apiJson, putWithProgress } from "@/lib/client/api";

type Point = { x: number; y: number };

export function PlanUpload({ siteId, zoneId, hasPlan }: { siteId: string; zoneId: string; hasPlan: boolean }) {
  const router = useRouter();
  const [file, setFile] = useState<File | null>(null);
  const [preview, setPreview] = useState<{ url: string; width: number; height: number } | null>(null);
  const [points, setPoints] = useState<Point[]>([]);
  const [distance, setDistance] = useState("");
  const [progress, setProgress] = useState<number | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [done, setDone] = useState(false);

  useEffect(() => {
    setPreview(null);
    setPoints([]);
    if (!file || !file.type.startsWith("image/")) return;
    const url = URL.createObjectURL(file);
    const img = new Image();
    img.onload = () => setPreview({ url, width: img.naturalWidth, height: img.naturalHeight });
    img.src = url;
    return () => URL.revokeObjectURL(url);
  }, [file]);

  async function upload() {
    if (!file) return;
    setError(null);
    setDone(false);
    let scale: { x1: number; y1: number; x2: number; y2: number; distanceMm: number } | undefined;
    if (points.length === 2 || distance.trim()) {
      const mm = Number(distance.replace(",", "."));
      if (points.length !== 2) return setError("For a scale, tap two points on the preview, then give the distance between them.");
      if (!Number.isFinite(mm) || mm <= 0) return setError("The distance between the two points must be a number of mm, more than 0.");
      scale = { x1: points[0]!.x, y1: points[0]!.y, x2: points[1]!.x, y2: points[1]!.y, distanceMm: mm };
    }
    const contentType = file.type || (file.name.toLowerCase().endsWith(".pdf") ? "application/pdf" : "application/octet-stream");
    setProgress(0);
    const start = await apiJson<{ key: string; uploadUrl: string }>(`/api/v1/sites/${siteId}/zones/${zoneId}/plan`, { body: { contentType, size: file.size } });
    if (!start.ok) {
      setProgress(null);
      return setError(Object.values(start.error.fields)[0] ?? start.error.message);
    }
    try {
      await putWithProgress(start.data.uploadUrl, file, contentType, setProgress);
    } catch (e) {
      setProgress(null);
      return setError(`${(e as Error).message} The file is still chosen: try again.`);
    }
    const complete = await apiJson(`/api/v1/sites/${siteId}/zones/${zoneId}/plan/complete`, { body: { key: start.data.key, ...(scale ? { scale } : {}) } });
    setProgress(null);
    if (!complete.ok) return setError(Object.values(complete.error.fields).join(" ") || complete.error.message);
    setDone(true);
    setFile(null);
    router.refresh();
  }

  return (
    <section aria-labelledby="upload-h" className="flex flex-col gap-3 rounded-xl border-2 border-ink/15 bg-paper-raised p-4 print:hidden">
      <h2 id="upload-h" className="text-lg font-bold">{hasPlan ? "Replace the plan" : "Upload the plan"}</h2>
      <p className="text-sm text-ink-soft">A PNG, JPEG or WebP image, or a one-page PDF (drawn to an image on the server), up to 20 MB. Members already placed keep their spots.</p>
      <label className="flex flex-col gap-1 font-semibold">
        Plan file
        <input
          type="file"
          accept="image/png,image/jpeg,image/webp,application/pdf"
          className="min-h-touch"
          onChange={(e) => setFile(e.target.files?.[0] ?? null)}
          data-testid="plan-file"
        />
      </label>
      {preview ? (
        <div className="flex flex-col gap-2">
          <p className="text-sm">Scale (optional): tap two points whose distance you know — {points.length}/2 chosen.</p>
          <PlanCanvas
            imageUrl={preview.url}
            width={preview.width}
            height={preview.height}
            pins={[]}
            marker={points.at(-1) ?? null}
            onPlanTap={(p) => setPoints((old) => (old.length >= 2 ? [p] : [...old, p]))}
            label="Preview of the new plan"
          />
          <label className="flex flex-col gap-1 text-sm font-semibold">
            Distance between the two points (mm)
            <input inputMode="decimal" className="min-h-touch rounded-lg border-2 border-ink/30 bg-paper px-2" value={distance} onChange={(e) => setDistance(e.target.value)} />
          </label>
        </div>
      ) : null}
      {error ? (
        <p role="alert" className="flex items-center gap-2 font-semibold text-bad"><Icon name="bad" className="h-5 w-5" /> {error}</p>
      ) : null}
      {done ? <p role="status" className="flex items-center gap-2 font-semibold text-ok"><Icon name="ok" className="h-5 w-5" /> Plan uploaded.</p> : null}
      <Button type="button" disabled={!file || progress != null} onClick={upload}>
        {progress != null ? `Uploading… ${Math.round(progress * 100)} %` : "Upload plan"}
      </Button>
    </section>
  );
}
