import "server-only";
import { and, asc, eq } from "drizzle-orm";
import { db, type DbOrTx } from "@/db";
import { members, memberTypes, users, zones, type PlanScale } from "@/db/schema";

export type ZonePlanRow = {
  zoneId: string;
  siteId: string;
  name: string;
  level: string | null;
  grid: string | null;
  planImageKey: string | null;
  planSourceKey: string | null;
  planSourceType: string | null;
  planWidth: number | null;
  planHeight: number | null;
  planScale: PlanScale | null;
  planUploadedAt: Date | null;
  planUploadedByName: string | null;
};

/** A zone's plan fields, only when the zone belongs to the given site. */
export async function getZonePlan({ siteId, zoneId }: { siteId: string; zoneId: string }, tx: DbOrTx = db): Promise<ZonePlanRow | null> {
  const [row] = await tx
    .select({
      zoneId: zones.id,
      siteId: zones.siteId,
      name: zones.name,
      level: zones.level,
      grid: zones.grid,
      planImageKey: zones.planImageKey,
      planSourceKey: zones.planSourceKey,
      planSourceType: zones.planSourceType,
      planWidth: zones.planWidth,
      planHeight: zones.planHeight,
      planScale: zones.planScale,
      planUploadedAt: zones.planUploadedAt,
      planUploadedByName: users.name,
    })
    .from(zones)
    .leftJoin(users, eq(users.id, zones.planUploadedBy))
    .where(and(eq(zones.id, zoneId), eq(zones.siteId, siteId)))
    .limit(1);
  return row ?? null;
}

export async function setZonePlan(
  {
    siteId,
    zoneId,
    values,
  }: {
    siteId: string;
    zoneId: string;
    values: { planImageKey: string; planSourceKey: string; planSourceType: string; planWidth: number; planHeight: number; planScale: PlanScale | null; planUploadedBy: string; planUploadedAt: Date };
  },
  tx: DbOrTx = db,
) {
  const [row] = await tx.update(zones).set(values).where(and(eq(zones.id, zoneId), eq(zones.siteId, siteId))).returning({ id: zones.id });
  return row ?? null;
}

export type ZonePlanMember = {
  memberId: string;
  tag: string;
  status: (typeof members.$inferSelect)["status"];
  pass: boolean | null;
  utilisation: number | null;
  capacityN: number | null;
  loadN: number;
  typeName: string;
  x: number | null;
  y: number | null;
};

/** Every member logged in the zone with its latest check (denormalised on the member), by tag. */
export async function listZonePlanMembers({ siteId, zoneId }: { siteId: string; zoneId: string }, tx: DbOrTx = db): Promise<ZonePlanMember[]> {
  return tx
    .select({
      memberId: members.id,
      tag: members.tag,
      status: members.status,
      pass: members.checkPass,
      utilisation: members.utilisation,
      capacityN: members.capacityN,
      loadN: members.loadN,
      typeName: memberTypes.name,
      x: members.planX,
      y: members.planY,
    })
    .from(members)
    .innerJoin(memberTypes, eq(memberTypes.id, members.memberTypeId))
    .where(and(eq(members.siteId, siteId), eq(members.zoneId, zoneId)))
    .orderBy(asc(members.tag));
}

/** Which zones of a site have a plan (for links from the overview, the register and the member page). */
export async function listZonesWithPlan({ siteId }: { siteId: string }, tx: DbOrTx = db) {
  const rows = await tx.select({ id: zones.id, name: zones.name, planImageKey: zones.planImageKey }).from(zones).where(eq(zones.siteId, siteId)).orderBy(asc(zones.name));
  return rows.map((r) => ({ id: r.id, name: r.name, hasPlan: r.planImageKey != null }));
}
