"use client";

import { signOut } from "next-auth/react";
import { Button, ButtonLink } from "@/components/ui/button";

export function SignOutButton() {
  return (
    <div className="flex flex-col gap-3 sm:flex-row">
      <Button type="button" onClick={() => signOut({ callbackUrl: "/sign-in" })}>
        Sign out now
      </Button>
      <ButtonLink href="/sites" variant="secondary">
        Stay signed in
      </ButtonLink>
    </div>
  );
}
