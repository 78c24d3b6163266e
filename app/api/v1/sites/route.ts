import { listUserSites } from "@/db/queries/users";
import { apiHandler, created } from "@/lib/api";
import { userRoute } from "@/lib/api/route";
import { requireApiUser } from "@/lib/auth";
import { ForbiddenError } from "@/lib/errors";
import { addSite, siteView } from "@/lib/sites/manage";
import { siteCreateSchema } from "@/lib/validations/onboarding";

/** The user's sites; archived ones only with `?archived=include`. */
export const GET = apiHandler(async (req) => {
  const user = await requireApiUser();
  const includeArchived = new URL(req.url).searchParams.get("archived") === "include";
  const sites = await listUserSites({ user, includeArchived });
  return {
    items: sites.map((s) => ({ id: s.id, name: s.name, code: s.code, address: s.address, roles: s.roles, archived: !!s.archivedAt })),
  };
});

/** Organisation admins add a site → 201 { site }. */
export const POST = userRoute({ body: siteCreateSchema, permission: "manageSite" }, async ({ user, input }) => {
  if (!user.isOrgAdmin) throw new ForbiddenError("Adding sites is for organisation admins.");
  return created({ site: siteView(await addSite({ user, input })) });
});
