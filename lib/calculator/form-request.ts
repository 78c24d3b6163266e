// Turns the calculator form (SI or US units, as typed) into an engine request in N, mm, MPa,
// and maps the engine's field errors (request paths) back onto the form's fields.
import { parseLength, toKnPerM2, toMm, toMpa, toN } from "@/lib/units";
import type { CalculatorForm } from "@/lib/validations/calculator";

export type UnitLabels = {
  length: string;
  dim: string;
  force: string;
  stress: string;
  timberStress: string;
  area: string;
  inertia: string;
  pressure: string;
  concrete: string;
  lineLoad: string;
};

export function unitLabels(units: "si" | "us"): UnitLabels {
  return units === "us"
    ? { length: "ft-in", dim: "in", force: "kip", stress: "ksi", timberStress: "ksi", area: "in²", inertia: "in⁴", pressure: "psf", concrete: "ksi", lineLoad: "lb/ft" }
    : { length: "mm", dim: "mm", force: "kN", stress: "MPa", timberStress: "MPa", area: "mm²", inertia: "mm⁴", pressure: "kPa", concrete: "MPa", lineLoad: "N/m" };
}

/** Methods whose member is a steel section (the new combined checks included). */
const STEEL_CHECKS = ["out-of-plumb", "raking-combined"];

const numberOf = (s: string) => Number(s.replace(/,/g, ""));

type Built = { request: Record<string, unknown>; fieldErrors: Partial<Record<keyof CalculatorForm, string>> };

