// Dates and figures in alert titles and e-mails: the site's own time zone, in words people read.
export function formatWhen(d: Date, timeZone = "Europe/London") {
  return new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeStyle: "short", timeZone }).format(d);
}

export function formatPercent(utilisation: number | null) {
  return utilisation == null || !Number.isFinite(utilisation) ? "not computable" : `${Math.round(utilisation * 100)} %`;
}

export function formatKn(n: number | null) {
  return n == null || !Number.isFinite(n) ? "—" : `${(n / 1000).toLocaleString("en-GB", { maximumFractionDigits: 1 })} kN`;
}

export function permitLabel(p: { kind: "load" | "strike"; number: number | null }) {
  return `permit to ${p.kind}${p.number != null ? ` No. ${p.number}` : ""}`;
}
