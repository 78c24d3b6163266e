// Which screens each role sees in a site's navigation (the server still checks every action).
import type { SiteRole } from "@/db/schema";
import { rolesAllowPure, type PermissionName } from "@/lib/permissions";

export type NavIcon = "overview" | "register" | "add" | "permit" | "inspect" | "alert" | "calc" | "library" | "scheme" | "people" | "sites" | "settings" | "scan";
/** `scan`: the label scanner, drawn as its own button in the middle of the phone's bottom bar. */
export type NavItem = { href: string; label: string; icon: NavIcon; primary?: boolean; scan?: boolean };

/**
 * `bar`: the item's claim on the phone's bottom bar, lowest first; the bar holds the four lowest
 * the person's roles allow (plus the scan button and "More"). `barFor` gives a claim to some roles only.
 */
type NavDef = { path: string; label: string; icon: NavIcon; permission: PermissionName; bar?: number; barFor?: { roles: readonly SiteRole[]; bar: number }; scan?: boolean };

/** Items in the phone's bottom bar, besides the scan button and "More". */
const BAR_SIZE = 4;

/** In display order. */
const SITE_NAV: NavDef[] = [
  { path: "", label: "Overview", icon: "overview", permission: "viewSite", bar: 0 },
  { path: "/members/new", label: "Log member", icon: "add", permission: "logMember", bar: 1 },
  // In a site manager's bottom bar (alerts are the manager's main job); under "More" for the rest.
  { path: "/alerts", label: "Alerts", icon: "alert", permission: "viewAlerts", barFor: { roles: ["manager"], bar: 1 } },
  // Everyone who records inspections has the round in the bar (the round is the phone's daily job).
  { path: "/inspections", label: "Inspections", icon: "inspect", permission: "inspect", bar: 2 },
  { path: "/members", label: "Register", icon: "register", permission: "viewSite", bar: 3 },
  { path: "/calculator", label: "Calculator", icon: "calc", permission: "calculate", bar: 4 },
  { path: "/permits", label: "Permits", icon: "permit", permission: "viewSite", bar: 5 },
  { path: "/scan", label: "Scan a label", icon: "scan", permission: "viewSite", scan: true },
  { path: "/library", label: "Library", icon: "library", permission: "manageLibrary" },
  { path: "/schemes", label: "Schemes", icon: "scheme", permission: "manageSchemes" },
  { path: "/people", label: "People", icon: "people", permission: "managePeople" },
  { path: "/settings", label: "Site settings", icon: "settings", permission: "manageSite" },
];

export function siteNav(siteId: string, roles: readonly SiteRole[]): NavItem[] {
  const allowed = SITE_NAV.filter((d) => rolesAllowPure(roles, d.permission));
  const claim = (d: NavDef) => (d.barFor?.roles.some((r) => roles.includes(r)) ? d.barFor.bar : d.bar);
  const inBar = new Set(
    allowed
      .filter((d) => claim(d) !== undefined)
      .sort((a, b) => claim(a)! - claim(b)!)
      .slice(0, BAR_SIZE),
  );
  return allowed.map((d) => ({
    href: `/sites/${siteId}${d.path}`,
    label: d.label,
    icon: d.icon,
    primary: inBar.has(d),
    ...(d.scan ? { scan: true } : {}),
  }));
}
