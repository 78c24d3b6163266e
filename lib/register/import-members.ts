// CSV import of members: every row is logged through createMember in ONE transaction. Every
// problem in every row is collected (row, field, reason); if there is any, nothing is stored.
import "server-only";
import Papa from "papaparse";
import { transaction } from "@/db";
import { getRegisterFilterOptions } from "@/db/queries/member-list";
import type { SessionUser } from "@/db/queries/users";
import { AppError, fieldErrorsFromZod, ValidationError } from "@/lib/errors";
import { parseForce, parseLength } from "@/lib/units";
import { memberCreateSchema } from "@/lib/validations/member";
import { createMember, type SiteForCheck } from "./members";
import { EXPORT_COLUMNS, IMPORT_COLUMNS } from "./members-csv";

export const MAX_IMPORT_ROWS = 2000;
export const MAX_IMPORT_BYTES = 2 * 1024 * 1024;

/** Row numbers are the file's line numbers as a spreadsheet shows them: the header is row 1. */
export type ImportProblem = { row: number; field: string; reason: string };

export class ImportRejectedError extends AppError {
  constructor(readonly rows: ImportProblem[], message: string) {
    super(422, "import_rejected", message);
  }
}

export type ImportResult = {
  created: number;
  failing: number;
  members: { id: string; tag: string; pass: boolean; utilisation: number | null }[];
};

/** Export-only columns are ignored, so a file exported from one site can be imported into another. */
const IGNORED_COLUMNS = new Set<string>(EXPORT_COLUMNS.filter((c) => !(IMPORT_COLUMNS as readonly string[]).includes(c)));
const KNOWN_COLUMNS = new Set<string>([...IMPORT_COLUMNS, ...IGNORED_COLUMNS]);

/** createMember's field names → the CSV column a person fixes. */
function columnFor(field: string, loadColumn: string): string {
  const root = field.split(".")[0]!;
  const map: Record<string, string> = {
    tag: "tag",
    zoneId: "zone",
    schemeId: "scheme",
    memberTypeId: "type",
    extensionMm: "extension_mm",
    endConditions: "end_conditions",
    loadN: loadColumn,
    loadSource: loadColumn,
    spacingXMm: "spacing_x_mm",
    spacingYMm: "spacing_y_mm",
    notes: "notes",
    _: "row",
  };
  return map[root] ?? root;
}

const key = (s: string) => s.trim().toLowerCase();

function rejection(rows: ImportProblem[]) {
  const n = new Set(rows.map((r) => r.row)).size;
  return new ImportRejectedError(
    rows,
    `Nothing was imported: ${rows.length} problem${rows.length === 1 ? "" : "s"} in ${n} row${n === 1 ? "" : "s"}. Fix them in the file and import it again.`,
  );
}

/**
 * The route (on the seam) has found the site and checked `importMembers`; every role allowed to
 * import is also allowed to log members (lib/permissions.ts), so each row is logged as that person.
 */
