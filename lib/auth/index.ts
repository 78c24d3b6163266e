// The one way to learn who is signed in. Pages use requireUser (redirects), handlers requireApiUser (401).
import "server-only";
import { cache } from "react";
import { decode } from "next-auth/jwt";
import { cookies, headers } from "next/headers";
import { redirect } from "next/navigation";
import { REQUESTED_PATH_HEADER, safeCallbackPath } from "./callback";
import { getSessionUserAt, type SessionUser } from "@/db/queries/users";
import { env } from "@/lib/env";
import { UnauthorizedError } from "@/lib/errors";
import { SESSION_COOKIE_NAME } from "./options";

export type { SessionUser };
export { safeCallbackPath };

type Claims = { id: string; sv: number; sid?: string };

/**
 * The session cookie's claims (who, session version, session id), or null. The same decoding
 * next-auth's own session endpoint does (`decode` from next-auth/jwt: A256GCM, expiry checked),
 * without its per-call callbacks and re-encoding of a fresh cookie that a server render cannot
 * send anyway. A token is decrypted once and its claims kept until it expires: the cookie is
 * authenticated, so the same string always carries the same claims. Whether the session still
 * holds (signed out, deactivated, password reset, roles changed) is asked of the database on
 * every request by getSessionUserAt.
 */
const claimsByToken = new Map<string, { claims: Claims; expiresAtMs: number }>();
const CLAIMS_KEPT = 1000;

async function sessionClaims(): Promise<Claims | null> {
  const jar = await cookies();
  const name = SESSION_COOKIE_NAME;
  // next-auth splits a large token over name.0, name.1, …; ours is small, but read it the same way.
  let token = jar.get(name)?.value;
  if (!token) {
    const chunks = jar
      .getAll()
      .filter((c) => c.name.startsWith(`${name}.`))
      .sort((a, b) => Number(a.name.slice(name.length + 1)) - Number(b.name.slice(name.length + 1)));
    token = chunks.length ? chunks.map((c) => c.value).join("") : undefined;
  }
  if (!token) return null;
  const kept = claimsByToken.get(token);
  if (kept && kept.expiresAtMs > Date.now()) return kept.claims;
  let payload: Awaited<ReturnType<typeof decode>>;
  try {
    payload = await decode({ token, secret: env.NEXTAUTH_SECRET });
  } catch {
    return null; // tampered, expired or made with another secret: not signed in
  }
  const uid = payload?.uid;
  if (typeof uid !== "string") return null;
  const claims: Claims = { id: uid, sv: typeof payload?.sv === "number" ? payload.sv : 0, sid: typeof payload?.sid === "string" ? payload.sid : undefined };
  const exp = typeof payload?.exp === "number" ? payload.exp * 1000 : Date.now();
  if (claimsByToken.size >= CLAIMS_KEPT) claimsByToken.delete(claimsByToken.keys().next().value!);
  claimsByToken.set(token, { claims, expiresAtMs: exp });
  return claims;
}

/**
 * Who is signed in and, with a site id, the site and the roles they hold there — one database
 * round trip (getSessionUserAt). Cached for the request, so a page's layout and body share it.
 */
export const getCurrentSession = cache(async (siteId?: string) => {
  const claims = await sessionClaims();
  if (!claims) return null;
  return getSessionUserAt({ id: claims.id, sessionVersion: claims.sv, sid: claims.sid, siteId });
});

export const getCurrentUser = cache(async (): Promise<SessionUser | null> => (await getCurrentSession())?.user ?? null);

async function toSignIn(callbackUrl?: string): Promise<never> {
  const requested = safeCallbackPath((await headers()).get(REQUESTED_PATH_HEADER));
  const back = requested ?? safeCallbackPath(callbackUrl);
  redirect(back ? `/sign-in?callbackUrl=${encodeURIComponent(back)}` : "/sign-in");
}

/**
 * For pages and server actions rendered as pages: sends a signed-out person to sign in, and back
 * afterwards to exactly the address they opened (the proxy passes it on, query string included,
 * so a QR label's member or a `?tag=` prefill survives sign-in); `callbackUrl` is the fallback.
 */
export async function requireUser(callbackUrl?: string): Promise<SessionUser> {
  const user = await getCurrentUser();
  return user ?? toSignIn(callbackUrl);
}

/** requireUser for a page on a site: the person and, in the same round trip, the site and their roles there (null: not theirs). */
export async function requireUserAt(siteId: string, callbackUrl?: string) {
  const session = await getCurrentSession(siteId);
  return session ?? toSignIn(callbackUrl);
}

/** For route handlers and server actions: throws 401. */
export async function requireApiUser(): Promise<SessionUser> {
  return (await requireApiSession()).user;
}

/** requireApiUser that also reads a site's access in the same round trip (the seam's siteRoute). */
export async function requireApiSession(siteId?: string) {
  const session = await getCurrentSession(siteId);
  if (!session) throw new UnauthorizedError();
  return session;
}
