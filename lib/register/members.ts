// The register's use cases: log a member, edit it, and re-check every member of a type. Each runs
// the engine on the server and stores the member, its check snapshot and an audit event in one
// transaction, so the record always shows what was known when.
import "server-only";
// `db` only for updateMember's transaction (the member helper's area; see eslint.config.mjs's temporary exemption).
import { transaction, type DbOrTx, type Tx } from "@/db";
import { recordAudit, recordAudits } from "@/db/queries/audit";
import { getCheck, insertCheck, insertChecks } from "@/db/queries/checks";
import { getMemberType } from "@/db/queries/member-types";
import {
  getMemberForUpdate, getMemberIdByClientId, getMemberIdByTag, getMemberView, insertMember, listMembersOfSchemeForCheck, listMembersOfTypeForCheck,
  setLatestChecks, updateMemberRow, type MemberView,
} from "@/db/queries/members";
import { attachPhotos, getPhotosByIds } from "@/db/queries/photos";
import { getScheme, type SchemeView } from "@/db/queries/schemes";
import type { SessionUser } from "@/db/queries/users";
import { getZone } from "@/db/queries/zones";
import { getZonePlan } from "@/db/queries/zone-plans";
import type { Member, MemberType } from "@/db/schema";
import { ConflictError, fieldErrorsFromZod, NotFoundError, ValidationError, type FieldErrors } from "@/lib/errors";
import { getLastInspectionSummary } from "@/db/queries/member-history";
import { MEMBER_STATUS_LABELS } from "@/lib/labels";
import { CHECK_FIELDS, EDITABLE_STATUSES, memberPatchSchema, memberStateSchema, type MemberCreate, type MemberPatch } from "@/lib/validations/member";
import { statusEditConflict } from "./member-lifecycle";
import { deriveSlabLoad, type SlabLoadInfo } from "./slab-load";
import { deriveBackpropLoad, type BackpropLoadInfo } from "./backprop-load";
import { bearingRequest, checkSnapshot, runCheck, type CheckOutcome } from "./run-check";
import { calculate, type Step } from "@/lib/engineering";
import type { MemberBase } from "@/db/schema";

export type SiteForCheck = { id: string; organisationId: string; designCode: "en1993" | "aisc360-lrfd" | "aisc360-asd"; unitSystem: "si" | "us" };

/** A base the engine cannot check (no ground or slab, a partial sole plate…) is a 422 under `base.<field>`; nothing is stored. */
function assertBaseCheckable(base: MemberBase | null | undefined, site: SiteForCheck) {
  if (!base) return;
  const r = calculate(bearingRequest(base, 1000, site).request);
  if (!r.ok) {
    const fields: FieldErrors = {};
    for (const e of r.errors) if (e.field !== "loadN") fields[`base.${e.field || "basePlateBMm"}`] ??= e.message;
    if (Object.keys(fields).length) throw new ValidationError(fields);
  }
}

export type { MemberView, SessionUser, Tx };

import { checkView, type CheckView } from "./check-view";

export { checkView, type CheckView };
/** A sentence saying why a check does not pass, for a refusal or a status line. */
export function failingReason(outcome: { capacityN: number | null; utilisation: number | null; result: Record<string, unknown> }): string {
  const r = outcome.result as { ok?: boolean; errors?: { message: string }[] };
  if (r.ok === false) return `The capacity check could not be completed: ${(r.errors ?? []).map((e) => e.message).join(" ") || "the engine refused the inputs."}`;
  const b = (outcome.result as { bearing?: { ok?: boolean; pass?: boolean; utilisation?: number } }).bearing;
  if (b && (b.ok === false || b.pass !== true)) {
    const bp = b.utilisation == null ? "?" : Math.round(b.utilisation * 100);
    return `The ground or slab under the member's base fails its bearing check (utilisation ${bp} %, over 100 %): spread the load with a larger sole plate or check the ground.`;
  }
  const pct = outcome.utilisation == null ? "?" : Math.round(outcome.utilisation * 100);
  return `The member fails its capacity check (utilisation ${pct} %, over 100 %).`;
}

