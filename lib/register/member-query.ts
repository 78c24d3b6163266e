// The register's query string (filters, sort, paging), read the same way by the list, the CSV
// export and the label sheet. A bad value is a 422 naming the parameter.
import "server-only";
import { fieldErrorsFromZod, ValidationError } from "@/lib/errors";
import { memberListQuerySchema, searchParamsToQuery } from "@/lib/validations/member-list";

/** `wholeSet`: the caller wants every matching member, so any page position in the URL is ignored. */
export function parseMemberListRequest(req: Request, { wholeSet = false }: { wholeSet?: boolean } = {}) {
  const query = searchParamsToQuery(new URL(req.url).searchParams);
  if (wholeSet) {
    delete query.cursor;
    delete query.limit;
  }
  const parsed = memberListQuerySchema.safeParse(query);
  if (!parsed.success) throw new ValidationError(fieldErrorsFromZod(parsed.error.issues), "Some query values need attention.");
  const { limit, cursor, sort, dir, ...filters } = parsed.data;
  return { limit, cursor, sort, dir, filters };
}
