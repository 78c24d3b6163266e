// The register's query string (filters, sort, paging), read the same way by the list, the CSV
// export and the label sheet. A bad value is a 422 naming the parameter.
import "server-only";
import { fieldErrorsFromZod, ValidationError } from "@/lib/errors";
import { memberListQuerySchema, searchParamsToQuery } from "@/lib/validations/member-list";

/**
 * A query parser for the seam (`siteRoute({ query: memberListQuery() })`). `wholeSet`: the caller
 * wants every matching member, so any page position in the URL is ignored.
 */
export function memberListQuery({ wholeSet = false }: { wholeSet?: boolean } = {}) {
  return (raw: unknown) => {
    const query = searchParamsToQuery(raw as Record<string, string | string[] | undefined>);
    if (wholeSet) {
      delete query.cursor;
      delete query.limit;
    }
    const parsed = memberListQuerySchema.safeParse(query);
    if (!parsed.success) throw new ValidationError(fieldErrorsFromZod(parsed.error.issues), "Some query values need attention.");
    const { limit, cursor, sort, dir, ...filters } = parsed.data;
    return { limit, cursor, sort, dir, filters };
  };
}
