// An alert's kind in words and an icon as well as colour.
import { Icon } from "@/components/icons";
import { ALERT_KIND_SHORT, ALERT_SEVERITY, isAlertKind } from "@/lib/alerts/kinds";

export function AlertKindBadge({ kind }: { kind: string }) {
  const known = isAlertKind(kind);
  const bad = known && ALERT_SEVERITY[kind] === "bad";
  return (
    <span className={`inline-flex items-center gap-1 whitespace-nowrap rounded-md border px-1.5 py-0.5 text-sm font-semibold ${bad ? "border-bad/60 bg-bad-soft text-bad" : "border-warn/60 bg-warn-soft text-warn"}`}>
      <Icon name={bad ? "bad" : "warn"} className="h-4 w-4" />
      {known ? ALERT_KIND_SHORT[kind] : kind}
    </span>
  );
}
