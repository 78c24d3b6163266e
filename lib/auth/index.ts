// The one way to learn who is signed in. Pages use requireUser (redirects), handlers requireApiUser (401).
import "server-only";
import { cache } from "react";
import { getServerSession } from "next-auth";
import { redirect } from "next/navigation";
import { getSessionUser, type SessionUser } from "@/db/queries/users";
import { UnauthorizedError } from "@/lib/errors";
import { authOptions } from "./options";

export type { SessionUser };

export const getCurrentUser = cache(async (): Promise<SessionUser | null> => {
  const session = await getServerSession(authOptions);
  const id = (session?.user as { id?: string } | undefined)?.id;
  if (!id) return null;
  return getSessionUser({ id });
});

/** For pages and server actions rendered as pages: sends a signed-out person to sign in. */
export async function requireUser(callbackUrl?: string): Promise<SessionUser> {
  const user = await getCurrentUser();
  if (!user) redirect(callbackUrl ? `/sign-in?callbackUrl=${encodeURIComponent(callbackUrl)}` : "/sign-in");
  return user;
}

/** For route handlers and server actions: throws 401. */
export async function requireApiUser(): Promise<SessionUser> {
  const user = await getCurrentUser();
  if (!user) throw new UnauthorizedError();
  return user;
}
