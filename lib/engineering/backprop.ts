// Loads on slabs and props through the casting cycle of a multi-storey frame
// with n levels of props, by the simplified method of Grundy & Kabaila (1963),
// "Construction loads on slabs with shored formwork in multistory buildings",
// ACI Journal 60(12). Assumptions of the method, stated in the working:
//  1. props are infinitely stiff axially, so every slab joined by props
//     deflects by the same amount under a new load;
//  2. all slabs have the same flexural stiffness, so they share a load
//     increment equally;
//  3. the ground under the first level of props is rigid;
//  4. loads are expressed as multiples of one slab's self-weight.
// The cycle here is the paper's simple shoring: strike the lowest level of
// props, lift it to the top, cast the next slab.

import { fieldError, fmt, step } from "./steps";
import type { BackpropStage, CalculationRequest, FieldError, MethodOutcome, Step } from "./types";

export const GK_SOURCE = { source: "Grundy & Kabaila 1963, ACI Journal 60(12)", note: "simplified method" };

export interface BackpropOptions {
  shoredLevels: number;
  cycles: number;
  /** Extra dead load of formwork at casting, as a fraction of the slab self-weight. */
  formworkRatio: number;
  /** Construction load while casting, as a fraction of the slab self-weight (removed after casting). */
  constructionRatio: number;
}

/**
 * The sequence itself (raw numbers in, ratios out). Slab loads are listed top
 * (newest hardened slab) first; prop levels top (under the newest slab) first.
 */
export function backpropSequence(o: BackpropOptions): { stages: BackpropStage[]; maxSlab: number; maxProp: number } {
  // Index 0 is the first slab above the ground. For slab j: load[j] is the load its own bending carries,
  // weight[j] its weight (1, plus formwork while it is propped, plus construction load while cast),
  // props[j] the force in the props under it (null once struck). Equilibrium of each slab:
  // load[j] = weight[j] + props[j + 1] − props[j].
  const load: number[] = [];
  const weight: number[] = [];
  const props: (number | null)[] = [];
  let wet = false;
  const stages: BackpropStage[] = [];
  let maxSlab = 0;
  let maxProp = 0;

  const propsDown = () => {
    // Props from the top down, from each slab's equilibrium.
    for (let j = load.length - 1; j >= 0; j--) {
      if (props[j] === null) continue;
      const above = j + 1 < load.length && props[j + 1] !== null ? (props[j + 1] as number) : 0;
      props[j] = weight[j] + above - load[j];
    }
  };
  /** Shares whatever the stack of propped slabs above the lowest struck level must now carry equally among its hardened slabs. */
  const share = () => {
    const top = load.length - 1;
    // Slab j − 1 and slab j are joined while the props under slab j are in place.
    let b = top;
    while (b > 0 && props[b] !== null) b--;
    const grounded = b === 0 && props[0] !== null;
    if (!grounded) {
      const hardenedTop = wet ? top - 1 : top;
      let total = 0;
      for (let j = b; j <= top; j++) total += weight[j];
      // Props under slab b are struck (or b is the first slab on struck props): the stack carries its weight alone.
      let carried = 0;
      for (let j = b; j <= hardenedTop; j++) carried += load[j];
      const m = hardenedTop - b + 1;
      if (m > 0) for (let j = b; j <= hardenedTop; j++) load[j] += (total - carried) / m;
    }
    propsDown();
  };
  const snapshot = (label: string) => {
    const hardenedTop = wet ? load.length - 2 : load.length - 1;
    const s: number[] = [];
    for (let j = hardenedTop; j >= 0; j--) s.push(load[j]);
    const p: number[] = [];
    for (let j = props.length - 1; j >= 0; j--) if (props[j] !== null) p.push(props[j] as number);
    for (const v of s) if (v > maxSlab) maxSlab = v;
    for (const v of p) if (v > maxProp) maxProp = v;
    stages.push({ label, slabLoadRatios: s, propLoadRatios: p });
  };

  for (let cycle = 1; cycle <= o.cycles; cycle++) {
    const live = props.filter((p) => p !== null).length;
    if (live >= o.shoredLevels) {
      let b = 0;
      while (props[b] === null) b++;
      props[b] = null;
      weight[b] = 1; // its formwork is struck with the props
      if (b > 0) load[b - 1] = weight[b - 1] - (props[b - 1] ?? 0);
      share();
      snapshot(`Cycle ${cycle}: props under slab ${b + 1} struck and lifted to the top`);
    }
    load.push(0);
    weight.push(1 + o.formworkRatio + o.constructionRatio);
    props.push(0);
    wet = true;
    share();
    snapshot(`Cycle ${cycle}: slab ${load.length} cast`);
    if (o.constructionRatio > 0) {
      weight[load.length - 1] -= o.constructionRatio;
      share();
      snapshot(`Cycle ${cycle}: construction load off slab ${load.length}`);
    }
    wet = false; // the slab hardens before the next cycle and shares later loads
  }
  return { stages, maxSlab, maxProp };
}

