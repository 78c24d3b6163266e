// The register's query string (filters, sort, paging), read the same way by the list, the CSV
// export and the label sheet. A bad value is a 422 naming the parameter.
import "server-only";
import { z } from "zod";
import { fieldErrorsFromZod, ValidationError } from "@/lib/errors";
import { memberListQuerySchema, searchParamsToQuery } from "@/lib/validations/member-list";

/**
 * A query parser for the seam (`siteRoute({ query: memberListQuery() })`). `wholeSet`: the caller
 * wants every matching member, so any page position in the URL is ignored. `extra`: a route's own
 * parameters beside the register's (the label sheet's `start`), refused in the same 422.
 */
export function memberListQuery<E extends z.ZodRawShape = Record<never, never>>({ wholeSet = false, extra }: { wholeSet?: boolean; extra?: E } = {}) {
  const extraSchema = z.object(extra ?? ({} as E));
  return (raw: unknown) => {
    const params = raw as Record<string, string | string[] | undefined>;
    const query = searchParamsToQuery(params);
    if (wholeSet) {
      delete query.cursor;
      delete query.limit;
    }
    const own = Object.fromEntries(
      Object.keys(extra ?? {}).map((k) => {
        const v = Array.isArray(params[k]) ? params[k][0] : params[k];
        return [k, v === undefined || v.trim() === "" ? undefined : v];
      }),
    );
    const parsed = memberListQuerySchema.safeParse(query);
    const more = extraSchema.safeParse(own);
    if (!parsed.success || !more.success)
      throw new ValidationError(
        { ...(more.success ? {} : fieldErrorsFromZod(more.error.issues)), ...(parsed.success ? {} : fieldErrorsFromZod(parsed.error.issues)) },
        "Some query values need attention.",
      );
    const { limit, cursor, sort, dir, ...filters } = parsed.data;
    return { limit, cursor, sort, dir, filters, ...more.data };
  };
}
