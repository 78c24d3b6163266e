import type { ReactNode } from "react";

/** A labelled input with its error announced and linked through aria-describedby. */
export function Field({
  id, label, error, hint, children,
}: { id: string; label: ReactNode; error?: string; hint?: ReactNode; children: ReactNode }) {
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-sm font-semibold text-ink">
        {label}
      </label>
      {children}
      {hint && !error ? (
        <p id={`${id}-hint`} className="text-sm text-ink-soft">
          {hint}
        </p>
      ) : null}
      {error ? (
        <p id={`${id}-error`} role="alert" className="flex items-start gap-1 text-sm font-semibold text-bad">
          <span aria-hidden>⚠</span> {error}
        </p>
      ) : null}
    </div>
  );
}

export const inputClass =
  "min-h-touch w-full rounded-lg border-2 border-ink/40 bg-paper-raised px-3 py-2 text-base text-ink placeholder:text-ink-faint focus:border-brand aria-[invalid=true]:border-bad";

export function describedBy(id: string, error?: string, hint?: boolean) {
  return error ? `${id}-error` : hint ? `${id}-hint` : undefined;
}
