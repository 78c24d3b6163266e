import type { Metadata } from "next";
import { SignOutButton } from "./sign-out-button";

export const metadata: Metadata = { title: "Sign out" };

export default function SignOutPage() {
  return (
    <>
      <h1 className="mb-2 text-xl font-bold">Sign out</h1>
      <p className="mb-6 text-ink-soft">Anything you have saved stays in the register. Unsaved drafts stay on this device.</p>
      <SignOutButton />
    </>
  );
}
