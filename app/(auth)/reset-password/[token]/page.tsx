import type { Metadata } from "next";
import { ApiForm } from "@/app/_onboarding/api-form";
import { MIN_PASSWORD_LENGTH } from "@/lib/auth/password-policy";

export const metadata: Metadata = { title: "Choose a new password" };

export default async function ResetPasswordPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  return (
    <>
      <h1 className="mb-2 text-xl font-bold">Choose a new password</h1>
      <p className="mb-4 text-ink-soft">Every device signed in to your account is signed out; sign in again with the new password.</p>
      <ApiForm
        testId="reset"
        url={`/api/v1/password-resets/${encodeURIComponent(token)}`}
        submitLabel="Set the new password"
        fields={[{ name: "password", label: "New password", type: "password", autoComplete: "new-password", hint: `At least ${MIN_PASSWORD_LENGTH} characters, not a common password.` }]}
        then={{ kind: "signIn", emailPath: "email", href: "/sites" }}
      />
    </>
  );
}
