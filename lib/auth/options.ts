import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import { env } from "@/lib/env";
import { checkCredentials } from "./sign-in";

export const authOptions: NextAuthOptions = {
  secret: env.NEXTAUTH_SECRET,
  session: { strategy: "jwt", maxAge: 12 * 60 * 60 },
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
  callbacks: {
    async jwt({ token, user }) {
      if (user) {
        token.uid = user.id;
        // Checked against the account on every request (lib/auth/index.ts): a deactivation or a
        // password reset bumps the stored version and ends this session on every device.
        token.sv = (user as { sessionVersion?: number }).sessionVersion ?? 0;
      }
      return token;
    },
    async session({ session, token }) {
      if (session.user && typeof token.uid === "string") {
        (session.user as { id?: string }).id = token.uid;
        (session.user as { sv?: number }).sv = typeof token.sv === "number" ? token.sv : 0;
      }
      return session;
    },
  },
};
