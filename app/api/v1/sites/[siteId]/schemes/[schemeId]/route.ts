import { siteRoute } from "@/lib/api/route";
import { editScheme } from "@/lib/register/schemes";
import { schemeSchema } from "@/lib/validations/scheme";

export const PATCH = siteRoute({ resource: "scheme", permission: "manageSchemes", body: schemeSchema }, async ({ user, site, resource: scheme, input }) =>
  editScheme({ user, site, scheme, input }),
);
