// An edit made against an older copy of a member (a phone that was offline, a second tab) is
// refused with the member as it stands now, so the person can compare both and choose.
import "server-only";
import { getMemberView } from "@/db/queries/members";
import { ConflictError } from "@/lib/errors";
import type { MemberPatch } from "@/lib/validations/member";
import { memberDetail } from "./member-detail";
import { updateMember, type SessionUser, type SiteForCheck } from "./members";

type Site = SiteForCheck & { timezone: string };

/** updateMember, with a version conflict's 409 carrying `current`: the member record as GET returns it. */
export async function editMember(args: { user: SessionUser; site: Site; member: { id: string }; input: MemberPatch }) {
  try {
    return await updateMember(args);
  } catch (e) {
    if (e instanceof ConflictError && e.fields?.baseVersion) {
      const now = await getMemberView({ memberId: args.member.id });
      if (now) throw new ConflictError(e.message, e.fields, await memberDetail({ member: now, site: args.site }));
    }
    throw e;
  }
}