function typeRangeError(type: Pick<MemberType, "minExtensionMm" | "maxExtensionMm" | "kind" | "name">, extensionMm: number): string | null {
  // Only a telescopic prop cannot physically sit outside its range: outside it the number is a typo.
  // A strut longer than its supplier's table exists; the check then refuses it and it shows failing.
  if (type.kind !== "en1065-prop") return null;
  const { minExtensionMm: lo, maxExtensionMm: hi } = type;
  if ((lo != null && extensionMm < lo) || (hi != null && extensionMm > hi)) {
    return `${type.name} extends from ${lo ?? "?"} to ${hi ?? "?"} mm; ${Math.round(extensionMm)} mm is outside that range. Measure again, or choose the right type.`;
  }
  return null;
}

type Resolved = {
  type: MemberType;
  zone: { id: string; name: string } | null;
  scheme: Awaited<ReturnType<typeof getScheme>> | null;
  loadN: number;
  slab: SlabLoadInfo | null;
  backprop: BackpropLoadInfo | null;
};

type MemberState = {
  zoneId?: string | null;
  schemeId?: string | null;
  memberTypeId: string;
  extensionMm: number;
  loadSource: "direct" | "slab" | "backprop";
  loadN?: number;
  level?: number | null;
  spacingXMm?: number | null;
  spacingYMm?: number | null;
};

/** Resolves the references of a member (same site / organisation) and its load; field errors otherwise. */
async function resolveRefs(site: SiteForCheck, v: MemberState, tx: DbOrTx, currentTypeId?: string): Promise<Resolved> {
  const errors: FieldErrors = {};
  const [zone, scheme, type] = await Promise.all([
    v.zoneId ? getZone({ siteId: site.id, zoneId: v.zoneId }, tx) : Promise.resolve(null),
    v.schemeId ? getScheme({ siteId: site.id, schemeId: v.schemeId }, tx) : Promise.resolve(null),
    // A member may keep an archived type it already had; new choices must be current.
    getMemberType({ organisationId: site.organisationId, memberTypeId: v.memberTypeId, includeArchived: v.memberTypeId === currentTypeId }, tx),
  ]);
  if (v.zoneId && !zone) errors.zoneId = "That zone is not on this site; choose one from the list.";
  if (v.schemeId && !scheme) errors.schemeId = "That scheme is not on this site; choose one from the list.";
  if (!type) errors.memberTypeId = "That member type is not in your organisation's library; choose one from the list.";
  if (type) {
    const rangeError = typeRangeError(type, v.extensionMm);
    if (rangeError) errors.extensionMm = rangeError;
  }
  let loadN = v.loadN ?? NaN;
  let slab: SlabLoadInfo | null = null;
  let backprop: BackpropLoadInfo | null = null;
  if (v.loadSource === "slab" && scheme) {
    const derived = deriveSlabLoad(scheme, v.spacingXMm ?? NaN, v.spacingYMm ?? NaN);
    if (!derived.ok) Object.assign(errors, derived.fields);
    else {
      slab = derived.info;
      loadN = derived.info.loadPerMemberN;
    }
  }
  if (v.loadSource === "backprop" && scheme) {
    const derived = deriveBackpropLoad(scheme, v.level ?? NaN, v.spacingXMm ?? NaN, v.spacingYMm ?? NaN);
    if (!derived.ok) {
      // A scheme-side reason (no back-propping, no slab) is said against the load source the member chose.
      for (const [k, m] of Object.entries(derived.fields)) errors[k.startsWith("backprop") ? "loadSource" : k] ??= m;
    } else {
      backprop = derived.info;
      loadN = derived.info.loadPerMemberN;
    }
  }
  if (Object.keys(errors).length) throw new ValidationError(errors);
  return { type: type!, zone, scheme, loadN, slab, backprop };
}

/**
 * A place on a plan needs the member's zone to have one. Returns the columns to store, or the
 * field error to report (the position itself is range-checked by the schema).
 */
async function planColumns(args: { siteId: string; zoneId: string | null; position: { x: number; y: number } | null }, tx: DbOrTx): Promise<{ planX: number | null; planY: number | null } | string> {
  const { position } = args;
  if (!position) return { planX: null, planY: null };
  if (!args.zoneId) return "Put the member in a zone first: a place on a plan belongs to a zone's plan.";
  const plan = await getZonePlan({ siteId: args.siteId, zoneId: args.zoneId }, tx);
  if (!plan?.planImageKey) return `${plan?.name ?? "This zone"} has no plan yet; a designer or coordinator uploads it on the zone's plan page.`;
  return { planX: position.x, planY: position.y };
}

