import { listUserSites } from "@/db/queries/users";
import { created } from "@/lib/api";
import { userRoute } from "@/lib/api/route";
import { ForbiddenError } from "@/lib/errors";
import { addSite, siteView } from "@/lib/sites/manage";
import { siteCreateSchema } from "@/lib/validations/onboarding";
import { z } from "zod";

const sitesQuery = z.object({ archived: z.enum(["include", "exclude"], { error: () => "archived may be include or exclude." }).optional() });

/** The sites the signed-in person can see, with their roles on each; archived ones only with `?archived=include`. */
export const GET = userRoute({ query: sitesQuery }, async ({ user, query }) => {
  const sites = await listUserSites({ user, includeArchived: query.archived === "include" });
  return {
    items: sites.map((s) => ({ id: s.id, name: s.name, code: s.code, address: s.address, roles: s.roles, archived: !!s.archivedAt })),
  };
});

/** Organisation admins add a site → 201 { site }. */
export const POST = userRoute({ body: siteCreateSchema, permission: "manageSite" }, async ({ user, input }) => {
  if (!user.isOrgAdmin) throw new ForbiddenError("Adding sites is for organisation admins.");
  return created({ site: siteView(await addSite({ user, input })) });
});
