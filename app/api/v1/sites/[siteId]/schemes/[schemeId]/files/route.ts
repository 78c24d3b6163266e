import { listSchemeDocuments } from "@/db/queries/scheme-documents";
import { siteRoute } from "@/lib/api/route";
import { presignSchemeFile } from "@/lib/register/schemes";
import { presignGet } from "@/lib/storage";
import { schemeFilePresignSchema } from "@/lib/validations/scheme";

/** Every drawing revision and check certificate of the scheme, newest first, each with a link. */
export const GET = siteRoute({ resource: "scheme", permission: "viewSite" }, async ({ resource: scheme }) => {
  const docs = await listSchemeDocuments({ schemeId: scheme.id });
  return { documents: await Promise.all(docs.map(async (d) => ({ ...d, current: d.objectKey === scheme.drawingKey || d.objectKey === scheme.certificateKey, url: await presignGet(d.objectKey) }))) };
});

/** { kind: "drawing" | "certificate", contentType, size } → { key, uploadUrl, headers } */
export const POST = siteRoute({ resource: "scheme", permission: "manageSchemes", body: schemeFilePresignSchema }, (ctx) => presignSchemeFile(ctx));
