// The one way figures are written on screen, in PDFs and in e-mails: force, length and utilisation
// in the site's unit system (SI sites: kN and mm; US sites: kip and feet-and-inches), with the
// unit always written and "—" where there is no value.
import { formatFeetInches, formatForce, formatLength } from "@/lib/units";

export type UnitSystem = "si" | "us";

const missing = (v: number | null | undefined): v is null | undefined => v == null || !Number.isFinite(v);

/** A force in newtons: "12.5 kN" on an SI site, "2.81 kip" on a US one. */
export function formatForceFor(n: number | null | undefined, units: UnitSystem = "si"): string {
  if (missing(n)) return "—";
  return units === "us" ? formatForce(n, "kip", 2) : formatForce(n, "kN", 1);
}

/** A length in millimetres: "2650 mm" on an SI site, 8' 8 5/16" on a US one. */
export function formatLengthFor(mm: number | null | undefined, units: UnitSystem = "si"): string {
  if (missing(mm)) return "—";
  return units === "us" ? formatFeetInches(mm) : formatLength(mm, "mm", 0);
}

/** Utilisation as a ratio (1 = at capacity): "87 %". */
export function formatUtilisation(u: number | null | undefined): string {
  if (missing(u)) return "—";
  return `${Math.round(u * 100)} %`;
}

/** "14:32" today, "2 Dec 14:32" for an older copy: the banner says how old what is shown is. */
export function loadedAtText(renderedAt: string, now = new Date()): string {
  const at = new Date(renderedAt);
  const time = at.toLocaleTimeString("en-GB", { hour: "2-digit", minute: "2-digit" });
  return at.toDateString() === now.toDateString() ? time : `${at.toLocaleDateString("en-GB", { day: "numeric", month: "short" })} ${time}`;
}
