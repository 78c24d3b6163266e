import { created } from "@/lib/api";
import { siteRoute } from "@/lib/api/route";
import { presignPhoto } from "@/lib/photos";
import { photoPresignSchema } from "@/lib/validations/member";

/** { contentType, size } → { photoId, uploadUrl }: a photo for a member that is not saved yet (attach with photoIds). */
export const POST = siteRoute({ resource: "site", permission: "logMember", body: photoPresignSchema }, async ({ user, site, input }) =>
  created(await presignPhoto({ user, site, input })),
);
