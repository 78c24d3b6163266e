import type { Metadata } from "next";
import { ApiForm } from "@/app/_onboarding/api-form";
import { AppShell } from "@/components/app-shell";
import { requireUser } from "@/lib/auth";
import { MIN_PASSWORD_LENGTH } from "@/lib/auth/password-policy";

export const metadata: Metadata = { title: "Change password" };

export default async function AccountPage() {
  const user = await requireUser("/account");
  return (
    <AppShell user={user} nav={[{ href: "/sites", label: "Sites", icon: "sites", primary: true }]} rootHref="/sites" context={user.organisationName}>
      <div className="mx-auto max-w-md">
        <h1 className="mb-4 text-2xl font-bold">Change your password</h1>
        <ApiForm
          testId="password"
          url="/api/v1/me/password"
          fields={[
            { name: "currentPassword", label: "Current password", type: "password", autoComplete: "current-password" },
            { name: "newPassword", label: "New password", type: "password", autoComplete: "new-password", hint: `At least ${MIN_PASSWORD_LENGTH} characters, not a common password.` },
          ]}
          submitLabel="Change password"
          resetOnSuccess
          then={{ kind: "message", text: "Password changed. Use the new one next time you sign in." }}
        />
      </div>
    </AppShell>
  );
}
