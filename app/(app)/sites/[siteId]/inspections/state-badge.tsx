// An inspection's state in words and an icon as well as colour.
import { Icon } from "@/components/icons";
import { INSPECTION_STATE_LABELS, type InspectionState } from "@/lib/inspections/due";

const STYLE: Record<InspectionState, { icon: "ok" | "bad" | "warn" | "inspect"; cls: string }> = {
  overdue: { icon: "warn", cls: "border-bad/60 bg-bad-soft text-bad" },
  due_now: { icon: "warn", cls: "border-bad/60 bg-bad-soft text-bad" },
  failed: { icon: "bad", cls: "border-bad/60 bg-bad-soft text-bad" },
  never: { icon: "inspect", cls: "border-warn/60 bg-warn-soft text-warn" },
  due_soon: { icon: "warn", cls: "border-warn/60 bg-warn-soft text-warn" },
  in_date: { icon: "ok", cls: "border-ok/50 bg-ok-soft text-ok" },
};

export function InspectionStateBadge({ state }: { state: InspectionState }) {
  const s = STYLE[state];
  return (
    <span data-state={state} className={`inline-flex items-center gap-1 whitespace-nowrap rounded-md border px-1.5 py-0.5 text-sm font-semibold ${s.cls}`}>
      <Icon name={s.icon} className="h-4 w-4" />
      {INSPECTION_STATE_LABELS[state]}
    </span>
  );
}

export function ResultBadge({ result }: { result: "pass" | "fail" }) {
  return result === "pass" ? (
    <span className="inline-flex items-center gap-1 whitespace-nowrap font-semibold text-ok">
      <Icon name="ok" className="h-4 w-4" /> Passed
    </span>
  ) : (
    <span className="inline-flex items-center gap-1 whitespace-nowrap rounded-md bg-bad px-1.5 py-0.5 font-bold text-white">
      <Icon name="bad" className="h-4 w-4" /> Failed
    </span>
  );
}
