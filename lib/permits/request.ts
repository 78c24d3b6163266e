// Requesting a permit to load or to strike: the scope is chosen members or a scheme in a zone;
// members that cannot be in the request are named with the reason, and nothing is stored.
import "server-only";
import { transaction } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import { getSiteMembersForPermit, insertPermit, insertPermitMembers, listSchemeZoneMembers, nextRequestNumber, type ReviewMember } from "@/db/queries/permits";
import { getScheme } from "@/db/queries/schemes";
import type { SessionUser } from "@/db/queries/users";
import { getZone } from "@/db/queries/zones";
import { ValidationError } from "@/lib/errors";
import { permitNumberLabel, type PermitRequest } from "@/lib/validations/permit";
import { fmtUtilisation } from "./format";

type Ctx = { user: SessionUser; site: { id: string }; input: PermitRequest };

async function chooseScope(siteId: string, input: PermitRequest) {
  if (input.scope === "members") {
    const ids = [...new Set(input.memberIds!)];
    const scope = await getSiteMembersForPermit({ siteId, memberIds: ids });
    if (scope.length !== ids.length) {
      const missing = ids.length - scope.length;
      throw new ValidationError({ memberIds: `${missing} of the chosen members ${missing === 1 ? "is" : "are"} not on this site.` });
    }
    const schemeIds = new Set(scope.map((m) => m.schemeId));
    const zoneIds = new Set(scope.map((m) => m.zoneId));
    return {
      scope,
      schemeId: schemeIds.size === 1 ? ([...schemeIds][0] ?? null) : null,
      zoneId: zoneIds.size === 1 ? ([...zoneIds][0] ?? null) : null,
    };
  }
  const [scheme, zone] = await Promise.all([getScheme({ siteId, schemeId: input.schemeId! }), getZone({ siteId, zoneId: input.zoneId! })]);
  const fields: Record<string, string> = {};
  if (!scheme) fields.schemeId = "That scheme is not on this site.";
  if (!zone) fields.zoneId = "That zone is not on this site.";
  if (Object.keys(fields).length) throw new ValidationError(fields);
  const scope = await listSchemeZoneMembers({
    siteId,
    schemeId: scheme!.id,
    zoneId: zone!.id,
    statuses: input.kind === "load" ? ["draft", "submitted"] : ["loaded", "submitted", "out_of_service"],
  });
  if (scope.length === 0)
    throw new ValidationError({
      schemeId: `Scheme ${scheme!.reference} has no members in ${zone!.name} that ${input.kind === "load" ? "are waiting to be loaded" : "are still standing"}.`,
    });
  return { scope, schemeId: scheme!.id, zoneId: zone!.id };
}

/** Why each member cannot be in a request of this kind, one line per member. */
function scopeProblems(kind: "load" | "strike", scope: ReviewMember[]) {
  const problems: string[] = [];
  for (const m of scope) {
    if (kind === "load") {
      if (m.coveredBy?.kind === "load") problems.push(`${m.tag} is already loaded under issued permit ${permitNumberLabel("load", m.coveredBy.number)}`);
      else if (!["draft", "submitted"].includes(m.status)) problems.push(`${m.tag} is ${m.status === "out_of_service" ? "out of service" : m.status}; only draft or submitted members can be loaded`);
      else if (m.checkPass === false)
        problems.push(
          m.utilisation == null
            ? `${m.tag} fails its capacity check (the check could not be completed)`
            : `${m.tag} fails its capacity check at ${fmtUtilisation(m.utilisation)} utilisation`,
        );
      else if (m.checkPass == null) problems.push(`${m.tag} has no capacity check yet`);
    } else {
      if (m.status === "struck") problems.push(`${m.tag} has already been struck`);
      else if (m.coveredBy?.kind === "strike") problems.push(`${m.tag} is already released for striking under ${permitNumberLabel("strike", m.coveredBy.number)}`);
    }
  }
  return problems;
}

export async function requestPermit({ user, site, input }: Ctx) {
  const siteId = site.id;
  const { scope, schemeId, zoneId } = await chooseScope(siteId, input);
  const problems = scopeProblems(input.kind, scope);
  if (problems.length) {
    const field = input.scope === "members" ? "memberIds" : "schemeId";
    throw new ValidationError({ [field]: `${problems.join("; ")}.` }, `These members cannot be in this request: ${problems.join("; ")}.`);
  }
  return transaction(async (tx) => {
    const row = await insertPermit(
      {
        siteId,
        kind: input.kind,
        requestNumber: await nextRequestNumber({ siteId }, tx),
        schemeId,
        zoneId,
        requestedBy: user.id,
        requestNote: input.note || null,
        evidence: (input.evidence as Record<string, unknown> | undefined) ?? null,
      },
      tx,
    );
    await insertPermitMembers({ permitId: row.id, memberIds: scope.map((m) => m.id) }, tx);
    await recordAudit(
      {
        organisationId: user.organisationId,
        siteId,
        actorId: user.id,
        action: "permit.requested",
        entityType: "permit",
        entityId: row.id,
        after: { kind: row.kind, requestNumber: row.requestNumber, members: scope.map((m) => m.tag), schemeId, zoneId, evidence: row.evidence, note: row.requestNote },
      },
      tx,
    );
    return row;
  });
}
