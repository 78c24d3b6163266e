import { randomUUID } from "node:crypto";
import type { NextAuthOptions } from "next-auth";
import { revokeSession } from "@/db/queries/users";
import { sessionCookie } from "@/lib/security/headers";
import CredentialsProvider from "next-auth/providers/credentials";
import { env } from "@/lib/env";
import { checkCredentials } from "./sign-in";

const SESSION_MAX_AGE_S = 12 * 60 * 60;
const SESSION_COOKIE = sessionCookie(env.APP_URL.startsWith("https:"));
/** The session cookie's name, for lib/auth's per-request reading of it. */
export const SESSION_COOKIE_NAME = SESSION_COOKIE.name;

export const authOptions: NextAuthOptions = {
  secret: env.NEXTAUTH_SECRET,
  session: { strategy: "jwt", maxAge: SESSION_MAX_AGE_S },
  // HttpOnly, SameSite=Lax always; Secure (and the __Secure- prefix) when APP_URL is https.
  useSecureCookies: env.APP_URL.startsWith("https:"),
  cookies: { sessionToken: SESSION_COOKIE },
  pages: { signIn: "/sign-in", signOut: "/sign-out", error: "/sign-in" },
  providers: [
    CredentialsProvider({
      name: "E-mail and password",
      credentials: { email: { label: "E-mail", type: "email" }, password: { label: "Password", type: "password" } },
      async authorize(credentials) {
        const outcome = await checkCredentials(credentials ?? {});
        // next-auth passes a thrown error's message to the sign-in form as `error`.
        if (!outcome.ok) throw new Error(outcome.message);
        return outcome.user;
      },
    }),
  ],
  events: {
    // Signing out ends this session on the server too: a copy of the cookie no longer works.
    async signOut({ token }) {
      const sid = typeof token?.sid === "string" ? token.sid : null;
      if (!sid) return;
      const exp = typeof token.exp === "number" ? token.exp * 1000 : Date.now() + SESSION_MAX_AGE_S * 1000;
      await revokeSession({ sid, userId: typeof token.uid === "string" ? token.uid : null, expiresAt: new Date(exp) });
    },
  },
  callbacks: {
    async jwt({ token, user }) {
      if (user) {
        token.uid = user.id;
        // Checked against the account on every request (lib/auth/index.ts): a deactivation or a
        // password reset bumps the stored version and ends this session on every device.
        token.sv = (user as { sessionVersion?: number }).sessionVersion ?? 0;
        // This session's own id: signing out records it as ended (revoked_sessions).
        token.sid = randomUUID();
      }
      return token;
    },
    async session({ session, token }) {
      if (session.user && typeof token.uid === "string") {
        (session.user as { id?: string }).id = token.uid;
        (session.user as { sv?: number }).sv = typeof token.sv === "number" ? token.sv : 0;
        (session.user as { sid?: string }).sid = typeof token.sid === "string" ? token.sid : undefined;
      }
      return session;
    },
  },
};
