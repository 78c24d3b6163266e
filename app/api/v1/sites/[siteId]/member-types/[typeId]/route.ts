import { siteRoute } from "@/lib/api/route";
import { deleteMemberType, updateMemberType } from "@/lib/register/member-types";
import { memberTypeSchema } from "@/lib/validations/member-type";

/** Saves a changed type as a new revision and re-checks every member using it. */
export const PATCH = siteRoute(
  { resource: "memberType", permission: "manageLibrary", body: memberTypeSchema },
  async ({ user, site, resource: memberType, input }) => updateMemberType({ user, site, memberType, input }),
);

/** Refused with 409 while any member uses the type. */
export const DELETE = siteRoute({ resource: "memberType", permission: "manageLibrary" }, async ({ user, site, resource: memberType }) =>
  deleteMemberType({ user, site, memberType }),
);