export async function importMembers({ user, site, csv }: { user: SessionUser; site: SiteForCheck; csv: string }): Promise<ImportResult> {
  if (csv.trim() === "") throw new ValidationError({ file: "The file is empty; use the template and add one member per row." });

  const parsed = Papa.parse<Record<string, string>>(csv, {
    header: true,
    skipEmptyLines: "greedy",
    transformHeader: (h) => key(h.replace(/^\uFEFF/, "")),
  });
  const problems: ImportProblem[] = [];
  const headers = (parsed.meta.fields ?? []).filter((h) => h !== "");
  for (const h of headers)
    if (!KNOWN_COLUMNS.has(h))
      problems.push({ row: 1, field: h, reason: `Unknown column "${h}". The columns are: ${IMPORT_COLUMNS.join(", ")}.` });
  for (const required of ["tag", "type", "extension_mm"])
    if (!headers.includes(required)) problems.push({ row: 1, field: required, reason: `The file has no ${required} column; the first row must name the columns (download the template).` });
  if (!headers.includes("load_kn") && !headers.includes("load_n") && !(headers.includes("spacing_x_mm") && headers.includes("spacing_y_mm")))
    problems.push({ row: 1, field: "load_kn", reason: "The file has no load_kn (or load_n) column, and no spacing_x_mm and spacing_y_mm to derive the load from a scheme's slab." });
  if (problems.length) throw rejection(problems);

  // Papa counts data rows from 0; a row's line in the file is that + 2 (for the header), unless
  // a quoted cell spans lines, which the row number then follows from the parser's own index.
  const rows = parsed.data;
  if (rows.length === 0) throw new ValidationError({ file: "The file has a header but no members; add one member per row under it." });
  if (rows.length > MAX_IMPORT_ROWS)
    throw new ValidationError({ file: `The file has ${rows.length} members; import at most ${MAX_IMPORT_ROWS} at a time (split the file).` });
  for (const e of parsed.errors) {
    const row = (e.row ?? 0) + 2;
    problems.push({ row, field: "row", reason: e.code === "TooManyFields" || e.code === "TooFewFields" ? `${e.message}; check for a stray comma or a missing cell.` : e.message });
  }

  const options = await getRegisterFilterOptions({ siteId: site.id, organisationId: site.organisationId });
  const zones = new Map(options.zones.map((z) => [key(z.name), z.id]));
  const schemes = new Map(options.schemes.map((s) => [key(s.reference), s.id]));
  const types = new Map(options.types.map((t) => [key(t.name), t.id]));
  const list = (names: string[]) => (names.length > 6 ? `${names.slice(0, 6).join("; ")}; …` : names.join("; "));

  const inputs: { row: number; loadColumn: string; reported: Set<string>; input: Record<string, unknown> }[] = [];
  const seenTags = new Map<string, number>();
  rows.forEach((r, i) => {
    const row = i + 2;
    const cell = (c: string) => (r[c] ?? "").trim();
    const rowProblems: ImportProblem[] = [];
    const add = (field: string, reason: string) => rowProblems.push({ row, field, reason });

    const tag = cell("tag");
    if (tag) {
      const earlier = seenTags.get(key(tag));
      if (earlier) add("tag", `${tag} is also on row ${earlier} of this file; each member needs its own tag.`);
      else seenTags.set(key(tag), row);
    }
    let zoneId: string | null = null;
    if (cell("zone")) {
      zoneId = zones.get(key(cell("zone"))) ?? null;
      if (!zoneId) add("zone", `No zone on this site is called "${cell("zone")}". Zones here: ${list(options.zones.map((z) => z.name)) || "none yet"}.`);
    }
    let schemeId: string | null = null;
    if (cell("scheme")) {
      schemeId = schemes.get(key(cell("scheme"))) ?? null;
      if (!schemeId) add("scheme", `No scheme on this site has the reference "${cell("scheme")}". Schemes here: ${list(options.schemes.map((s) => s.reference)) || "none yet"}.`);
    }
    let memberTypeId: string | undefined;
    if (!cell("type")) add("type", "Enter the member type's name as it is in the library.");
    else {
      memberTypeId = types.get(key(cell("type")));
      if (!memberTypeId) add("type", `No member type in your library is called "${cell("type")}". Types: ${list(options.types.map((t) => t.name))}.`);
    }
    const length = (column: string, required: boolean): number | null | undefined => {
      const v = cell(column);
      if (!v) {
        if (required) add(column, `Enter the ${column.replace(/_/g, " ")} (a number in millimetres).`);
        return undefined;
      }
      const p = parseLength(v, "mm");
      if (!p.ok) {
        add(column, p.message);
        return undefined;
      }
      return p.value;
    };
    const extensionMm = length("extension_mm", true);
    const spacingXMm = length("spacing_x_mm", false);
    const spacingYMm = length("spacing_y_mm", false);

    let loadN: number | undefined;
    let loadColumn = headers.includes("load_kn") ? "load_kn" : "load_n";
    const kn = cell("load_kn");
    const n = cell("load_n");
    if (kn && n) add("load_kn", "Give the load in load_kn or in load_n, not both.");
    else if (kn || n) {
      loadColumn = kn ? "load_kn" : "load_n";
      const p = parseForce(kn || n, kn ? "kN" : "N");
      if (!p.ok) add(loadColumn, p.message);
      else loadN = p.value;
    }
    // No load but both spacings: the load comes from the scheme's slab (the engine's method).
    const fromSlab = loadN === undefined && !rowProblems.some((p) => p.field === loadColumn) && spacingXMm != null && spacingYMm != null;

    // A row with problems still goes through the member checks below, so the report names every
    // problem in it at once (the ones already found here are not repeated).
    problems.push(...rowProblems);
    inputs.push({
      row,
      loadColumn,
      reported: new Set(rowProblems.map((p) => p.field)),
      input: {
        tag,
        zoneId,
        schemeId,
        memberTypeId,
        extensionMm,
        ...(cell("end_conditions") ? { endConditions: cell("end_conditions") } : {}),
        loadSource: fromSlab ? "slab" : "direct",
        ...(loadN !== undefined ? { loadN } : {}),
        spacingXMm: spacingXMm ?? null,
        spacingYMm: spacingYMm ?? null,
        notes: cell("notes") || null,
      },
    });
  });

  // Rows that read well still go through the same use case as the phone form, each in a savepoint
  // so one refusal does not stop the others from being checked; then all or nothing is kept.
  class Rollback extends Error {}
  try {
    return await transaction(async (tx) => {
      const created: ImportResult["members"] = [];
      for (const { row, loadColumn, reported, input } of inputs) {
        try {
          const out = await tx.transaction((sp) => {
            // The same schema the API's body goes through, so a row is refused with the same fields.
            const parsed = memberCreateSchema.safeParse(input);
            if (!parsed.success) throw new ValidationError(fieldErrorsFromZod(parsed.error.issues));
            return createMember({ user, site, input: parsed.data, tx: sp, source: "import" });
          });
          created.push({ id: out.member.id, tag: out.member.tag, pass: out.check.pass, utilisation: out.check.utilisation });
        } catch (e) {
          if (!(e instanceof ValidationError)) throw e;
          for (const [field, reason] of Object.entries(e.fields ?? { _: e.message })) {
            const column = columnFor(field, loadColumn);
            if (!reported.has(column)) problems.push({ row, field: column, reason });
            reported.add(column);
          }
        }
      }
      if (problems.length) throw new Rollback("import rejected");
      return { created: created.length, failing: created.filter((m) => !m.pass).length, members: created };
    });
  } catch (e) {
    if (e instanceof Rollback) throw rejection(problems.sort((a, b) => a.row - b.row));
    throw e;
  }
}
