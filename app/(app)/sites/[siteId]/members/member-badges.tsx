// Status and check result in words and an icon as well as colour (the register's table and cards).
import { Icon } from "@/components/icons";
import { MEMBER_STATUS_LABELS } from "@/lib/labels";

type Status = keyof typeof MEMBER_STATUS_LABELS;

const STATUS_STYLE: Record<Status, { icon: "ok" | "bad" | "warn" | "permit" | "register" | "add"; cls: string }> = {
  draft: { icon: "add", cls: "border-ink/30 bg-paper-sunk text-ink" },
  submitted: { icon: "permit", cls: "border-brand/50 bg-brand-soft text-brand-strong" },
  loaded: { icon: "ok", cls: "border-ok/50 bg-ok-soft text-ok" },
  struck: { icon: "register", cls: "border-ink/30 bg-paper-sunk text-ink-soft" },
  out_of_service: { icon: "bad", cls: "border-bad/60 bg-bad-soft text-bad" },
};

export function StatusBadge({ status }: { status: Status }) {
  const s = STATUS_STYLE[status];
  return (
    <span className={`inline-flex items-center gap-1 whitespace-nowrap rounded-md border px-1.5 py-0.5 text-sm font-semibold ${s.cls}`}>
      <Icon name={s.icon} className="h-4 w-4" />
      {MEMBER_STATUS_LABELS[status]}
    </span>
  );
}

export function CheckBadge({ pass, hasCapacity }: { pass: boolean | null; hasCapacity: boolean }) {
  if (pass === true)
    return (
      <span className="inline-flex items-center gap-1 whitespace-nowrap font-semibold text-ok">
        <Icon name="ok" className="h-4 w-4" /> Pass
      </span>
    );
  if (pass === false)
    return (
      <span
        className="inline-flex items-center gap-1 whitespace-nowrap rounded-md bg-bad px-1.5 py-0.5 font-bold text-white"
        title={hasCapacity ? "Over capacity" : "The check could not compute a capacity (e.g. outside the supplier's table)"}
      >
        <Icon name="bad" className="h-4 w-4" /> Fail
        {hasCapacity ? null : <span className="sr-only">, no capacity could be computed</span>}
      </span>
    );
  return (
    <span className="inline-flex items-center gap-1 whitespace-nowrap font-semibold text-warn">
      <Icon name="warn" className="h-4 w-4" /> Not checked
    </span>
  );
}
