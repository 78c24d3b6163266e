// The kinds of alert, who gets them, and how each may be delivered. Pure data: the pages, the
// scans and the tests all read it.
import type { SiteRole } from "@/db/schema";

export const ALERT_KINDS = [
  "member_overloaded",
  "inspection_failed",
  "inspection_overdue",
  "inspection_due_soon",
  "permit_expiring",
  "permit_expired",
  "email_failing",
] as const;
export type AlertKind = (typeof ALERT_KINDS)[number];

export const ALERT_KIND_LABELS: Record<AlertKind, string> = {
  member_overloaded: "Member overloaded (fails its capacity check)",
  inspection_failed: "Member failed its inspection",
  inspection_overdue: "Inspection overdue or due now",
  inspection_due_soon: "Inspection due within 24 hours",
  permit_expiring: "Permit about to expire",
  permit_expired: "Permit expired",
  email_failing: "E-mail not being delivered",
};

/** Short words shown beside the icon in lists. */
export const ALERT_KIND_SHORT: Record<AlertKind, string> = {
  member_overloaded: "Overloaded",
  inspection_failed: "Failed inspection",
  inspection_overdue: "Inspection overdue",
  inspection_due_soon: "Inspection due soon",
  permit_expiring: "Permit expiring",
  permit_expired: "Permit expired",
  email_failing: "E-mail failing",
};

export const ALERT_SEVERITY: Record<AlertKind, "bad" | "warn"> = {
  member_overloaded: "bad",
  inspection_failed: "bad",
  inspection_overdue: "bad",
  inspection_due_soon: "warn",
  permit_expiring: "warn",
  permit_expired: "bad",
  email_failing: "warn",
};

/** Who is alerted on a site, by role. */
export const ALERT_RECIPIENT_ROLES: Record<AlertKind, readonly SiteRole[]> = {
  member_overloaded: ["manager", "coordinator"],
  inspection_failed: ["manager", "coordinator"],
  inspection_overdue: ["manager", "coordinator"],
  inspection_due_soon: ["manager", "coordinator"],
  permit_expiring: ["manager", "coordinator"],
  permit_expired: ["manager", "coordinator"],
  email_failing: ["coordinator", "admin"],
};

/** Overload and expiry always e-mail the site manager at once, whatever the manager prefers. */
export const ALWAYS_EMAIL_MANAGER: readonly AlertKind[] = ["member_overloaded", "permit_expiring", "permit_expired"];

export const DELIVERIES = ["immediate", "digest", "in_app"] as const;
export type Delivery = (typeof DELIVERIES)[number];
export const DELIVERY_LABELS: Record<Delivery, string> = {
  immediate: "E-mail me at once",
  digest: "Daily digest only",
  in_app: "In the app only",
};
export const DEFAULT_DELIVERY: Delivery = "immediate";

export function isAlertKind(v: unknown): v is AlertKind {
  return typeof v === "string" && (ALERT_KINDS as readonly string[]).includes(v);
}

/** How one person receives one alert on a site, given their roles there and their preference. */
export function deliveryFor(kind: AlertKind, roles: readonly SiteRole[], preference: Delivery | undefined): Delivery | null {
  if (!roles.some((r) => ALERT_RECIPIENT_ROLES[kind].includes(r))) return null;
  if (ALWAYS_EMAIL_MANAGER.includes(kind) && roles.includes("manager")) return "immediate";
  return preference ?? DEFAULT_DELIVERY;
}
