import { created } from "@/lib/api";
import { siteRoute } from "@/lib/api/route";
import { presignPhoto } from "@/lib/photos";
import { photoPresignSchema } from "@/lib/validations/member";

/** { contentType, size, clientId? } → 201 { photoId, uploadUrl }: a photo for a member that is not saved yet (attach with photoIds). A clientId already used on this site: 200 with that photo (and a fresh URL). */
export const POST = siteRoute({ resource: "site", permission: "logMember", body: photoPresignSchema }, async ({ user, site, input }) => {
  const { replayed, ...body } = await presignPhoto({ user, site, input });
  return replayed ? body : created(body);
});
