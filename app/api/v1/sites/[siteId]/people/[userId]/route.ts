import { siteRoute } from "@/lib/api/route";
import { setSiteRoles } from "@/lib/auth/people";
import { rolesSchema } from "@/lib/validations/onboarding";

const forbidden = "Changing people's roles is for organisation admins.";

/** { roles } → 200 { person }: exactly these roles on this site, from the person's next request. */
export const PUT = siteRoute({ resource: "site", permission: "managePeople", forbidden, body: rolesSchema }, async ({ user, site, params, input }) => ({
  person: await setSiteRoles({ user, site, userId: params.userId ?? "", roles: input.roles }),
}));

/** Removes the person from this site (every role) → 204. */
export const DELETE = siteRoute({ resource: "site", permission: "managePeople", forbidden }, async ({ user, site, params }) => {
  await setSiteRoles({ user, site, userId: params.userId ?? "", roles: [] });
  return new Response(null, { status: 204 });
});
