// Recording an inspection. A failed one takes the member out of service, removes it from every
// issued permit that covers it, tells those permits' recipients and raises a "failed inspection"
// alert — all in one transaction, so none of it happens without the rest. The route (on the seam
// in lib/api/route.ts) has found the member and checked the `inspect` permission.
import "server-only";
import { transaction } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import {
  attachInspectionPhotos, findPhotosForInspection, getInspectionByClientId, getLatestInspection, insertInspection, lockMemberForInspection,
  setMemberStatusForInspection,
} from "@/db/queries/inspections";
import { removeMemberFromIssuedPermits } from "@/db/queries/permits";
import { enqueueEmails } from "@/db/queries/outbox";
import { renderPermitMemberRemoved } from "@/emails/alert-permit-member-removed";
import { formatDateTime } from "@/lib/format-date";
import { permitLabel } from "@/lib/alerts/format";
import { raiseAlerts } from "@/lib/alerts/raise";
import { closeLoadPermitsLeftEmpty } from "@/lib/permits/auto-close";
import type { SessionUser } from "@/lib/auth";
import { env } from "@/lib/env";
import { ConflictError, NotFoundError, ValidationError } from "@/lib/errors";
import type { InspectionInput } from "@/lib/validations/inspection";
import { checkLabel } from "./checklist";
import { nextDueFrom } from "./due";

/**
 * With a `clientId` this member already has an inspection for (a request retried after a lost
 * answer, or sent twice at once): the inspection recorded the first time, `replayed: true`, and
 * nothing new. The member row lock serialises twins, so the second always sees the first.
 */
