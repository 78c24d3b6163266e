import "server-only";
import { and, count, eq, isNull, sql } from "drizzle-orm";
import { db, type DbOrTx } from "@/db";
import { accessChanged, keptAccess } from "@/db/access-cache";
import { memberships, organisations, revokedSessions, signInThrottle, sites, users, type SiteRole } from "@/db/schema";
import { siteColumns, type SiteColumnsRow } from "./site-columns";

export type SessionUser = {
  id: string;
  email: string;
  name: string;
  organisationId: string;
  organisationName: string;
  isOrgAdmin: boolean;
  sessionVersion: number;
};

export async function getUserForSignIn({ email }: { email: string }, tx: DbOrTx = db) {
  const [row] = await tx
    .select({
      id: users.id,
      email: users.email,
      name: users.name,
      passwordHash: users.passwordHash,
      disabledAt: users.disabledAt,
      sessionVersion: users.sessionVersion,
    })
    .from(users)
    .where(sql`lower(${users.email}) = ${email.toLowerCase()}`)
    .limit(1);
  return row ?? null;
}

export type SessionAccess = { site: SiteColumnsRow; roles: SiteRole[] };

/**
 * The signed-in person, read on every request. `sessionVersion` is the one in their session
 * cookie: a deactivation or password reset bumps the stored one, so every older session ends.
 * With `siteId`, the same single round trip also reads that site (if it is the person's
 * organisation's) and every role they hold there now, so a route or page on a site learns who is
 * asking and what they may do there in one indexed query: a role removed a moment ago is already
 * gone from the answer.
 */
export async function getSessionUserAt(
  args: { id: string; sessionVersion?: number; sid?: string; siteId?: string },
  tx: DbOrTx = db,
): Promise<{ user: SessionUser; access: SessionAccess | null } | null> {
  // Outside a transaction the answer may come from memory (db/access-cache.ts: dropped on any change).
  if (tx !== db) return readSessionUserAt(args, tx);
  return keptAccess(`${args.id}|${args.sessionVersion ?? ""}|${args.sid ?? ""}|${args.siteId ?? ""}`, () => readSessionUserAt(args, tx));
}

async function readSessionUserAt(
  { id, sessionVersion, sid, siteId }: { id: string; sessionVersion?: number; sid?: string; siteId?: string },
  tx: DbOrTx,
): Promise<{ user: SessionUser; access: SessionAccess | null } | null> {
  // A signed-out session's id is in revoked_sessions: the same round trip answers both questions.
  const revoked = sid
    ? sql<boolean>`exists (select 1 from ${revokedSessions} where ${revokedSessions.sid} = ${sid})`
    : sql<boolean>`false`;
  const base = tx
    .select({
      id: users.id,
      email: users.email,
      name: users.name,
      organisationId: users.organisationId,
      organisationName: organisations.name,
      isOrgAdmin: users.isOrgAdmin,
      disabledAt: users.disabledAt,
      sessionVersion: users.sessionVersion,
      revoked,
      ...(siteId
        ? {
            site: siteColumns,
            // memberships_unique (user_id, site_id, role) answers this from the index.
            roles: sql<string[] | null>`(select array_agg(${memberships.role}::text) from ${memberships} where ${memberships.userId} = ${id} and ${memberships.siteId} = ${siteId})`,
          }
        : {}),
    })
    .from(users)
    .innerJoin(organisations, eq(organisations.id, users.organisationId));
  const query = siteId
    ? base.leftJoin(sites, and(eq(sites.id, siteId), eq(sites.organisationId, users.organisationId)))
    : base;
  const [row] = (await query.where(eq(users.id, id)).limit(1)) as unknown as {
    id: string; email: string; name: string; organisationId: string; organisationName: string; isOrgAdmin: boolean;
    disabledAt: Date | null; sessionVersion: number; revoked: boolean; site?: SiteColumnsRow | null; roles?: string[] | null;
  }[];
  if (!row || row.disabledAt || row.revoked) return null;
  if (sessionVersion !== undefined && sessionVersion !== row.sessionVersion) return null;
  const user: SessionUser = {
    id: row.id,
    email: row.email,
    name: row.name,
    organisationId: row.organisationId,
    organisationName: row.organisationName,
    isOrgAdmin: row.isOrgAdmin,
    sessionVersion: row.sessionVersion,
  };
  if (!row.site) return { user, access: null };
  return { user, access: { site: row.site, roles: siteRoles(user, row.roles ?? []) } };
}

