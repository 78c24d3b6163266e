import { apiHandler, readJson } from "@/lib/api";
import { requireApiUser } from "@/lib/auth";
import { presignSchemeFile } from "@/lib/register/schemes";

/** { kind: "drawing" | "certificate", contentType, size } → { key, uploadUrl, headers } */
export const POST = apiHandler<{ siteId: string; schemeId: string }>(async (req, { params }) => {
  const user = await requireApiUser();
  const input = await readJson(req);
  return presignSchemeFile({ user, siteId: params.siteId, schemeId: params.schemeId, input });
});
