import { apiHandler, readJson } from "@/lib/api";
import { requireApiUser } from "@/lib/auth";
import { editZone } from "@/lib/register/schemes";

export const PATCH = apiHandler<{ siteId: string; zoneId: string }>(async (req, { params }) => {
  const user = await requireApiUser();
  const input = await readJson(req);
  return editZone({ user, siteId: params.siteId, zoneId: params.zoneId, input });
});