function checkRow(outcome: CheckOutcome, slab: SlabLoadInfo | null, backprop: BackpropLoadInfo | null = null) {
  return checkSnapshot(outcome, slab ? { slabLoad: slab } : backprop ? { backpropLoad: backprop } : undefined);
}

/** What an audit row keeps of a member: its fields, without the bookkeeping timestamps. */
function auditMember(m: Member) {
  const { createdAt: _c, updatedAt: _u, ...rest } = m;
  return rest;
}

function isUniqueViolation(e: unknown) {
  const code = (e as { code?: string; cause?: { code?: string } })?.code ?? (e as { cause?: { code?: string } })?.cause?.code;
  return code === "23505";
}

/**
 * Logs a member on a site. The caller has found the site, checked `logMember` and parsed the input
 * with memberCreateSchema (the route through the seam in lib/api/route.ts; the CSV import per row).
 */
export async function createMember(args: {
  user: SessionUser;
  site: SiteForCheck;
  input: MemberCreate;
  tx?: Tx;
  source?: "form" | "api" | "import";
}): Promise<{ member: MemberView; check: CheckView }> {
  const { user, site, input, source = "api" } = args;

  const work = async (tx: Tx) => {
    const ref = await resolveRefs(site, input, tx);
    const errors: FieldErrors = {};
    if (await getMemberIdByTag({ siteId: site.id, tag: input.tag }, tx)) {
      errors.tag = `${input.tag} is already on this site's register; use another tag or open that member to edit it.`;
    }
    const photoIds = [...new Set(input.photoIds ?? [])];
    if (photoIds.length) {
      const found = await getPhotosByIds({ siteId: site.id, photoIds }, tx);
      const byId = new Map(found.map((p) => [p.id, p]));
      for (const id of photoIds) {
        const p = byId.get(id);
        if (!p) errors.photoIds = "One of the photos was not uploaded to this site; upload it again.";
        else if (p.memberId) errors.photoIds = "One of the photos already belongs to another member.";
        else if (p.status !== "ready") errors.photoIds = p.status === "rejected" ? "One of the photos was refused; remove it and take it again." : "One of the photos has not finished uploading; wait for it or retry it.";
      }
    }
    const place = await planColumns({ siteId: site.id, zoneId: ref.zone?.id ?? null, position: input.planPosition ?? null }, tx);
    if (typeof place === "string") errors.planPosition = place;
    if (Object.keys(errors).length) throw new ValidationError(errors);
    const planPlace = place as { planX: number | null; planY: number | null };

    assertBaseCheckable(input.base, site);
    const outcome = runCheck(ref.type, { extensionMm: input.extensionMm, endConditions: input.endConditions, loadN: ref.loadN, base: input.base ?? null }, site);
    if (input.submit && !outcome.pass) {
      throw new ValidationError({ submit: `${failingReason(outcome)} A failing member cannot be submitted; save it as a draft and correct it.` }, "A failing member cannot be submitted.");
    }
    let member: Member;
    try {
      member = await insertMember(
        {
          siteId: site.id,
          tag: input.tag,
          zoneId: ref.zone?.id ?? null,
          schemeId: ref.scheme?.id ?? null,
          memberTypeId: ref.type.id,
          extensionMm: input.extensionMm,
          endConditions: input.endConditions,
          spacingXMm: input.spacingXMm ?? null,
          spacingYMm: input.spacingYMm ?? null,
          loadSource: input.loadSource,
          level: input.loadSource === "backprop" ? (input.level ?? null) : null,
          loadN: ref.loadN,
          status: input.submit ? "submitted" : "draft",
          notes: input.notes ?? null,
          base: input.base ?? null,
          capacityN: outcome.capacityN,
          utilisation: outcome.utilisation,
          checkPass: outcome.pass,
          ...planPlace,
          installedBy: user.id,
          installedAt: new Date(),
          createdBy: user.id,
          clientId: input.clientId ?? null,
        },
        tx,
      );
    } catch (e) {
      if (isUniqueViolation(e)) throw new ValidationError({ tag: `${input.tag} is already on this site's register; use another tag.` });
      throw e;
    }
    const check = await insertCheck({ memberId: member.id, reason: "logged", createdBy: user.id, ...checkRow(outcome, ref.slab, ref.backprop) }, tx);
    member = await updateMemberRow({ memberId: member.id, values: { latestCheckId: check.id } }, tx);
    const attached = await attachPhotos({ siteId: site.id, memberId: member.id, photoIds }, tx);
    if (attached !== photoIds.length) throw new ValidationError({ photoIds: "One of the photos was attached elsewhere meanwhile; upload it again." });
    await recordAudit(
      {
        organisationId: site.organisationId,
        siteId: site.id,
        actorId: user.id,
        action: "member.created",
        entityType: "member",
        entityId: member.id,
        after: { ...auditMember(member), source, photoIds, check: { id: check.id, capacityN: check.capacityN, utilisation: check.utilisation, pass: check.pass, method: check.method } },
      },
      tx,
    );
    const view = await getMemberView({ memberId: member.id }, tx);
    return { member: view!, check: checkView(check) };
  };
  return args.tx ? work(args.tx) : transaction(work);
}

