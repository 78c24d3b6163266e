// Dates and figures in alert titles and e-mails: the site's own time zone, in words people read.
import { formatForceFor, formatUtilisation } from "@/lib/client/format";

export function formatWhen(d: Date, timeZone = "Europe/London") {
  return new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeStyle: "short", timeZone }).format(d);
}

export function formatPercent(utilisation: number | null) {
  return utilisation == null || !Number.isFinite(utilisation) ? "not computable" : formatUtilisation(utilisation);
}

export function formatKn(n: number | null) {
  return formatForceFor(n, "si");
}

export function permitLabel(p: { kind: "load" | "strike"; number: number | null }) {
  return `permit to ${p.kind}${p.number != null ? ` No. ${p.number}` : ""}`;
}
