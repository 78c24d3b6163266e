// Which screens each role sees in a site's navigation (the server still checks every action).
import type { SiteRole } from "@/db/schema";
import { rolesAllowPure, type PermissionName } from "@/lib/permissions";

export type NavIcon = "overview" | "register" | "add" | "permit" | "inspect" | "alert" | "calc" | "library" | "scheme" | "people" | "sites";
export type NavItem = { href: string; label: string; icon: NavIcon; primary?: boolean };

type NavDef = { path: string; label: string; icon: NavIcon; permission: PermissionName; primary?: boolean };

/** In display order; `primary` items go in the phone's bottom bar (at most four plus "More"). */
const SITE_NAV: NavDef[] = [
  { path: "", label: "Overview", icon: "overview", permission: "viewSite", primary: true },
  { path: "/calculator", label: "Calculator", icon: "calc", permission: "calculate", primary: true },
  { path: "/people", label: "People", icon: "people", permission: "managePeople" },
];

export function siteNav(siteId: string, roles: readonly SiteRole[]): NavItem[] {
  return SITE_NAV.filter((d) => rolesAllowPure(roles, d.permission)).map((d) => ({
    href: `/sites/${siteId}${d.path}`,
    label: d.label,
    icon: d.icon,
    primary: d.primary,
  }));
}
