// The one answer to "may this user do this on this site?". Every handler and action asks it.
import "server-only";
import { getSiteAccessRow } from "@/db/queries/sites";
import { ARCHIVED_SITE_PERMISSIONS, rolesAllowPure, type PermissionName } from "@/lib/permissions";
import type { SessionUser } from "@/lib/auth";
import { ConflictError, ForbiddenError, NotFoundError } from "@/lib/errors";

export { ALL_ROLES, PERMISSIONS, ROLE_LABELS } from "@/lib/permissions";
export type Permission = PermissionName;
export const rolesAllow = rolesAllowPure;

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
export function isUuid(value: unknown): value is string {
  return typeof value === "string" && UUID.test(value);
}

/**
 * The site and the user's roles there. Another organisation's site, a site the user holds no
 * role on, or a malformed id are all "not found" so nothing reveals that they exist.
 */
export async function getSiteAccess(user: SessionUser, siteId: string) {
  if (!isUuid(siteId)) throw new NotFoundError("That site");
  const access = await getSiteAccessRow({ siteId, user });
  if (!access || access.roles.length === 0) throw new NotFoundError("That site");
  return access;
}

/** Throws 404 for no access and 403 when the user's roles do not include the permission. */
export async function assertSitePermission(user: SessionUser, siteId: string, permission: Permission) {
  const access = await getSiteAccess(user, siteId);
  if (!rolesAllow(access.roles, permission)) throw new ForbiddenError();
  if (access.site.archivedAt && !ARCHIVED_SITE_PERMISSIONS.includes(permission))
    throw new ConflictError("This site is archived and read-only. An organisation admin can restore it from the site's settings.");
  return access;
}
