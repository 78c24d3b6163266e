// Credential check with throttling: repeated failures for an address are slowed down.
import "server-only";
import { clearSignInFailures, getThrottle, getUserForSignIn, recordSignInFailure } from "@/db/queries/users";
import { signInSchema } from "@/lib/validations/auth";
import { dummyHash, verifyPassword } from "./password";

/** Failures allowed before each further failure blocks the address for a while. */
export const FREE_FAILURES = 4;
const WINDOW_MS = 15 * 60 * 1000;
const MAX_BLOCK_MS = 15 * 60 * 1000;


export type SignInOutcome =
  | { ok: true; user: { id: string; email: string; name: string; sessionVersion: number } }
  | { ok: false; reason: "invalid" | "blocked"; message: string };

export function blockDurationMs(failures: number): number {
  if (failures <= FREE_FAILURES) return 0;
  return Math.min(30_000 * 2 ** (failures - FREE_FAILURES - 1), MAX_BLOCK_MS);
}

export async function checkCredentials(input: unknown, now = new Date()): Promise<SignInOutcome> {
  const parsed = signInSchema.safeParse(input);
  if (!parsed.success) return { ok: false, reason: "invalid", message: parsed.error.issues[0]!.message };
  const email = parsed.data.email.toLowerCase();

  const throttle = await getThrottle({ email });
  if (throttle?.blockedUntil && throttle.blockedUntil > now) {
    const seconds = Math.ceil((throttle.blockedUntil.getTime() - now.getTime()) / 1000);
    return {
      ok: false,
      reason: "blocked",
      message: `Too many failed sign-ins for this address. Wait ${seconds} s and try again.`,
    };
  }

  const user = await getUserForSignIn({ email });
  const good = await verifyPassword(parsed.data.password, user?.passwordHash ?? (await dummyHash()));
  if (user && good && !user.disabledAt) {
    if (throttle) await clearSignInFailures({ email });
    return { ok: true, user: { id: user.id, email: user.email, name: user.name, sessionVersion: user.sessionVersion } };
  }

  const recent = throttle && now.getTime() - throttle.lastFailureAt.getTime() < WINDOW_MS;
  const failures = (recent ? throttle.failures : 0) + 1;
  const block = blockDurationMs(failures);
  await recordSignInFailure({ email, now, failures, blockedUntil: block ? new Date(now.getTime() + block) : null });
  return {
    ok: false,
    reason: "invalid",
    message: "That e-mail address and password do not match an account. Check both and try again.",
  };
}
