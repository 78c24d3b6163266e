// Page-side access: not signed in → sign-in; not found or not yours → 404 page.
import "server-only";
import { cache } from "react";
import { notFound } from "next/navigation";
import { getSiteAccess } from "@/lib/authz";
import { NotFoundError } from "@/lib/errors";
import { ARCHIVED_SITE_PERMISSIONS, rolesAllowPure, type PermissionName } from "@/lib/permissions";
import { requireUser } from "./index";

export const loadSitePage = cache(async (siteId: string) => {
  const user = await requireUser(`/sites/${siteId}`);
  try {
    const access = await getSiteAccess(user, siteId);
    // An archived site is read-only: screens offer only what still works there.
    const archived = !!access.site.archivedAt;
    return { user, ...access, may: (p: PermissionName) => rolesAllowPure(access.roles, p) && (!archived || ARCHIVED_SITE_PERMISSIONS.includes(p)) };
  } catch (e) {
    if (e instanceof NotFoundError) notFound();
    throw e;
  }
});
