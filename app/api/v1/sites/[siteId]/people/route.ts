import { listSitePeople } from "@/db/queries/memberships";
import { siteRoute } from "@/lib/api/route";

/** Everyone holding a role on the site, with their roles and whether their account is active. */
export const GET = siteRoute({ resource: "site", permission: "managePeople", forbidden: "Managing people is for organisation admins." }, async ({ site }) => ({
  items: await listSitePeople({ siteId: site.id }),
}));
