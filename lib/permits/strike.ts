// Striking under a permit to strike: confirmed all at once, member by member, or zone by zone;
// the permit closes when its last member is struck. While the request is open its evidence can be
// amended (new cube results); the earlier evidence stays in the permit's history.
import "server-only";
import { listPermitMemberIds, listPermitMembers, lockMembers, setMembersStatus } from "@/db/queries/permits";
import type { SessionUser } from "@/db/queries/users";
import type { Permit } from "@/db/schema";
import { ConflictError, ValidationError } from "@/lib/errors";
import { permitNumberLabel, type ConfirmStruckInput, type StrikeEvidence } from "@/lib/validations/permit";
import { closeLoadPermitsCovering } from "./auto-close";
import { wrongState } from "./errors";
import { transitionPermit } from "./transition";

type Ctx<I> = { user: SessionUser; resource: Permit; input: I };

export async function confirmStruck({ user, resource, input }: Ctx<ConfirmStruckInput>) {
  if (resource.kind !== "strike") throw new ConflictError("Only a permit to strike is confirmed as struck.");
  const actor = { organisationId: user.organisationId, userId: user.id };
  const { permit, result } = await transitionPermit({
    permitId: resource.id,
    actor,
    from: ["issued"],
    refuse: (locked) => wrongState("Striking can be confirmed only while the permit is issued", locked.status),
    plan: async (locked, tx) => {
      await lockMembers({ memberIds: await listPermitMemberIds({ permitId: locked.id }, tx) }, tx);
      const scope = await listPermitMembers({ permitId: locked.id }, tx);
      const standing = scope.filter((m) => m.status !== "struck");
      let chosen = standing;
      if (input.memberIds) {
        const ids = [...new Set(input.memberIds)];
        const notInScope = ids.filter((id) => !scope.some((m) => m.id === id));
        if (notInScope.length)
          throw new ValidationError({ memberIds: `${notInScope.length} of the chosen members ${notInScope.length === 1 ? "is" : "are"} not in this permit.` });
        const already = scope.filter((m) => ids.includes(m.id) && m.status === "struck");
        if (already.length) throw new ValidationError({ memberIds: `${already.map((m) => m.tag).join(", ")} ${already.length === 1 ? "has" : "have"} already been struck.` });
        chosen = standing.filter((m) => ids.includes(m.id));
      } else if (input.zoneId) {
        chosen = standing.filter((m) => m.zoneId === input.zoneId);
        if (chosen.length === 0) throw new ValidationError({ zoneId: "No member of this permit is still standing in that zone." });
      }
      const label = permitNumberLabel("strike", locked.number)!;
      const struck = await setMembersStatus({ memberIds: chosen.map((m) => m.id), from: ["draft", "submitted", "loaded", "out_of_service"], to: "struck" }, tx);
      const left = standing.length - struck.length;
      const now = new Date();
      await closeLoadPermitsCovering({ memberIds: struck.map((m) => m.id), actor, because: `every member struck (last under ${label})` }, tx);
      const done = left === 0;
      return {
        values: done ? { struckConfirmedAt: now, struckConfirmedBy: user.id, status: "closed" as const, closedAt: now, closedBy: user.id } : {},
        audit: done
          ? { action: "permit.struck_confirmed", before: { status: "issued" }, after: { status: "closed", struckConfirmedAt: now, members: struck.map((m) => m.tag) } }
          : { action: "permit.struck_partly", after: { members: struck.map((m) => m.tag), stillStanding: left } },
        also: struck.map((m) => ({ action: "member.struck", entityType: "member", entityId: m.id, after: { status: "struck", permit: label } })),
        result: { struck: struck.map((m) => m.tag), stillStanding: left },
      };
    },
  });
  return { permit, ...result };
}

export async function amendEvidence({ user, resource, input }: Ctx<{ evidence: StrikeEvidence }>) {
  if (resource.kind !== "strike") throw new ConflictError("Striking evidence belongs to a permit to strike; a permit to load has none.");
  const { permit } = await transitionPermit({
    permitId: resource.id,
    actor: { organisationId: user.organisationId, userId: user.id },
    from: ["requested"],
    refuse: (locked) => wrongState("Striking evidence can be amended only while the request is open", locked.status),
    plan: async (locked) => {
      const history = [...(locked.evidenceHistory ?? [])];
      if (locked.evidence) history.push({ evidence: locked.evidence, replacedAt: new Date().toISOString(), replacedBy: user.id, replacedByName: user.name });
      return {
        values: { evidence: input.evidence as Record<string, unknown>, evidenceHistory: history },
        audit: { action: "permit.evidence_amended", before: { evidence: locked.evidence }, after: { evidence: input.evidence } },
      };
    },
  });
  return permit;
}