/** The answer a create gave the first time, rebuilt from what was stored. */
async function storedCreate(memberId: string): Promise<{ member: MemberView; check: CheckView | null }> {
  const member = (await getMemberView({ memberId }))!;
  const check = member.latestCheckId ? await getCheck({ checkId: member.latestCheckId }) : null;
  return { member, check: check ? checkView(check) : null };
}

/**
 * Logs a member once per `clientId`: a create retried after a lost response (or sent twice at the
 * same moment) gets the member made the first time, with `replayed: true`, and nothing new is stored.
 * Concurrent twins race on the unique (site, client_id) index; the loser reads the winner's row back.
 */
export async function createMemberOnce(args: { user: SessionUser; site: SiteForCheck; input: MemberCreate; source?: "form" | "api" }) {
  const { site, input } = args;
  const clientId = input.clientId;
  if (clientId) {
    const existing = await getMemberIdByClientId({ siteId: site.id, clientId });
    if (existing) return { replayed: true as const, ...(await storedCreate(existing)) };
  }
  try {
    return { replayed: false as const, ...(await createMember(args)) };
  } catch (e) {
    // The twin committed first: its tag (or its clientId) is now taken by the very member we meant to make.
    if (clientId && (isUniqueViolation(e) || (e instanceof ValidationError && e.fields?.tag))) {
      const existing = await getMemberIdByClientId({ siteId: site.id, clientId });
      if (existing) return { replayed: true as const, ...(await storedCreate(existing)) };
    }
    throw e;
  }
}

/** Unknown keys in a patch are named one by one rather than as one anonymous error. */
function patchErrors(issues: { code?: string; keys?: string[]; path: PropertyKey[]; message: string }[]): FieldErrors {
  const out: FieldErrors = {};
  for (const i of issues) {
    if (i.code === "unrecognized_keys" && i.keys) for (const k of i.keys) out[k] = "This value cannot be changed here: it is not a field of a member, or the system sets it.";
  }
  return { ...fieldErrorsFromZod(issues.filter((i) => i.code !== "unrecognized_keys")), ...out };
}

/** Parses a PATCH body (the seam answers 422 with these field errors before the use case runs). */
export function parseMemberPatch(raw: unknown): MemberPatch {
  const parsed = memberPatchSchema.safeParse(raw);
  if (!parsed.success) throw new ValidationError(patchErrors(parsed.error.issues));
  return parsed.data;
}

/**
 * Edits a member the route has already found and authorised (see app/api/v1/members/[memberId]).
 * A status the lifecycle owns cannot be set or left here (409 with the reason; lib/register/member-lifecycle.ts).
 */
