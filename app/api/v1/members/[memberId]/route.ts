import { listChecks } from "@/db/queries/checks";
import { listPhotos } from "@/db/queries/photos";
import { apiHandler, readJson } from "@/lib/api";
import { requireApiUser } from "@/lib/auth";
import { photoView } from "@/lib/photos";
import { checkView, loadMemberForUser, updateMember } from "@/lib/register/members";

/** The member, its latest check and its photos (thumbnail and display URLs). */
export const GET = apiHandler<{ memberId: string }>(async (_req, { params }) => {
  const user = await requireApiUser();
  const { member } = await loadMemberForUser(user, params.memberId);
  const [checks, photos] = await Promise.all([listChecks({ memberId: member.id }), listPhotos({ memberId: member.id })]);
  const latest = checks.find((c) => c.id === member.latestCheckId) ?? checks[0];
  return {
    member,
    check: latest ? checkView(latest) : null,
    checks: checks.map((c) => ({ ...checkView(c), reason: c.reason, createdByName: c.createdByName })),
    photos: await Promise.all(photos.map((p) => photoView({ ...p, status: "ready", memberId: member.id, rejectReason: null }))),
  };
});

/** Edits a member; a change to extension, load, spacing, end conditions, type or scheme re-checks it. */
export const PATCH = apiHandler<{ memberId: string }>(async (req, { params }) => {
  const user = await requireApiUser();
  const input = await readJson(req);
  return updateMember({ user, memberId: params.memberId, input });
});
