import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { getCurrentUser } from "@/lib/auth";
import { SignInForm } from "./sign-in-form";

export const metadata: Metadata = { title: "Sign in" };

function safeCallback(url: string | undefined) {
  // Only same-site paths: never send someone to another host after signing in.
  return url && url.startsWith("/") && !url.startsWith("//") ? url : "/sites";
}

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ callbackUrl?: string }> }) {
  const { callbackUrl } = await searchParams;
  const target = safeCallback(callbackUrl);
  if (await getCurrentUser()) redirect(target);
  return (
    <>
      <h1 className="mb-4 text-xl font-bold">Sign in</h1>
      <SignInForm callbackUrl={target} />
    </>
  );
}
