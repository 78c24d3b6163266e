import "server-only";
import { and, eq, sql } from "drizzle-orm";
import { db, type DbOrTx } from "@/db";
import { memberships, organisations, signInThrottle, sites, users } from "@/db/schema";

export type SessionUser = {
  id: string;
  email: string;
  name: string;
  organisationId: string;
  organisationName: string;
  isOrgAdmin: boolean;
};

export async function getUserForSignIn({ email }: { email: string }, tx: DbOrTx = db) {
  const [row] = await tx
    .select({ id: users.id, email: users.email, name: users.name, passwordHash: users.passwordHash, disabledAt: users.disabledAt })
    .from(users)
    .where(sql`lower(${users.email}) = ${email.toLowerCase()}`)
    .limit(1);
  return row ?? null;
}

export async function getSessionUser({ id }: { id: string }, tx: DbOrTx = db): Promise<SessionUser | null> {
  const [row] = await tx
    .select({
      id: users.id,
      email: users.email,
      name: users.name,
      organisationId: users.organisationId,
      organisationName: organisations.name,
      isOrgAdmin: users.isOrgAdmin,
      disabledAt: users.disabledAt,
    })
    .from(users)
    .innerJoin(organisations, eq(organisations.id, users.organisationId))
    .where(eq(users.id, id))
    .limit(1);
  if (!row || row.disabledAt) return null;
  const { disabledAt: _disabled, ...user } = row;
  return user;
}

/** The sites a user can see, with every role they hold there. Org admins see all their organisation's sites. */
export async function listUserSites({ user }: { user: SessionUser }, tx: DbOrTx = db) {
  const rows = await tx
    .select({ id: sites.id, name: sites.name, code: sites.code, address: sites.address, role: memberships.role })
    .from(sites)
    .leftJoin(memberships, and(eq(memberships.siteId, sites.id), eq(memberships.userId, user.id)))
    .where(eq(sites.organisationId, user.organisationId))
    .orderBy(sites.name);
  const bySite = new Map<string, { id: string; name: string; code: string; address: string | null; roles: string[] }>();
  for (const r of rows) {
    if (!r.role && !user.isOrgAdmin) continue;
    const s = bySite.get(r.id) ?? { id: r.id, name: r.name, code: r.code, address: r.address, roles: [] };
    if (r.role && !s.roles.includes(r.role)) s.roles.push(r.role);
    if (user.isOrgAdmin && !s.roles.includes("admin")) s.roles.push("admin");
    bySite.set(r.id, s);
  }
  return [...bySite.values()];
}

export async function getThrottle({ email }: { email: string }, tx: DbOrTx = db) {
  const [row] = await tx.select().from(signInThrottle).where(eq(signInThrottle.email, email.toLowerCase())).limit(1);
  return row ?? null;
}

export async function recordSignInFailure(
  { email, now, blockedUntil, failures }: { email: string; now: Date; blockedUntil: Date | null; failures: number },
  tx: DbOrTx = db,
) {
  await tx
    .insert(signInThrottle)
    .values({ email: email.toLowerCase(), failures, lastFailureAt: now, blockedUntil })
    .onConflictDoUpdate({ target: signInThrottle.email, set: { failures, lastFailureAt: now, blockedUntil } });
}

export async function clearSignInFailures({ email }: { email: string }, tx: DbOrTx = db) {
  await tx.delete(signInThrottle).where(eq(signInThrottle.email, email.toLowerCase()));
}
