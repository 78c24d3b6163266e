// The organisation's member library: create, edit (re-checking every member of the type in the
// same transaction) and delete (refused while members use the type). Routes on the seam
// (lib/api/route.ts) find the site and the type, check `manageLibrary` and parse the body first.
import "server-only";
import { transaction } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import {
  countMembersOfType, deleteMemberTypeRow, getMemberTypeByName, insertMemberType, updateMemberTypeRow,
  type MemberTypeValues, type MemberTypeView,
} from "@/db/queries/member-types";
import type { SessionUser } from "@/db/queries/users";
import { calculate } from "@/lib/engineering";
import { findSteelGrade, findTimberClass } from "@/lib/engineering/materials";
import { ConflictError, ValidationError, type FieldErrors } from "@/lib/errors";
import type { MemberTypeParsed } from "@/lib/validations/member-type";
import { buildCheckRequest } from "./check-request";
import { recheckMembersOfType } from "./members";

/** Turns the form's values into what the type stores (the engine's inputs, derived ranges). */
export function toTypeValues(v: MemberTypeParsed): MemberTypeValues {
  const common = { name: v.name, kind: v.kind, supplier: v.supplier || null, notes: v.notes || null };
  switch (v.kind) {
    case "en1065-prop":
      return { ...common, params: { propClass: v.params.propClass }, minExtensionMm: v.minExtensionMm, maxExtensionMm: v.maxExtensionMm };
    case "supplier-table":
    case "trench-strut": {
      const t = v.params.table;
      return { ...common, params: { table: t }, minExtensionMm: t[0]!.lengthMm, maxExtensionMm: t[t.length - 1]!.lengthMm };
    }
    case "steel-section": {
      const g = findSteelGrade(v.params.grade)!;
      const s = v.params.section;
      const t = "tMm" in s ? s.tMm : undefined;
      let fyMpa = g.fyMpa;
      // EN 1993-1-1 Table 3.1: a lower yield above the thickness limit; ASTM A500: round tubes differ.
      if (g.tLimitMm != null && g.fyThickMpa != null && t != null && t > g.tLimitMm) fyMpa = g.fyThickMpa;
      if (g.fyRoundMpa != null && s.shape === "chs") fyMpa = g.fyRoundMpa;
      return { ...common, params: { section: s, grade: g.id, formed: v.params.formed, fyMpa }, minExtensionMm: null, maxExtensionMm: null };
    }
    case "timber-section": {
      const c = findTimberClass(v.params.strengthClass)!;
      return {
        ...common,
        params: { section: v.params.section, strengthClass: c.id, timberType: v.params.timberType ?? (v.params.section.shape === "round" ? "round" : c.timberType) },
        minExtensionMm: null,
        maxExtensionMm: null,
      };
    }
  }
}

/** Runs the engine once on the new type so a section or table it cannot use is refused now, not on site. */
function engineErrors(values: MemberTypeValues): FieldErrors {
  const sampleLength = values.minExtensionMm != null && values.maxExtensionMm != null ? (values.minExtensionMm + values.maxExtensionMm) / 2 : 2500;
  const grade = typeof values.params.grade === "string" ? findSteelGrade(values.params.grade) : undefined;
  const site = { designCode: grade?.family === "ASTM" ? ("aisc360-lrfd" as const) : ("en1993" as const), unitSystem: "si" as const };
  const { request } = buildCheckRequest(values, { extensionMm: sampleLength, endConditions: "pinned-pinned", loadN: 1 }, site);
  const r = calculate(request);
  if (r.ok) return {};
  const out: FieldErrors = {};
  for (const e of r.errors) {
    if (e.field === "lengthMm" || e.field === "loadN") continue; // the sample length, not the type
    const key = e.field === "maxExtensionMm" || e.field === "minExtensionMm" ? e.field : e.field ? `params.${e.field}` : "params";
    if (!(key in out)) out[key] = e.message;
  }
  return out;
}

/** The parsed form as stored values, refused (422) when the engine cannot use the type. */
function typeValues(input: MemberTypeParsed): MemberTypeValues {
  const values = toTypeValues(input);
  const errors = engineErrors(values);
  if (Object.keys(errors).length) throw new ValidationError(errors);
  return values;
}

type LibrarySite = { id: string; organisationId: string };

export async function createMemberType({ user, site, input }: { user: SessionUser; site: LibrarySite; input: MemberTypeParsed }) {
  const values = typeValues(input);
  return transaction(async (tx) => {
    if (await getMemberTypeByName({ organisationId: site.organisationId, name: values.name }, tx)) {
      throw new ValidationError({ name: `Your library already has a type called "${values.name}"; give this one another name.` });
    }
    const row = await insertMemberType({ ...values, organisationId: site.organisationId }, tx);
    await recordAudit(
      { organisationId: site.organisationId, siteId: site.id, actorId: user.id, action: "member_type.created", entityType: "member_type", entityId: row.id, after: values },
      tx,
    );
    return { memberType: row };
  });
}

/** Saves a changed type as a new revision and re-checks every member that uses it. */
export async function updateMemberType({ user, site, memberType: before, input }: { user: SessionUser; site: LibrarySite; memberType: MemberTypeView; input: MemberTypeParsed }) {
  const memberTypeId = before.id;
  const values = typeValues(input);
  if (values.kind !== before.kind) throw new ValidationError({ kind: "A type's kind cannot change; create a new type instead." });
  return transaction(async (tx) => {
    const clash = await getMemberTypeByName({ organisationId: site.organisationId, name: values.name }, tx);
    if (clash && clash.id !== memberTypeId) throw new ValidationError({ name: `Your library already has a type called "${values.name}".` });
    const row = (await updateMemberTypeRow({ organisationId: site.organisationId, memberTypeId, values: { ...values, revision: before.revision + 1 } }, tx))!;
    const rechecked = await recheckMembersOfType({ user, memberTypeId, tx, reason: `type edited (revision ${row.revision})` });
    await recordAudit(
      {
        organisationId: site.organisationId,
        siteId: site.id,
        actorId: user.id,
        action: "member_type.updated",
        entityType: "member_type",
        entityId: memberTypeId,
        before: { name: before.name, supplier: before.supplier, params: before.params, minExtensionMm: before.minExtensionMm, maxExtensionMm: before.maxExtensionMm, notes: before.notes, revision: before.revision },
        after: { ...values, revision: row.revision, recheckedMembers: rechecked },
      },
      tx,
    );
    return { memberType: row, recheckedMembers: rechecked };
  });
}

export async function deleteMemberType({ user, site, memberType: type }: { user: SessionUser; site: LibrarySite; memberType: MemberTypeView }) {
  const memberTypeId = type.id;
  return transaction(async (tx) => {
    const used = await countMembersOfType({ memberTypeId }, tx);
    if (used > 0) {
      throw new ConflictError(
        `"${type.name}" is used by ${used} member${used === 1 ? "" : "s"} on your sites, so it cannot be deleted: their checks refer to it. Change those members to another type first.`,
      );
    }
    await deleteMemberTypeRow({ organisationId: site.organisationId, memberTypeId }, tx);
    await recordAudit(
      { organisationId: site.organisationId, siteId: site.id, actorId: user.id, action: "member_type.deleted", entityType: "member_type", entityId: memberTypeId, before: type },
      tx,
    );
    return { deleted: true };
  });
}
