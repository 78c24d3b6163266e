// Which columns the desk table shows. Tag, status, check, utilisation and extension always show
// (what a coordinator reads first); the rest can be chosen, and the choice is kept in the address
// (?cols=zone,load,capacity) like the filters. The default set fits a 1366 px desk without
// scrolling sideways.
export const OPTIONAL_COLUMNS = [
  { id: "load", label: "Load" },
  { id: "capacity", label: "Capacity" },
  { id: "type", label: "Type" },
  { id: "zone", label: "Zone" },
  { id: "scheme", label: "Scheme" },
  { id: "photos", label: "Photos" },
  { id: "updated", label: "Updated" },
] as const;

export type OptionalColumn = (typeof OPTIONAL_COLUMNS)[number]["id"];

export const DEFAULT_COLUMNS: readonly OptionalColumn[] = ["load", "capacity", "type", "zone", "updated"];

const IDS = new Set<string>(OPTIONAL_COLUMNS.map((c) => c.id));

/** The address's `cols` → the optional columns shown; absent means the default set, "none" means none. */
export function parseColumns(cols: string | null | undefined): OptionalColumn[] {
  if (cols == null || cols.trim() === "") return [...DEFAULT_COLUMNS];
  if (cols === "none") return [];
  const wanted = new Set(cols.split(",").map((c) => c.trim()));
  // Unknown names in a shared link are ignored, never an error; the order is always the table's.
  return OPTIONAL_COLUMNS.map((c) => c.id).filter((id) => wanted.has(id) && IDS.has(id));
}

/** The optional columns shown → the `cols` value (undefined for the default, so plain links stay plain). */
export function columnsParam(shown: readonly OptionalColumn[]): string | undefined {
  const ordered = OPTIONAL_COLUMNS.map((c) => c.id).filter((id) => shown.includes(id));
  if (ordered.length === DEFAULT_COLUMNS.length && ordered.every((id) => DEFAULT_COLUMNS.includes(id))) return undefined;
  return ordered.length ? ordered.join(",") : "none";
}
