// A stored check as the screens and the API show it. Pure, so the phone can show a check it ran
// itself (offline, provisional) in the same words as the server's.
import type { Step } from "@/lib/engineering";

export type CheckView = {
  id: string;
  capacityN: number | null;
  utilisation: number | null;
  pass: boolean;
  method: string;
  basis: string;
  /** Factor applied to the working load before comparing it with the capacity, and why. */
  loadFactor: number;
  loadFactorSource: string;
  /** The engine's statement of what the capacity is compared with. */
  loadBasis: string | null;
  warnings: string[];
  errors?: { field: string; message: string }[];
  /** Bearing under the member's base, when the member carries one: its own pass, utilisation and working. */
  bearing?: BearingView;
  engineVersion: string;
  createdAt: Date;
};

type BearingView = {
  pass: boolean;
  utilisation: number | null;
  /** Load the bearing check used (working load on the ground, design load on a slab), N, and its factor. */
  loadN: number | null;
  loadFactor: number;
  steps: Step[];
  warnings: string[];
  errors?: { field: string; message: string }[];
};

/** The stored bearing check of a snapshot, for the screen and the API. */
function bearingView(result: Record<string, unknown>, inputs: Record<string, unknown>): BearingView | undefined {
  const b = result.bearing as { ok?: boolean; pass?: boolean; utilisation?: number; steps?: Step[]; warnings?: string[]; errors?: { field: string; message: string }[] } | undefined;
  if (!b) return undefined;
  const base = inputs.base as { loadN?: number; loadFactor?: number } | undefined;
  return {
    pass: b.ok !== false && b.pass === true,
    utilisation: b.utilisation ?? null,
    loadN: typeof base?.loadN === "number" ? base.loadN : null,
    loadFactor: Number(base?.loadFactor ?? 1),
    steps: b.steps ?? [],
    warnings: b.warnings ?? [],
    ...(b.ok === false ? { errors: b.errors ?? [] } : {}),
  };
}

export function checkView(row: {
  id: string;
  capacityN: number | null;
  utilisation: number | null;
  pass: boolean;
  method: string;
  inputs: Record<string, unknown>;
  result: Record<string, unknown>;
  engineVersion: string;
  createdAt: Date;
}): CheckView {
  const result = row.result as { ok?: boolean; warnings?: string[]; errors?: { field: string; message: string }[]; loadBasis?: string; basis?: string };
  const inputs = row.inputs as { basis?: string; loadFactor?: number; loadFactorSource?: string; slabLoad?: { warnings?: string[] }; backpropLoad?: { warnings?: string[] } };
  const warnings = [...(result.warnings ?? []), ...(inputs.slabLoad?.warnings ?? []), ...(inputs.backpropLoad?.warnings ?? [])];
  const bearing = bearingView(row.result, row.inputs);
  return {
    id: row.id,
    capacityN: row.capacityN,
    utilisation: row.utilisation,
    pass: row.pass,
    method: row.method,
    basis: String(result.basis ?? inputs.basis ?? ""),
    loadFactor: Number(inputs.loadFactor ?? 1),
    loadFactorSource: String(inputs.loadFactorSource ?? ""),
    loadBasis: result.loadBasis ?? null,
    warnings,
    ...(result.ok === false ? { errors: result.errors ?? [] } : {}),
    ...(bearing ? { bearing } : {}),
    engineVersion: row.engineVersion,
    createdAt: row.createdAt,
  };
}