export function formToRequest(f: CalculatorForm): Built {
  const us = f.units === "us";
  const fieldErrors: Built["fieldErrors"] = {};
  const r: Record<string, unknown> = { method: f.method };
  const dim = (s: string) => (us ? toMm(numberOf(s), "in") : numberOf(s));
  const force = (s: string) => (us ? toN(numberOf(s), "kip") : toN(numberOf(s), "kN"));
  const steelStress = (s: string) => (us ? toMpa(numberOf(s), "ksi") : numberOf(s));
  // One unit family under US: every stress and modulus is in ksi, timber and concrete included.
  const timberStress = (s: string) => (us ? toMpa(numberOf(s), "ksi") : numberOf(s));
  const set = (key: string, text: string, convert: (s: string) => number) => {
    if (text.trim() !== "") r[key] = convert(text);
  };

  const pressure = (s: string) => (us ? toKnPerM2(numberOf(s), "psf") : numberOf(s));
  const concrete = (s: string) => (us ? toMpa(numberOf(s), "ksi") : numberOf(s));
  // lb/ft → N/m: 1 lbf per 304.8 mm
  const lineLoad = (s: string) => (us ? (toN(numberOf(s), "lbf") * 1000) / 304.8 : numberOf(s));
  const plumbProp = f.method === "out-of-plumb" && f.plumbTarget === "prop";

  const lengthless = f.method === "base-bearing" || f.method === "backprop-sequence";
  if (!lengthless) {
    const len = parseLength(f.length, us ? "in" : "mm");
    if (len.ok) r.lengthMm = len.value;
    else fieldErrors.length = len.message;
  }

  const usesSection = !["en1065", "supplier-table", "base-bearing", "backprop-sequence"].includes(f.method) && !plumbProp;
  if (usesSection) {
    if (f.ends) r.ends = f.ends;
    set("k", f.k, numberOf);
    const s: Record<string, unknown> = { shape: f.shape };
    if (f.shape === "chs") Object.assign(s, { dMm: dim(f.d || "NaN"), tMm: dim(f.t || "NaN") });
    if (f.shape === "rhs") Object.assign(s, { bMm: dim(f.b || "NaN"), hMm: dim(f.h || "NaN"), tMm: dim(f.t || "NaN") });
    if (f.shape === "rect") Object.assign(s, { bMm: dim(f.b || "NaN"), hMm: dim(f.h || "NaN") });
    if (f.shape === "round") Object.assign(s, { dMm: dim(f.d || "NaN") });
    if (f.shape === "given")
      Object.assign(s, {
        areaMm2: us ? numberOf(f.area || "NaN") * 25.4 ** 2 : numberOf(f.area || "NaN"),
        iMinMm4: us ? numberOf(f.iMin || "NaN") * 25.4 ** 4 : numberOf(f.iMin || "NaN"),
      });
    // Empty dimensions become NaN so the engine names the missing field in its own words.
    for (const [k, v] of Object.entries(s)) if (typeof v === "number" && Number.isNaN(v)) delete s[k];
    // Point braces need no section: leave it out when none of its sizes were typed.
    if (!(f.method === "point-brace" && Object.keys(s).length === 1)) r.section = s;
  }
  if (["euler", "en1993", "aisc360-lrfd", "aisc360-asd", "point-brace"].includes(f.method)) {
    set("eMpa", f.e, steelStress);
  }
  if (["en1993", "aisc360-lrfd", "aisc360-asd"].includes(f.method) || (STEEL_CHECKS.includes(f.method) && !plumbProp)) {
    set("fyMpa", f.fy, steelStress);
    if (f.steelGrade && f.fy.trim() === "") r.steelGrade = f.steelGrade;
    if (f.hssWeld && (f.method.startsWith("aisc") || f.checkCode === "aisc360")) r.hssWeld = f.hssWeld;
  }
  if (STEEL_CHECKS.includes(f.method)) {
    if (!plumbProp) {
      r.plumbCode = f.checkCode;
      if (f.checkCode === "aisc360") r.designBasis = f.designBasis;
      if (f.formed) r.formed = f.formed;
    }
    set("eccentricityMm", f.eccentricity, dim);
  }
  if (f.method === "out-of-plumb") {
    set("outOfPlumbDeg", f.plumbDeg, numberOf);
    set("outOfPlumbMm", f.plumbOffset, dim);
    if (plumbProp) {
      if (f.propClass) r.propClass = f.propClass;
      set("maxExtensionMm", f.maxExtension, dim);
      set("minExtensionMm", f.minExtension, dim);
    }
  }
  if (f.method === "raking-combined") {
    set("angleDeg", f.angle, numberOf);
    set("selfWeightNPerM", f.selfWeight, lineLoad);
  }
  if (f.method === "base-bearing") {
    // A leaning prop: its angle, or the offset of its head over its base with its length.
    set("outOfPlumbDeg", f.plumbDeg, numberOf);
    set("outOfPlumbMm", f.plumbOffset, dim);
    set("frictionCoefficient", f.friction, numberOf);
    if (f.length.trim() !== "") {
      const len = parseLength(f.length, us ? "in" : "mm");
      if (len.ok) r.lengthMm = len.value;
      else fieldErrors.length = len.message;
    }
    set("basePlateBMm", f.basePlateB, dim);
    set("basePlateLMm", f.basePlateL, dim);
    set("solePlateBMm", f.solePlateB, dim);
    set("solePlateLMm", f.solePlateL, dim);
    set("solePlateTMm", f.solePlateT, dim);
    set("allowablePressureKPa", f.allowablePressure, pressure);
    if (f.soil) r.soil = f.soil;
    set("slabEffectiveDepthMm", f.slabEffDepth, dim);
    set("fckMpa", f.fck, concrete);
    if (f.slabEffDepth.trim() !== "") r.punchingCode = f.punchingCode;
  }
  if (f.method === "backprop-sequence") {
    set("shoredLevels", f.shoredLevels, numberOf);
    set("slabSelfWeightKPa", f.slabSelfWeight, pressure);
    set("formworkKPa", f.formworkLoad, pressure);
    set("constructionKPa", f.constructionLoad, pressure);
    set("cycles", f.cycles, numberOf);
  }
  if (f.method === "en1993") {
    if (f.curve) r.curve = f.curve;
    if (f.formed) r.formed = f.formed;
    set("gammaM1", f.gammaM1, numberOf);
  }
  if (f.method === "en1995") {
    if (f.strengthClass && f.fc0k.trim() === "") r.strengthClass = f.strengthClass;
    set("fc0kMpa", f.fc0k, timberStress);
    set("e005Mpa", f.e005, timberStress);
    set("kmod", f.kmod, numberOf);
    set("gammaM", f.gammaM, numberOf);
    if (f.timberType) r.timberType = f.timberType;
  }
  if (f.method === "nds") {
    set("fcStarMpa", f.fcStar, timberStress);
    set("eMinMpa", f.eMin, timberStress);
    set("c", f.c, numberOf);
    if (f.timberType) r.timberType = f.timberType;
  }
  if (f.method === "en1065") {
    if (f.propClass) r.propClass = f.propClass;
    set("maxExtensionMm", f.maxExtension, dim);
    set("minExtensionMm", f.minExtension, dim);
  }
  if (f.method === "supplier-table") {
    r.supplierInterpolation = f.supplierInterpolation;
    const rows: { lengthMm: number; safeLoadN: number }[] = [];
    const lines = f.table.split(/\r?\n/).map((l) => l.trim()).filter(Boolean);
    lines.forEach((line, i) => {
      const parts = line.split(/[,;\t ]+/).filter(Boolean);
      if (parts.length !== 2 || parts.some((p) => !Number.isFinite(numberOf(p)))) {
        fieldErrors.table ??= `Line ${i + 1} ("${line}") must be two numbers: length and safe load.`;
        return;
      }
      rows.push({ lengthMm: dim(parts[0]!), safeLoadN: force(parts[1]!) });
    });
    r.table = rows;
  }
  if (f.method === "point-brace") {
    set("braces", f.braces, numberOf);
    r.designBasis = f.designBasis;
  }
  if (f.method !== "backprop-sequence") set("loadN", f.load, force);
  return { request: r, fieldErrors };
}

