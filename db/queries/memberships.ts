import "server-only";
import { and, eq } from "drizzle-orm";
import { db, type DbOrTx } from "@/db";
import { memberships, users, type SiteRole } from "@/db/schema";

export async function listSitePeople({ siteId }: { siteId: string }, tx: DbOrTx = db) {
  const rows = await tx
    .select({ userId: users.id, name: users.name, email: users.email, role: memberships.role })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.siteId, siteId))
    .orderBy(users.name);
  const byUser = new Map<string, { userId: string; name: string; email: string; roles: SiteRole[] }>();
  for (const r of rows) {
    const u = byUser.get(r.userId) ?? { userId: r.userId, name: r.name, email: r.email, roles: [] };
    u.roles.push(r.role);
    byUser.set(r.userId, u);
  }
  return [...byUser.values()];
}

/** Everyone holding a role on a site (for permits and alerts). */
export async function listSiteRoleEmails({ siteId, role }: { siteId: string; role: SiteRole }, tx: DbOrTx = db) {
  return tx
    .selectDistinct({ userId: users.id, email: users.email, name: users.name })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.siteId, siteId), eq(memberships.role, role)));
}
