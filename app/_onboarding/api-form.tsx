"use client";
// One small form for the onboarding and admin screens: labelled fields, the server's field
// errors under each field, and what happens after success. What was typed stays in the form
// whatever the server answers.
import { signIn } from "next-auth/react";
import { useRouter } from "next/navigation";
import { useState, type FormEvent } from "react";
import { Icon } from "@/components/icons";
import { Button } from "@/components/ui/button";
import { describedBy, Field, inputClass } from "@/components/ui/field";
import { submitJson } from "@/lib/auth/submit";

export type FieldDef =
  | { name: string; label: string; type: "text" | "email" | "password" | "number"; autoComplete?: string; hint?: string; defaultValue?: string | number; required?: boolean; inputMode?: "numeric" | "email" | "text" }
  | { name: string; label: string; type: "select"; options: { value: string; label: string }[]; hint?: string; defaultValue?: string }
  | { name: string; label: string; type: "checkboxes"; options: { value: string; label: string }[]; hint?: string; defaultValue?: string[] };

export type Then =
  | { kind: "redirect"; href: string; idPath?: string }
  | { kind: "message"; text: string }
  | { kind: "refresh"; text?: string }
  /** Sign in with the e-mail given (or typed in `emailField`) and the typed `password`, then go. */
  | { kind: "signIn"; email?: string; emailPath?: string; emailField?: string; href: string; idPath?: string };

function pick(obj: unknown, path?: string): string | undefined {
  if (!path) return undefined;
  let v: unknown = obj;
  for (const k of path.split(".")) v = v && typeof v === "object" ? (v as Record<string, unknown>)[k] : undefined;
  return typeof v === "string" ? v : undefined;
}

