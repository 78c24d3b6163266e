import type { Metadata } from "next";
import { redirect } from "next/navigation";
import Link from "next/link";
import { getCurrentUser } from "@/lib/auth";
import { safeCallbackPath } from "@/lib/auth/callback";
import { countOrganisations } from "@/db/queries/users";
import { SignInForm } from "./sign-in-form";

export const metadata: Metadata = { title: "Sign in" };

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ callbackUrl?: string | string[] }> }) {
  const { callbackUrl } = await searchParams;
  // Only same-site paths: never send someone to another host after signing in.
  const target = safeCallbackPath(typeof callbackUrl === "string" ? callbackUrl : null) ?? "/sites";
  if (await getCurrentUser()) redirect(target);
  // A new installation has nobody to sign in yet: the one-time setup comes first.
  if ((await countOrganisations()) === 0) redirect("/setup");
  return (
    <>
      <h1 className="mb-4 text-xl font-bold">Sign in</h1>
      <SignInForm callbackUrl={target} />
      <p className="mt-4 text-center">
        <Link href="/forgot-password" className="inline-flex min-h-touch items-center font-semibold text-brand underline">
          Forgot your password?
        </Link>
      </p>
    </>
  );
}