export async function updateMember(args: {
  user: SessionUser;
  site: SiteForCheck & { timezone?: string };
  member: { id: string };
  input: MemberPatch;
}): Promise<{ member: MemberView; check: CheckView | null }> {
  const { user, site, input: patch } = args;
  const memberId = args.member.id;

  return transaction(async (tx) => {
    const before = (await getMemberForUpdate({ memberId }, tx))!;
    if (patch.baseVersion !== undefined && patch.baseVersion !== before.version) {
      throw new ConflictError(
        `${before.tag} was changed by someone else since this edit was started (version ${patch.baseVersion}; it is now at version ${before.version}). Nothing was saved: compare the two and choose what to keep.`,
        { baseVersion: `The member is now at version ${before.version}.` },
      );
    }
    if (patch.status !== undefined && patch.status !== before.status) {
      const conflict = statusEditConflict({
        tag: before.tag,
        current: before.status,
        requested: patch.status,
        lastInspection: before.status === "out_of_service" ? await getLastInspectionSummary({ memberId }, tx) : null,
        timeZone: site.timezone,
      });
      if (conflict) throw new ConflictError(conflict, { status: conflict });
    }
    const merged = {
      tag: patch.tag ?? before.tag,
      zoneId: patch.zoneId !== undefined ? patch.zoneId : before.zoneId,
      schemeId: patch.schemeId !== undefined ? patch.schemeId : before.schemeId,
      memberTypeId: patch.memberTypeId ?? before.memberTypeId,
      extensionMm: patch.extensionMm ?? before.extensionMm,
      endConditions: patch.endConditions ?? before.endConditions,
      loadSource: patch.loadSource ?? before.loadSource,
      // A level belongs to a load from back-propping: leaving that source leaves the level too.
      level: patch.level !== undefined ? patch.level : (patch.loadSource ?? before.loadSource) === "backprop" ? before.level : null,
      loadN: patch.loadN ?? before.loadN,
      spacingXMm: patch.spacingXMm !== undefined ? patch.spacingXMm : before.spacingXMm,
      spacingYMm: patch.spacingYMm !== undefined ? patch.spacingYMm : before.spacingYMm,
      notes: patch.notes !== undefined ? patch.notes : before.notes,
      base: patch.base !== undefined ? patch.base : before.base,
    };
    const state = memberStateSchema.safeParse(merged);
    if (!state.success) throw new ValidationError(fieldErrorsFromZod(state.error.issues));
    const v = state.data;

    const errors: FieldErrors = {};
    if (v.tag.toLowerCase() !== before.tag.toLowerCase()) {
      const other = await getMemberIdByTag({ siteId: site.id, tag: v.tag }, tx);
      if (other && other !== memberId) errors.tag = `${v.tag} is already on this site's register; use another tag.`;
    }
    if (patch.status !== undefined && patch.status !== before.status && !(EDITABLE_STATUSES as readonly string[]).includes(patch.status)) {
      errors.status = `${MEMBER_STATUS_LABELS[patch.status]} is set by a permit, not by editing; choose ${EDITABLE_STATUSES.map((s) => MEMBER_STATUS_LABELS[s]).join(", ")}.`;
    }
    if (Object.keys(errors).length) throw new ValidationError(errors);

    const touched = CHECK_FIELDS.some((f) => patch[f] !== undefined && patch[f] !== before[f]);
    const ref = await resolveRefs(site, v, tx, before.memberTypeId);
    // A place belongs to the zone's plan: moving the member to another zone takes it off the plan
    // unless the same edit places it on the new one.
    const zoneChanged = (ref.zone?.id ?? null) !== before.zoneId;
    const position =
      patch.planPosition !== undefined
        ? patch.planPosition
        : zoneChanged || before.planX == null || before.planY == null
          ? null
          : { x: before.planX, y: before.planY };
    const place = await planColumns({ siteId: site.id, zoneId: ref.zone?.id ?? null, position }, tx);
    if (typeof place === "string") throw new ValidationError({ planPosition: place });
    let check: CheckView | null = null;
    let pass = before.checkPass ?? false;
    const values: Partial<Member> = {
      tag: v.tag,
      zoneId: ref.zone?.id ?? null,
      schemeId: ref.scheme?.id ?? null,
      memberTypeId: ref.type.id,
      extensionMm: v.extensionMm,
      endConditions: v.endConditions,
      loadSource: v.loadSource,
      level: v.level ?? null,
      loadN: ref.loadN,
      spacingXMm: v.spacingXMm ?? null,
      spacingYMm: v.spacingYMm ?? null,
      notes: v.notes ?? null,
      ...place,
      base: v.base ?? null,
    };
    assertBaseCheckable(v.base, site);
    let outcome: CheckOutcome | null = null;
    if (touched || ref.loadN !== before.loadN) {
      outcome = runCheck(ref.type, { extensionMm: v.extensionMm, endConditions: v.endConditions, loadN: ref.loadN, outOfPlumbDeg: before.outOfPlumbDeg, base: v.base ?? null }, site);
      pass = outcome.pass;
    }
    if (patch.status !== undefined && patch.status !== before.status) {
      if (patch.status === "submitted" && !pass) {
        const reason = outcome ? failingReason(outcome) : "The member fails its latest capacity check.";
        throw new ValidationError({ status: `${reason} A failing member cannot be submitted.` }, "A failing member cannot be submitted.");
      }
      values.status = patch.status;
    }
    if (outcome) {
      const row = await insertCheck({ memberId, reason: "edited", createdBy: user.id, ...checkRow(outcome, ref.slab, ref.backprop) }, tx);
      Object.assign(values, { latestCheckId: row.id, capacityN: row.capacityN, utilisation: row.utilisation, checkPass: row.pass });
      check = checkView(row);
    }
    const after = await updateMemberRow({ memberId, values }, tx);
    const changed = Object.keys(values).filter((k) => JSON.stringify(before[k as keyof Member]) !== JSON.stringify(after[k as keyof Member]));
    if (changed.length) {
      // The two plan columns are one fact for the record: where the member stands on the plan.
      const planMoved = changed.includes("planX") || changed.includes("planY");
      const keys = changed.filter((k) => k !== "planX" && k !== "planY");
      const placeOf = (m: Member) => (m.planX == null || m.planY == null ? null : { x: m.planX, y: m.planY });
      const pick = (m: Member) => ({ ...Object.fromEntries(keys.map((k) => [k, m[k as keyof Member]])), ...(planMoved ? { planPosition: placeOf(m) } : {}) });
      await recordAudit(
        {
          organisationId: site.organisationId,
          siteId: site.id,
          actorId: user.id,
          action: outcome ? "member.edited_and_rechecked" : "member.edited",
          entityType: "member",
          entityId: memberId,
          before: pick(before),
          after: { ...pick(after), ...(check ? { check: { id: check.id, capacityN: check.capacityN, utilisation: check.utilisation, pass: check.pass } } : {}) },
        },
        tx,
      );
    }
    const view = await getMemberView({ memberId }, tx);
    return { member: view!, check };
  });
}

