// Site access for pages (lib/auth/site-page.ts): the site and the roles held there, or 404. Route
// handlers get the same answer through the seam (lib/api/route.ts and lib/api/resources.ts).
import "server-only";
import { getSiteAccessRow } from "@/db/queries/sites";
import type { PermissionName } from "@/lib/permissions";
import type { SessionUser } from "@/lib/auth";
import { NotFoundError } from "@/lib/errors";

export type Permission = PermissionName;

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
