// Numbers on the register with their units (SI sites: mm and kN; US sites: ft-in and kip).
import { formatFeetInches, fromN } from "@/lib/units";

export type UnitSystem = "si" | "us";

const nf = (digits: number) => new Intl.NumberFormat("en-GB", { minimumFractionDigits: digits, maximumFractionDigits: digits });
const n0 = nf(0);
const n1 = nf(1);

export function formatUtilisation(u: number | null): string {
  return u === null ? "—" : `${n0.format(u * 100)} %`;
}

export function formatForceShort(n: number | null, units: UnitSystem): string {
  if (n === null) return "—";
  return units === "us" ? `${n1.format(fromN(n, "kip"))} kip` : `${n1.format(n / 1000)} kN`;
}

export function formatExtension(mm: number, units: UnitSystem): string {
  return units === "us" ? formatFeetInches(mm) : `${n0.format(mm)} mm`;
}

export function formatUpdated(iso: string): string {
  const d = new Date(iso);
  return d.toLocaleString("en-GB", { day: "numeric", month: "short", hour: "2-digit", minute: "2-digit" });
}
