import { apiHandler, readJson } from "@/lib/api";
import { requireApiUser } from "@/lib/auth";
import { deleteMemberType, updateMemberType } from "@/lib/register/member-types";

/** Saves a changed type as a new revision and re-checks every member using it. */
export const PATCH = apiHandler<{ siteId: string; typeId: string }>(async (req, { params }) => {
  const user = await requireApiUser();
  const input = await readJson(req);
  return updateMemberType({ user, siteId: params.siteId, memberTypeId: params.typeId, input });
});

/** Refused with 409 while any member uses the type. */
export const DELETE = apiHandler<{ siteId: string; typeId: string }>(async (_req, { params }) => {
  const user = await requireApiUser();
  return deleteMemberType({ user, siteId: params.siteId, memberTypeId: params.typeId });
});