export async function recordInspection(args: { user: SessionUser; member: { id: string }; input: InspectionInput; now?: Date }) {
  const { user, input, now = new Date() } = args;
  const memberId = args.member.id;
  return transaction(async (tx) => {
    // Locked so two inspections cannot interleave; gone only if deleted since the route found it.
    const member = await lockMemberForInspection({ memberId }, tx);
    if (!member) throw new NotFoundError("That member");
    if (member.status === "struck")
      throw new ConflictError("This member has been struck (removed); there is nothing to inspect. Log it again if it is back in use.");
    if (input.clientId) {
      const first = await getInspectionByClientId({ memberId, clientId: input.clientId }, tx);
      if (first) {
        const { inspectorName, ...rest } = first;
        return {
          replayed: true as const,
          inspection: { ...rest, inspectorName: inspectorName ?? user.name },
          member: { id: memberId, tag: member.tag, status: member.status },
          removedFromPermits: [] as { id: string; label: string }[],
        };
      }
    }

    const photoIds = input.photoIds ?? [];
    if (photoIds.length) {
      const found = await findPhotosForInspection({ siteId: member.siteId, memberId, photoIds }, tx);
      const missing = photoIds.filter((id) => !found.some((f) => f.id === id));
      if (missing.length) throw new ValidationError({ photoIds: `Photo ${missing[0]} was not found for this member, or belongs to another inspection.` });
      const rejected = found.find((f) => f.status === "rejected");
      if (rejected) throw new ValidationError({ photoIds: `Photo ${rejected.id} was rejected (not a usable image); take it again.` });
    }

    const previous = await getLatestInspection({ memberId }, tx);
    const items = (input.items ?? []).map((i) => ({ check: i.check, result: i.result, ...(i.note ? { note: i.note } : {}) }));
    const inspection = await insertInspection(
      {
        siteId: member.siteId,
        memberId,
        inspectorId: user.id,
        result: input.result,
        items,
        notes: input.notes || null,
        inspectedAt: now,
        nextDueAt: input.result === "pass" ? nextDueFrom(now, member.inspectionIntervalDays) : null,
        clientId: input.clientId ?? null,
      },
      tx,
    );
    await attachInspectionPhotos({ memberId, inspectionId: inspection.id, photoIds }, tx);
    const audit = { organisationId: member.organisationId, siteId: member.siteId, actorId: user.id };
    await recordAudit(
      { ...audit, action: "inspection.recorded", entityType: "inspection", entityId: inspection.id, after: { memberId, tag: member.tag, result: input.result, items, notes: input.notes ?? null, photoIds } },
      tx,
    );

    let status = member.status;
    const removedFromPermits: { id: string; label: string }[] = [];
    if (input.result === "fail") {
      if (member.status !== "out_of_service") {
        await setMemberStatusForInspection({ memberId, status: "out_of_service" }, tx);
        await recordAudit(
          { ...audit, action: "member.status_changed", entityType: "member", entityId: memberId, before: { status: member.status }, after: { status: "out_of_service", reason: "failed inspection", inspectionId: inspection.id } },
          tx,
        );
        status = "out_of_service";
      }
      const failed = items.filter((i) => i.result === "fail").map((i) => `${checkLabel(i.check)}${i.note ? ` (${i.note})` : ""}`);
      const when = formatDateTime(now, member.siteTimezone);
      const reason = `Failed inspection on ${when}${failed.length ? `: ${failed.join("; ")}` : ""}`.slice(0, 500);
      const permits = await removeMemberFromIssuedPermits({ memberId, reason, now }, tx);
      for (const p of permits) {
        const label = permitLabel(p);
        removedFromPermits.push({ id: p.id, label });
        await recordAudit(
          { ...audit, action: "permit.member_removed", entityType: "permit", entityId: p.id, before: { memberId, tag: member.tag, inScope: true }, after: { memberId, tag: member.tag, inScope: false, reason } },
          tx,
        );
        const mail = renderPermitMemberRemoved({
          siteName: member.siteName,
          permitLabel: label.charAt(0).toUpperCase() + label.slice(1),
          tag: member.tag,
          inspectedAt: when,
          inspectorName: user.name,
          failedItems: failed,
          notes: input.notes || null,
          link: new URL(`/sites/${member.siteId}/permits/${p.id}`, env.APP_URL).toString(),
        });
        await enqueueEmails(
          [...new Set(p.recipients)].map((to) => ({
            siteId: member.siteId,
            kind: "permit:member_removed",
            toEmail: to,
            subject: mail.subject,
            text: mail.text,
            html: mail.html,
            relatedType: "permit",
            relatedId: p.id,
          })),
          tx,
        );
      }
      // A permit to load left with no member standing closes itself (audited, same transaction).
      await closeLoadPermitsLeftEmpty(
        {
          permitIds: permits.filter((p) => p.kind === "load").map((p) => p.id),
          actor: { organisationId: user.organisationId, userId: user.id },
          because: `no member left standing after ${member.tag} failed its inspection`,
        },
        tx,
      );
      await raiseAlerts(
        [
          {
            siteId: member.siteId,
            kind: "inspection_failed",
            subjectType: "member",
            subjectId: memberId,
            threshold: inspection.id,
            title: `${member.tag} failed its inspection`,
            body:
              `${user.name} recorded a failed inspection of ${member.tag} on ${when}. It is now out of service` +
              (removedFromPermits.length ? ` and has been removed from ${removedFromPermits.map((p) => p.label).join(", ")}.` : ".") +
              (failed.length ? ` Failed: ${failed.join("; ")}.` : "") +
              (input.notes ? ` Notes: ${input.notes}` : ""),
            link: `/sites/${member.siteId}/members/${memberId}/inspect`,
            createdAt: now,
          },
        ],
        tx,
      );
    } else if (member.status === "out_of_service") {
      // Out of service (after a failed inspection, or set by a person reporting damage): a passing
      // inspection is the only way back to service (lib/register/member-lifecycle.ts), and not to any
      // permit. A member that fails its capacity check comes back as a draft, since it cannot be submitted.
      const back = member.checkPass ? "submitted" : "draft";
      await setMemberStatusForInspection({ memberId, status: back }, tx);
      await recordAudit(
        {
          ...audit, action: "member.status_changed", entityType: "member", entityId: memberId, before: { status: member.status },
          after: { status: back, reason: previous?.result === "fail" ? "passed re-inspection" : "passed inspection", inspectionId: inspection.id },
        },
        tx,
      );
      status = back;
    }

    return {
      replayed: false as const,
      inspection: {
        id: inspection.id,
        memberId,
        result: inspection.result,
        items: inspection.items,
        notes: inspection.notes,
        inspectedAt: inspection.inspectedAt,
        nextDueAt: inspection.nextDueAt,
        inspectorName: user.name,
        photoIds,
      },
      member: { id: memberId, tag: member.tag, status },
      removedFromPermits,
    };
  });
}
