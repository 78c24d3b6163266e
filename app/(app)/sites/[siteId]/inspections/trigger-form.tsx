"use client";
// A coordinator makes inspections due now for a zone or the whole site.
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { Icon } from "@/components/icons";
import { useServerErrors } from "@/components/use-server-errors";
import { apiJson } from "@/lib/client/api";
import { Button } from "@/components/ui/button";
import { describedBy, Field, inputClass } from "@/components/ui/field";
import { inspectionTriggerSchema, type InspectionTriggerInput } from "@/lib/validations/inspection";

type FormIn = z.input<typeof inspectionTriggerSchema>;

export function TriggerForm({ siteId, zones }: { siteId: string; zones: { id: string; name: string }[] }) {
  const router = useRouter();
  const [done, setDone] = useState<string | null>(null);
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, reset, setError, formState: { errors, isSubmitting } } = useForm<FormIn, unknown, InspectionTriggerInput>({
    resolver: zodResolver(inspectionTriggerSchema),
    defaultValues: { zoneId: null, reason: "" },
  });
  const placeErrors = useServerErrors(setError);

  async function onSubmit(v: InspectionTriggerInput) {
    setFormError(null);
    const r = await apiJson<{ trigger: { zoneName: string | null } }>(`/api/v1/sites/${siteId}/inspection-triggers`, { body: { zoneId: v.zoneId || null, reason: v.reason } });
    if (!r.ok) {
      const { unplaced } = placeErrors(r.error);
      if (unplaced.length) setFormError(unplaced.join(" "));
      return;
    }
    setDone(`Inspections are now due in ${r.data.trigger.zoneName ?? "the whole site"}.`);
    reset({ zoneId: null, reason: "" });
    router.refresh();
  }

  return (
    <form onSubmit={handleSubmit(onSubmit)} noValidate className="grid gap-2 sm:grid-cols-[1fr_2fr_auto] sm:items-end">
      <Field id="trigger-zone" label="Where" error={errors.zoneId?.message}>
        <select id="trigger-zone" className={inputClass} {...register("zoneId", { setValueAs: (v) => (v ? v : null) })} aria-describedby={describedBy("trigger-zone", errors.zoneId?.message)}>
          <option value="">Whole site</option>
          {zones.map((z) => (
            <option key={z.id} value={z.id}>
              {z.name}
            </option>
          ))}
        </select>
      </Field>
      <Field id="trigger-reason" label="Why (incident or weather)" error={errors.reason?.message}>
        <input id="trigger-reason" className={inputClass} placeholder="e.g. gusts over 60 km/h overnight" aria-invalid={Boolean(errors.reason)} aria-describedby={describedBy("trigger-reason", errors.reason?.message)} {...register("reason")} />
      </Field>
      <Button type="submit" variant="danger" disabled={isSubmitting}>
        <Icon name="warn" className="h-5 w-5" /> Inspect now
      </Button>
      {done ? (
        <p role="status" className="flex items-center gap-2 font-semibold text-ok sm:col-span-3">
          <Icon name="ok" className="h-5 w-5" /> {done}
        </p>
      ) : null}
      {formError ? (
        <p role="alert" className="font-semibold text-bad sm:col-span-3">
          {formError}
        </p>
      ) : null}
    </form>
  );
}
