// POST /api/v1/sites/{siteId}/members/import — members from CSV (text/csv body, or multipart with a
// "file" field). All rows or none: 201 with counts, or 422 with every problem as { row, field, reason }.
// GET returns the template CSV.
import { NextResponse } from "next/server";
import { siteRoute } from "@/lib/api/route";
import { ValidationError } from "@/lib/errors";
import { importMembers, ImportRejectedError, MAX_IMPORT_BYTES } from "@/lib/register/import-members";
import { getRegisterFilterOptions } from "@/db/queries/member-list";
import { importTemplate } from "@/lib/register/members-csv";

const TOO_BIG = `The file is larger than ${MAX_IMPORT_BYTES / 1024 / 1024} MB; split it into smaller files.`;

async function readCsv(req: Request): Promise<string> {
  const length = Number(req.headers.get("content-length") ?? 0);
  if (length > MAX_IMPORT_BYTES + 64 * 1024) throw new ValidationError({ file: TOO_BIG }, TOO_BIG);
  const type = (req.headers.get("content-type") ?? "").toLowerCase();
  if (type.startsWith("multipart/form-data")) {
    let form: FormData;
    try {
      form = await req.formData();
    } catch {
      throw new ValidationError({ file: "The upload could not be read; choose the file again." });
    }
    const file = form.get("file");
    if (!file || typeof file === "string") throw new ValidationError({ file: "Choose a CSV file to import." });
    if (file.size > MAX_IMPORT_BYTES) throw new ValidationError({ file: TOO_BIG }, TOO_BIG);
    if (!/\.csv$/i.test(file.name) && !/csv|text\/plain|excel/.test(file.type))
      throw new ValidationError({ file: `${file.name} is not a CSV file; save the spreadsheet as CSV (comma-separated) and try again.` });
    return file.text();
  }
  if (type.startsWith("text/csv") || type.startsWith("text/plain") || type.startsWith("application/csv")) {
    const text = await req.text();
    if (text.length > MAX_IMPORT_BYTES) throw new ValidationError({ file: TOO_BIG }, TOO_BIG);
    return text;
  }
  throw new ValidationError(
    { file: "Send the CSV as the request body with Content-Type text/csv, or as a multipart form with a file field." },
    "The request must carry a CSV file.",
  );
}

// bodyMode "raw": the CSV (or multipart form) is read here, after the seam has checked the role.
export const POST = siteRoute({ resource: "site", permission: "importMembers", bodyMode: "raw" }, async ({ req, user, site }) => {
  const csv = await readCsv(req);
  try {
    const result = await importMembers({ user, site, csv });
    return NextResponse.json(result, { status: 201 });
  } catch (e) {
    if (e instanceof ImportRejectedError)
      return NextResponse.json({ error: { code: e.code, message: e.message, rows: e.rows } }, { status: 422 });
    throw e;
  }
});

export const GET = siteRoute({ resource: "site", permission: "viewSite" }, async ({ site }) => {
  const o = await getRegisterFilterOptions({ siteId: site.id, organisationId: site.organisationId });
  const template = importTemplate({ zone: o.zones[0]?.name, scheme: o.schemes[0]?.reference, type: o.types[0]?.name });
  return new Response(`\uFEFF${template}`, {
    headers: {
      "content-type": "text/csv; charset=utf-8",
      "content-disposition": 'attachment; filename="strutwise-members-template.csv"',
    },
  });
});
