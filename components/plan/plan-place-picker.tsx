"use client";
// Placing a member on its zone's plan while logging or editing it: tap the spot (pinch to zoom).
// The other members of the zone are drawn faintly so the spot can be judged against them.
import { useEffect, useMemo, useState } from "react";
import { apiJson } from "@/lib/client/api";
import { pinState } from "@/lib/zone-plans/pin-look";
import { PlanCanvas, type CanvasPin } from "./plan-canvas";

export type PlanPlace = { x: number; y: number } | null;

type PlanData = {
  imageUrl: string | null;
  width: number | null;
  height: number | null;
  zoneName: string;
  pins: { memberId: string; tag: string; x: number; y: number; status: "draft" | "submitted" | "loaded" | "struck" | "out_of_service"; pass: boolean | null; word: string }[];
};

export function PlanPlacePicker({ siteId, zoneId, memberId, value, onChange, error }: { siteId: string; zoneId: string; memberId?: string; value: PlanPlace; onChange: (p: PlanPlace) => void; error?: string }) {
  const [plan, setPlan] = useState<PlanData | null>(null);
  const [state, setState] = useState<"idle" | "loading" | "failed">("idle");

  useEffect(() => {
    if (!zoneId) {
      setPlan(null);
      return;
    }
    let live = true;
    setState("loading");
    apiJson<PlanData>(`/api/v1/sites/${siteId}/zones/${zoneId}/plan`).then((r) => {
      if (!live) return;
      setPlan(r.ok ? r.data : null);
      setState(r.ok ? "idle" : "failed");
    });
    return () => {
      live = false;
    };
  }, [siteId, zoneId]);

  const others: CanvasPin[] = useMemo(
    () => (plan?.pins ?? []).filter((p) => p.memberId !== memberId).map((p) => ({ id: p.memberId, x: p.x, y: p.y, state: pinState(p), label: p.tag, dim: true })),
    [plan, memberId],
  );

  if (!zoneId) return null;
  return (
    <fieldset className="flex flex-col gap-2 rounded-lg border-2 border-ink/15 p-3" aria-describedby={error ? "planPosition-error" : undefined}>
      <legend className="px-1 font-semibold">Place on the zone plan (optional)</legend>
      {state === "loading" ? <p className="text-sm text-ink-soft">Loading the zone’s plan…</p> : null}
      {state === "failed" ? <p className="text-sm text-warn">The zone’s plan could not be loaded; the member can be placed later.</p> : null}
      {plan && !plan.imageUrl ? <p className="text-sm text-ink-soft">{plan.zoneName} has no plan yet; the member can be placed once one is uploaded.</p> : null}
      {plan?.imageUrl && plan.width && plan.height ? (
        <>
          <p className="text-sm">
            {value ? `Placed at ${Math.round(value.x * 100)} % across, ${Math.round(value.y * 100)} % down. Tap elsewhere to move it.` : "Tap where the member stands."}
          </p>
          <PlanCanvas
            imageUrl={plan.imageUrl}
            width={plan.width}
            height={plan.height}
            pins={others}
            marker={value}
            onPlanTap={onChange}
            labels="auto"
            label={`${plan.zoneName} plan`}
          />
          {value ? (
            <button type="button" className="min-h-touch w-fit rounded-lg border-2 border-ink/40 px-3 font-semibold" onClick={() => onChange(null)}>
              Take it off the plan
            </button>
          ) : null}
        </>
      ) : null}
      {error ? (
        <p id="planPosition-error" role="alert" className="font-semibold text-bad">{error}</p>
      ) : null}
    </fieldset>
  );
}
