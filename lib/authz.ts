// Site access for pages (lib/auth/site-page.ts): the site and the roles held there, or 404. Route
// handlers get the same answer through the seam (lib/api/route.ts and lib/api/resources.ts).
import "server-only";
import type { SessionAccess } from "@/db/queries/users";
import type { PermissionName } from "@/lib/permissions";
import { NotFoundError } from "@/lib/errors";

export type Permission = PermissionName;

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
export function isUuid(value: unknown): value is string {
  return typeof value === "string" && UUID.test(value);
}

/**
 * The site and the user's roles there, as read with the session (getSessionUserAt). Another
 * organisation's site, a site the user holds no role on, or a malformed id are all "not found"
 * so nothing reveals that they exist.
 */
export function siteAccessOr404(access: SessionAccess | null | undefined, what = "That site"): SessionAccess {
  if (!access || access.roles.length === 0) throw new NotFoundError(what);
  return access;
}
