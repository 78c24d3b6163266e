// The register as CSV: export columns (a superset of the import columns, so an export can be
// edited and imported into another site) and the import template.
import Papa from "papaparse";
import type { MemberListItem } from "@/db/queries/member-list";

export const EXPORT_COLUMNS = [
  "tag", "status", "check", "utilisation_pct", "capacity_kn", "load_kn", "extension_mm", "end_conditions",
  "type", "zone", "scheme", "spacing_x_mm", "spacing_y_mm", "photos", "updated_at", "notes", "member_id",
] as const;

export const IMPORT_COLUMNS = [
  "tag", "zone", "scheme", "type", "extension_mm", "end_conditions", "load_kn", "load_n", "spacing_x_mm", "spacing_y_mm", "notes",
] as const;

/** A spreadsheet must not run text from the register as a formula (CSV injection). */
function text(v: string | null | undefined): string {
  if (v == null) return "";
  return /^[=+\-@\t\r]/.test(v) ? `'${v}` : v;
}

const round = (v: number, digits: number) => String(Number(v.toFixed(digits)));

function row(m: MemberListItem): string[] {
  return [
    text(m.tag),
    m.status,
    m.pass === true ? "pass" : m.pass === false ? "fail" : "not checked",
    m.utilisation == null ? "" : round(m.utilisation * 100, 1),
    m.capacityN == null ? "" : round(m.capacityN / 1000, 2),
    round(m.loadN / 1000, 3),
    round(m.extensionMm, 1),
    m.endConditions,
    text(m.type.name),
    text(m.zone?.name),
    text(m.scheme?.reference),
    m.spacingXMm == null ? "" : round(m.spacingXMm, 1),
    m.spacingYMm == null ? "" : round(m.spacingYMm, 1),
    String(m.photoCount),
    m.updatedAt,
    text(m.notes),
    m.id,
  ];
}

export function csvHeader(): string {
  return Papa.unparse([EXPORT_COLUMNS as unknown as string[]], { newline: "\r\n" }) + "\r\n";
}

export function csvRows(items: MemberListItem[]): string {
  if (items.length === 0) return "";
  return Papa.unparse(items.map(row), { newline: "\r\n" }) + "\r\n";
}

/** The template: the header and one example row using this site's own names, so it imports as it is. */
export function importTemplate(example: { zone?: string; scheme?: string; type?: string }): string {
  const header = IMPORT_COLUMNS as unknown as string[];
  const row = [
    "EXAMPLE-001", example.zone ?? "", example.scheme ?? "", example.type ?? "", "2750", "pinned-pinned", "12.5", "", "1200", "1200",
    "Example row: replace it with your members (load in kN, or in N in load_n; lengths in mm)",
  ];
  return Papa.unparse([header, row], { newline: "\r\n" }) + "\r\n";
}
