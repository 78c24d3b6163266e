import "server-only";
import { and, count, eq, sql } from "drizzle-orm";
import { db, type DbOrTx } from "@/db";
import { members, memberships, permits, sites, type SiteRole } from "@/db/schema";
import { countFailingNow } from "./member-history";

export type SiteValues = {
  name: string;
  code: string;
  address: string | null;
  unitSystem: "si" | "us";
  designCode: "en1993" | "aisc360-lrfd" | "aisc360-asd";
  inspectionIntervalDays: number;
  permitValidityHours: number;
  expiryWarningHours: number;
  timezone: string;
};
import type { SessionUser } from "./users";

const siteColumns = {
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

export type SiteSummary = Awaited<ReturnType<typeof getSiteAccessRow>>;

/** The site if it belongs to the user's organisation, with the roles the user holds there. */
export async function getSiteAccessRow({ siteId, user }: { siteId: string; user: SessionUser }, tx: DbOrTx = db) {
  const [site] = await tx
    .select(siteColumns)
    .from(sites)
    .where(and(eq(sites.id, siteId), eq(sites.organisationId, user.organisationId)))
    .limit(1);
  if (!site) return null;
  const rows = await tx
    .select({ role: memberships.role })
    .from(memberships)
    .where(and(eq(memberships.siteId, siteId), eq(memberships.userId, user.id)));
  const roles = rows.map((r) => r.role) as SiteRole[];
  if (user.isOrgAdmin && !roles.includes("admin")) roles.push("admin");
  return { site, roles };
}

export async function getSiteCounts({ siteId }: { siteId: string }, tx: DbOrTx = db) {
  const [memberRows, permitRows] = await Promise.all([
    tx.select({ status: members.status, n: count() }).from(members).where(eq(members.siteId, siteId)).groupBy(members.status),
    tx.select({ status: permits.status, n: count() }).from(permits).where(eq(permits.siteId, siteId)).groupBy(permits.status),
  ]);
  // The same rule as the "overloaded now" list and the overload alerts (struck members excluded).
  const failing = await countFailingNow({ siteId }, tx);
  return {
    members: Object.fromEntries(memberRows.map((r) => [r.status, r.n])) as Record<string, number>,
    permits: Object.fromEntries(permitRows.map((r) => [r.status, r.n])) as Record<string, number>,
    failing,
  };
}

export async function createSite({ organisationId, values }: { organisationId: string; values: SiteValues }, tx: DbOrTx = db) {
  const [row] = await tx.insert(sites).values({ organisationId, ...values }).returning(siteColumns);
  return row!;
}

export async function updateSite(
  { siteId, values }: { siteId: string; values: Partial<SiteValues> & { archivedAt?: Date | null } },
  tx: DbOrTx = db,
) {
  const [row] = await tx.update(sites).set(values).where(eq(sites.id, siteId)).returning(siteColumns);
  return row!;
}

/** Another site of the organisation already using this code (codes label QR sheets and permits). */
export async function siteCodeTaken(
  { organisationId, code, exceptSiteId }: { organisationId: string; code: string; exceptSiteId?: string },
  tx: DbOrTx = db,
) {
  const rows = await tx
    .select({ id: sites.id })
    .from(sites)
    .where(and(eq(sites.organisationId, organisationId), sql`lower(${sites.code}) = ${code.toLowerCase()}`));
  return rows.some((r) => r.id !== exceptSiteId);
}
