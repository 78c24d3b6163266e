import { listSchemes } from "@/db/queries/schemes";
import { created } from "@/lib/api";
import { siteRoute } from "@/lib/api/route";
import { createScheme } from "@/lib/register/schemes";
import { schemeSchema } from "@/lib/validations/scheme";

export const GET = siteRoute({ resource: "site", permission: "viewSite" }, async ({ site }) => ({ items: await listSchemes({ siteId: site.id }) }));

export const POST = siteRoute({ resource: "site", permission: "manageSchemes", body: schemeSchema }, async ({ user, site, input }) =>
  created(await createScheme({ user, site, input })),
);
