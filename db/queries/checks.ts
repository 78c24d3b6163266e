import "server-only";
import { desc, eq } from "drizzle-orm";
import { db, type DbOrTx } from "@/db";
import { checks, users, type Check } from "@/db/schema";

export type NewCheck = typeof checks.$inferInsert;

export async function insertCheck(values: NewCheck, tx: DbOrTx = db): Promise<Check> {
  const [row] = await tx.insert(checks).values(values).returning();
  return row!;
}

export async function getCheck({ checkId }: { checkId: string }, tx: DbOrTx = db): Promise<Check | null> {
  const [row] = await tx.select().from(checks).where(eq(checks.id, checkId)).limit(1);
  return row ?? null;
}

/** Inserts many checks (in the order given) and returns their ids in the same order. */
export async function insertChecks(values: NewCheck[], tx: DbOrTx = db): Promise<string[]> {
  const ids: string[] = [];
  for (let i = 0; i < values.length; i += 500) {
    const rows = await tx.insert(checks).values(values.slice(i, i + 500)).returning({ id: checks.id });
    ids.push(...rows.map((r) => r.id));
  }
  return ids;
}

/** Every check of a member, newest first, with who ran it. The member's access is checked by the caller. */
export async function listChecks({ memberId }: { memberId: string }, tx: DbOrTx = db) {
  return tx
    .select({
      id: checks.id,
      method: checks.method,
      reason: checks.reason,
      inputs: checks.inputs,
      result: checks.result,
      capacityN: checks.capacityN,
      utilisation: checks.utilisation,
      pass: checks.pass,
      engineVersion: checks.engineVersion,
      createdAt: checks.createdAt,
      createdByName: users.name,
    })
    .from(checks)
    .leftJoin(users, eq(users.id, checks.createdBy))
    .where(eq(checks.memberId, memberId))
    .orderBy(desc(checks.createdAt), desc(checks.id));
}
