// A site's permits: list (filter, sort) and request a permit to load or to strike.
import { listPermits } from "@/db/queries/permits";
import { apiHandler, created, readJson } from "@/lib/api";
import { requireApiUser } from "@/lib/auth";
import { assertSitePermission } from "@/lib/authz";
import { fieldErrorsFromZod, ValidationError } from "@/lib/errors";
import { requestPermit } from "@/lib/permits";
import { permitListQuerySchema, permitNumberLabel } from "@/lib/validations/permit";

export const GET = apiHandler<{ siteId: string }>(async (req, { params }) => {
  const user = await requireApiUser();
  const { site } = await assertSitePermission(user, params.siteId, "viewSite");
  const q = permitListQuerySchema.safeParse(Object.fromEntries(new URL(req.url).searchParams));
  if (!q.success) throw new ValidationError(fieldErrorsFromZod(q.error.issues));
  const rows = await listPermits({ siteId: site.id, ...q.data });
  return { permits: rows.map((r) => ({ ...r, numberLabel: permitNumberLabel(r.kind, r.number) })) };
});

export const POST = apiHandler<{ siteId: string }>(async (req, { params }) => {
  const user = await requireApiUser();
  const body = await readJson(req);
  const permit = await requestPermit({ user, siteId: params.siteId, body });
  return created({ permit: { id: permit.id, kind: permit.kind, status: permit.status, requestedAt: permit.requestedAt } });
});
