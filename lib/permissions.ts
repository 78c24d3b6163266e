// What each role may do on a site (BS 5975 roles; one person may hold several). Pure data, so
// navigation and tests can use it; lib/authz.ts enforces it on the server.
import type { SiteRole } from "@/db/schema";

export const ALL_ROLES: readonly SiteRole[] = ["engineer", "coordinator", "supervisor", "designer", "manager", "admin"];

export const ROLE_LABELS: Record<SiteRole, string> = {
  engineer: "Site engineer",
  coordinator: "Temporary works coordinator",
  supervisor: "Temporary works supervisor",
  designer: "Temporary works designer",
  manager: "Site manager",
  admin: "Organisation admin",
};

export const PERMISSIONS = {
  viewSite: ALL_ROLES,
  calculate: ALL_ROLES,
  logMember: ["engineer", "coordinator", "supervisor"],
  editMember: ["engineer", "coordinator", "supervisor"],
  importMembers: ["engineer", "coordinator"],
  manageZones: ["designer", "coordinator", "admin"],
  manageSchemes: ["designer", "coordinator"],
  manageLibrary: ["designer", "admin"],
  requestPermit: ["engineer", "supervisor", "coordinator"],
  issuePermit: ["coordinator"],
  /** Give a supervisor scope to issue permits for some zones until a date. */
  delegatePermits: ["coordinator"],
  /** Confirm on the ground that striking under a permit to strike is done. */
  confirmStriking: ["supervisor", "coordinator"],
  inspect: ["engineer", "supervisor", "coordinator"],
  triggerInspections: ["coordinator"],
  viewAlerts: ALL_ROLES,
  managePeople: ["admin"],
  /** A site's name, code and policies (inspection interval, permit validity, warning time, units, basis); archiving. */
  manageSite: ["admin"],
} as const satisfies Record<string, readonly SiteRole[]>;

export type PermissionName = keyof typeof PERMISSIONS;

export function rolesAllowPure(roles: readonly SiteRole[], permission: PermissionName): boolean {
  return roles.some((r) => (PERMISSIONS[permission] as readonly SiteRole[]).includes(r));
}

/** What still works on an archived (read-only) site: reading, the calculator, and restoring it. */
export const ARCHIVED_SITE_PERMISSIONS: readonly PermissionName[] = ["viewSite", "calculate", "viewAlerts", "manageSite"];
