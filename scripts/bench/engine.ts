// Throughput of the calculation engine on one core: the raw closed-form
// checks (plain numbers in, number out) and full calculate() calls with
// validation and working steps. Each loop is bounded in time.
//
//   npx tsx scripts/bench/engine.ts

import {
  aiscNominalStrength,
  calculate,
  en1065CharacteristicN,
  en1993BucklingResistance,
  en1995Resistance,
  eulerLoad,
  IMPERFECTION_FACTORS,
  ndsCapacity,
  en1992PunchingStress,
  interpolateTableInverseSquare,
  rhsRoundedSecondMoment,
} from "../../lib/engineering";

export interface BenchRow {
  name: string;
  value: number;
  unit: string;
  goal?: string;
}

const INPUTS = 4096;
const MASK = INPUTS - 1;

/** Deterministic pseudo-random inputs so runs are comparable (mulberry32). */
function rng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function makeInputs() {
  const r = rng(20240601);
  const f = (lo: number, hi: number) => {
    const a = new Float64Array(INPUTS);
    for (let i = 0; i < INPUTS; i++) a[i] = lo + (hi - lo) * r();
    return a;
  };
  return {
    area: f(300, 20000),
    iMin: f(1e5, 5e7),
    length: f(500, 8000),
    fy: f(235, 460),
    e: f(190000, 210000),
    fc0k: f(16, 30),
    e005: f(4700, 10700),
    kmod: f(0.6, 1.1),
    d: f(75, 250),
    fcStar: f(5, 15),
    eMin: f(2500, 6000),
  };
}

type Inputs = ReturnType<typeof makeInputs>;

/** Runs `body(i)` in batches until `ms` has elapsed; returns calls per second. */
function timeLoop(ms: number, body: (i: number) => number): { perSecond: number; sink: number } {
  let sink = 0;
  // Warm-up so the JIT has compiled the body before timing starts.
  for (let i = 0; i < 50_000; i++) sink += body(i & MASK);
  const batch = 20_000;
  let calls = 0;
  const start = process.hrtime.bigint();
  const limit = BigInt(ms) * 1_000_000n;
  let elapsed = 0n;
  while (elapsed < limit) {
    for (let i = 0; i < batch; i++) sink += body((calls + i) & MASK);
    calls += batch;
    elapsed = process.hrtime.bigint() - start;
  }
  return { perSecond: calls / (Number(elapsed) / 1e9), sink };
}

const ALPHA_B = IMPERFECTION_FACTORS.b;
const TABLE_L = Float64Array.from([1750, 2000, 2500, 3000, 3500]);
const TABLE_P = Float64Array.from([35000, 32000, 27000, 22000, 17000]);

function checkRequests(x: Inputs): unknown[] {
  const out: unknown[] = [];
  for (let i = 0; i < 256; i++) {
    const L = Math.round(x.length[i]);
    switch (i % 4) {
      case 0:
        out.push({ method: "out-of-plumb", lengthMm: L, section: { shape: "chs", dMm: 114.3, tMm: 5 }, steelGrade: "S355", loadN: 50000, outOfPlumbDeg: 1 + (i % 3), eccentricityMm: 10 });
        break;
      case 1:
        out.push({ method: "base-bearing", loadN: 20000 + 100 * i, basePlateBMm: 150, basePlateLMm: 150, slabEffectiveDepthMm: 160, fckMpa: 30 });
        break;
      case 2:
        out.push({ method: "raking-combined", lengthMm: 3000 + (L % 3000), angleDeg: 60, section: { shape: "chs", dMm: 168.3, tMm: 6.3 }, fyMpa: 355, loadN: 100000 });
        break;
      default:
        out.push({ method: "backprop-sequence", shoredLevels: 1 + (i % 6), slabSelfWeightKPa: 6 });
    }
  }
  return out;
}

function cores(x: Inputs): Array<[string, (i: number) => number]> {
  return [
    ["euler", (i) => eulerLoad(x.e[i], x.iMin[i], x.length[i])],
    [
      "en1993",
      (i) => en1993BucklingResistance(x.area[i], x.fy[i], eulerLoad(x.e[i], x.iMin[i], x.length[i]), ALPHA_B, 1.0),
    ],
    ["aisc360", (i) => aiscNominalStrength(x.area[i], x.fy[i], x.e[i], x.length[i] / Math.sqrt(x.iMin[i] / x.area[i]))],
    ["en1065", (i) => en1065CharacteristicN("B", 3500, 1750 + (x.length[i] % 1750))],
    [
      "en1995",
      (i) => en1995Resistance(x.d[i] * x.d[i], x.d[i] / Math.sqrt(12), x.length[i], x.fc0k[i], x.e005[i], x.kmod[i], 1.3, 0.2),
    ],
    ["nds", (i) => ndsCapacity(x.d[i] * x.d[i], x.d[i], Math.min(x.length[i], 45 * x.d[i]), x.fcStar[i], x.eMin[i], 0.8)],
    ["supplier table 1/L²", (i) => interpolateTableInverseSquare(TABLE_L, TABLE_P, 1750 + (x.length[i] % 1750))],
    ["rhs rounded corners I", (i) => rhsRoundedSecondMoment(x.d[i], x.d[i], 5, 10, 5)],
    ["punching EN 1992 v_Rd,c", (i) => en1992PunchingStress(100 + (x.d[i] % 200), x.fc0k[i] + 10, 0.005).vRdc],
  ];
}

