// Single-use links to set a new password; only the token's SHA-256 is stored.
import "server-only";
import { and, eq, isNull, sql } from "drizzle-orm";
import { db, type DbOrTx } from "@/db";
import { passwordResets, users } from "@/db/schema";

export async function createPasswordReset(
  { userId, tokenHash, expiresAt }: { userId: string; tokenHash: string; expiresAt: Date },
  tx: DbOrTx = db,
) {
  const [row] = await tx.insert(passwordResets).values({ userId, tokenHash, expiresAt }).returning({ id: passwordResets.id });
  return row!;
}

/** The reset a link points to, locked for the caller's transaction so it is used once. */
export async function getPasswordResetForUpdate({ tokenHash }: { tokenHash: string }, tx: DbOrTx) {
  const [row] = await tx
    .select({
      id: passwordResets.id,
      userId: passwordResets.userId,
      expiresAt: passwordResets.expiresAt,
      usedAt: passwordResets.usedAt,
      organisationId: users.organisationId,
      email: users.email,
      name: users.name,
      disabledAt: users.disabledAt,
    })
    .from(passwordResets)
    .innerJoin(users, eq(users.id, passwordResets.userId))
    .where(eq(passwordResets.tokenHash, tokenHash))
    .limit(1)
    .for("update", { of: passwordResets });
  return row ?? null;
}

/** Uses this reset and every other open one for the person (one new password ends them all). */
export async function markPasswordResetsUsed({ userId }: { userId: string }, tx: DbOrTx = db) {
  await tx
    .update(passwordResets)
    .set({ usedAt: sql`now()` })
    .where(and(eq(passwordResets.userId, userId), isNull(passwordResets.usedAt)));
}
