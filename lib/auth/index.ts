// The one way to learn who is signed in. Pages use requireUser (redirects), handlers requireApiUser (401).
import "server-only";
import { cache } from "react";
import { getServerSession } from "next-auth";
import { headers } from "next/headers";
import { redirect } from "next/navigation";
import { REQUESTED_PATH_HEADER, safeCallbackPath } from "./callback";
import { getSessionUser, type SessionUser } from "@/db/queries/users";
import { UnauthorizedError } from "@/lib/errors";
import { authOptions } from "./options";

export type { SessionUser };
export { safeCallbackPath };

export const getCurrentUser = cache(async (): Promise<SessionUser | null> => {
  const session = await getServerSession(authOptions);
  const claims = session?.user as { id?: string; sv?: number; sid?: string } | undefined;
  if (!claims?.id) return null;
  return getSessionUser({ id: claims.id, sessionVersion: claims.sv ?? 0, sid: claims.sid });
});

/**
 * For pages and server actions rendered as pages: sends a signed-out person to sign in, and back
 * afterwards to exactly the address they opened (the proxy passes it on, query string included,
 * so a QR label's member or a `?tag=` prefill survives sign-in); `callbackUrl` is the fallback.
 */
export async function requireUser(callbackUrl?: string): Promise<SessionUser> {
  const user = await getCurrentUser();
  if (!user) {
    const requested = safeCallbackPath((await headers()).get(REQUESTED_PATH_HEADER));
    const back = requested ?? safeCallbackPath(callbackUrl);
    redirect(back ? `/sign-in?callbackUrl=${encodeURIComponent(back)}` : "/sign-in");
  }
  return user;
}

/** For route handlers and server actions: throws 401. */
export async function requireApiUser(): Promise<SessionUser> {
  const user = await getCurrentUser();
  if (!user) throw new UnauthorizedError();
  return user;
}
