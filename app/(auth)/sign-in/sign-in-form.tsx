"use client";

import { Icon } from "@/components/icons";
import { zodResolver } from "@hookform/resolvers/zod";
import { signIn } from "next-auth/react";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { describedBy, Field, inputClass } from "@/components/ui/field";
import { signInSchema, type SignInInput } from "@/lib/validations/auth";

export function SignInForm({ callbackUrl }: { callbackUrl: string }) {
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    formState: { errors, isSubmitting },
  } = useForm<SignInInput>({ resolver: zodResolver(signInSchema), defaultValues: { email: "", password: "" } });

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    const res = await signIn("credentials", { ...values, redirect: false });
    if (!res || res.error) {
      setFormError(
        res?.error && res.error !== "CredentialsSignin"
          ? res.error
          : "That e-mail address and password do not match an account. Check both and try again.",
      );
      return;
    }
    window.location.assign(callbackUrl);
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      {formError ? (
        <p role="alert" className="rounded-lg border-2 border-bad bg-bad-soft p-3 font-semibold text-bad">
          <Icon name="bad" className="mr-1 inline h-5 w-5 align-text-bottom" />
          {formError}
        </p>
      ) : null}
      <Field id="email" label="E-mail" error={errors.email?.message}>
        <input
          id="email"
          type="email"
          autoComplete="username"
          inputMode="email"
          className={inputClass}
          aria-invalid={!!errors.email}
          aria-describedby={describedBy("email", errors.email?.message)}
          {...register("email")}
        />
      </Field>
      <Field id="password" label="Password" error={errors.password?.message}>
        <input
          id="password"
          type="password"
          autoComplete="current-password"
          className={inputClass}
          aria-invalid={!!errors.password}
          aria-describedby={describedBy("password", errors.password?.message)}
          {...register("password")}
        />
      </Field>
      <Button type="submit" disabled={isSubmitting}>
        {isSubmitting ? "Signing in…" : "Sign in"}
      </Button>
    </form>
  );
}
