// Invitations to join a site: only the SHA-256 of each link's token is stored.
import "server-only";
import { and, desc, eq, gt, isNull, sql } from "drizzle-orm";
import { db, type DbOrTx } from "@/db";
import { invitations, organisations, sites, users, type SiteRole } from "@/db/schema";

const columns = {
  id: invitations.id,
  organisationId: invitations.organisationId,
  siteId: invitations.siteId,
  email: invitations.email,
  name: invitations.name,
  roles: invitations.roles,
  expiresAt: invitations.expiresAt,
  acceptedAt: invitations.acceptedAt,
  revokedAt: invitations.revokedAt,
  lastSentAt: invitations.lastSentAt,
  sendCount: invitations.sendCount,
  createdAt: invitations.createdAt,
};

export type InvitationRow = {
  id: string;
  organisationId: string;
  siteId: string | null;
  email: string;
  name: string | null;
  roles: SiteRole[];
  expiresAt: Date;
  acceptedAt: Date | null;
  revokedAt: Date | null;
  lastSentAt: Date | null;
  sendCount: number;
  createdAt: Date;
};

export async function createInvitation(
  v: { organisationId: string; siteId: string; email: string; name: string | null; roles: SiteRole[]; tokenHash: string; invitedBy: string; expiresAt: Date },
  tx: DbOrTx = db,
): Promise<InvitationRow> {
  const [row] = await tx
    .insert(invitations)
    .values({ ...v, email: v.email.toLowerCase(), lastSentAt: new Date() })
    .returning(columns);
  return row as InvitationRow;
}

/** An invitation of the organisation by id (the admin's pages and routes). */
export async function getInvitationForOrg({ invitationId, organisationId }: { invitationId: string; organisationId: string }, tx: DbOrTx = db) {
  const [row] = await tx
    .select(columns)
    .from(invitations)
    .where(and(eq(invitations.id, invitationId), eq(invitations.organisationId, organisationId)))
    .limit(1);
  return (row as InvitationRow | undefined) ?? null;
}

/** The invitation a link points to, with the site and organisation names for the acceptance page. */
export async function getInvitationByTokenHash({ tokenHash }: { tokenHash: string }, tx: DbOrTx = db) {
  const [row] = await tx
    .select({ ...columns, siteName: sites.name, organisationName: organisations.name, invitedByName: users.name })
    .from(invitations)
    .innerJoin(organisations, eq(organisations.id, invitations.organisationId))
    .leftJoin(sites, eq(sites.id, invitations.siteId))
    .leftJoin(users, eq(users.id, invitations.invitedBy))
    .where(eq(invitations.tokenHash, tokenHash))
    .limit(1);
  return (row as (InvitationRow & { siteName: string | null; organisationName: string; invitedByName: string | null }) | undefined) ?? null;
}

/** Locks the row so a link pressed twice at once is accepted once. */
export async function lockInvitation({ invitationId }: { invitationId: string }, tx: DbOrTx) {
  await tx.execute(sql`select 1 from ${invitations} where ${invitations.id} = ${invitationId} for update`);
}

export async function listPendingInvitations({ siteId, now = new Date() }: { siteId: string; now?: Date }, tx: DbOrTx = db) {
  const rows = await tx
    .select({ ...columns, invitedByName: users.name })
    .from(invitations)
    .leftJoin(users, eq(users.id, invitations.invitedBy))
    .where(and(eq(invitations.siteId, siteId), isNull(invitations.acceptedAt), isNull(invitations.revokedAt), gt(invitations.expiresAt, now)))
    .orderBy(desc(invitations.createdAt));
  return rows as (InvitationRow & { invitedByName: string | null })[];
}

export async function markInvitationAccepted({ invitationId, userId }: { invitationId: string; userId: string }, tx: DbOrTx = db) {
  await tx.update(invitations).set({ acceptedAt: new Date(), acceptedBy: userId }).where(eq(invitations.id, invitationId));
}

export async function markInvitationRevoked({ invitationId }: { invitationId: string }, tx: DbOrTx = db) {
  const [row] = await tx.update(invitations).set({ revokedAt: new Date() }).where(eq(invitations.id, invitationId)).returning(columns);
  return row as InvitationRow;
}

/** A re-send gets a new link (the old one stops working) and a new 7-day expiry. */
export async function renewInvitation(
  { invitationId, tokenHash, expiresAt }: { invitationId: string; tokenHash: string; expiresAt: Date },
  tx: DbOrTx = db,
) {
  const [row] = await tx
    .update(invitations)
    .set({ tokenHash, expiresAt, lastSentAt: new Date(), sendCount: sql`${invitations.sendCount} + 1` })
    .where(eq(invitations.id, invitationId))
    .returning(columns);
  return row as InvitationRow;
}
