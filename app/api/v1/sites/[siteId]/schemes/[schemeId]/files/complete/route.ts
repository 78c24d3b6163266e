import { apiHandler, readJson } from "@/lib/api";
import { requireApiUser } from "@/lib/auth";
import { completeSchemeFile } from "@/lib/register/schemes";

/** { kind, key } → the scheme with the file recorded (after checking it is a PDF or an image). */
export const POST = apiHandler<{ siteId: string; schemeId: string }>(async (req, { params }) => {
  const user = await requireApiUser();
  const input = await readJson(req);
  return completeSchemeFile({ user, siteId: params.siteId, schemeId: params.schemeId, input });
});