export function runBackpropSequence(req: CalculationRequest): MethodOutcome {
  const errors: FieldError[] = [];
  if (req.shoredLevels === undefined) errors.push(fieldError("shoredLevels", "Give the number of levels of props in use at once (1 to 6)."));
  if (req.slabSelfWeightKPa === undefined) errors.push(fieldError("slabSelfWeightKPa", "Give the self-weight of one slab in kPa (kN/m²), e.g. 6.0 for a 250 mm slab."));
  if (errors.length || req.shoredLevels === undefined || req.slabSelfWeightKPa === undefined) return { ok: false, errors };
  const n = req.shoredLevels;
  const w = req.slabSelfWeightKPa;
  const f = req.formworkKPa ?? 0;
  const c = req.constructionKPa ?? 0;
  const cycles = req.cycles ?? 3 * n + 4;
  if (cycles < n + 1) {
    return { ok: false, errors: [fieldError("cycles", `With ${n} levels of props the loads settle only after at least ${n + 1} cycles (got ${cycles}).`)] };
  }
  const r = backpropSequence({ shoredLevels: n, cycles, formworkRatio: f / w, constructionRatio: c / w });
  const steps: Step[] = [
    step("Levels of props in use at once", "n", n, "", "User input"),
    step("Slab self-weight", "w", w, "kPa", "User input"),
    step(req.formworkKPa !== undefined ? "Formwork self-weight (given)" : "Formwork self-weight neglected, as in the simplified method", "w_f", f, "kPa", req.formworkKPa !== undefined ? "User input" : GK_SOURCE),
    step(req.constructionKPa !== undefined ? "Construction load while casting (given)" : "Construction load while casting not included", "q_c", c, "kPa", req.constructionKPa !== undefined ? "User input" : GK_SOURCE),
    step("Casting cycles followed", "cycles", cycles, "", req.cycles !== undefined ? "User input" : { source: "Common practice", note: "3n + 4 cycles: the largest ratios have been reached by then" }),
    step("Assumptions: props axially rigid, slabs of equal stiffness share each load increment, ground rigid", "—", "simplified method", "", GK_SOURCE),
    step("Largest slab load, multiple of one slab's self-weight", "max S/w", r.maxSlab, "", GK_SOURCE),
    step("Largest slab load", "max S", r.maxSlab * w, "kPa", GK_SOURCE),
    step("Largest prop level load, multiple of one slab's self-weight", "max P/w", r.maxProp, "", GK_SOURCE),
    step("Largest prop level load", "max P", r.maxProp * w, "kPa", GK_SOURCE),
  ];
  const warnings = [
    `The youngest slabs carry up to ${fmt(r.maxSlab)} times their own weight before they reach full strength; check each slab's strength at its age (a designer's check, not made here).`,
    "The simplified method ignores the different stiffness of young concrete and the shortening of the props; refined analyses (e.g. Liu, Chen & Bowman 1985) give somewhat different ratios.",
  ];
  return {
    ok: true,
    value: {
      basis: "load-ratio",
      loadBasis: "Ratios are multiples of one slab's self-weight; multiply by the slab's self-weight per m² and the tributary area of a prop for the load on each prop level.",
      stages: r.stages,
      maxSlabLoadRatio: r.maxSlab,
      maxPropLoadRatio: r.maxProp,
      steps,
      warnings,
    },
  };
}
