"use client";
// The coordinator's and supervisor's actions on one permit. Each posts to /api/v1 and refreshes the page.
import { useRouter } from "next/navigation";
import { useEffect, useRef, useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { z } from "zod";
import { Icon } from "@/components/icons";
import { apiJson } from "@/lib/client/api";
import { Button } from "@/components/ui/button";
import { Field, describedBy, inputClass } from "@/components/ui/field";
import { permitReasonSchema } from "@/lib/validations/permit";
import { formatHours } from "@/lib/format-date";

function ErrorBox({ message }: { message: string | null }) {
  if (!message) return null;
  return (
    <p role="alert" className="flex items-start gap-2 rounded-lg border-2 border-bad bg-bad-soft p-3 font-semibold text-bad">
      <Icon name="bad" className="h-5 w-5 shrink-0" /> {message}
    </p>
  );
}

/** A local "YYYY-MM-DDTHH:mm" for <input type="datetime-local">. */
function localInput(d: Date) {
  const p = (n: number) => String(n).padStart(2, "0");
  return `${d.getFullYear()}-${p(d.getMonth() + 1)}-${p(d.getDate())}T${p(d.getHours())}:${p(d.getMinutes())}`;
}

const issueFormSchema = z.object({
  validUntil: z.string().min(1, { error: "Enter until when the permit is valid." }).refine((s) => !Number.isNaN(new Date(s).getTime()), { error: "Enter a date and time." }),
  conditions: z.string().max(2000, { error: "Keep the conditions under 2000 characters." }),
});
type IssueForm = z.infer<typeof issueFormSchema>;

export function IssuePanel({ permitId, defaultHours, maxDays, canIssue, blockers }: { permitId: string; defaultHours: number; maxDays: number; canIssue: boolean; blockers: number }) {
  const router = useRouter();
  const [formError, setFormError] = useState<string | null>(null);
  const [min, setMin] = useState<string>("");
  const { register, handleSubmit, setError, setValue, formState } = useForm<IssueForm>({
    resolver: zodResolver(issueFormSchema),
    defaultValues: { validUntil: "", conditions: "" },
  });
  // The default validity is computed in the browser so it is in the user's own clock.
  useEffect(() => {
    const now = new Date();
    setValue("validUntil", localInput(new Date(now.getTime() + defaultHours * 3600_000)));
    setMin(localInput(now));
  }, [defaultHours, setValue]);

  const onSubmit = handleSubmit(async (v) => {
    setFormError(null);
    const r = await apiJson(`/api/v1/permits/${permitId}/issue`, {
      body: { validUntil: new Date(v.validUntil).toISOString(), conditions: v.conditions.trim() || undefined },
    });
    if (!r.ok) {
      setFormError(r.error.message);
      if (r.error.fields.validUntil) setError("validUntil", { message: r.error.fields.validUntil });
      if (r.error.fields.conditions) setError("conditions", { message: r.error.fields.conditions });
      if (r.error.status === 409 || r.error.status === 422) router.refresh();
      return;
    }
    router.refresh();
  });
  const e = formState.errors;
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-3" aria-label="Issue the permit">
      <Field id="validUntil" label="Valid until" error={e.validUntil?.message} hint={`Default from the site's settings: ${formatHours(defaultHours)}. At most ${maxDays} days.`}>
        <input
          id="validUntil"
          type="datetime-local"
          min={min}
          className={inputClass}
          {...register("validUntil")}
          aria-invalid={!!e.validUntil}
          aria-describedby={describedBy("validUntil", e.validUntil?.message, true)}
        />
      </Field>
      <Field id="conditions" label="Conditions (printed on the permit)" error={e.conditions?.message}>
        <textarea id="conditions" rows={3} className={inputClass} placeholder="e.g. Pour bay 1 before bay 2" {...register("conditions")} aria-invalid={!!e.conditions} />
      </Field>
      <ErrorBox message={formError} />
      <Button type="submit" disabled={!canIssue || formState.isSubmitting} className="text-lg md:self-start md:px-8">
        <Icon name="ok" /> {formState.isSubmitting ? "Issuing…" : "Issue permit"}
      </Button>
      {!canIssue ? (
        <p className="flex items-center gap-2 text-sm font-semibold text-bad">
          <Icon name="bad" className="h-4 w-4" /> Cannot be issued until the {blockers} problem{blockers === 1 ? " above is" : "s above are"} resolved.
        </p>
      ) : null}
    </form>
  );
}

type ReasonForm = z.infer<typeof permitReasonSchema>;

