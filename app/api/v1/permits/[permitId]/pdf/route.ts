// The stored permit PDF from S3 (404 until it has been rendered). `?size=letter|a4` renders the
// same permit on the other paper size on demand.
import { siteRoute } from "@/lib/api/route";
import { AppError, NotFoundError, ValidationError } from "@/lib/errors";
import { permitRecord } from "@/lib/permits";
import { defaultPaper, renderPermitPdfNow, type PaperSize } from "@/lib/permits/pdf";
import { getObject } from "@/lib/storage";
import { permitNumberLabel } from "@/lib/validations/permit";

function sizeQuery(raw: unknown): { size: PaperSize | null } {
  const v = (raw as Record<string, unknown>).size;
  if (v === undefined) return { size: null };
  if (typeof v !== "string" || !["a4", "letter"].includes(v.toLowerCase())) throw new ValidationError({ size: "Choose a4 or letter." });
  return { size: v.toLowerCase() === "letter" ? "LETTER" : "A4" };
}

export const GET = siteRoute({ resource: "permit", permission: "viewSite", query: sizeQuery }, async ({ resource: permit, site, query }) => {
  if (!permit.pdfKey)
    throw new AppError(404, "not_found", permit.issuedAt ? "The PDF of this permit is still being prepared; try again in a moment." : "A permit has a PDF only once it is issued.");
  const wanted = query.size;
  const record = wanted && wanted !== defaultPaper(site.unitSystem as "si" | "us") ? await permitRecord(permit.id) : null;
  const body = record ? await renderPermitPdfNow(record, wanted!) : await getObject(permit.pdfKey);
  if (!body) throw new NotFoundError("The PDF of this permit");
  const name = `${permitNumberLabel(permit.kind, permit.number)}${wanted ? `-${wanted.toLowerCase()}` : ""}.pdf`;
  return new Response(new Uint8Array(body), {
    headers: {
      "content-type": "application/pdf",
      "content-disposition": `inline; filename="${name}"`,
      "cache-control": "private, no-store",
    },
  });
});
