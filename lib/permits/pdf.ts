// The permit PDF: rendered from the permit's detail record, stored in S3, then the e-mails
// waiting for it are released.
import "server-only";
import { transaction } from "@/db";
import { releaseHeldEmails } from "@/db/queries/outbox";
import { getPermitForUpdate, listPermitsAwaitingPdf, updatePermit } from "@/db/queries/permits";
import { PERMIT_STATUS_LABELS } from "@/lib/labels";
import { renderPermitPdf, type PermitPdfData } from "@/lib/pdf/permit";
import { putObject } from "@/lib/storage";
import { PERMIT_KIND_LABELS } from "@/lib/validations/permit";
import { permitRecord, type PermitRecord } from "./detail";
import { formatDateTime } from "@/lib/format-date";
import { fmtForce, fmtValidUntil, fmtLength, fmtUtilisation, type UnitSystem } from "./format";
import { evidenceFinding } from "./preconditions";
import { permitUrl } from "./urls";
import { requestReference } from "./words";

export type PaperSize = "A4" | "LETTER";

export const permitPdfKey = (siteId: string, permitId: string) => `permits/${siteId}/${permitId}.pdf`;

/** Letter for sites working in US units, A4 otherwise. */
export const defaultPaper = (units: UnitSystem): PaperSize => (units === "us" ? "LETTER" : "A4");

/** The PDF's content from the permit's record; null until the permit has been issued. */
export function permitPdfData(r: PermitRecord): PermitPdfData | null {
  const { permit: p, view: v, units, timeZone: tz, scope } = r;
  if (!p.issuedAt || p.number == null) return null;
  const zones = [...new Set(scope.map((m) => m.zoneName).filter((z): z is string => !!z))];
  const schemeRefs = [...new Set(scope.map((m) => m.schemeReference).filter((s): s is string => !!s))];
  const schemes = schemeRefs.map((ref) =>
    ref === v.schemeReference ? `${ref} — ${v.schemeTitle} (design check category ${v.schemeCategory})` : ref,
  );
  return {
    numberLabel: r.numberLabel!,
    kindLabel: PERMIT_KIND_LABELS[p.kind],
    kind: p.kind,
    statusLabel: PERMIT_STATUS_LABELS[p.status].toUpperCase(),
    siteName: v.siteName,
    siteCode: v.siteCode,
    zones,
    schemes,
    requestReference: requestReference({ requestNumber: p.requestNumber, requestedByName: v.requestedByName, requestedAt: p.requestedAt }, tz),
    requestNote: p.requestNote,
    issuedBy: v.approvedByName ?? "—",
    issuedAt: formatDateTime(p.issuedAt, tz),
    validUntil: fmtValidUntil(p.issuedAt, p.validUntil, tz),
    conditions: p.conditions,
    evidence: p.kind === "strike" ? evidenceFinding(p.evidence).text : null,
    members: scope.map((m) => ({
      tag: m.tag,
      type: m.memberTypeName,
      zone: m.zoneName ?? "—",
      extension: fmtLength(m.extensionMm, units).replace(/ (mm|in)$/, ""),
      load: fmtForce(m.loadN, units).replace(/ (kN|kip)$/, ""),
      capacity: fmtForce(m.capacityN, units).replace(/ (kN|kip)$/, ""),
      utilisation: fmtUtilisation(m.utilisation),
    })),
    units: units === "us" ? { length: "in", force: "kip" } : { length: "mm", force: "kN" },
    permitUrl: permitUrl(p.siteId, p.id),
    generatedAt: formatDateTime(new Date(), tz),
  };
}

/** Renders a permit's PDF in the given paper size without storing it (e.g. `?size=letter`). */
export async function renderPermitPdfNow(record: PermitRecord, size?: PaperSize): Promise<Buffer | null> {
  const data = permitPdfData(record);
  if (!data) return null;
  return renderPermitPdf(data, size ?? defaultPaper(record.units));
}

/**
 * Renders and stores the PDF of an issued permit, sets its key and releases the e-mails held for
 * it with the PDF attached. Safe to run twice at once: the permit row lock makes one of them the
 * one that records the key and releases the mail. Returns the object key (null: not issued).
 * Pass the record when the caller already has it (issuing builds it once).
 */
export async function renderAndStorePermitPdf(permitId: string, given?: PermitRecord): Promise<string | null> {
  const record = given ?? (await permitRecord(permitId));
  if (!record) return null;
  const data = permitPdfData(record);
  if (!data) return null;
  const pdf = await renderPermitPdf(data, defaultPaper(record.units));
  const key = permitPdfKey(record.permit.siteId, permitId);
  await putObject(key, pdf, "application/pdf");
  await transaction(async (tx) => {
    const locked = await getPermitForUpdate({ permitId }, tx);
    if (!locked) return;
    if (!locked.pdfKey) await updatePermit({ permitId, values: { pdfKey: key } }, tx);
    await releaseHeldEmails(
      { waitFor: `pdf:${permitId}`, attachments: [{ key, filename: `${data.numberLabel}.pdf`, contentType: "application/pdf" }] },
      tx,
    );
  });
  return key;
}

/** For the worker: issued permits whose PDF is missing (rendering failed after commit) are rendered now. */
export async function renderPendingPermitPdfs({ limit = 10, olderThanSeconds = 20 }: { limit?: number; olderThanSeconds?: number } = {}) {
  // The grace period leaves a PDF the issuing request is rendering right now to that request.
  const pending = await listPermitsAwaitingPdf({ limit, olderThanSeconds });
  let rendered = 0;
  const failed: string[] = [];
  for (const p of pending) {
    try {
      if (await renderAndStorePermitPdf(p.id)) rendered++;
    } catch (e) {
      failed.push(p.id);
      console.error("[permits] PDF rendering failed", p.id, e instanceof Error ? e.message : e);
    }
  }
  return { pending: pending.length, rendered, failed };
}
