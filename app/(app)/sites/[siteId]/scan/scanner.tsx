"use client";
// The label scanner: the phone's camera reads the QR code on a member's label and opens it. When
// there is no camera, or its permission is refused, the person types the tag (or chooses a photo
// of the label, read by the same decoder). Only this app's addresses are followed (lib/scan/resolve.ts).
import { useRouter } from "next/navigation";
import { useCallback, useEffect, useRef, useState } from "react";
import { Icon } from "@/components/icons";
import { Button } from "@/components/ui/button";
import { decodeQr } from "@/lib/scan/decode";
import { resolveScan } from "@/lib/scan/resolve";

type Camera = { state: "starting" } | { state: "on" } | { state: "off"; message: string };

/** The largest side a frame or photo is read at: plenty for a label, quick on a phone. */
const FRAME_MAX = 800;
const PHOTO_MAX = 1600;

function cameraProblem(e: unknown): string {
  const name = e instanceof DOMException || e instanceof Error ? e.name : "";
  if (name === "NotAllowedError" || name === "SecurityError")
    return "The camera permission was refused, so labels cannot be scanned here. Type the tag printed on the label below, or choose a photo of the label. To scan, allow the camera for this site in the browser's settings.";
  if (name === "NotFoundError" || name === "OverconstrainedError" || name === "DevicesNotFoundError")
    return "No camera was found on this device. Type the tag printed on the label below, or choose a photo of the label.";
  if (name === "NotReadableError")
    return "The camera is in use by another app. Close it and try again, or type the tag printed on the label below.";
  return "The camera could not be started. Type the tag printed on the label below, or choose a photo of the label.";
}

/** The pixels of an image or video frame, scaled so its longer side is at most `max`. */
function pixels(source: CanvasImageSource, w: number, h: number, max: number, canvas: HTMLCanvasElement) {
  const scale = Math.min(1, max / Math.max(w, h));
  canvas.width = Math.max(1, Math.round(w * scale));
  canvas.height = Math.max(1, Math.round(h * scale));
  const ctx = canvas.getContext("2d", { willReadFrequently: true });
  if (!ctx) return null;
  ctx.drawImage(source, 0, 0, canvas.width, canvas.height);
  return ctx.getImageData(0, 0, canvas.width, canvas.height);
}