const PATH_TO_FIELD: Record<string, keyof CalculatorForm> = {
  lengthMm: "length",
  k: "k",
  ends: "ends",
  section: "shape",
  "section.shape": "shape",
  "section.dMm": "d",
  "section.tMm": "t",
  "section.bMm": "b",
  "section.hMm": "h",
  "section.areaMm2": "area",
  "section.iMinMm4": "iMin",
  eMpa: "e",
  fyMpa: "fy",
  steelGrade: "steelGrade",
  curve: "curve",
  formed: "formed",
  gammaM1: "gammaM1",
  strengthClass: "strengthClass",
  timberType: "timberType",
  kmod: "kmod",
  gammaM: "gammaM",
  fc0kMpa: "fc0k",
  e005Mpa: "e005",
  fcStarMpa: "fcStar",
  eMinMpa: "eMin",
  c: "c",
  propClass: "propClass",
  maxExtensionMm: "maxExtension",
  minExtensionMm: "minExtension",
  braces: "braces",
  designBasis: "designBasis",
  loadN: "load",
  hssWeld: "hssWeld",
  outOfPlumbDeg: "plumbDeg",
  outOfPlumbMm: "plumbOffset",
  eccentricityMm: "eccentricity",
  plumbCode: "checkCode",
  angleDeg: "angle",
  selfWeightNPerM: "selfWeight",
  basePlateBMm: "basePlateB",
  basePlateLMm: "basePlateL",
  solePlateBMm: "solePlateB",
  solePlateLMm: "solePlateL",
  solePlateTMm: "solePlateT",
  allowablePressureKPa: "allowablePressure",
  frictionCoefficient: "friction",
  soil: "soil",
  slabEffectiveDepthMm: "slabEffDepth",
  slabDepthMm: "slabEffDepth",
  fckMpa: "fck",
  punchingCode: "punchingCode",
  shoredLevels: "shoredLevels",
  slabSelfWeightKPa: "slabSelfWeight",
  formworkKPa: "formworkLoad",
  constructionKPa: "constructionLoad",
  cycles: "cycles",
  supplierInterpolation: "supplierInterpolation",
};

/** The form field an engine error belongs to, or null for the form as a whole. */
export function fieldForPath(path: string): keyof CalculatorForm | null {
  if (path.startsWith("table")) return "table";
  return PATH_TO_FIELD[path] ?? null;
}