/**
 * Re-checks every member of a type (after the type changed) inside the caller's transaction:
 * a new check per member, the member's latest result updated, and an audit row per member.
 * Returns how many members were re-checked.
 */
export async function recheckMembersOfType(args: { user: SessionUser; memberTypeId: string; tx: Tx; reason: string }): Promise<number> {
  const { user, memberTypeId, tx, reason } = args;
  const type = await getMemberType({ organisationId: user.organisationId, memberTypeId, includeArchived: true }, tx);
  if (!type) throw new NotFoundError("That member type");
  const rows = await listMembersOfTypeForCheck({ memberTypeId }, tx);
  const mine = rows.filter((r) => r.siteOrganisationId === user.organisationId);
  if (mine.length === 0) return 0;
  const outcomes = mine.map((m) => {
    const outcome = runCheck(
      type,
      { extensionMm: m.extensionMm, endConditions: m.endConditions, loadN: m.loadN, outOfPlumbDeg: m.outOfPlumbDeg, base: m.base },
      { designCode: m.siteDesignCode, unitSystem: m.siteUnitSystem },
    );
    // Keep the slab working of the member's previous check out of it: the load itself is unchanged.
    return { m, outcome };
  });
  const ids = await insertChecks(
    outcomes.map(({ m, outcome }) => ({ memberId: m.id, reason, createdBy: user.id, ...checkRow(outcome, null) })),
    tx,
  );
  await setLatestChecks(
    outcomes.map(({ m, outcome }, i) => ({ memberId: m.id, checkId: ids[i]!, capacityN: outcome.capacityN, utilisation: outcome.utilisation, pass: outcome.pass })),
    tx,
  );
  const audits = outcomes.map(({ m, outcome }, i) => ({
    organisationId: user.organisationId,
    siteId: m.siteId,
    actorId: user.id,
    action: "member.rechecked",
    entityType: "member",
    entityId: m.id,
    before: { latestCheckId: m.latestCheckId, capacityN: m.capacityN, utilisation: m.utilisation, checkPass: m.checkPass },
    after: { latestCheckId: ids[i], capacityN: outcome.capacityN, utilisation: outcome.utilisation, checkPass: outcome.pass, reason, memberTypeRevision: type.revision },
  }));
  await recordAudits(audits, tx);
  return mine.length;
}

