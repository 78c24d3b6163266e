import type { Metadata } from "next";
import Link from "next/link";
import { ApiForm } from "@/app/_onboarding/api-form";
import { Icon } from "@/components/icons";
import { ButtonLink } from "@/components/ui/button";
import { getCurrentUser } from "@/lib/auth";
import { lookUpInvitation } from "@/lib/auth/invitations";
import { MIN_PASSWORD_LENGTH } from "@/lib/auth/password-policy";
import { AppError } from "@/lib/errors";
import { ROLE_LABELS } from "@/lib/permissions";
import type { SiteRole } from "@/db/schema";

export const metadata: Metadata = { title: "Accept an invitation" };
export const dynamic = "force-dynamic";

export default async function InvitePage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  let found: Awaited<ReturnType<typeof lookUpInvitation>>;
  try {
    found = await lookUpInvitation(token);
  } catch (e) {
    const message = e instanceof AppError ? (e.status === 404 ? "This invitation link is not valid. Check that you opened the whole link from the e-mail." : e.message) : "This invitation cannot be opened right now.";
    return (
      <>
        <h1 className="mb-4 text-xl font-bold">Invitation not usable</h1>
        <p role="alert" className="rounded-lg border-2 border-bad bg-bad-soft p-3 font-semibold text-bad">
          <Icon name="bad" className="mr-1 inline h-5 w-5 align-text-bottom" />
          {message}
        </p>
        <p className="mt-4">
          <Link href="/sign-in" className="inline-flex min-h-touch items-center font-semibold text-brand underline">
            Go to sign-in
          </Link>
        </p>
      </>
    );
  }
  const { invitation, existingAccount } = found;
  const roles = (invitation.roles as SiteRole[]).map((r) => ROLE_LABELS[r]).join(", ");
  const user = await getCurrentUser();
  const intro = (
    <div className="mb-4">
      <h1 className="mb-2 text-xl font-bold">Join {invitation.siteName}</h1>
      <p className="text-ink-soft">
        {invitation.invitedByName ?? "Your admin"} of {invitation.organisationName} invited <strong className="text-ink">{invitation.email}</strong> as: {roles}.
      </p>
    </div>
  );
  if (existingAccount) {
    const signedInAsInvitee = user?.email.toLowerCase() === invitation.email.toLowerCase();
    return (
      <>
        {intro}
        {signedInAsInvitee ? (
          <ApiForm testId="accept" url={`/api/v1/invitations/${token}/accept`} fields={[]} submitLabel="Accept and open the site" then={{ kind: "redirect", href: "/sites/:id", idPath: "siteId" }} />
        ) : (
          <>
            <p className="mb-4">You already have a Strutwise account. Sign in with it to accept; you keep your password and gain these roles.</p>
            <ButtonLink href={`/sign-in?callbackUrl=${encodeURIComponent(`/invite/${token}`)}`}>Sign in to accept</ButtonLink>
          </>
        )}
      </>
    );
  }
  return (
    <>
      {intro}
      <ApiForm
        testId="accept"
        url={`/api/v1/invitations/${token}/accept`}
        submitLabel="Create my account"
        busyLabel="Creating…"
        fields={[
          { name: "name", label: "Your name", type: "text", autoComplete: "name", defaultValue: invitation.name ?? "" },
          { name: "password", label: "Choose a password", type: "password", autoComplete: "new-password", hint: `At least ${MIN_PASSWORD_LENGTH} characters, not a common password. A few unrelated words work well.` },
        ]}
        then={{ kind: "signIn", email: invitation.email, href: "/sites/:id", idPath: "siteId" }}
      />
    </>
  );
}
