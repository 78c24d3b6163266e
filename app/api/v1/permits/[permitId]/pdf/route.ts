// The stored permit PDF from S3 (404 until it has been rendered). `?size=letter|a4` renders the
// same permit on the other paper size on demand.
import { AppError, NotFoundError, ValidationError } from "@/lib/errors";
import { apiHandler } from "@/lib/api";
import { requireApiUser } from "@/lib/auth";
import { loadPermitForUser } from "@/lib/permits";
import { defaultPaper, renderPermitPdfNow } from "@/lib/permits/pdf";
import { getObject } from "@/lib/storage";
import { permitNumberLabel } from "@/lib/validations/permit";

export const GET = apiHandler<{ permitId: string }>(async (req, { params }) => {
  const user = await requireApiUser();
  const { permit, site } = await loadPermitForUser(user, params.permitId);
  if (!permit.pdfKey)
    throw new AppError(404, "not_found", permit.issuedAt ? "The PDF of this permit is still being prepared; try again in a moment." : "A permit has a PDF only once it is issued.");
  const sizeParam = new URL(req.url).searchParams.get("size");
  if (sizeParam && !["a4", "letter"].includes(sizeParam.toLowerCase()))
    throw new ValidationError({ size: "Choose a4 or letter." });
  const wanted = sizeParam ? (sizeParam.toLowerCase() === "letter" ? "LETTER" : "A4") : null;
  const body =
    wanted && wanted !== defaultPaper(site.unitSystem as "si" | "us")
      ? await renderPermitPdfNow(permit.id, wanted)
      : await getObject(permit.pdfKey);
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