function requests(x: Inputs): unknown[] {
  const out: unknown[] = [];
  for (let i = 0; i < 256; i++) {
    const L = Math.round(x.length[i]);
    switch (i % 6) {
      case 0:
        out.push({ method: "en1993", lengthMm: L, section: { shape: "chs", dMm: 114.3, tMm: 5 }, steelGrade: "S355", formed: "hot-finished", loadN: 100000 });
        break;
      case 1:
        out.push({ method: "aisc360-lrfd", lengthMm: L, ends: "fixed-pinned", section: { shape: "rhs", bMm: 100, hMm: 100, tMm: 6 }, fyMpa: 345, loadN: 100000 });
        break;
      case 2:
        out.push({ method: "en1065", lengthMm: 2000 + (L % 1500), propClass: "D", maxExtensionMm: 3500, loadN: 15000 });
        break;
      case 3:
        out.push({ method: "en1995", lengthMm: Math.min(L, 4000), section: { shape: "rect", bMm: 100, hMm: 100 }, strengthClass: "C24", loadN: 20000 });
        break;
      case 4:
        out.push({
          method: "supplier-table",
          lengthMm: 1800 + (L % 1700),
          table: [
            { lengthMm: 1750, safeLoadN: 35000 },
            { lengthMm: 2500, safeLoadN: 27000 },
            { lengthMm: 3500, safeLoadN: 17000 },
          ],
          loadN: 15000,
        });
        break;
      default:
        out.push({ method: "euler", lengthMm: L, section: { shape: "chs", dMm: 48.3, tMm: 4 } });
    }
  }
  return out;
}

export async function benchEngine(): Promise<BenchRow[]> {
  const x = makeInputs();
  const rows: BenchRow[] = [];
  let sink = 0;
  const list = cores(x);
  for (const [name, fn] of list) {
    const r = timeLoop(250, fn);
    sink += r.sink;
    rows.push({ name: `engine core ${name} (one core)`, value: Math.round(r.perSecond), unit: "checks/s" });
  }
  // A mixed stream of every core, the figure the goal refers to.
  const n = list.length;
  const fns = list.map(([, fn]) => fn);
  const mixed = timeLoop(1200, (i) => fns[i % n](i));
  sink += mixed.sink;
  rows.unshift({ name: "engine closed-form checks, mixed methods (one core)", value: Math.round(mixed.perSecond), unit: "checks/s", goal: ">= 1000000" });

  const reqs = requests(x);
  let okCount = 0;
  const calc = timeLoop(1500, (i) => {
    const r = calculate(reqs[i & 255]);
    if (r.ok) okCount++;
    return r.ok ? (r.capacityN ?? 0) : 0;
  });
  sink += calc.sink;
  rows.push({ name: "engine calculate() with validation and steps (one core)", value: Math.round(calc.perSecond), unit: "calls/s" });
  const creqs = checkRequests(x);
  const checks = timeLoop(1500, (i) => {
    const r = calculate(creqs[i & 255]);
    if (r.ok) okCount++;
    return r.ok ? (r.utilisation ?? r.maxSlabLoadRatio ?? 0) : 0;
  });
  sink += checks.sink;
  rows.push({ name: "engine calculate() checks around a member (plumb, bearing, raker, back-prop)", value: Math.round(checks.perSecond), unit: "calls/s" });
  if (!Number.isFinite(sink) || okCount === 0) throw new Error("bench produced no valid results");
  return rows;
}

// Run standalone only when this file is the entry point, not when imported by scripts/bench.ts.
if (/scripts[\\/]bench[\\/]engine\.ts$/.test(process.argv[1] ?? "")) {
  benchEngine().then(
    (rows) => {
      for (const r of rows) console.log(`${r.name.padEnd(58)} ${String(r.value).padStart(12)} ${r.unit}${r.goal ? `   (goal ${r.goal})` : ""}`);
    },
    (err: unknown) => {
      console.error(err);
      process.exitCode = 1;
    },
  );
}
