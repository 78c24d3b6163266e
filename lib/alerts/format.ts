// Figures in alert titles and e-mails, in words people read (dates: lib/format-date.ts).
import { formatForceFor, formatUtilisation } from "@/lib/client/format";

export function formatPercent(utilisation: number | null) {
  return utilisation == null || !Number.isFinite(utilisation) ? "not computable" : formatUtilisation(utilisation);
}

export function formatKn(n: number | null) {
  return formatForceFor(n, "si");
}

export function permitLabel(p: { kind: "load" | "strike"; number: number | null }) {
  return `permit to ${p.kind}${p.number != null ? ` No. ${p.number}` : ""}`;
}
