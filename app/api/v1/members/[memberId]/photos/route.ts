import { apiHandler, created, readJson } from "@/lib/api";
import { requireApiUser } from "@/lib/auth";
import { ForbiddenError } from "@/lib/errors";
import { rolesAllowPure } from "@/lib/permissions";
import { presignPhoto } from "@/lib/photos";
import { loadMemberForUser } from "@/lib/register/members";

/** { contentType, size } → { photoId, uploadUrl } for a photo of an existing member. */
export const POST = apiHandler<{ memberId: string }>(async (req, { params }) => {
  const user = await requireApiUser();
  const { member, roles } = await loadMemberForUser(user, params.memberId);
  if (!rolesAllowPure(roles, "editMember")) throw new ForbiddenError("Your role on this site does not allow adding photos to members.");
  const input = await readJson(req);
  return created(await presignPhoto({ user, siteId: member.siteId, memberId: member.id, input }));
});
