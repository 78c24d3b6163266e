// A library member type as calculator inputs: the method and the values the type stores (SI),
// re-expressed in the units the form is using, so a calculation can start from the site's types.
import { findSteelGrade } from "@/lib/engineering/materials";
import { CALCULATOR_DEFAULTS, type CalculatorForm } from "@/lib/validations/calculator";
import { convertFormUnits, type UnitSystem } from "./units-speech";

export type LibraryType = {
  id: string;
  name: string;
  kind: string;
  params: Record<string, unknown>;
  minExtensionMm: number | null;
  maxExtensionMm: number | null;
};

const text = (v: unknown) => (typeof v === "number" && Number.isFinite(v) ? String(Number(v.toPrecision(6))) : "");

function sectionFields(s: unknown): Partial<CalculatorForm> {
  if (!s || typeof s !== "object") return {};
  const x = s as Record<string, unknown>;
  const shape = (["chs", "rhs", "rect", "round", "given"] as const).find((k) => k === x.shape) ?? "chs";
  return { shape, d: text(x.dMm), t: text(x.tMm), b: text(x.bMm), h: text(x.hMm), area: text(x.areaMm2), iMin: text(x.iMinMm4) };
}

/** Calculator values for a library type, or null for a kind the calculator cannot start from. */
export function typeToForm(type: LibraryType, current: CalculatorForm, designCode: "en1993" | "aisc360-lrfd" | "aisc360-asd"): CalculatorForm | null {
  const keep = { length: "", load: "" };
  // Start from the type in SI, keeping the extension and load already typed.
  const base: CalculatorForm = { ...CALCULATOR_DEFAULTS, units: "si" };
  const p = type.params;
  let si: CalculatorForm;
  switch (type.kind) {
    case "en1065-prop":
      si = { ...base, method: "en1065", propClass: (["A", "B", "C", "D", "E"] as const).find((c) => c === p.propClass) ?? "D", maxExtension: text(type.maxExtensionMm), minExtension: text(type.minExtensionMm) };
      break;
    case "supplier-table":
    case "trench-strut": {
      const rows = Array.isArray(p.table) ? (p.table as { lengthMm?: unknown; safeLoadN?: unknown }[]) : [];
      const table = rows
        .filter((r) => typeof r.lengthMm === "number" && typeof r.safeLoadN === "number")
        .map((r) => `${text(r.lengthMm)}, ${text((r.safeLoadN as number) / 1000)}`)
        .join("\n");
      si = { ...base, method: "supplier-table", table };
      break;
    }
    case "steel-section": {
      const grade = typeof p.grade === "string" ? findSteelGrade(p.grade) : undefined;
      const method = grade?.family === "ASTM" || designCode !== "en1993" ? (designCode === "aisc360-asd" ? "aisc360-asd" : "aisc360-lrfd") : "en1993";
      const formed = p.formed === "hot-finished" || p.formed === "cold-formed" ? p.formed : "";
      si = { ...base, ...sectionFields(p.section), method, steelGrade: grade?.id ?? "", formed: method === "en1993" ? formed : "" };
      break;
    }
    case "timber-section": {
      const timberType = (["solid", "round", "glulam", "lvl"] as const).find((t) => t === p.timberType) ?? "";
      si = { ...base, ...sectionFields(p.section), method: "en1995", strengthClass: typeof p.strengthClass === "string" ? p.strengthClass : "", timberType };
      break;
    }
    default:
      return null;
  }
  const out = convertFormUnits(si, "si", current.units as UnitSystem);
  for (const k of Object.keys(keep) as (keyof typeof keep)[]) out[k] = current[k];
  return out;
}
