import { siteRoute } from "@/lib/api/route";
import { memberDetail } from "@/lib/register/member-detail";
import { editMember } from "@/lib/register/member-edit";
import { parseMemberPatch } from "@/lib/register/members";

/**
 * The member record: the member, its latest check and every check, its photos (thumbnail and
 * display URLs), its inspections and permits, its state in words and its history as sentences.
 */
export const GET = siteRoute({ resource: "member", permission: "viewSite" }, async ({ site, resource: member }) => memberDetail({ member, site }));

/**
 * Edits a member; a change to extension, load, spacing, end conditions, type or scheme re-checks it.
 * A status the lifecycle owns (loaded, struck, out of service) cannot be set or left here: 409 with the reason.
 * With `baseVersion` (the member's `version` the edit started from) and a newer member on the server:
 * 409 { error: { code: "conflict", message, fields: { baseVersion }, current: <member record> } }, nothing saved.
 */
export const PATCH = siteRoute(
  {
    resource: "member",
    permission: "editMember",
    forbidden: "Your role on this site does not allow editing members.",
    body: parseMemberPatch,
  },
  async ({ user, site, resource: member, input }) => editMember({ user, site, member, input }),
);
