// Runs the engine for one member and returns what the register stores as its check.
import { calculate, ENGINE_VERSION } from "@/lib/engineering";
import { buildCheckRequest, isLeaning, LEAN_CHECKED_KINDS, type CheckMember, type CheckSite, type CheckType } from "./check-request";

const KIND_WORDS: Record<CheckType["kind"], string> = {
  "en1065-prop": "an EN 1065 prop",
  "steel-section": "a steel member",
  "supplier-table": "a member rated by its supplier's table",
  "trench-strut": "a trench strut",
  "timber-section": "a timber member",
};

/** A lean the engine cannot check for this kind is said, never dropped. */
function leanWarning(type: CheckType, member: CheckMember): string | null {
  if (!isLeaning(member) || LEAN_CHECKED_KINDS.includes(type.kind)) return null;
  const how = member.outOfPlumbMm != null && member.outOfPlumbMm > 0 ? `${Math.round(member.outOfPlumbMm)} mm` : `${Number(member.outOfPlumbDeg!.toFixed(2))}°`;
  return `Measured ${how} out of plumb: the out-of-plumb check covers EN 1065 props and steel sections only, so this capacity is for ${KIND_WORDS[type.kind]} standing plumb. Re-plumb it, or have a temporary works designer assess the lean.`;
}

export type CheckOutcome = {
  method: string;
  inputs: Record<string, unknown>;
  result: Record<string, unknown>;
  capacityN: number | null;
  utilisation: number | null;
  pass: boolean;
  engineVersion: string;
};

/**
 * The load the base-bearing check compares: on the ground, the working load against an allowable
 * pressure; on a slab, the design load for punching (EN 1990 Table A1.2(B) γ = 1.5 for EN 1992-1-1,
 * ASCE 7 §2.3 1.6 for ACI 318 — the same single factor as the member's check, common practice).
 */
export function bearingRequest(base: NonNullable<CheckMember["base"]>, loadN: number, site: CheckSite) {
  const onSlab = base.slabDepthMm !== undefined || base.slabEffectiveDepthMm !== undefined;
  const punchingCode = base.punchingCode ?? (site.designCode === "en1993" ? "en1992" : "aci318");
  const loadFactor = onSlab ? (punchingCode === "en1992" ? 1.5 : 1.6) : 1.0;
  const request: Record<string, unknown> = { method: "base-bearing", ...base, ...(onSlab ? { punchingCode } : {}), loadN: loadN * loadFactor };
  return { request, loadFactor };
}

/** The stored check snapshot's engine fields (the caller adds member, reason, author). */
export function checkSnapshot(outcome: CheckOutcome, extraInputs?: Record<string, unknown>) {
  return {
    method: outcome.method,
    inputs: extraInputs ? { ...outcome.inputs, ...extraInputs } : outcome.inputs,
    result: outcome.result,
    capacityN: outcome.capacityN,
    utilisation: outcome.utilisation,
    pass: outcome.pass,
    engineVersion: outcome.engineVersion,
  };
}

export function runCheck(type: CheckType, member: CheckMember, site: CheckSite): CheckOutcome {
  const { request, basis, loadFactor, loadFactorSource } = buildCheckRequest(type, member, site);
  const result = calculate(request);
  const inputs: Record<string, unknown> = { ...request, workingLoadN: member.loadN, loadFactor, loadFactorSource, basis };
  if (!result.ok) {
    // A member the engine cannot check is not passing: it blocks a permit until it is fixed.
    return {
      method: String(request.method),
      inputs,
      result: result as unknown as Record<string, unknown>,
      capacityN: null,
      utilisation: null,
      pass: false,
      engineVersion: ENGINE_VERSION,
    };
  }
  const lean = leanWarning(type, member);
  if (lean) result.warnings.push(lean);
  const capacityN = result.capacityN ?? null;
  let utilisation = result.utilisation ?? (capacityN === null ? null : (request.loadN as number) / capacityN);
  // A check with no capacity and no utilisation cannot show the member is safe.
  let pass = result.pass ?? (utilisation !== null && utilisation <= 1);
  const stored = result as unknown as Record<string, unknown>;
  if (member.base) {
    // Bearing under the base is part of the member's check: failing bearing fails the member.
    const b = bearingRequest(member.base, member.loadN, site);
    const bearing = calculate(b.request);
    inputs.base = { ...b.request, loadFactor: b.loadFactor };
    stored.bearing = bearing;
    if (!bearing.ok) pass = false;
    else {
      const u = bearing.utilisation ?? null;
      if (u !== null && (utilisation === null || u > utilisation)) utilisation = u;
      pass = pass && bearing.pass === true;
    }
  }
  return {
    method: result.method,
    inputs,
    result: stored,
    capacityN,
    utilisation,
    pass,
    engineVersion: ENGINE_VERSION,
  };
}
