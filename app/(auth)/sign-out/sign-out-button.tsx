"use client";
// Signing out empties the pages and API reads kept for offline use. Entries still waiting on this
// phone are the person's own: they are said first, stay on the phone, and are sent only when the
// same person signs in again (never under whoever signs in next).
import { signOut } from "next-auth/react";
import { useEffect, useState } from "react";
import { Icon } from "@/components/icons";
import { Button, ButtonLink } from "@/components/ui/button";
import { forgetOfflineCopies } from "@/lib/client/forget-offline";
import { isMine, listItems } from "@/lib/client/outbox/store";

export function SignOutButton({ userId }: { userId: string | null }) {
  const [waiting, setWaiting] = useState<number | null>(null);
  const [busy, setBusy] = useState(false);

  useEffect(() => {
    if (!userId) return setWaiting(0);
    void listItems().then(
      (all) => setWaiting(all.filter((i) => isMine(i, userId)).length),
      () => setWaiting(0),
    );
  }, [userId]);

  async function go() {
    setBusy(true);
    await forgetOfflineCopies();
    await signOut({ callbackUrl: "/sign-in" });
  }

  return (
    <div className="flex flex-col gap-3">
      {waiting ? (
        <p role="alert" className="flex items-start gap-2 rounded-lg border-2 border-warn bg-warn-soft p-3 font-semibold" data-testid="sign-out-waiting">
          <Icon name="warn" className="mt-0.5 h-5 w-5 shrink-0" />
          <span>
            {waiting === 1 ? "1 entry saved on this phone has" : `${waiting} entries saved on this phone have`} not reached the server yet. If you sign out now
            {waiting === 1 ? " it stays" : " they stay"} on this phone and {waiting === 1 ? "is" : "are"} sent only when you sign in here again; nobody else can send or see {waiting === 1 ? "it" : "them"}. To send now, stay signed in until you have signal.
          </span>
        </p>
      ) : null}
      <div className="flex flex-col gap-3 sm:flex-row">
        <Button type="button" disabled={busy || waiting === null} onClick={() => void go()}>
          {waiting ? "Sign out anyway" : "Sign out now"}
        </Button>
        <ButtonLink href="/sites" variant="secondary">
          Stay signed in
        </ButtonLink>
      </div>
    </div>
  );
}
