// The capacity check the phone runs itself when a member is saved with no signal: the same engine
// and the same request the server builds (check-request.ts, run-check.ts), from the library and
// schemes the page was loaded with. Provisional: the server checks the member again when it
// arrives, and that check is the one stored.
import type { CheckSite, CheckType } from "./check-request";
import { checkView, type CheckView } from "./check-view";
import { checkSnapshot, runCheck } from "./run-check";
import { deriveBackpropLoad, type BackpropScheme } from "./backprop-load";
import { deriveSlabLoad, type SlabScheme } from "./slab-load";

export type OfflineCheckData = {
  site: CheckSite;
  types: (CheckType & { id: string })[];
  schemes: (SlabScheme & { backprop?: BackpropScheme["backprop"]; id: string })[];
};

type MemberInput = {
  memberTypeId?: unknown;
  extensionMm?: unknown;
  endConditions?: unknown;
  loadSource?: unknown;
  loadN?: unknown;
  schemeId?: unknown;
  spacingXMm?: unknown;
  spacingYMm?: unknown;
  level?: unknown;
};

const num = (v: unknown) => (typeof v === "number" && Number.isFinite(v) ? v : null);

/** The phone's own check, or null when this phone cannot run it (type or slab data not here): the server's check then stands alone. */
export function provisionalCheck(input: MemberInput, data: OfflineCheckData): { check: CheckView; loadN: number } | null {
  const type = data.types.find((t) => t.id === input.memberTypeId);
  const extensionMm = num(input.extensionMm);
  if (!type || extensionMm === null) return null;
  let loadN = num(input.loadN);
  if (input.loadSource === "slab") {
    const scheme = data.schemes.find((s) => s.id === input.schemeId);
    const x = num(input.spacingXMm);
    const y = num(input.spacingYMm);
    if (!scheme || x === null || y === null) return null;
    const derived = deriveSlabLoad(scheme, x, y);
    if (!derived.ok) return null;
    loadN = derived.info.loadPerMemberN;
  }
  if (input.loadSource === "backprop") {
    const scheme = data.schemes.find((s) => s.id === input.schemeId);
    const x = num(input.spacingXMm);
    const y = num(input.spacingYMm);
    const level = num(input.level);
    if (!scheme || x === null || y === null || level === null) return null;
    const derived = deriveBackpropLoad({ ...scheme, backprop: scheme.backprop ?? null }, level, x, y);
    if (!derived.ok) return null;
    loadN = derived.info.loadPerMemberN;
  }
  if (loadN === null) return null;
  const endConditions = (typeof input.endConditions === "string" ? input.endConditions : "pinned-pinned") as Parameters<typeof runCheck>[1]["endConditions"];
  const outcome = runCheck(type, { extensionMm, endConditions, loadN }, data.site);
  return { check: checkView({ id: "provisional", ...checkSnapshot(outcome), createdAt: new Date() }), loadN };
}
