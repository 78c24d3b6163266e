// Runs the engine for one member and returns what the register stores as its check.
import { calculate, ENGINE_VERSION } from "@/lib/engineering";
import { buildCheckRequest, type CheckMember, type CheckSite, type CheckType } from "./check-request";

export type CheckOutcome = {
  method: string;
  inputs: Record<string, unknown>;
  result: Record<string, unknown>;
  capacityN: number | null;
  utilisation: number | null;
  pass: boolean;
  engineVersion: string;
};

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
  const inputs = { ...request, workingLoadN: member.loadN, loadFactor, loadFactorSource, basis };
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
  const capacityN = result.capacityN ?? null;
  const utilisation = result.utilisation ?? (capacityN === null ? null : (request.loadN as number) / capacityN);
  return {
    method: result.method,
    inputs,
    result: result as unknown as Record<string, unknown>,
    capacityN,
    utilisation,
    // A check with no capacity and no utilisation cannot show the member is safe.
    pass: result.pass ?? (utilisation !== null && utilisation <= 1),
    engineVersion: ENGINE_VERSION,
  };
}
