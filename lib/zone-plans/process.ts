// What happens to a plan's bytes once they are in the store: the type is read from the bytes
// (never from the name or the declared type); a one-page PDF is rendered to a PNG on the server;
// an image is turned upright and scaled down so its longest side is at most MAX_PLAN_PX.
import sharp from "sharp";
import { MAX_PLAN_PX } from "@/lib/validations/zone-plan";

export type ProcessedPlan = { sourceType: string; image: Buffer; imageType: "image/png" | "image/jpeg"; width: number; height: number };
export type PlanOutcome = { ok: true; plan: ProcessedPlan } | { ok: false; reason: string };

const IMAGE_TYPES: Record<string, string> = { png: "image/png", jpeg: "image/jpeg", webp: "image/webp" };

function isPdf(bytes: Buffer) {
  return bytes.subarray(0, 5).toString("latin1") === "%PDF-";
}

// pdf.js (inside unpdf) calls ArrayBuffer.prototype.transferToFixedLength, which Node 20 lacks.
function ensureTransferShim() {
  if (typeof (ArrayBuffer.prototype as unknown as Record<string, unknown>).transferToFixedLength === "function") return;
  Object.defineProperty(ArrayBuffer.prototype, "transferToFixedLength", {
    configurable: true,
    writable: true,
    value(this: ArrayBuffer, n?: number) {
      const len = n ?? this.byteLength;
      const out = new ArrayBuffer(len);
      new Uint8Array(out).set(new Uint8Array(this, 0, Math.min(len, this.byteLength)));
      return out;
    },
  });
}

async function renderPdf(bytes: Buffer): Promise<PlanOutcome> {
  ensureTransferShim();
  const { getDocumentProxy, renderPageAsImage } = await import("unpdf");
  let doc: Awaited<ReturnType<typeof getDocumentProxy>>;
  try {
    doc = await getDocumentProxy(new Uint8Array(bytes));
  } catch {
    return { ok: false, reason: "The PDF is damaged, cut short or password-protected and cannot be opened; export the plan again." };
  }
  try {
    if (doc.numPages !== 1)
      return { ok: false, reason: `The PDF has ${doc.numPages} pages; a zone plan is one page. Upload a PDF of just the page with this zone's plan.` };
    const page = await doc.getPage(1);
    const vp = page.getViewport({ scale: 1 });
    const longest = Math.max(vp.width, vp.height);
    if (!(longest > 0)) return { ok: false, reason: "The PDF's page has no size; export the plan again." };
    // A3 at 72 pt/in is 1191 pt long: scale 3 gives about 3600 px, fine enough to read grid labels.
    const scale = Math.min(4, MAX_PLAN_PX / longest);
    const png = await renderPageAsImage(doc, 1, { canvasImport: () => import("@napi-rs/canvas"), scale });
    return fromImage(Buffer.from(png), "application/pdf");
  } catch {
    return { ok: false, reason: "The PDF's page could not be drawn (it may be damaged); export the plan again or upload it as a PNG." };
  } finally {
    await doc.destroy().catch(() => undefined);
  }
}

async function fromImage(bytes: Buffer, sourceType: string): Promise<PlanOutcome> {
  try {
    const base = sharp(bytes, { failOn: "error", limitInputPixels: 400_000_000 }).rotate();
    const resized = base.resize(MAX_PLAN_PX, MAX_PLAN_PX, { fit: "inside", withoutEnlargement: true }).flatten({ background: "#ffffff" });
    const asJpeg = sourceType === "image/jpeg";
    const { data, info } = await (asJpeg ? resized.jpeg({ quality: 85 }) : resized.png({ compressionLevel: 8, palette: false })).toBuffer({ resolveWithObject: true });
    return { ok: true, plan: { sourceType, image: data, imageType: asJpeg ? "image/jpeg" : "image/png", width: info.width, height: info.height } };
  } catch {
    return { ok: false, reason: `The ${sourceType === "application/pdf" ? "PDF's rendered page" : sourceType.replace("image/", "").toUpperCase() + " file"} is damaged or cut short and cannot be read; upload it again.` };
  }
}

export async function processPlan(bytes: Buffer): Promise<PlanOutcome> {
  if (isPdf(bytes)) return renderPdf(bytes);
  const meta = await sharp(bytes).metadata().catch(() => null);
  if (!meta) return { ok: false, reason: "The file is neither an image nor a PDF (its contents were checked, not its name or declared type); upload the plan as a PNG, JPEG, WebP or one-page PDF." };
  const type = meta.format ? IMAGE_TYPES[meta.format] : undefined;
  if (!type) return { ok: false, reason: `The file is a ${String(meta.format ?? "unknown").toUpperCase()} image; a plan must be a PNG, JPEG, WebP or one-page PDF.` };
  if (!meta.width || !meta.height) return { ok: false, reason: "The image has no readable size; export the plan again." };
  return fromImage(bytes, type);
}