export function ApiForm({
  url, method = "POST", fields, submitLabel, busyLabel, then, extra, resetOnSuccess = false, testId,
}: {
  url: string;
  method?: string;
  fields: FieldDef[];
  submitLabel: string;
  busyLabel?: string;
  then: Then;
  /** Constant values sent with the form. */
  extra?: Record<string, unknown>;
  resetOnSuccess?: boolean;
  testId?: string;
}) {
  const router = useRouter();
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function onSubmit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = e.currentTarget;
    const data = new FormData(form);
    const body: Record<string, unknown> = { ...extra };
    for (const f of fields) {
      if (f.type === "checkboxes") body[f.name] = data.getAll(f.name).map(String);
      else if (f.type === "number") {
        const raw = String(data.get(f.name) ?? "").trim();
        if (raw !== "") body[f.name] = Number(raw.replace(",", "."));
      } else {
        const raw = String(data.get(f.name) ?? "");
        if (raw !== "" || f.type === "password") body[f.name] = raw;
      }
    }
    setBusy(true);
    setFormError(null);
    setDone(null);
    const r = await submitJson(url, method, body);
    if (!r.ok) {
      const byField: Record<string, string> = {};
      for (const [k, v] of Object.entries(r.fields)) {
        const top = k.split(".")[0]!;
        if (fields.some((f) => f.name === top)) byField[top] ??= v;
      }
      setErrors(byField);
      setFormError(Object.keys(byField).length ? (r.status === 422 ? "Some values need attention." : r.message) : r.message);
      setBusy(false);
      return;
    }
    setErrors({});
    if (then.kind === "signIn") {
      const email = then.email ?? pick(r.body, then.emailPath) ?? String(data.get(then.emailField ?? "email") ?? "");
      const res = await signIn("credentials", { email, password: String(data.get("password") ?? ""), redirect: false });
      const id = pick(r.body, then.idPath);
      window.location.assign(res && !res.error ? then.href.replace(":id", id ?? "") : "/sign-in");
      return;
    }
    if (then.kind === "redirect") {
      router.push(then.href.replace(":id", pick(r.body, then.idPath) ?? ""));
      router.refresh();
      return;
    }
    if (resetOnSuccess) form.reset();
    setBusy(false);
    if (then.kind === "message") setDone(then.text);
    else {
      if (then.text) setDone(then.text);
      router.refresh();
    }
  }

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4" data-testid={testId}>
      {formError ? (
        <p role="alert" className="rounded-lg border-2 border-bad bg-bad-soft p-3 font-semibold text-bad">
          <Icon name="bad" className="mr-1 inline h-5 w-5 align-text-bottom" />
          {formError}
        </p>
      ) : null}
      {done ? (
        <p role="status" className="rounded-lg border-2 border-ok bg-ok-soft p-3 font-semibold text-ok">
          <Icon name="ok" className="mr-1 inline h-5 w-5 align-text-bottom" />
          {done}
        </p>
      ) : null}
      {fields.map((f) => {
        const id = `${testId ?? "f"}-${f.name}`;
        const error = errors[f.name];
        if (f.type === "checkboxes")
          return (
            <fieldset key={f.name} className="flex flex-col gap-1" aria-describedby={describedBy(id, error, !!f.hint)}>
              <legend className="mb-1 text-sm font-semibold text-ink">{f.label}</legend>
              {f.options.map((o) => (
                <label key={o.value} className="flex min-h-touch items-center gap-3 rounded-lg px-1">
                  <input type="checkbox" name={f.name} value={o.value} defaultChecked={f.defaultValue?.includes(o.value)} className="h-6 w-6" />
                  {o.label}
                </label>
              ))}
              {f.hint && !error ? <p id={`${id}-hint`} className="text-sm text-ink-soft">{f.hint}</p> : null}
              {error ? (
                <p id={`${id}-error`} role="alert" className="text-sm font-semibold text-bad">
                  <span aria-hidden>⚠</span> {error}
                </p>
              ) : null}
            </fieldset>
          );
        return (
          <Field key={f.name} id={id} label={f.label} error={error} hint={f.hint}>
            {f.type === "select" ? (
              <select id={id} name={f.name} defaultValue={f.defaultValue} className={inputClass} aria-invalid={!!error} aria-describedby={describedBy(id, error, !!f.hint)}>
                {f.options.map((o) => (
                  <option key={o.value} value={o.value}>
                    {o.label}
                  </option>
                ))}
              </select>
            ) : (
              <input
                id={id}
                name={f.name}
                type={f.type === "number" ? "text" : f.type}
                inputMode={f.type === "number" ? "numeric" : f.inputMode}
                autoComplete={f.autoComplete}
                defaultValue={f.defaultValue}
                className={inputClass}
                aria-invalid={!!error}
                aria-describedby={describedBy(id, error, !!f.hint)}
              />
            )}
          </Field>
        );
      })}
      <Button type="submit" disabled={busy}>
        {busy ? (busyLabel ?? "Saving…") : submitLabel}
      </Button>
    </form>
  );
}

/** A single button that calls the API (resend, revoke, remove, deactivate) and refreshes the page. */
export function ApiButton({
  url, method = "POST", label, busyLabel, confirm, variant = "secondary", body,
}: { url: string; method?: string; label: string; busyLabel?: string; confirm?: string; variant?: "primary" | "secondary" | "danger"; body?: unknown }) {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  return (
    <span className="inline-flex flex-col">
      <Button
        type="button"
        variant={variant}
        disabled={busy}
        onClick={async () => {
          if (confirm && !window.confirm(confirm)) return;
          setBusy(true);
          setError(null);
          const r = await submitJson(url, method, body);
          setBusy(false);
          if (!r.ok) setError(r.message);
          else router.refresh();
        }}
      >
        {busy ? (busyLabel ?? "Working…") : label}
      </Button>
      {error ? (
        <span role="alert" className="mt-1 text-sm font-semibold text-bad">
          <span aria-hidden>⚠</span> {error}
        </span>
      ) : null}
    </span>
  );
}
