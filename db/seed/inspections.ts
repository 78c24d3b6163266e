// Demo inspections: a recent pass for most installed members (so permits can be issued in the
// demo), one member overdue, a failed one for the damaged prop, none for draft members.
import { and, eq, inArray } from "drizzle-orm";
import type { PgTransaction } from "drizzle-orm/pg-core";
import * as schema from "@/db/schema";
import { checkLabel, INSPECTION_CHECKS } from "@/lib/inspections/checklist";

const DAY = 24 * 3600_000;

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- the seed's own transaction type
type SeedTx = PgTransaction<any, typeof schema, any>;

export async function seedInspections(
  tx: SeedTx,
  { memberIds, inspectorId, now }: { memberIds: Record<string, string[]>; inspectorId: string; now: number },
) {
  const allPass = INSPECTION_CHECKS.map((c) => ({ check: c.key, result: "pass" as const }));
  const ids = ["l1", "l2", "rs", "ts"].flatMap((g) => memberIds[g] ?? []);
  if (ids.length === 0) return;
  const rows = await tx
    .select({ id: schema.members.id, siteId: schema.members.siteId, tag: schema.members.tag, status: schema.members.status, interval: schema.sites.inspectionIntervalDays })
    .from(schema.members)
    .innerJoin(schema.sites, eq(schema.sites.id, schema.members.siteId))
    .where(and(inArray(schema.members.id, ids)));
  const values = rows.map((m) => {
    // WXW-L2-P01 was last inspected 9 days ago: overdue on a 7-day interval.
    const overdue = m.tag === "WXW-L2-P01";
    const failed = m.status === "out_of_service";
    const at = new Date(now - (overdue ? 9 : failed ? 3 : 1 + (m.tag.charCodeAt(m.tag.length - 1) % 2)) * DAY);
    return {
      siteId: m.siteId,
      memberId: m.id,
      inspectorId,
      result: failed ? ("fail" as const) : ("pass" as const),
      items: failed
        ? allPass.map((i) => (i.check === "condition" ? { check: i.check, result: "fail" as const, note: "Inner tube bent by a pallet truck" } : i))
        : allPass,
      notes: failed ? `${checkLabel("condition")}: failed. Taken out of use.` : null,
      inspectedAt: at,
      nextDueAt: failed ? null : new Date(at.getTime() + m.interval * DAY),
    };
  });
  await tx.insert(schema.inspections).values(values);
}
