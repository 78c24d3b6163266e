// Invitations: an admin invites someone to a site by e-mail; the link works once, for 7 days.
import "server-only";
import { transaction } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import {
  createInvitation, getInvitationByTokenHash, lockInvitation, markInvitationAccepted, markInvitationRevoked, renewInvitation,
  type InvitationRow,
} from "@/db/queries/invitations";
import { addUserRolesOnSite, listUserRolesOnSite } from "@/db/queries/memberships";
import { enqueueEmails } from "@/db/queries/outbox";
import { countInWindow, createUser, getUserByEmail } from "@/db/queries/users";
import type { SiteRole } from "@/db/schema";
import { invitationEmail } from "@/emails/invitation";
import type { Site } from "@/lib/api/resources";
import { AppError, ConflictError, NotFoundError, TooManyRequestsError, UnauthorizedError, ValidationError } from "@/lib/errors";
import { ROLE_LABELS } from "@/lib/permissions";
import type { z } from "zod";
import type { acceptInvitationSchema, invitationSchema } from "@/lib/validations/onboarding";
import { getCurrentUser, type SessionUser } from "./index";
import { formatDateTime } from "@/lib/format-date";
import { hashPassword } from "./password";
import { passwordProblem } from "./password-policy";
import { hashToken, looksLikeToken, newToken } from "./tokens";
import { invitationUrl } from "./urls";

export const INVITATION_DAYS = 7;
const expiry = (now = new Date()) => new Date(now.getTime() + INVITATION_DAYS * 24 * 3600 * 1000);

/** What the admin's screens and the API show of an invitation (never its token). */
export function invitationView(i: InvitationRow, now = new Date()) {
  const state = i.acceptedAt ? "accepted" : i.revokedAt ? "revoked" : i.expiresAt <= now ? "expired" : "pending";
  return {
    id: i.id,
    siteId: i.siteId,
    email: i.email,
    name: i.name,
    roles: i.roles,
    state,
    expiresAt: i.expiresAt,
    lastSentAt: i.lastSentAt,
    sendCount: i.sendCount,
    createdAt: i.createdAt,
  };
}

function queueInvitationEmail(
  { site, invitation, token, invitedBy }: { site: Site; invitation: InvitationRow; token: string; invitedBy: SessionUser },
  tx: Parameters<typeof enqueueEmails>[1],
) {
  const mail = invitationEmail({
    siteName: site.name,
    organisationName: invitedBy.organisationName,
    invitedBy: invitedBy.name,
    roles: invitation.roles.map((r) => ROLE_LABELS[r]),
    url: invitationUrl(token),
    expiresOn: formatDateTime(invitation.expiresAt, site.timezone),
  });
  return enqueueEmails([{ siteId: site.id, kind: "invitation", toEmail: invitation.email, ...mail, relatedType: "invitation", relatedId: invitation.id }], tx);
}

/** Invitation e-mails (new and resent) one admin may send in an hour, across every app instance. */
export const INVITATIONS_PER_HOUR = 30;

async function assertInvitationBudget(user: SessionUser, now = new Date()) {
  const sent = await countInWindow({ key: `invite:${user.id}`, now, windowMs: 60 * 60 * 1000 });
  if (sent > INVITATIONS_PER_HOUR)
    throw new TooManyRequestsError(`You have sent ${INVITATIONS_PER_HOUR} invitations in the last hour; wait a while before sending more.`);
}

export async function inviteToSite({ user, site, input }: { user: SessionUser; site: Site; input: z.output<typeof invitationSchema> }) {
  await assertInvitationBudget(user);
  return transaction(async (tx) => {
    const existing = await getUserByEmail({ email: input.email }, tx);
    if (existing && existing.organisationId === user.organisationId) {
      const held = await listUserRolesOnSite({ siteId: site.id, userId: existing.id }, tx);
      if (input.roles.every((r) => held.includes(r)))
        throw new ConflictError(`${existing.name} already holds ${input.roles.length > 1 ? "these roles" : "this role"} on this site.`, {
          roles: "Already held on this site.",
        });
    }
    const { token, hash } = newToken();
    const invitation = await createInvitation(
      { organisationId: user.organisationId, siteId: site.id, email: input.email, name: input.name ?? null, roles: input.roles, tokenHash: hash, invitedBy: user.id, expiresAt: expiry() },
      tx,
    );
    await queueInvitationEmail({ site, invitation, token, invitedBy: user }, tx);
    await recordAudit({ organisationId: user.organisationId, siteId: site.id, actorId: user.id, action: "invitation.created", entityType: "invitation", entityId: invitation.id, after: { email: invitation.email, roles: invitation.roles } }, tx);
    return invitation;
  });
}

function assertOpen(i: InvitationRow) {
  if (i.acceptedAt) throw new ConflictError("This invitation has already been accepted; it cannot be sent again.");
  if (i.revokedAt) throw new ConflictError("This invitation was revoked.");
}

/** A new link (the previous one stops working) and a fresh 7 days. */
export async function resendInvitation({ user, site, invitation }: { user: SessionUser; site: Site; invitation: InvitationRow }) {
  assertOpen(invitation);
  await assertInvitationBudget(user);
  return transaction(async (tx) => {
    const { token, hash } = newToken();
    const renewed = await renewInvitation({ invitationId: invitation.id, tokenHash: hash, expiresAt: expiry() }, tx);
    await queueInvitationEmail({ site, invitation: renewed, token, invitedBy: user }, tx);
    await recordAudit({ organisationId: user.organisationId, siteId: site.id, actorId: user.id, action: "invitation.resent", entityType: "invitation", entityId: invitation.id, after: { expiresAt: renewed.expiresAt } }, tx);
    return renewed;
  });
}