export function ReasonAction({ permitId, action, label, hint, danger = true }: { permitId: string; action: "refuse" | "withdraw"; label: string; hint: string; danger?: boolean }) {
  const router = useRouter();
  const [open, setOpen] = useState(false);
  const [formError, setFormError] = useState<string | null>(null);
  const ref = useRef<HTMLTextAreaElement | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<ReasonForm>({ resolver: zodResolver(permitReasonSchema), defaultValues: { reason: "" } });
  useEffect(() => {
    if (open) ref.current?.focus();
  }, [open]);
  if (!open)
    return (
      <Button type="button" variant={danger ? "danger" : "secondary"} onClick={() => setOpen(true)} className="md:self-start">
        {label}…
      </Button>
    );
  const id = `${action}-reason`;
  const { ref: rhfRef, ...reg } = register("reason");
  const onSubmit = handleSubmit(async (v) => {
    setFormError(null);
    const r = await apiJson(`/api/v1/permits/${permitId}/${action}`, { body: v });
    if (!r.ok) {
      setFormError(r.error.message);
      if (r.error.fields.reason) setError("reason", { message: r.error.fields.reason });
      if (r.error.status === 409) router.refresh();
      return;
    }
    setOpen(false);
    router.refresh();
  });
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-2 rounded-xl border-2 border-bad/60 p-3" aria-label={label}>
      <Field id={id} label={`Reason (${hint})`} error={formState.errors.reason?.message}>
        <textarea
          id={id}
          rows={3}
          className={inputClass}
          {...reg}
          ref={(el) => {
            rhfRef(el);
            ref.current = el;
          }}
          aria-invalid={!!formState.errors.reason}
          aria-describedby={describedBy(id, formState.errors.reason?.message)}
        />
      </Field>
      <ErrorBox message={formError} />
      <div className="flex flex-wrap gap-2">
        <Button type="submit" variant="danger" disabled={formState.isSubmitting}>
          {formState.isSubmitting ? "Sending…" : label}
        </Button>
        <Button type="button" variant="secondary" onClick={() => setOpen(false)}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

export function PostAction({ permitId, action, label, confirm, variant = "secondary" }: { permitId: string; action: "close" | "confirm-struck"; label: string; confirm: string; variant?: "primary" | "secondary" }) {
  const router = useRouter();
  const [asking, setAsking] = useState(false);
  const [busy, setBusy] = useState(false);
  const [error, setErrorText] = useState<string | null>(null);
  if (!asking)
    return (
      <Button type="button" variant={variant} onClick={() => setAsking(true)}>
        {label}
      </Button>
    );
  return (
    <div className="flex flex-col gap-2 rounded-xl border-2 border-ink/30 p-3" role="group" aria-label={label}>
      <p className="font-semibold">{confirm}</p>
      <ErrorBox message={error} />
      <div className="flex flex-wrap gap-2">
        <Button
          type="button"
          variant="primary"
          disabled={busy}
          onClick={async () => {
            setBusy(true);
            const r = await apiJson(`/api/v1/permits/${permitId}/${action}`, { method: "POST" });
            setBusy(false);
            if (!r.ok) {
              setErrorText(r.error.message);
              return;
            }
            setAsking(false);
            router.refresh();
          }}
        >
          {busy ? "Saving…" : `Yes, ${label.charAt(0).toLowerCase()}${label.slice(1)}`}
        </Button>
        <Button type="button" variant="secondary" onClick={() => setAsking(false)}>
          Cancel
        </Button>
      </div>
    </div>
  );
}

/** Refreshes the page while the PDF is being made or e-mails are on their way (for at most two minutes). */
export function LiveRefresh({ active }: { active: boolean }) {
  const router = useRouter();
  const started = useRef(Date.now());
  useEffect(() => {
    if (!active) return;
    const t = setInterval(() => {
      if (Date.now() - started.current > 120_000) return clearInterval(t);
      router.refresh();
    }, 3000);
    return () => clearInterval(t);
  }, [active, router]);
  return null;
}

/** Striking member by member: tick the members taken out, confirm; the permit closes with the last. */
export function StrikeMembers({ permitId, members }: { permitId: string; members: { id: string; tag: string; zone: string | null }[] }) {
  const router = useRouter();
  const [chosen, setChosen] = useState<string[]>([]);
  const [busy, setBusy] = useState(false);
  const [error, setErrorText] = useState<string | null>(null);
  return (
    <fieldset className="flex flex-col gap-2 rounded-xl border-2 border-ink/30 p-3">
      <legend className="px-1 font-bold">Confirm striking member by member</legend>
      <ul className="flex flex-col gap-1">
        {members.map((m) => (
          <li key={m.id}>
            <label className="flex min-h-touch items-center gap-3">
              <input
                type="checkbox"
                className="h-6 w-6"
                checked={chosen.includes(m.id)}
                onChange={(e) => setChosen((c) => (e.target.checked ? [...c, m.id] : c.filter((x) => x !== m.id)))}
              />
              <span className="font-semibold">{m.tag}</span>
              {m.zone ? <span className="text-sm text-ink-soft">{m.zone}</span> : null}
            </label>
          </li>
        ))}
      </ul>
      <ErrorBox message={error} />
      <Button
        type="button"
        variant="secondary"
        disabled={busy || chosen.length === 0}
        className="md:self-start"
        onClick={async () => {
          setBusy(true);
          setErrorText(null);
          const r = await apiJson(`/api/v1/permits/${permitId}/confirm-struck`, { body: { memberIds: chosen } });
          setBusy(false);
          if (!r.ok) {
            setErrorText(Object.values(r.error.fields)[0] ?? r.error.message);
            return;
          }
          setChosen([]);
          router.refresh();
        }}
      >
        {busy ? "Saving…" : `Confirm ${chosen.length || ""} member${chosen.length === 1 ? "" : "s"} struck`.replace("  ", " ")}
      </Button>
    </fieldset>
  );
}

/** New strength results for an open permit to strike; the earlier ones stay in the history. */
export function AmendEvidence({ permitId, requiredMpa, ageDays }: { permitId: string; requiredMpa: number | null; ageDays: number | null }) {
  const router = useRouter();
  const [open, setOpen] = useState(false);
  const [age, setAge] = useState(ageDays != null ? String(ageDays) : "");
  const [required, setRequired] = useState(requiredMpa != null ? String(requiredMpa) : "");
  const [results, setResults] = useState("");
  const [specimen, setSpecimen] = useState<"cube" | "cylinder">("cube");
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [busy, setBusy] = useState(false);
  if (!open)
    return (
      <Button type="button" variant="secondary" onClick={() => setOpen(true)} className="md:self-start">
        Enter new strength results…
      </Button>
    );
  const num = (s: string) => (s.trim() === "" ? Number.NaN : Number(s.replace(",", ".")));
  return (
    <form
      noValidate
      aria-label="New strength results"
      className="flex flex-col gap-3 rounded-xl border-2 border-ink/30 p-3"
      onSubmit={async (e) => {
        e.preventDefault();
        const list = results.split(/[;\s]+/).filter(Boolean).map(num);
        const local: Record<string, string> = {};
        if (!Number.isFinite(num(age))) local.concreteAgeDays = "Enter the age of the concrete in days.";
        if (!Number.isFinite(num(required))) local.requiredStrengthMpa = "Enter the required striking strength in MPa.";
        if (list.length === 0 || list.some((x) => !Number.isFinite(x))) local.results = "Enter each result in MPa, separated by spaces (e.g. 24.5 23.0).";
        setErrors(local);
        if (Object.keys(local).length) return;
        setBusy(true);
        const r = await apiJson(`/api/v1/permits/${permitId}/evidence`, {
          method: "PATCH",
          body: { evidence: { basis: "strength", concreteAgeDays: num(age), requiredStrengthMpa: num(required), results: list.map((strengthMpa) => ({ specimen, strengthMpa })) } },
        });
        setBusy(false);
        if (!r.ok) {
          const f: Record<string, string> = {};
          for (const [k, v] of Object.entries(r.error.fields)) f[k.startsWith("evidence.results") ? "results" : k.replace("evidence.", "")] = v;
          setErrors(Object.keys(f).length ? f : { results: r.error.message });
          return;
        }
        setOpen(false);
        router.refresh();
      }}
    >
      <Field id="ev-age" label="Concrete age (days)" error={errors.concreteAgeDays}>
        <input id="ev-age" inputMode="numeric" className={inputClass} value={age} onChange={(e) => setAge(e.target.value)} aria-invalid={!!errors.concreteAgeDays} aria-describedby={describedBy("ev-age", errors.concreteAgeDays)} />
      </Field>
      <Field id="ev-required" label="Required striking strength (MPa)" error={errors.requiredStrengthMpa}>
        <input id="ev-required" inputMode="decimal" className={inputClass} value={required} onChange={(e) => setRequired(e.target.value)} aria-invalid={!!errors.requiredStrengthMpa} aria-describedby={describedBy("ev-required", errors.requiredStrengthMpa)} />
      </Field>
      <Field id="ev-specimen" label="Specimens">
        <select id="ev-specimen" className={inputClass} value={specimen} onChange={(e) => setSpecimen(e.target.value as "cube" | "cylinder")}>
          <option value="cube">Cubes</option>
          <option value="cylinder">Cylinders</option>
        </select>
      </Field>
      <Field id="ev-results" label="Results (MPa, separated by spaces)" error={errors.results}>
        <input id="ev-results" className={inputClass} value={results} onChange={(e) => setResults(e.target.value)} placeholder="e.g. 24.5 23.0" aria-invalid={!!errors.results} aria-describedby={describedBy("ev-results", errors.results)} />
      </Field>
      <div className="flex flex-wrap gap-2">
        <Button type="submit" disabled={busy}>
          {busy ? "Saving…" : "Save the new results"}
        </Button>
        <Button type="button" variant="secondary" onClick={() => setOpen(false)}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
