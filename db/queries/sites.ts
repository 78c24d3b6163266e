import "server-only";
import { and, count, eq, sql } from "drizzle-orm";
import { db, type DbOrTx } from "@/db";
import { accessChanged } from "@/db/access-cache";
import { members, memberships, permits, sites } from "@/db/schema";
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
import { siteColumns } from "./site-columns";
import { siteRoles, type SessionUser } from "./users";


export type SiteSummary = Awaited<ReturnType<typeof getSiteAccessRow>>;

/** The site if it belongs to the user's organisation, with the roles the user holds there (one round trip). */
export async function getSiteAccessRow({ siteId, user }: { siteId: string; user: SessionUser }, tx: DbOrTx = db) {
  const [row] = await tx
    .select({
      site: siteColumns,
      // memberships_unique (user_id, site_id, role) answers this from the index.
      roles: sql<string[] | null>`(select array_agg(${memberships.role}::text) from ${memberships} where ${memberships.userId} = ${user.id} and ${memberships.siteId} = ${siteId})`,
    })
    .from(sites)
    .where(and(eq(sites.id, siteId), eq(sites.organisationId, user.organisationId)))
    .limit(1);
  if (!row) return null;
  return { site: row.site, roles: siteRoles(user, row.roles ?? []) };
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
  accessChanged(tx);
  const [row] = await tx.insert(sites).values({ organisationId, ...values }).returning(siteColumns);
  return row!;
}

export async function updateSite(
  { siteId, values }: { siteId: string; values: Partial<SiteValues> & { archivedAt?: Date | null } },
  tx: DbOrTx = db,
) {
  accessChanged(tx);
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
