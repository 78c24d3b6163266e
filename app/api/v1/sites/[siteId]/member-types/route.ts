import { listMemberTypes } from "@/db/queries/member-types";
import { created } from "@/lib/api";
import { siteRoute } from "@/lib/api/route";
import { createMemberType } from "@/lib/register/member-types";
import { memberTypeSchema } from "@/lib/validations/member-type";

/** The organisation's library, seen from one of its sites. */
export const GET = siteRoute({ resource: "site", permission: "viewSite" }, async ({ site }) => ({
  items: await listMemberTypes({ organisationId: site.organisationId }),
}));

export const POST = siteRoute({ resource: "site", permission: "manageLibrary", body: memberTypeSchema }, async ({ user, site, input }) =>
  created(await createMemberType({ user, site, input })),
);
