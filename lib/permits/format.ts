// How permits show numbers and times: the site's unit system and time zone, with units always written.
import { formatForce, formatLength } from "@/lib/units";

export type UnitSystem = "si" | "us";

export function fmtForce(n: number | null | undefined, units: UnitSystem): string {
  if (n == null || !Number.isFinite(n)) return "—";
  return units === "us" ? formatForce(n, "kip", 2) : formatForce(n, "kN", 1);
}

export function fmtLength(mm: number | null | undefined, units: UnitSystem): string {
  if (mm == null || !Number.isFinite(mm)) return "—";
  return units === "us" ? formatLength(mm, "in", 1) : formatLength(mm, "mm", 0);
}

export function fmtUtilisation(u: number | null | undefined): string {
  if (u == null || !Number.isFinite(u)) return "—";
  return `${Math.round(u * 100)} %`;
}

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
