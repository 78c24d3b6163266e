import { apiHandler, created, readJson } from "@/lib/api";
import { requireApiUser } from "@/lib/auth";
import { presignSitePhoto } from "@/lib/photos";

/** { contentType, size } → { photoId, uploadUrl }: a photo for a member that is not saved yet (attach with photoIds). */
export const POST = apiHandler<{ siteId: string }>(async (req, { params }) => {
  const user = await requireApiUser();
  const input = await readJson(req);
  return created(await presignSitePhoto({ user, siteId: params.siteId, input }));
});
