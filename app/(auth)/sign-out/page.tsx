import type { Metadata } from "next";
import { getCurrentUser } from "@/lib/auth";
import { SignOutButton } from "./sign-out-button";

export const metadata: Metadata = { title: "Sign out" };

export default async function SignOutPage() {
  const user = await getCurrentUser();
  return (
    <>
      <h1 className="mb-2 text-xl font-bold">Sign out</h1>
      <p className="mb-6 text-ink-soft">
        Anything you have saved stays in the register. Unsaved drafts stay on this device. The pages kept on this phone for working with no signal are removed.
      </p>
      <SignOutButton userId={user?.id ?? null} />
    </>
  );
}