/**
 * Re-checks one member inside the caller's transaction after something outside its own fields
 * changed (an inspection's plumb reading): `values` are stored with the new check, the member's
 * latest result is updated and one audit row says why. The caller holds the member's row lock.
 */
export async function recheckMember(args: {
  user: SessionUser;
  site: Pick<SiteForCheck, "id" | "organisationId" | "designCode" | "unitSystem">;
  memberId: string;
  values?: Partial<Pick<Member, "outOfPlumbDeg">>;
  reason: string;
  audit?: Record<string, unknown>;
  tx: Tx;
}): Promise<{ before: Member; after: Member; outcome: CheckOutcome; check: CheckView }> {
  const { user, site, memberId, values = {}, reason, tx } = args;
  const before = await getMemberForUpdate({ memberId }, tx);
  if (!before) throw new NotFoundError("That member");
  const type = await getMemberType({ organisationId: site.organisationId, memberTypeId: before.memberTypeId, includeArchived: true }, tx);
  if (!type) throw new NotFoundError("That member's type");
  const merged = { ...before, ...values };
  const outcome = runCheck(
    type,
    { extensionMm: merged.extensionMm, endConditions: merged.endConditions, loadN: merged.loadN, outOfPlumbDeg: merged.outOfPlumbDeg, base: merged.base },
    site,
  );
  const row = await insertCheck({ memberId, reason, createdBy: user.id, ...checkRow(outcome, null) }, tx);
  const after = await updateMemberRow(
    { memberId, values: { ...values, latestCheckId: row.id, capacityN: row.capacityN, utilisation: row.utilisation, checkPass: row.pass } },
    tx,
  );
  await recordAudit(
    {
      organisationId: site.organisationId,
      siteId: site.id,
      actorId: user.id,
      action: "member.rechecked",
      entityType: "member",
      entityId: memberId,
      before: { latestCheckId: before.latestCheckId, capacityN: before.capacityN, utilisation: before.utilisation, checkPass: before.checkPass, outOfPlumbDeg: before.outOfPlumbDeg },
      after: { latestCheckId: row.id, capacityN: row.capacityN, utilisation: row.utilisation, checkPass: row.pass, outOfPlumbDeg: after.outOfPlumbDeg, reason, ...args.audit },
    },
    tx,
  );
  return { before, after, outcome, check: checkView(row) };
}

/** A scheme's fields that a member's derived load depends on: a change to any re-checks those members. */
export const SCHEME_LOAD_FIELDS = ["slabThicknessMm", "concreteDensityKnM3", "formworkKnM2", "constructionKnM2", "backprop"] as const;

const listTags = (tags: string[]) => (tags.length > 5 ? `${tags.slice(0, 5).join(", ")} and ${tags.length - 5} more` : tags.join(", "));

/**
 * Re-derives the load of every member that takes it from the scheme (after the scheme changed) and
 * re-checks it inside the caller's transaction: new load, a new check with its working and the
 * reason, the member's latest result, and one audit row per member saying which scheme changed.
 * A scheme that can no longer give those loads is refused (422, nothing stored). A member that now
 * fails is picked up by the overload sweep like any other failing check.
 */
