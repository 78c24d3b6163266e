import "server-only";
import { and, eq, inArray, isNull, notInArray } from "drizzle-orm";
import { db, type DbOrTx } from "@/db";
import { accessChanged } from "@/db/access-cache";
import { memberships, users, type SiteRole } from "@/db/schema";

export async function listSitePeople({ siteId }: { siteId: string }, tx: DbOrTx = db) {
  const rows = await tx
    .select({
      userId: users.id,
      name: users.name,
      email: users.email,
      isOrgAdmin: users.isOrgAdmin,
      disabledAt: users.disabledAt,
      role: memberships.role,
    })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.siteId, siteId))
    .orderBy(users.name);
  type Person = { userId: string; name: string; email: string; isOrgAdmin: boolean; active: boolean; roles: SiteRole[] };
  const byUser = new Map<string, Person>();
  for (const r of rows) {
    const u = byUser.get(r.userId) ?? {
      userId: r.userId,
      name: r.name,
      email: r.email,
      isOrgAdmin: r.isOrgAdmin,
      active: !r.disabledAt,
      roles: [],
    };
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
    .where(and(eq(memberships.siteId, siteId), eq(memberships.role, role), isNull(users.disabledAt)));
}

export async function listUserRolesOnSite({ siteId, userId }: { siteId: string; userId: string }, tx: DbOrTx = db) {
  const rows = await tx
    .select({ role: memberships.role })
    .from(memberships)
    .where(and(eq(memberships.siteId, siteId), eq(memberships.userId, userId)));
  return rows.map((r) => r.role);
}

/** Makes the person's roles on the site exactly `roles` (an empty list removes them from it). */
export async function setUserRolesOnSite(
  { siteId, userId, roles }: { siteId: string; userId: string; roles: SiteRole[] },
  tx: DbOrTx = db,
) {
  accessChanged(tx);
  const where = and(eq(memberships.siteId, siteId), eq(memberships.userId, userId));
  await tx.delete(memberships).where(roles.length ? and(where, notInArray(memberships.role, roles)) : where);
  if (roles.length)
    await tx
      .insert(memberships)
      .values(roles.map((role) => ({ siteId, userId, role })))
      .onConflictDoNothing();
}

/** Adds roles without taking any away (accepting an invitation). */
export async function addUserRolesOnSite(
  { siteId, userId, roles }: { siteId: string; userId: string; roles: SiteRole[] },
  tx: DbOrTx = db,
) {
  if (!roles.length) return;
  accessChanged(tx);
  await tx
    .insert(memberships)
    .values(roles.map((role) => ({ siteId, userId, role })))
    .onConflictDoNothing();
}

/** Active people holding the site's admin role, besides organisation admins. */
export async function listActiveSiteAdmins({ siteId }: { siteId: string }, tx: DbOrTx = db) {
  return tx
    .selectDistinct({ id: users.id })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.siteId, siteId), inArray(memberships.role, ["admin"]), isNull(users.disabledAt)));
}
