import { getMemberSiteForUser, listInspections } from "@/db/queries/inspections";
import { apiHandler, created, readJson } from "@/lib/api";
import { requireApiUser } from "@/lib/auth";
import { assertSitePermission, isUuid } from "@/lib/authz";
import { fieldErrorsFromZod, NotFoundError, ValidationError } from "@/lib/errors";
import { recordInspection } from "@/lib/inspections/record";
import { inspectionSchema } from "@/lib/validations/inspection";

async function loadMember(memberId: string, organisationId: string) {
  if (!isUuid(memberId)) throw new NotFoundError("That member");
  const member = await getMemberSiteForUser({ memberId, organisationId });
  if (!member) throw new NotFoundError("That member");
  return member;
}

/** A member's inspection history, newest first. */
export const GET = apiHandler<{ memberId: string }>(async (_req, { params }) => {
  const user = await requireApiUser();
  const member = await loadMember(params.memberId, user.organisationId);
  await assertSitePermission(user, member.siteId, "viewSite");
  const items = await listInspections({ memberId: member.id });
  return { member: { id: member.id, tag: member.tag, status: member.status }, items };
});

/** Records an inspection; a failed one takes the member out of service and out of its permits. */
export const POST = apiHandler<{ memberId: string }>(async (req, { params }) => {
  const user = await requireApiUser();
  const member = await loadMember(params.memberId, user.organisationId);
  await assertSitePermission(user, member.siteId, "inspect");
  const parsed = inspectionSchema.safeParse(await readJson(req));
  if (!parsed.success) throw new ValidationError(fieldErrorsFromZod(parsed.error.issues));
  const out = await recordInspection({ user, memberId: member.id, input: parsed.data });
  return created(out);
});