export async function revokeInvitation({ user, site, invitation }: { user: SessionUser; site: Site; invitation: InvitationRow }) {
  if (invitation.acceptedAt) throw new ConflictError("This invitation has already been accepted; remove the person from the site instead.");
  if (invitation.revokedAt) return invitation;
  return transaction(async (tx) => {
    const revoked = await markInvitationRevoked({ invitationId: invitation.id }, tx);
    await recordAudit({ organisationId: user.organisationId, siteId: site.id, actorId: user.id, action: "invitation.revoked", entityType: "invitation", entityId: invitation.id, before: { state: "pending" }, after: { state: "revoked" } }, tx);
    return revoked;
  });
}

export class InvitationGoneError extends AppError {
  constructor(code: "invitation_accepted" | "invitation_expired" | "invitation_revoked", message: string) {
    super(410, code, message);
  }
}

/** Why a link no longer works, in words (the page and the API say the same). */
function assertUsable(i: InvitationRow, now: Date) {
  if (i.acceptedAt) throw new InvitationGoneError("invitation_accepted", "This invitation has already been used. Sign in with the account you made, or ask your admin for a new invitation.");
  if (i.revokedAt) throw new InvitationGoneError("invitation_revoked", "This invitation was withdrawn by your organisation's admin. Ask them for a new one if you still need access.");
  if (i.expiresAt <= now) throw new InvitationGoneError("invitation_expired", `This invitation has expired (links work for ${INVITATION_DAYS} days). Ask your admin to send it again.`);
}

/** For the acceptance page: the invitation behind a link, or why it does not work. */
export async function lookUpInvitation(token: string, now = new Date()) {
  if (!looksLikeToken(token)) throw new NotFoundError("That invitation link");
  const inv = await getInvitationByTokenHash({ tokenHash: hashToken(token) });
  if (!inv || !inv.siteId) throw new NotFoundError("That invitation link");
  assertUsable(inv, now);
  const existing = await getUserByEmail({ email: inv.email });
  return { invitation: inv, existingAccount: !!existing };
}

/**
 * Accepts a link. A new person gives their name and password and gets an account (201). Someone
 * who already has an account in the organisation signs in first and just gains the roles (200).
 */
export async function acceptInvitation({ token, input, now = new Date() }: { token: string; input: z.output<typeof acceptInvitationSchema>; now?: Date }) {
  if (!looksLikeToken(token)) throw new NotFoundError("That invitation link");
  const signedIn = await getCurrentUser();
  const passwordHash = input.password ? await hashPassword(input.password) : null;
  return transaction(async (tx) => {
    const found = await getInvitationByTokenHash({ tokenHash: hashToken(token) }, tx);
    if (!found || !found.siteId) throw new NotFoundError("That invitation link");
    await lockInvitation({ invitationId: found.id }, tx);
    const inv = (await getInvitationByTokenHash({ tokenHash: hashToken(token) }, tx))!;
    assertUsable(inv, now);
    const siteId = inv.siteId!;
    const roles = inv.roles as SiteRole[];
    const existing = await getUserByEmail({ email: inv.email }, tx);
    if (existing) {
      if (existing.organisationId !== inv.organisationId)
        throw new ConflictError("That e-mail address already belongs to an account of another organisation; ask your admin to invite a different address.");
      if (existing.disabledAt) throw new ConflictError("The account for this address is deactivated. Ask your organisation's admin to reactivate it.");
      if (!signedIn || signedIn.id !== existing.id)
        throw new UnauthorizedError(`You already have an account (${existing.email}). Sign in with it, then open the invitation link again.`);
      await addUserRolesOnSite({ siteId, userId: existing.id, roles }, tx);
      await markInvitationAccepted({ invitationId: inv.id, userId: existing.id }, tx);
      await recordAudit({ organisationId: inv.organisationId, siteId, actorId: existing.id, action: "invitation.accepted", entityType: "invitation", entityId: inv.id, after: { userId: existing.id, roles, newAccount: false } }, tx);
      return { status: 200 as const, user: { id: existing.id, email: existing.email, name: existing.name }, siteId, roles };
    }
    const name = input.name ?? inv.name ?? undefined;
    const fields: Record<string, string> = {};
    if (!name) fields.name = "Enter your name.";
    if (!input.password) fields.password = "Choose a password.";
    else {
      const problem = passwordProblem(input.password, [name ?? "", inv.email, inv.organisationName]);
      if (problem) fields.password = problem;
    }
    if (Object.keys(fields).length) throw new ValidationError(fields);
    const user = await createUser({ organisationId: inv.organisationId, email: inv.email, name: name!, passwordHash: passwordHash! }, tx);
    await addUserRolesOnSite({ siteId, userId: user.id, roles }, tx);
    await markInvitationAccepted({ invitationId: inv.id, userId: user.id }, tx);
    await recordAudit({ organisationId: inv.organisationId, actorId: user.id, action: "user.created", entityType: "user", entityId: user.id, after: { email: user.email, name: user.name, via: "invitation" } }, tx);
    await recordAudit({ organisationId: inv.organisationId, siteId, actorId: user.id, action: "invitation.accepted", entityType: "invitation", entityId: inv.id, after: { userId: user.id, roles, newAccount: true } }, tx);
    return { status: 201 as const, user: { id: user.id, email: user.email, name: user.name }, siteId, roles };
  });
}
