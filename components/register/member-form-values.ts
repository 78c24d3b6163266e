// The member form's text fields and their conversion to the API's SI input (mm, N). US sites
// type feet-and-inches and kips; others type mm and kN. The same zod schema then checks the result.
import { parseForce, parseLength, formatFeetInches, fromN, type ForceUnit, type LengthUnit } from "@/lib/units";

export type UnitSystem = "si" | "us";

export type MemberFormValues = {
  tag: string;
  zoneId: string;
  schemeId: string;
  memberTypeId: string;
  extension: string;
  endConditions: string;
  loadSource: "direct" | "slab" | "backprop";
  load: string;
  /** Level of props for a load from back-propping ("1" = right under the slab being cast), or "". */
  level: string;
  spacingX: string;
  spacingY: string;
  notes: string;
  submit: boolean;
};

export const EMPTY_MEMBER_FORM: MemberFormValues = {
  tag: "", zoneId: "", schemeId: "", memberTypeId: "", extension: "", endConditions: "pinned-pinned", loadSource: "direct", load: "", level: "", spacingX: "", spacingY: "", notes: "", submit: false,
};

export function units(system: UnitSystem): { length: LengthUnit; force: ForceUnit; lengthHint: string; forceHint: string } {
  return system === "us"
    ? { length: "in", force: "kip", lengthHint: `feet and inches, e.g. 9' 6" (a bare number is inches)`, forceHint: "kips, e.g. 5.2 (or type 2400 lbf)" }
    : { length: "mm", force: "kN", lengthHint: "millimetres, e.g. 2650 (or type 2.65 m)", forceHint: "kN, e.g. 12.5" };
}

/** API field → form field, for mapping server and schema errors back onto the inputs. */
export const FIELD_OF: Record<string, keyof MemberFormValues> = {
  extensionMm: "extension", loadN: "load", spacingXMm: "spacingX", spacingYMm: "spacingY",
};

/** Converts the text fields; parse errors come back keyed by form field. */
export function toMemberInput(v: MemberFormValues, system: UnitSystem): { input: Record<string, unknown>; errors: Partial<Record<keyof MemberFormValues, string>> } {
  const u = units(system);
  const errors: Partial<Record<keyof MemberFormValues, string>> = {};
  const len = (text: string, field: keyof MemberFormValues, what: string): number | undefined => {
    if (!text.trim()) return undefined;
    const r = parseLength(text, u.length);
    if (!r.ok) errors[field] = `${what}: ${r.message}`;
    return r.ok ? r.value : undefined;
  };
  const extensionMm = len(v.extension, "extension", "Extension");
  const spacingXMm = len(v.spacingX, "spacingX", "Spacing X");
  const spacingYMm = len(v.spacingY, "spacingY", "Spacing Y");
  let loadN: number | undefined;
  if (v.loadSource === "direct" && v.load.trim()) {
    const r = parseForce(v.load, u.force);
    if (!r.ok) errors.load = `Load: ${r.message}`;
    else loadN = r.value;
  }
  const input: Record<string, unknown> = {
    tag: v.tag,
    zoneId: v.zoneId || null,
    schemeId: v.schemeId || null,
    memberTypeId: v.memberTypeId || undefined,
    extensionMm,
    endConditions: v.endConditions,
    loadSource: v.loadSource,
    notes: v.notes.trim() ? v.notes : null,
  };
  if (v.loadSource === "direct") input.loadN = loadN;
  else {
    input.spacingXMm = spacingXMm ?? null;
    input.spacingYMm = spacingYMm ?? null;
  }
  if (v.loadSource === "backprop") input.level = v.level ? Number(v.level) : null;
  if (v.loadSource === "direct" && (spacingXMm || spacingYMm)) {
    input.spacingXMm = spacingXMm ?? null;
    input.spacingYMm = spacingYMm ?? null;
  }
  return { input, errors };
}

export function lengthText(mm: number | null | undefined, system: UnitSystem) {
  if (mm == null) return "";
  return system === "us" ? formatFeetInches(mm) : String(Math.round(mm * 10) / 10);
}

export function forceText(n: number | null | undefined, system: UnitSystem) {
  if (n == null) return "";
  const v = fromN(n, system === "us" ? "kip" : "kN");
  return String(Math.round(v * 1000) / 1000);
}
