// GET /api/v1/sites/{siteId}/members — the register list (filters, sort, keyset paging).
import "server-only";
import { listMembers } from "@/db/queries/member-list";
import { apiHandler } from "@/lib/api";
import { requireApiUser } from "@/lib/auth";
import { assertSitePermission } from "@/lib/authz";
import { fieldErrorsFromZod, ValidationError } from "@/lib/errors";
import { memberListQuerySchema, searchParamsToQuery } from "@/lib/validations/member-list";

export const GET = apiHandler<{ siteId: string }>(async (req, { params }) => {
  const user = await requireApiUser();
  await assertSitePermission(user, params.siteId, "viewSite");
  const parsed = memberListQuerySchema.safeParse(searchParamsToQuery(new URL(req.url).searchParams));
  if (!parsed.success) throw new ValidationError(fieldErrorsFromZod(parsed.error.issues), "Some query values need attention.");
  const { limit, cursor, sort, dir, ...filters } = parsed.data;
  return listMembers({ siteId: params.siteId, filters, sort, dir, limit, cursor });
});
