// The columns of a site that a request carries (the seam's `site`, a page's `site`): shared by
// the site access lookup (sites.ts) and the per-request session lookup (users.ts).
import "server-only";
import { sites } from "@/db/schema";

export const siteColumns = {
  id: sites.id,
  organisationId: sites.organisationId,
  name: sites.name,
  code: sites.code,
  address: sites.address,
  timezone: sites.timezone,
  unitSystem: sites.unitSystem,
  designCode: sites.designCode,
  permitValidityHours: sites.permitValidityHours,
  inspectionIntervalDays: sites.inspectionIntervalDays,
  plumbToleranceMm: sites.plumbToleranceMm,
  expiryWarningHours: sites.expiryWarningHours,
  archivedAt: sites.archivedAt,
};

export type SiteColumnsRow = Pick<typeof sites.$inferSelect, keyof typeof siteColumns>;
