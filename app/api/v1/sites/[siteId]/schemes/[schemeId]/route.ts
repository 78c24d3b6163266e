import { apiHandler, readJson } from "@/lib/api";
import { requireApiUser } from "@/lib/auth";
import { editScheme } from "@/lib/register/schemes";

export const PATCH = apiHandler<{ siteId: string; schemeId: string }>(async (req, { params }) => {
  const user = await requireApiUser();
  const input = await readJson(req);
  return editScheme({ user, siteId: params.siteId, schemeId: params.schemeId, input });
});
