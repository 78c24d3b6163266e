"use client";
// The coordinator gives a supervisor scope to issue permits for some zones until a date.
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Icon } from "@/components/icons";
import { useServerErrors } from "@/components/use-server-errors";
import { apiJson } from "@/lib/client/api";
import { Button } from "@/components/ui/button";
import { Field, describedBy, inputClass } from "@/components/ui/field";
import { delegationSchema } from "@/lib/validations/permit";

type Values = { userId: string; zoneIds: string[]; validUntil: string };

export function DelegationForm({ siteId, supervisors, zones }: { siteId: string; supervisors: { id: string; name: string }[]; zones: { id: string; name: string }[] }) {
  const router = useRouter();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, reset, formState } = useForm<Values>({ defaultValues: { userId: "", zoneIds: [], validUntil: "" } });
  const placeErrors = useServerErrors(setError);
  const e = formState.errors;
  const onSubmit = handleSubmit(async (v) => {
    setFormError(null);
    const body = { ...v, zoneIds: v.zoneIds ?? [], validUntil: v.validUntil ? new Date(v.validUntil).toISOString() : "" };
    const parsed = delegationSchema.safeParse(body);
    if (!parsed.success) {
      for (const i of parsed.error.issues) setError(String(i.path[0]) as keyof Values, { message: i.message });
      return;
    }
    const r = await apiJson(`/api/v1/sites/${siteId}/permit-delegations`, { body });
    if (!r.ok) {
      setFormError(r.error.message);
      placeErrors(r.error);
      return;
    }
    reset();
    router.refresh();
  });
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-3 rounded-xl border-2 border-ink/15 bg-paper-raised p-4" aria-label="Give issuing scope">
      <h2 className="text-xl font-bold">Give issuing scope</h2>
      <Field id="userId" label="Supervisor" error={e.userId?.message}>
        <select id="userId" className={inputClass} {...register("userId")} aria-invalid={!!e.userId} aria-describedby={describedBy("userId", e.userId?.message)}>
          <option value="">Choose a supervisor</option>
          {supervisors.map((s) => (
            <option key={s.id} value={s.id}>
              {s.name}
            </option>
          ))}
        </select>
      </Field>
      <fieldset aria-describedby={e.zoneIds ? "zoneIds-error" : undefined}>
        <legend className="text-sm font-semibold">Zones the supervisor may issue for</legend>
        <div className="mt-1 grid grid-cols-1 gap-1 sm:grid-cols-2">
          {zones.map((z) => (
            <label key={z.id} className="flex min-h-touch items-center gap-2">
              <input type="checkbox" value={z.id} {...register("zoneIds")} className="h-5 w-5" /> {z.name}
            </label>
          ))}
        </div>
        {e.zoneIds ? (
          <p id="zoneIds-error" role="alert" className="text-sm font-semibold text-bad">
            ⚠ {e.zoneIds.message}
          </p>
        ) : null}
      </fieldset>
      <Field id="validUntil" label="Until" error={e.validUntil?.message}>
        <input id="validUntil" type="datetime-local" className={inputClass} {...register("validUntil")} aria-invalid={!!e.validUntil} aria-describedby={describedBy("validUntil", e.validUntil?.message)} />
      </Field>
      {formError ? (
        <p role="alert" className="flex items-center gap-2 font-semibold text-bad">
          <Icon name="bad" className="h-5 w-5" /> {formError}
        </p>
      ) : null}
      <Button type="submit" disabled={formState.isSubmitting}>
        Give scope
      </Button>
    </form>
  );
}

export function RevokeButton({ delegationId }: { delegationId: string }) {
  const router = useRouter();
  const [error, setErrorText] = useState<string | null>(null);
  return (
    <span className="flex flex-col gap-1">
      <Button
        type="button"
        variant="secondary"
        onClick={async () => {
          const r = await apiJson(`/api/v1/permit-delegations/${delegationId}/revoke`, { method: "POST" });
          if (!r.ok) setErrorText(r.error.message);
          else router.refresh();
        }}
      >
        Revoke
      </Button>
      {error ? <span role="alert" className="text-sm text-bad">{error}</span> : null}
    </span>
  );
}
