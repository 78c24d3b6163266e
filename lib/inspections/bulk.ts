// "All satisfactory" for members chosen in the register: each member gets its own passing
// inspection through recordInspection (audit, due dates, alerts exactly as for one), all in one
// transaction — every member is recorded, or none is, with the reason for each member that
// cannot be. The route (on the seam) has found the site and checked the `inspect` permission.
import "server-only";
import { transaction } from "@/db";
import { listSiteMembersForInspection } from "@/db/queries/inspections";
import type { SessionUser } from "@/lib/auth";
import { AppError, ValidationError, type FieldErrors } from "@/lib/errors";
import type { BulkInspectionInput } from "@/lib/validations/inspection";
import { INSPECTION_CHECKS } from "./checklist";
import { recordInspection } from "./record";

type MemberStatus = Awaited<ReturnType<typeof listSiteMembersForInspection>>[number]["status"];

/** Why a member in this state cannot be recorded satisfactory from the register (null: it can). */
function refusal(tag: string, status: MemberStatus): string | null {
  switch (status) {
    case "draft":
      return `${tag} is a draft, not installed yet: submit it once it is installed, then inspect it.`;
    case "struck":
      return `${tag} has been struck (removed); there is nothing to inspect.`;
    case "out_of_service":
      // Safety: a member out of service returns to service only after someone has looked at it on its own checklist.
      return `${tag} is out of service: re-inspect it on its own checklist; a bulk satisfactory record cannot return it to service.`;
    default:
      return null;
  }
}

export async function recordBulkSatisfactory({ user, site, input, now = new Date() }: { user: SessionUser; site: { id: string }; input: BulkInspectionInput; now?: Date }) {
  const items = INSPECTION_CHECKS.map((c) => ({ check: c.key, result: "pass" as const }));
  return transaction(async (tx) => {
    const found = new Map((await listSiteMembersForInspection({ siteId: site.id, memberIds: input.memberIds }, tx)).map((m) => [m.id, m]));
    // Not on this site (another site's, another organisation's, or no such member): 404, saying which, revealing nothing.
    const missing: FieldErrors = {};
    input.memberIds.forEach((id, i) => {
      if (!found.has(id)) missing[`memberIds.${i}`] = "No member with this id is on this site.";
    });
    const nMissing = Object.keys(missing).length;
    if (nMissing)
      throw new AppError(404, "not_found", `${nMissing} of the chosen members ${nMissing === 1 ? "was" : "were"} not found on this site; nothing was recorded.`, missing);

    const refused: FieldErrors = {};
    input.memberIds.forEach((id, i) => {
      const m = found.get(id)!;
      const why = refusal(m.tag, m.status);
      if (why) refused[`memberIds.${i}`] = why;
    });
    const nRefused = Object.keys(refused).length;
    if (nRefused)
      throw new ValidationError(refused, `${nRefused} of the chosen members cannot be recorded as satisfactory; nothing was recorded.`);

    // One inspection each, in id order (the order every multi-member write locks in, so none deadlock).
    const results = [];
    for (const id of [...input.memberIds].sort()) {
      const r = await recordInspection({ user, member: { id }, input: { result: "pass", items, notes: input.notes, clientId: input.clientId }, now, tx });
      results.push({
        memberId: id,
        tag: r.member.tag,
        status: r.member.status,
        inspectionId: r.inspection.id,
        nextDueAt: r.inspection.nextDueAt,
        replayed: r.replayed,
      });
    }
    results.sort((a, b) => a.tag.localeCompare(b.tag));
    return { recorded: results.filter((r) => !r.replayed).length, items: results };
  });
}
