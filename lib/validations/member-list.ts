// The register's query (filters, sort, paging): parsed by the API and by the register page for URL state.
import { z } from "zod";

export const MEMBER_STATUSES = ["draft", "submitted", "loaded", "struck", "out_of_service"] as const;
export const MEMBER_SORTS = ["tag", "utilisation", "extension", "status", "updated"] as const;
export type MemberSort = (typeof MEMBER_SORTS)[number];
export type SortDir = "asc" | "desc";

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

const uuidParam = (what: string) =>
  z
    .string()
    .trim()
    .regex(UUID, `${what} must be an id from this site's ${what.toLowerCase()} list.`)
    .optional();

const ratio = (what: string) =>
  z
    .string()
    .trim()
    .regex(/^(?:\d+(?:\.\d*)?|\.\d+)$/, `${what} must be a number of 0 or more (a ratio: 1 means 100 %).`)
    .transform(Number)
    .pipe(z.number().min(0).max(100, `${what} must be 100 or less (a ratio: 1 means 100 %).`))
    .optional();

/** Filters only: shared by the list, the CSV export and the label sheet. */
export const memberFilterShape = {
  status: z.enum(MEMBER_STATUSES, { error: `Status must be one of ${MEMBER_STATUSES.join(", ")}.` }).optional(),
  zoneId: uuidParam("Zone"),
  schemeId: uuidParam("Scheme"),
  typeId: uuidParam("Type"),
  pass: z.enum(["true", "false"], { error: "Pass must be true (passing) or false (failing)." }).optional(),
  utilMin: ratio("Minimum utilisation"),
  utilMax: ratio("Maximum utilisation"),
  q: z.string().trim().max(60, "Search text must be 60 characters or fewer.").optional(),
};

const refineRange = <T extends { utilMin?: number; utilMax?: number }>(v: T, ctx: z.RefinementCtx) => {
  if (v.utilMin !== undefined && v.utilMax !== undefined && v.utilMin > v.utilMax)
    ctx.addIssue({ code: "custom", path: ["utilMax"], message: "Maximum utilisation must not be below the minimum." });
};

export const memberFilterSchema = z.object(memberFilterShape).superRefine(refineRange);

export const memberListQuerySchema = z
  .object({
    ...memberFilterShape,
    limit: z
      .string()
      .trim()
      .regex(/^\d+$/, "Limit must be a whole number from 1 to 200.")
      .transform(Number)
      .pipe(z.number().int().min(1, "Limit must be a whole number from 1 to 200.").max(200, "Limit must be a whole number from 1 to 200."))
      .default(50),
    cursor: z.string().trim().max(500, "That cursor is not one this API gave out.").optional(),
    sort: z.enum(MEMBER_SORTS, { error: `Sort must be one of ${MEMBER_SORTS.join(", ")}.` }).default("tag"),
    dir: z.enum(["asc", "desc"], { error: "Dir must be asc or desc." }).default("asc"),
  })
  .superRefine(refineRange);

export type MemberFilters = z.infer<typeof memberFilterSchema>;
export type MemberListQuery = z.infer<typeof memberListQuerySchema>;

/** Every key the query understands (anything else in a URL is ignored, never an error). */
export const MEMBER_QUERY_KEYS = ["status", "zoneId", "schemeId", "typeId", "pass", "utilMin", "utilMax", "q", "limit", "cursor", "sort", "dir"] as const;

/** URLSearchParams → plain object of the known keys, dropping empty values ("" means "no filter"). */
export function searchParamsToQuery(params: URLSearchParams | Record<string, string | string[] | undefined>): Record<string, string> {
  const out: Record<string, string> = {};
  const get = (k: string): string | undefined => {
    if (params instanceof URLSearchParams) return params.get(k) ?? undefined;
    const v = params[k];
    return Array.isArray(v) ? v[0] : v;
  };
  for (const k of MEMBER_QUERY_KEYS) {
    const v = get(k);
    if (v !== undefined && v.trim() !== "") out[k] = v;
  }
  return out;
}
