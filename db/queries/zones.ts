import "server-only";
import { and, asc, count, eq } from "drizzle-orm";
import { db, type DbOrTx } from "@/db";
import { members, zones } from "@/db/schema";

const zoneColumns = { id: zones.id, siteId: zones.siteId, name: zones.name, level: zones.level, grid: zones.grid, area: zones.area, createdAt: zones.createdAt };
export type ZoneView = { id: string; siteId: string; name: string; level: string | null; grid: string | null; area: string | null; createdAt: Date };

export async function listZones({ siteId }: { siteId: string }, tx: DbOrTx = db): Promise<(ZoneView & { memberCount: number })[]> {
  const rows = await tx.select(zoneColumns).from(zones).where(eq(zones.siteId, siteId)).orderBy(asc(zones.name));
  const counts = await tx.select({ zoneId: members.zoneId, n: count() }).from(members).where(eq(members.siteId, siteId)).groupBy(members.zoneId);
  const by = new Map(counts.map((c) => [c.zoneId, c.n]));
  return rows.map((r) => ({ ...r, memberCount: by.get(r.id) ?? 0 }));
}

/** A zone only when it belongs to the given site. */
export async function getZone({ siteId, zoneId }: { siteId: string; zoneId: string }, tx: DbOrTx = db): Promise<ZoneView | null> {
  const [row] = await tx.select(zoneColumns).from(zones).where(and(eq(zones.id, zoneId), eq(zones.siteId, siteId))).limit(1);
  return row ?? null;
}

export async function getZoneByName({ siteId, name }: { siteId: string; name: string }, tx: DbOrTx = db) {
  const [row] = await tx.select(zoneColumns).from(zones).where(and(eq(zones.siteId, siteId), eq(zones.name, name))).limit(1);
  return row ?? null;
}

export async function insertZone(values: { siteId: string; name: string; level?: string | null; grid?: string | null; area?: string | null }, tx: DbOrTx = db) {
  const [row] = await tx.insert(zones).values(values).returning(zoneColumns);
  return row!;
}

export async function updateZone(
  { siteId, zoneId, values }: { siteId: string; zoneId: string; values: { name: string; level?: string | null; grid?: string | null; area?: string | null } },
  tx: DbOrTx = db,
) {
  const [row] = await tx.update(zones).set(values).where(and(eq(zones.id, zoneId), eq(zones.siteId, siteId))).returning(zoneColumns);
  return row ?? null;
}
