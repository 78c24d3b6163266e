import { created } from "@/lib/api";
import { siteRoute } from "@/lib/api/route";
import { presignPhoto } from "@/lib/photos";
import { photoPresignSchema } from "@/lib/validations/member";

/** { contentType, size } → { photoId, uploadUrl } for a photo of an existing member. */
export const POST = siteRoute(
  {
    resource: "member",
    permission: "editMember",
    forbidden: "Your role on this site does not allow adding photos to members.",
    body: photoPresignSchema,
  },
  async ({ user, site, resource: member, input }) => {
    const { replayed, ...body } = await presignPhoto({ user, site, memberId: member.id, input });
    return replayed ? body : created(body);
  },
);
