import { created } from "@/lib/api";
import { siteRoute } from "@/lib/api/route";
import { createMemberOnce } from "@/lib/register/members";
import { memberCreateSchema } from "@/lib/validations/member";

export { GET } from "@/lib/register/list-members-handler";

/**
 * Logs a member: 201 { member, check } — or 422 with field errors and nothing stored. With a
 * `clientId` already used on this site: 200 with the member made the first time, nothing new stored.
 */
export const POST = siteRoute({ resource: "site", permission: "logMember", body: memberCreateSchema }, async ({ user, site, input }) => {
  const { replayed, ...body } = await createMemberOnce({ user, site, input, source: "api" });
  return replayed ? body : created(body);
});
