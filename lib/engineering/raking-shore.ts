// Forces and geometry of a single raking shore carrying a horizontal thrust H
// at its head: equilibrium of a pin-ended strut, nothing more. The raker's own
// buckling capacity is a separate check (calculate() at the raker length).

import { z } from "zod";
import { isPlainObject, issuesToErrors, numberSchema, own } from "./request-schema";
import { fmt, step } from "./steps";
import type { FieldError, Step } from "./types";
import { ENGINE_VERSION } from "./version";

export interface RakingShoreGeometry {
  axialForceN: number;
  verticalForceN: number;
  horizontalForceN: number;
  rakerLengthMm: number;
  footDistanceMm: number;
}

/** H at the head, h = head height above the foot bearing, θ from horizontal in degrees. */
export function rakingShoreGeometry(thrustN: number, headHeightMm: number, angleDeg: number): RakingShoreGeometry {
  const th = (angleDeg * Math.PI) / 180;
  const cos = Math.cos(th);
  const sin = Math.sin(th);
  return {
    axialForceN: thrustN / cos,
    verticalForceN: (thrustN * sin) / cos,
    horizontalForceN: thrustN,
    rakerLengthMm: headHeightMm / sin,
    footDistanceMm: (headHeightMm * cos) / sin,
  };
}

const SCHEMA = z.object({
  thrustN: numberSchema({ label: "Horizontal thrust at the head H", unit: "N", min: 0, max: 1e9 }),
  headHeightMm: numberSchema({ label: "Height of the head above the foot bearing h", unit: "mm", max: 100_000 }),
  angleDeg: numberSchema({
    label: "Raker angle from horizontal θ",
    unit: "degrees",
    gt: 0,
    max: 89.999,
    hint: "The angle is measured from the ground, between 0° (flat) and 90° (vertical).",
  }),
});

export type RakingShoreResult =
  | ({ ok: true; engineVersion: string; steps: Step[]; warnings: string[] } & RakingShoreGeometry)
  | { ok: false; errors: FieldError[] };

const STATICS = { source: "Statics", note: "equilibrium of a pin-ended two-force member" };

export function calculateRakingShore(request: unknown): RakingShoreResult {
  try {
    if (!isPlainObject(request)) {
      return { ok: false, errors: [{ field: "", message: "The raking-shore request must be an object with the horizontal thrust at the head (N), the height of the head above the foot (mm) and the raker angle from horizontal (degrees)." }] };
    }
    const input: Record<string, unknown> = {};
    for (const key of Object.keys(SCHEMA.shape)) input[key] = own(request, key);
    const parsed = SCHEMA.safeParse(input);
    if (!parsed.success) return { ok: false, errors: issuesToErrors(parsed.error.issues) };
    const { thrustN, headHeightMm, angleDeg } = parsed.data;
    const g = rakingShoreGeometry(thrustN, headHeightMm, angleDeg);
    const values = Object.values(g);
    if (!values.every(Number.isFinite)) {
      return { ok: false, errors: [{ field: "angleDeg", message: `An angle of ${fmt(angleDeg)}° is too close to vertical for the forces to be computed.` }] };
    }
    const warnings: string[] = [];
    if (angleDeg < 45 || angleDeg > 75) {
      warnings.push(
        `A raker at ${fmt(angleDeg)}° is outside the usual 45°–75° range (common practice): ${angleDeg < 45 ? "a flat raker needs a long foot distance and pushes hard vertically on a low wall plate" : "a steep raker gives little horizontal restraint for its axial force and loads the wall head upwards"}.`,
      );
    }
    const steps: Step[] = [
      step("Horizontal thrust at the head", "H", thrustN, "N", "User input"),
      step("Height of the head above the foot bearing", "h", headHeightMm, "mm", "User input"),
      step("Raker angle from horizontal", "θ", angleDeg, "°", "User input"),
      step("Axial force in the raker F = H/cos θ", "F", g.axialForceN, "N", STATICS),
      step("Vertical component at head and foot V = H·tan θ", "V", g.verticalForceN, "N", STATICS),
      step("Horizontal component at head and foot", "H", g.horizontalForceN, "N", STATICS),
      step("Raker length head to foot L = h/sin θ", "L", g.rakerLengthMm, "mm", "Geometry"),
      step("Foot distance from the wall = h/tan θ", "x", g.footDistanceMm, "mm", "Geometry"),
    ];
    return { ok: true, engineVersion: ENGINE_VERSION, ...g, steps, warnings };
  } catch {
    return { ok: false, errors: [{ field: "", message: "The raking-shore request could not be read; check every value is a number." }] };
  }
}
