import { created } from "@/lib/api";
import { siteRoute } from "@/lib/api/route";
import { createMember } from "@/lib/register/members";
import { memberCreateSchema } from "@/lib/validations/member";

export { GET } from "@/lib/register/list-members-handler";

/** Logs a member: 201 { member, check } — or 422 with field errors and nothing stored. */
export const POST = siteRoute({ resource: "site", permission: "logMember", body: memberCreateSchema }, async ({ user, site, input }) =>
  created(await createMember({ user, site, input, source: "api" })),
);
