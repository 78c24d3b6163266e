// How permits show numbers and times: the site's unit system and time zone, with units always written.
import { formatForceFor, formatLengthFor, formatUtilisation, type UnitSystem } from "@/lib/client/format";

export type { UnitSystem };

// Figures are written by the one client kit formatter (lib/client/format.ts).
export const fmtForce = formatForceFor;
export const fmtLength = formatLengthFor;
export const fmtUtilisation = formatUtilisation;

export function fmtDateTime(d: Date | string | null | undefined, timeZone: string, units: UnitSystem = "si"): string {
  if (!d) return "—";
  const date = typeof d === "string" ? new Date(d) : d;
  if (Number.isNaN(date.getTime())) return "—";
  return new Intl.DateTimeFormat(units === "us" ? "en-US" : "en-GB", {
    timeZone,
    day: "numeric",
    month: "short",
    year: "numeric",
    hour: "2-digit",
    minute: "2-digit",
    timeZoneName: "short",
  }).format(date);
}

export function fmtDate(d: Date | string | null | undefined, timeZone: string, units: UnitSystem = "si"): string {
  if (!d) return "—";
  const date = typeof d === "string" ? new Date(d) : d;
  if (Number.isNaN(date.getTime())) return "—";
  return new Intl.DateTimeFormat(units === "us" ? "en-US" : "en-GB", { timeZone, day: "numeric", month: "short", year: "numeric" }).format(date);
}
