// A stored check as the screens and the API show it. Pure, so the phone can show a check it ran
// itself (offline, provisional) in the same words as the server's.
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
  engineVersion: string;
  createdAt: Date;
};

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
  const inputs = row.inputs as { basis?: string; loadFactor?: number; loadFactorSource?: string; slabLoad?: { warnings?: string[] } };
  const warnings = [...(result.warnings ?? []), ...(inputs.slabLoad?.warnings ?? [])];
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
    engineVersion: row.engineVersion,
    createdAt: row.createdAt,
  };
}
