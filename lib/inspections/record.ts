// Recording an inspection. A failed one takes the member out of service, removes it from every
// issued permit that covers it, tells those permits' recipients and raises a "failed inspection"
// alert — all in one transaction, so none of it happens without the rest. The route (on the seam
// in lib/api/route.ts) has found the member and checked the `inspect` permission.
import "server-only";
import { transaction, type Tx } from "@/db";
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
import { overloadCandidate } from "@/lib/alerts/scans";
import { failingReason, recheckMember, type CheckView } from "@/lib/register/members";
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
export async function recordInspection(args: { user: SessionUser; member: { id: string }; input: InspectionInput; now?: Date; tx?: Tx }) {
  const { user, input, now = new Date() } = args;
  const memberId = args.member.id;
  // Inside a caller's transaction (a bulk record: all or nothing), or in one of its own.
  const run = <T>(fn: (tx: Tx) => Promise<T>): Promise<T> => (args.tx ? fn(args.tx) : transaction(fn));
  return run(async (tx) => {
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
          recheck: null,
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
    let items = (input.items ?? []).map((i) => ({ check: i.check, result: i.result, ...(i.note ? { note: i.note } : {}) }));
    let result = input.result;

    // A plumb reading re-checks the member out of plumb at that angle (it stands until a later reading).
    const plumbDeg = plumbAngle(input, member.extensionMm);
    let recheck: { check: CheckView; outOfPlumbDeg: number } | null = null;
    if (plumbDeg !== null) {
      const site = { id: member.siteId, organisationId: member.organisationId, designCode: member.designCode, unitSystem: member.unitSystem };
      const r = await recheckMember({ user, site, memberId, values: { outOfPlumbDeg: plumbDeg }, reason: "plumb reading", audit: { plumbDeg }, tx });
      recheck = { check: r.check, outOfPlumbDeg: plumbDeg };
      member.checkPass = r.outcome.pass;
      if (!r.outcome.pass) {
        // The member is not fit to carry its load as it stands: the inspection fails, on its plumb item.
        const why = `Re-checked ${fmtDeg(plumbDeg)}° out of plumb: ${failingReason(r.outcome).replace(/^The member fails/, "it fails")}`;
        const own = items.find((i) => i.check === "plumb");
        const note = own?.note && own.result === "fail" ? `${own.note}. ${why}` : why;
        items = [...items.filter((i) => i.check !== "plumb"), { check: "plumb", result: "fail" as const, note: note.slice(0, 500) }];
        result = "fail";
        await raiseAlerts(
          [
            (() => {
              const c = overloadCandidate(
                { siteId: member.siteId, memberId, tag: member.tag, checkId: r.check.id, utilisation: r.outcome.utilisation, capacityN: r.outcome.capacityN, loadN: r.after.loadN, extensionMm: r.after.extensionMm },
                now,
              );
              return { ...c, body: `${c.body} It was found ${fmtDeg(plumbDeg)}° out of plumb at an inspection by ${user.name}.` };
            })(),
          ],
          tx,
        );
      }
    }

    const inspection = await insertInspection(
      {
        siteId: member.siteId,
        memberId,
        inspectorId: user.id,
        result,
        plumbDeg,
        plumbOffsetMm: input.plumbOffsetMm ?? null,
        plumbOverMm: input.plumbOverMm ?? null,
        items,
        notes: input.notes || null,
        inspectedAt: now,
        nextDueAt: result === "pass" ? nextDueFrom(now, member.inspectionIntervalDays) : null,
        clientId: input.clientId ?? null,
      },
      tx,
    );
    await attachInspectionPhotos({ memberId, inspectionId: inspection.id, photoIds }, tx);
    const audit = { organisationId: member.organisationId, siteId: member.siteId, actorId: user.id };
    await recordAudit(
      { ...audit, action: "inspection.recorded", entityType: "inspection", entityId: inspection.id, after: { memberId, tag: member.tag, result, items, notes: input.notes ?? null, photoIds, ...(plumbDeg !== null ? { plumbDeg, recheckPass: recheck?.check.pass } : {}) } },
      tx,
    );

    let status = member.status;
    const removedFromPermits: { id: string; label: string }[] = [];
    if (result === "fail") {
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
        plumbDeg: inspection.plumbDeg,
        plumbOffsetMm: inspection.plumbOffsetMm,
        plumbOverMm: inspection.plumbOverMm,
        inspectorName: user.name,
        photoIds,
      },
      member: { id: memberId, tag: member.tag, status },
      removedFromPermits,
      /** The re-check a plumb reading made (null without a reading). */
      recheck,
    };
  });
}

const fmtDeg = (deg: number) => Number(deg.toFixed(2)).toString();

/**
 * The lean from vertical (degrees) a plumb reading gives, or null without one. An angle is taken as
 * read; an offset Δ over a measured height h gives θ = atan(Δ/h) (a level held vertical); an offset
 * of the head over the base with no height gives θ = asin(Δ/L) over the member's length L.
 */
function plumbAngle(input: InspectionInput, lengthMm: number): number | null {
  if (input.plumbDeg !== undefined) return input.plumbDeg;
  if (input.plumbOffsetMm === undefined) return null;
  const d = input.plumbOffsetMm;
  if (input.plumbOverMm !== undefined) return (Math.atan(d / input.plumbOverMm) * 180) / Math.PI;
  if (d >= lengthMm) {
    throw new ValidationError({ plumbOffsetMm: `An offset of ${Math.round(d)} mm cannot be as large as the member's length of ${Math.round(lengthMm)} mm; check the reading, or give the height it was measured over.` });
  }
  return (Math.asin(d / lengthMm) * 180) / Math.PI;
}
