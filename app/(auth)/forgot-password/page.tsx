import type { Metadata } from "next";
import Link from "next/link";
import { ApiForm } from "@/app/_onboarding/api-form";

export const metadata: Metadata = { title: "Forgot your password" };

export default function ForgotPasswordPage() {
  return (
    <>
      <h1 className="mb-2 text-xl font-bold">Set a new password</h1>
      <p className="mb-4 text-ink-soft">Enter the e-mail address you sign in with. We send a link that works once, within 1 hour.</p>
      <ApiForm
        testId="forgot"
        url="/api/v1/password-resets"
        submitLabel="Send the link"
        busyLabel="Sending…"
        fields={[{ name: "email", label: "E-mail", type: "email", autoComplete: "username", inputMode: "email" }]}
        then={{ kind: "message", text: "If that address belongs to an account, we have sent it a link. Check your inbox (and the spam folder)." }}
      />
      <p className="mt-4 text-center">
        <Link href="/sign-in" className="inline-flex min-h-touch items-center font-semibold text-brand underline">
          Back to sign-in
        </Link>
      </p>
    </>
  );
}