export async function recheckMembersOfScheme(args: {
  user: SessionUser;
  site: SiteForCheck;
  scheme: SchemeView;
  changed: string[];
  tx: Tx;
}): Promise<{ rechecked: number }> {
  const { user, site, scheme, changed, tx } = args;
  const reason = "scheme changed";
  // A slab load depends on the slab's four fields; a back-propped load on the slab's weight and the back-propping.
  const slabChanged = changed.some((k) => k !== "backprop");
  const bpChanged = changed.some((k) => k === "backprop" || k === "slabThicknessMm" || k === "concreteDensityKnM3");
  const sources = [...(slabChanged ? (["slab"] as const) : []), ...(bpChanged ? (["backprop"] as const) : [])];
  if (sources.length === 0) return { rechecked: 0 };
  const rows = await listMembersOfSchemeForCheck({ schemeId: scheme.id, loadSources: sources }, tx);
  if (rows.length === 0) return { rechecked: 0 };
  type Derived = { ok: true; info: SlabLoadInfo | BackpropLoadInfo } | { ok: false; fields: FieldErrors };
  const derived = rows.map((m) => ({
    m,
    d: (m.loadSource === "backprop"
      ? deriveBackpropLoad(scheme, m.level ?? NaN, m.spacingXMm ?? NaN, m.spacingYMm ?? NaN)
      : deriveSlabLoad(scheme, m.spacingXMm ?? NaN, m.spacingYMm ?? NaN)) as Derived,
  }));
  const refused = derived.filter((x) => !x.d.ok);
  if (refused.length) {
    const fields: FieldErrors = {};
    const say = (field: string, group: typeof refused, what: string, fix: string) => {
      if (!group.length || fields[field]) return;
      const many = group.length === 1 ? "takes its" : "take their";
      fields[field] = `${listTags(group.map((x) => x.m.tag))} ${many} load from this scheme's ${what}: ${fix}`;
    };
    const bp = refused.filter((x) => x.m.loadSource === "backprop");
    const slab = refused.filter((x) => x.m.loadSource !== "backprop");
    const firstReason = (g: typeof refused) => Object.values((g[0]?.d as { fields?: FieldErrors } | undefined)?.fields ?? {})[0] ?? "the load cannot be derived.";
    if (scheme.slabThicknessMm == null) say("slabThicknessMm", refused, "slab", "keep the slab thickness, or give those members their working load directly first.");
    else {
      say("slabThicknessMm", slab, "slab", firstReason(slab));
      if (!scheme.backprop) say("backprop", bp, "back-propping", "keep the back-propping, or give those members another load source first.");
      else if (bp.some((x) => (x.m.level ?? 0) > scheme.backprop!.shoredLevels))
        say("backprop.shoredLevels", bp, "back-propping", `they stand at levels up to ${Math.max(...bp.map((x) => x.m.level ?? 0))}; keep at least that many levels, or move them to another level first.`);
      else say("backprop", bp, "back-propping", firstReason(bp));
    }
    throw new ValidationError(fields);
  }
  const types = new Map<string, MemberType>();
  for (const id of new Set(rows.map((m) => m.memberTypeId))) {
    const t = await getMemberType({ organisationId: site.organisationId, memberTypeId: id, includeArchived: true }, tx);
    if (!t) throw new NotFoundError("A member's type");
    types.set(id, t);
  }
  for (const { m, d } of derived) {
    const info = (d as { ok: true; info: SlabLoadInfo | BackpropLoadInfo }).info;
    const slab = { loadPerMemberN: info.loadPerMemberN };
    const outcome = runCheck(
      types.get(m.memberTypeId)!,
      { extensionMm: m.extensionMm, endConditions: m.endConditions, loadN: slab.loadPerMemberN, outOfPlumbDeg: m.outOfPlumbDeg, base: m.base },
      site,
    );
    const row = await insertCheck(
      {
        memberId: m.id, reason, createdBy: user.id,
        ...(m.loadSource === "backprop" ? checkRow(outcome, null, info as BackpropLoadInfo) : checkRow(outcome, info as SlabLoadInfo)),
      },
      tx,
    );
    await updateMemberRow(
      { memberId: m.id, values: { loadN: slab.loadPerMemberN, latestCheckId: row.id, capacityN: row.capacityN, utilisation: row.utilisation, checkPass: row.pass } },
      tx,
    );
    await recordAudit(
      {
        organisationId: site.organisationId,
        siteId: site.id,
        actorId: user.id,
        action: "member.rechecked",
        entityType: "member",
        entityId: m.id,
        before: { loadN: m.loadN, latestCheckId: m.latestCheckId, capacityN: m.capacityN, utilisation: m.utilisation, checkPass: m.checkPass },
        after: {
          loadN: slab.loadPerMemberN, latestCheckId: row.id, capacityN: row.capacityN, utilisation: row.utilisation, checkPass: row.pass,
          reason, schemeId: scheme.id, schemeReference: scheme.reference, schemeFields: changed,
        },
      },
      tx,
    );
  }
  return { rechecked: rows.length };
}
