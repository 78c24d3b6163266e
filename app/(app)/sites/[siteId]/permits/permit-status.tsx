import { Icon } from "@/components/icons";
import { PERMIT_STATUS_LABELS } from "@/lib/labels";

type Status = keyof typeof PERMIT_STATUS_LABELS;

const LOOK: Record<Status, { icon: "permit" | "ok" | "bad" | "warn"; cls: string }> = {
  requested: { icon: "permit", cls: "border-brand bg-brand-soft text-brand-strong" },
  issued: { icon: "ok", cls: "border-ok bg-ok-soft text-ok" },
  refused: { icon: "bad", cls: "border-bad bg-bad-soft text-bad" },
  expired: { icon: "warn", cls: "border-warn bg-warn-soft text-warn" },
  withdrawn: { icon: "bad", cls: "border-bad bg-bad-soft text-bad" },
  closed: { icon: "ok", cls: "border-ink/40 bg-paper-sunk text-ink-soft" },
};

/** A permit's state in words with an icon (never colour alone). */
export function PermitStatus({ status }: { status: Status }) {
  const l = LOOK[status];
  return (
    <span className={`inline-flex items-center gap-1 rounded-full border-2 px-2 py-0.5 text-sm font-bold ${l.cls}`} data-testid="permit-status">
      <Icon name={l.icon} className="h-4 w-4" />
      {PERMIT_STATUS_LABELS[status]}
    </span>
  );
}
