// Passwords: a reset link by e-mail (same answer whether the address exists), setting a new one
// from the link (once, within 1 hour), and changing your own with the current one.
import "server-only";
import { transaction } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import { enqueueEmails } from "@/db/queries/outbox";
import { createPasswordReset, getPasswordResetForUpdate, markPasswordResetsUsed } from "@/db/queries/password-resets";
import {
  clearSignInFailures, countInWindow, getPasswordHash, getThrottle, getUserByEmail, recordSignInFailure, setPasswordHash, throttleKey,
} from "@/db/queries/users";
import { passwordResetEmail } from "@/emails/password-reset";
import { AppError, NotFoundError, TooManyRequestsError, ValidationError } from "@/lib/errors";
import type { SessionUser } from "./index";
import { hashPassword, verifyPassword } from "./password";
import { passwordProblem } from "./password-policy";
import { blockDurationMs } from "./sign-in";
import { hashToken, looksLikeToken, newToken } from "./tokens";
import { passwordResetUrl } from "./urls";

export const RESET_VALID_MS = 60 * 60 * 1000;
/** Reset e-mails per address in 15 minutes; counted for unknown addresses too, so the answer never differs. */
export const RESET_REQUESTS_PER_WINDOW = 5;
const WINDOW_MS = 15 * 60 * 1000;

export const RESET_ACCEPTED = {
  message: "If that address belongs to an account, we have sent it a link to set a new password. The link works once, within 1 hour.",
};

export async function requestPasswordReset({ email, now = new Date() }: { email: string; now?: Date }) {
  // One atomic count in PostgreSQL, so the limit holds across every app instance.
  const count = await countInWindow({ key: throttleKey("reset", email), now, windowMs: WINDOW_MS });
  if (count > RESET_REQUESTS_PER_WINDOW)
    throw new TooManyRequestsError("Too many reset requests for this address. Wait 15 minutes and try again.");
  const user = await getUserByEmail({ email });
  if (!user || user.disabledAt) return RESET_ACCEPTED;
  const { token, hash } = newToken();
  await transaction(async (tx) => {
    await createPasswordReset({ userId: user.id, tokenHash: hash, expiresAt: new Date(now.getTime() + RESET_VALID_MS) }, tx);
    const mail = passwordResetEmail({ name: user.name, url: passwordResetUrl(token) });
    await enqueueEmails([{ kind: "password_reset", toEmail: user.email, toUserId: user.id, ...mail, relatedType: "user", relatedId: user.id }], tx);
    await recordAudit({ organisationId: user.organisationId, actorId: null, action: "password.reset_requested", entityType: "user", entityId: user.id }, tx);
  });
  return RESET_ACCEPTED;
}

export class ResetGoneError extends AppError {
  constructor(code: "reset_used" | "reset_expired", message: string) {
    super(410, code, message);
  }
}

/** Sets the new password from a link; every session of the account ends (sign in again). */
export async function resetPassword({ token, password, now = new Date() }: { token: string; password: string; now?: Date }) {
  if (!looksLikeToken(token)) throw new NotFoundError("That password link");
  const passwordHash = await hashPassword(password);
  return transaction(async (tx) => {
    const reset = await getPasswordResetForUpdate({ tokenHash: hashToken(token) }, tx);
    if (!reset || reset.disabledAt) throw new NotFoundError("That password link");
    if (reset.usedAt) throw new ResetGoneError("reset_used", "This link has already been used. Ask for a new one from the sign-in page.");
    if (reset.expiresAt <= now) throw new ResetGoneError("reset_expired", "This link has expired (links work for 1 hour). Ask for a new one from the sign-in page.");
    const problem = passwordProblem(password, [reset.name, reset.email]);
    if (problem) throw new ValidationError({ password: problem });
    await setPasswordHash({ userId: reset.userId, passwordHash, endSessions: true }, tx);
    await markPasswordResetsUsed({ userId: reset.userId }, tx);
    await clearSignInFailures({ email: reset.email }, tx);
    await recordAudit({ organisationId: reset.organisationId, actorId: reset.userId, action: "password.reset", entityType: "user", entityId: reset.userId }, tx);
    return { email: reset.email };
  });
}

/** Changing your own password needs the current one; wrong guesses are slowed down like sign-in. */
export async function changeOwnPassword({ user, currentPassword, newPassword, now = new Date() }: { user: SessionUser; currentPassword: string; newPassword: string; now?: Date }) {
  const key = throttleKey("change", user.email);
  const throttle = await getThrottle({ email: key });
  if (throttle?.blockedUntil && throttle.blockedUntil > now) {
    const seconds = Math.ceil((throttle.blockedUntil.getTime() - now.getTime()) / 1000);
    throw new TooManyRequestsError(`Too many wrong current passwords. Wait ${seconds} s and try again.`);
  }
  const hash = await getPasswordHash({ userId: user.id });
  if (!hash || !(await verifyPassword(currentPassword, hash))) {
    const recent = throttle && now.getTime() - throttle.lastFailureAt.getTime() < WINDOW_MS;
    const failures = (recent ? throttle.failures : 0) + 1;
    const block = blockDurationMs(failures);
    await recordSignInFailure({ email: key, now, failures, blockedUntil: block ? new Date(now.getTime() + block) : null });
    throw new ValidationError({ currentPassword: "That is not your current password." });
  }
  const problem = passwordProblem(newPassword, [user.name, user.email]);
  if (problem) throw new ValidationError({ newPassword: problem });
  if (newPassword === currentPassword) throw new ValidationError({ newPassword: "Choose a password different from the current one." });
  const newHash = await hashPassword(newPassword);
  await transaction(async (tx) => {
    await setPasswordHash({ userId: user.id, passwordHash: newHash, endSessions: false }, tx);
    await clearSignInFailures({ email: key }, tx);
    await recordAudit({ organisationId: user.organisationId, actorId: user.id, action: "password.changed", entityType: "user", entityId: user.id }, tx);
  });
  return { ok: true };
}
