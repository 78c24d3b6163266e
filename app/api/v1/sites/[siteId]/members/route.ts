import { apiHandler, created, readJson } from "@/lib/api";
import { requireApiUser } from "@/lib/auth";
import { createMember } from "@/lib/register/members";

export { GET } from "@/lib/register/list-members-handler";

/** Logs a member: 201 { member, check } — or 422 with field errors and nothing stored. */
export const POST = apiHandler<{ siteId: string }>(async (req, { params }) => {
  const user = await requireApiUser();
  const input = await readJson(req);
  return created(await createMember({ user, siteId: params.siteId, input, source: "api" }));
});
