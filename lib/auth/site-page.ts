// Page-side access: not signed in → sign-in; not found or not yours → 404 page.
import "server-only";
import { cache } from "react";
import { notFound } from "next/navigation";
import { isUuid, siteAccessOr404 } from "@/lib/authz";
import { NotFoundError } from "@/lib/errors";
import { ARCHIVED_SITE_PERMISSIONS, rolesAllowPure, type PermissionName } from "@/lib/permissions";
import { requireUserAt } from "./index";

export const loadSitePage = cache(async (siteId: string) => {
  // Who is asking and what they hold on this site, in one round trip (a malformed id reads no site).
  const { user, access: known } = await requireUserAt(isUuid(siteId) ? siteId : "", `/sites/${siteId}`);
  try {
    const access = siteAccessOr404(known);
    // An archived site is read-only: screens offer only what still works there.
    const archived = !!access.site.archivedAt;
    return { user, ...access, may: (p: PermissionName) => rolesAllowPure(access.roles, p) && (!archived || ARCHIVED_SITE_PERMISSIONS.includes(p)) };
  } catch (e) {
    if (e instanceof NotFoundError) notFound();
    throw e;
  }
});