/** The roles a person holds on a site: their memberships, and admin everywhere for an organisation admin. */
export function siteRoles(user: Pick<SessionUser, "isOrgAdmin">, held: readonly string[]): SiteRole[] {
  const roles = [...new Set(held)] as SiteRole[];
  if (user.isOrgAdmin && !roles.includes("admin")) roles.push("admin");
  return roles;
}

/** The signed-in person alone (see getSessionUserAt). */
export async function getSessionUser(
  args: { id: string; sessionVersion?: number; sid?: string },
  tx: DbOrTx = db,
): Promise<SessionUser | null> {
  return (await getSessionUserAt(args, tx))?.user ?? null;
}

/** The sites a user can see, with every role they hold there. Org admins see all their organisation's sites. */
export async function listUserSites(
  { user, includeArchived = false }: { user: SessionUser; includeArchived?: boolean },
  tx: DbOrTx = db,
) {
  const rows = await tx
    .select({
      id: sites.id,
      name: sites.name,
      code: sites.code,
      address: sites.address,
      archivedAt: sites.archivedAt,
      role: memberships.role,
    })
    .from(sites)
    .leftJoin(memberships, and(eq(memberships.siteId, sites.id), eq(memberships.userId, user.id)))
    .where(and(eq(sites.organisationId, user.organisationId), includeArchived ? undefined : isNull(sites.archivedAt)))
    .orderBy(sites.name);
  type Row = { id: string; name: string; code: string; address: string | null; archivedAt: Date | null; roles: string[] };
  const bySite = new Map<string, Row>();
  for (const r of rows) {
    if (!r.role && !user.isOrgAdmin) continue;
    const s = bySite.get(r.id) ?? { id: r.id, name: r.name, code: r.code, address: r.address, archivedAt: r.archivedAt, roles: [] };
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

// ------------------------------------------------------------ onboarding and people

export async function countOrganisations(tx: DbOrTx = db) {
  const [row] = await tx.select({ n: count() }).from(organisations);
  return row?.n ?? 0;
}

/** Serialises first-run setup: two people pressing "Create" at once make one organisation. */
export async function lockSetup(tx: DbOrTx) {
  await tx.execute(sql`select pg_advisory_xact_lock(4242001)`);
}

export async function createOrganisation({ name, slug }: { name: string; slug: string }, tx: DbOrTx = db) {
  accessChanged(tx);
  const [row] = await tx.insert(organisations).values({ name, slug }).returning({ id: organisations.id, name: organisations.name });
  return row!;
}

export async function createUser(
  v: { organisationId: string; email: string; name: string; passwordHash: string; isOrgAdmin?: boolean },
  tx: DbOrTx = db,
) {
  accessChanged(tx);
  const [row] = await tx
    .insert(users)
    .values({ ...v, email: v.email.toLowerCase(), isOrgAdmin: v.isOrgAdmin ?? false })
    .returning({ id: users.id, email: users.email, name: users.name, organisationId: users.organisationId });
  return row!;
}

const personColumns = {
  id: users.id,
  organisationId: users.organisationId,
  email: users.email,
  name: users.name,
  isOrgAdmin: users.isOrgAdmin,
  disabledAt: users.disabledAt,
  sessionVersion: users.sessionVersion,
};

/** Any account with this address (addresses are unique across the whole installation). */
export async function getUserByEmail({ email }: { email: string }, tx: DbOrTx = db) {
  const [row] = await tx.select(personColumns).from(users).where(sql`lower(${users.email}) = ${email.toLowerCase()}`).limit(1);
  return row ?? null;
}

/** A person of this organisation, or null (another organisation's person is "not found"). */
export async function getOrgUser({ userId, organisationId }: { userId: string; organisationId: string }, tx: DbOrTx = db) {
  const [row] = await tx
    .select(personColumns)
    .from(users)
    .where(and(eq(users.id, userId), eq(users.organisationId, organisationId)))
    .limit(1);
  return row ?? null;
}

export async function getPasswordHash({ userId }: { userId: string }, tx: DbOrTx = db) {
  const [row] = await tx.select({ passwordHash: users.passwordHash }).from(users).where(eq(users.id, userId)).limit(1);
  return row?.passwordHash ?? null;
}

/** Sets a new password; `endSessions` also signs the person out everywhere. */
export async function setPasswordHash(
  { userId, passwordHash, endSessions }: { userId: string; passwordHash: string; endSessions: boolean },
  tx: DbOrTx = db,
) {
  accessChanged(tx);
  await tx
    .update(users)
    .set({ passwordHash, ...(endSessions ? { sessionVersion: sql`${users.sessionVersion} + 1` } : {}) })
    .where(eq(users.id, userId));
}

/** Deactivated: no sign-in, and every session on every device ends at its next request. */
export async function setUserDisabled({ userId, disabled }: { userId: string; disabled: boolean }, tx: DbOrTx = db) {
  accessChanged(tx);
  const [row] = await tx
    .update(users)
    .set({ disabledAt: disabled ? new Date() : null, sessionVersion: sql`${users.sessionVersion} + 1` })
    .where(eq(users.id, userId))
    .returning(personColumns);
  return row!;
}

/** Active organisation admins (for "the last admin cannot remove themselves"). */
export async function listActiveOrgAdmins({ organisationId }: { organisationId: string }, tx: DbOrTx = db) {
  return tx
    .select({ id: users.id })
    .from(users)
    .where(and(eq(users.organisationId, organisationId), eq(users.isOrgAdmin, true), isNull(users.disabledAt)));
}

/** Throttle rows are shared with sign-in under a prefixed key ("reset:…", "change:…"). */
export const throttleKey = (kind: "reset" | "change", email: string) => `${kind}:${email.toLowerCase()}`;

/** Ends one session for good: its id is refused until the cookie would have expired anyway. */
export async function revokeSession({ sid, userId, expiresAt }: { sid: string; userId: string | null; expiresAt: Date }, tx: DbOrTx = db) {
  accessChanged(tx);
  await tx.insert(revokedSessions).values({ sid, userId, expiresAt }).onConflictDoNothing();
}

/** Forgets revocations of sessions that have expired by themselves (the worker runs it hourly). */
export async function purgeExpiredRevocations({ now = new Date() }: { now?: Date } = {}, tx: DbOrTx = db) {
  const rows = await tx.delete(revokedSessions).where(sql`${revokedSessions.expiresAt} < ${now.toISOString()}::timestamptz`).returning({ sid: revokedSessions.sid });
  return rows.length;
}

/**
 * Counts one more action under `key` in a fixed window and returns the count, atomically (one
 * upsert), so a limit holds however many app instances share the database. Uses the sign-in
 * throttle table: its key column holds any key ("invite:<userId>", "reset:<email>"…).
 */
export async function countInWindow({ key, now, windowMs }: { key: string; now: Date; windowMs: number }, tx: DbOrTx = db) {
  const start = new Date(now.getTime() - windowMs).toISOString();
  const [row] = await tx.execute<{ failures: number }>(sql`
    insert into ${signInThrottle} (email, failures, last_failure_at) values (${key}, 1, ${now.toISOString()}::timestamptz)
    on conflict (email) do update set
      failures = case when ${signInThrottle.lastFailureAt} < ${start}::timestamptz then 1 else ${signInThrottle.failures} + 1 end,
      last_failure_at = case when ${signInThrottle.lastFailureAt} < ${start}::timestamptz then ${now.toISOString()}::timestamptz else ${signInThrottle.lastFailureAt} end
    returning failures`);
  return Number(row?.failures ?? 1);
}
