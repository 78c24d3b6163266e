// Which screens each role sees in a site's navigation (the server still checks every action).
import type { SiteRole } from "@/db/schema";
import { rolesAllowPure, type PermissionName } from "@/lib/permissions";

export type NavIcon = "overview" | "register" | "add" | "permit" | "inspect" | "alert" | "calc" | "library" | "scheme" | "people" | "sites" | "settings";
export type NavItem = { href: string; label: string; icon: NavIcon; primary?: boolean };

type NavDef = { path: string; label: string; icon: NavIcon; permission: PermissionName; primary?: boolean; primaryFor?: readonly SiteRole[] };

/** In display order; `primary` items go in the phone's bottom bar (at most four plus "More"). */
const SITE_NAV: NavDef[] = [
  { path: "", label: "Overview", icon: "overview", permission: "viewSite", primary: true },
  { path: "/members/new", label: "Log member", icon: "add", permission: "logMember", primary: true },
  // In a site manager's bottom bar (alerts are the manager's main job); under "More" for the rest.
  { path: "/alerts", label: "Alerts", icon: "alert", permission: "viewAlerts", primaryFor: ["manager"] },
  { path: "/members", label: "Register", icon: "register", permission: "viewSite", primary: true },
  { path: "/calculator", label: "Calculator", icon: "calc", permission: "calculate", primary: true },
  { path: "/permits", label: "Permits", icon: "permit", permission: "viewSite", primary: true },
  { path: "/inspections", label: "Inspections", icon: "inspect", permission: "inspect" },
  { path: "/library", label: "Library", icon: "library", permission: "manageLibrary" },
  { path: "/schemes", label: "Schemes", icon: "scheme", permission: "manageSchemes" },
  { path: "/people", label: "People", icon: "people", permission: "managePeople" },
  { path: "/settings", label: "Site settings", icon: "settings", permission: "manageSite" },
];

export function siteNav(siteId: string, roles: readonly SiteRole[]): NavItem[] {
  return SITE_NAV.filter((d) => rolesAllowPure(roles, d.permission)).map((d) => ({
    href: `/sites/${siteId}${d.path}`,
    label: d.label,
    icon: d.icon,
    primary: d.primary || (d.primaryFor?.some((r) => roles.includes(r)) ?? false),
  }));
}
