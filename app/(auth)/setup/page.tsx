import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { ApiForm } from "@/app/_onboarding/api-form";
import { setupNeeded } from "@/lib/auth/setup";
import { MIN_PASSWORD_LENGTH } from "@/lib/auth/password-policy";

export const metadata: Metadata = { title: "Set up Strutwise" };
export const dynamic = "force-dynamic";

/** The one-time first run of an empty installation; gone (404) once an organisation exists. */
export default async function SetupPage() {
  if (!(await setupNeeded())) notFound();
  return (
    <>
      <h1 className="mb-2 text-xl font-bold">Set up your organisation</h1>
      <p className="mb-4 text-ink-soft">
        This page appears once, on a new installation. You become the organisation admin: you then add sites and invite your team.
      </p>
      <ApiForm
        testId="setup"
        url="/api/v1/setup"
        submitLabel="Create the organisation"
        busyLabel="Creating…"
        fields={[
          { name: "organisationName", label: "Organisation name", type: "text", autoComplete: "organization" },
          { name: "name", label: "Your name", type: "text", autoComplete: "name" },
          { name: "email", label: "Your e-mail", type: "email", autoComplete: "username", inputMode: "email" },
          { name: "password", label: "Choose a password", type: "password", autoComplete: "new-password", hint: `At least ${MIN_PASSWORD_LENGTH} characters, not a common password. A few unrelated words work well.` },
        ]}
        then={{ kind: "signIn", href: "/sites" }}
      />
    </>
  );
}