export function Scanner({ siteId, appOrigin, notice, initialTag }: { siteId: string; appOrigin: string; notice: string | null; initialTag: string }) {
  const router = useRouter();
  const videoRef = useRef<HTMLVideoElement>(null);
  const streamRef = useRef<MediaStream | null>(null);
  const canvasRef = useRef<HTMLCanvasElement | null>(null);
  const lastRead = useRef<string | null>(null);
  const [camera, setCamera] = useState<Camera>({ state: "starting" });
  const [problem, setProblem] = useState<string | null>(notice);
  const [opening, setOpening] = useState<string | null>(null);
  const [tag, setTag] = useState(initialTag);
  const [tagError, setTagError] = useState<string | null>(null);
  const [reading, setReading] = useState(false);

  const stopCamera = useCallback(() => {
    streamRef.current?.getTracks().forEach((t) => t.stop());
    streamRef.current = null;
  }, []);

  /** Opens what a label (or typed text) points to; says why when it will not. */
  const open = useCallback(
    (text: string, from: "camera" | "photo" | "typed") => {
      const target = resolveScan(text, { origins: [window.location.origin, appOrigin] });
      if (target.kind === "refused") {
        if (from === "typed") setTagError(target.reason);
        else setProblem(target.reason);
        return false;
      }
      stopCamera();
      setProblem(null);
      setTagError(null);
      setOpening(target.kind === "tag" ? target.tag : "the member");
      router.push(target.kind === "open" ? target.href : `/sites/${siteId}/scan?tag=${encodeURIComponent(target.tag)}`);
      return true;
    },
    [appOrigin, router, siteId, stopCamera],
  );

  // The camera starts when the page opens (the person tapped Scan) and stops when they leave.
  useEffect(() => {
    let cancelled = false;
    let timer: ReturnType<typeof setTimeout> | undefined;
    if (!navigator.mediaDevices?.getUserMedia) {
      setCamera({ state: "off", message: "This browser gives no camera access here. Type the tag printed on the label below, or choose a photo of the label." });
      return;
    }
    navigator.mediaDevices
      .getUserMedia({ video: { facingMode: { ideal: "environment" } }, audio: false })
      .then(async (stream) => {
        if (cancelled) return stream.getTracks().forEach((t) => t.stop());
        streamRef.current = stream;
        const video = videoRef.current;
        if (!video) return;
        video.srcObject = stream;
        await video.play().catch(() => undefined);
        setCamera({ state: "on" });
        canvasRef.current ??= document.createElement("canvas");
        const tick = () => {
          if (cancelled || !streamRef.current) return;
          if (video.readyState >= 2 && video.videoWidth > 0) {
            const img = pixels(video, video.videoWidth, video.videoHeight, FRAME_MAX, canvasRef.current!);
            const text = img ? decodeQr(img.data, img.width, img.height) : null;
            // The same refused code in front of the camera is said once, not on every frame.
            if (text && text !== lastRead.current) {
              lastRead.current = text;
              if (open(text, "camera")) return;
            }
          }
          timer = setTimeout(tick, 150);
        };
        tick();
      })
      .catch((e: unknown) => {
        if (!cancelled) setCamera({ state: "off", message: cameraProblem(e) });
      });
    return () => {
      cancelled = true;
      if (timer) clearTimeout(timer);
      stopCamera();
    };
  }, [open, stopCamera]);

  async function readPhoto(file: File) {
    setProblem(null);
    setReading(true);
    try {
      const bitmap = await createImageBitmap(file);
      canvasRef.current ??= document.createElement("canvas");
      // Read at a large size first, then smaller: a smaller copy sometimes reads a blurred code.
      let text: string | null = null;
      for (const max of [PHOTO_MAX, FRAME_MAX]) {
        const img = pixels(bitmap, bitmap.width, bitmap.height, max, canvasRef.current);
        text = img ? decodeQr(img.data, img.width, img.height, { thorough: true }) : null;
        if (text) break;
      }
      bitmap.close();
      if (!text) setProblem("No QR code could be read in that photo. Take it closer, square on and in focus, or type the tag printed on the label.");
      else open(text, "photo");
    } catch {
      setProblem("That file could not be read as a picture. Choose a photo (JPEG or PNG) of the label, or type the tag.");
    } finally {
      setReading(false);
    }
  }

  function onTyped(e: React.FormEvent) {
    e.preventDefault();
    if (!tag.trim()) {
      setTagError("Type the tag printed on the label (for example WXW-L2-P01).");
      return;
    }
    open(tag, "typed");
  }

  return (
    <div className="flex flex-col gap-4">
      {opening ? (
        <p role="status" className="rounded-lg border-2 border-ok bg-ok-soft p-3 font-semibold">
          Opening {opening}…
        </p>
      ) : null}
      {problem ? (
        <p role="alert" className="flex items-start gap-2 rounded-lg border-2 border-bad bg-bad-soft p-3 font-semibold text-bad">
          <Icon name="bad" className="h-5 w-5 shrink-0" /> {problem}
        </p>
      ) : null}

      <section aria-label="Camera" className="flex flex-col gap-2">
        {camera.state === "off" ? (
          <p role="status" className="flex items-start gap-2 rounded-lg border-2 border-warn bg-warn-soft p-3" data-testid="camera-off">
            <Icon name="warn" className="h-5 w-5 shrink-0" /> {camera.message}
          </p>
        ) : (
          <>
            <div className="relative overflow-hidden rounded-xl bg-ink">
              <video ref={videoRef} muted playsInline className="aspect-square w-full object-cover" aria-label="Camera view" />
              <div aria-hidden className="pointer-events-none absolute inset-[18%] rounded-lg border-4 border-white/80" />
            </div>
            <p className="text-sm text-ink-soft" role="status">
              {camera.state === "starting" ? "Starting the camera… allow it when the browser asks." : "Hold the label's QR code inside the square."}
            </p>
          </>
        )}
      </section>

      <form onSubmit={onTyped} noValidate className="flex flex-col gap-2 rounded-xl border-2 border-ink/15 bg-paper-raised p-3" aria-label="Type the tag">
        <label htmlFor="scan-tag" className="font-semibold">
          Or type the tag on the label
        </label>
        <div className="flex gap-2">
          <input
            id="scan-tag"
            value={tag}
            onChange={(e) => {
              setTag(e.target.value);
              setTagError(null);
            }}
            autoCapitalize="characters"
            autoComplete="off"
            className="min-h-touch min-w-0 flex-1 rounded-lg border-2 border-ink/40 bg-paper-raised px-3 aria-[invalid=true]:border-bad"
            aria-invalid={Boolean(tagError)}
            aria-describedby={tagError ? "scan-tag-error" : undefined}
          />
          <Button type="submit">Open</Button>
        </div>
        {tagError ? (
          <p id="scan-tag-error" role="alert" className="text-sm font-semibold text-bad">
            <span aria-hidden>⚠</span> {tagError}
          </p>
        ) : null}
      </form>

      <div className="flex flex-col gap-1">
        <label htmlFor="scan-photo" className="font-semibold">
          Or choose a photo of the label
        </label>
        <input
          id="scan-photo"
          type="file"
          accept="image/*"
          disabled={reading}
          className="min-h-touch"
          onChange={(e) => {
            const f = e.target.files?.[0];
            e.target.value = "";
            if (f) void readPhoto(f);
          }}
        />
        {reading ? <p role="status">Reading the photo…</p> : null}
      </div>
    </div>
  );
}
