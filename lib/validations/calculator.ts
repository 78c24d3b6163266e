// The calculator form: text fields as typed (SI or US units), checked for being numbers here;
// the engine checks ranges and combinations and its errors are mapped back onto these fields.
import { z } from "zod";
import { ALL_METHOD_IDS, type EndCondition } from "@/lib/engineering/types";

const num = (label: string) =>
  z
    .string()
    .trim()
    .refine((v) => v === "" || Number.isFinite(Number(v.replace(/,/g, ""))), { message: `${label} must be a number.` });

export const END_OPTIONS: EndCondition[] = ["pinned-pinned", "fixed-pinned", "fixed-fixed", "fixed-free", "fixed-sway", "pinned-sway"];
export const SHAPES = ["chs", "rhs", "rect", "round", "given"] as const;

export const calculatorFormSchema = z.object({
  method: z.enum(ALL_METHOD_IDS),
  units: z.enum(["si", "us"]),
  length: z.string().trim(),
  ends: z.enum(["", ...END_OPTIONS]),
  k: num("K"),
  shape: z.enum(SHAPES),
  d: num("Diameter"),
  t: num("Wall thickness"),
  b: num("Width"),
  h: num("Depth"),
  area: num("Area"),
  iMin: num("Second moment of area"),
  e: num("E"),
  fy: num("Yield strength"),
  steelGrade: z.string(),
  curve: z.enum(["", "a0", "a", "b", "c", "d"]),
  formed: z.enum(["", "hot-finished", "cold-formed"]),
  gammaM1: num("γM1"),
  strengthClass: z.string(),
  timberType: z.enum(["", "solid", "round", "glulam", "lvl"]),
  kmod: num("kmod"),
  gammaM: num("γM"),
  fc0k: num("fc,0,k"),
  e005: num("E0,05"),
  fcStar: num("Fc*"),
  eMin: num("Emin'"),
  c: num("c"),
  propClass: z.enum(["", "A", "B", "C", "D", "E"]),
  maxExtension: num("Maximum extension"),
  minExtension: num("Minimum extension"),
  table: z.string(),
  braces: num("Braces"),
  designBasis: z.enum(["lrfd", "asd"]),
  load: num("Load"),
  hssWeld: z.enum(["", "erw", "saw"]),
  supplierInterpolation: z.enum(["inverse-square", "lower-row"]),
  // out of plumb / raking
  plumbTarget: z.enum(["steel", "prop"]),
  plumbDeg: num("Angle out of plumb"),
  plumbOffset: num("Offset out of plumb"),
  eccentricity: num("Eccentricity"),
  checkCode: z.enum(["en1993", "aisc360"]),
  angle: num("Raker angle"),
  selfWeight: num("Self-weight"),
  // bearing
  basePlateB: num("Base plate width"),
  basePlateL: num("Base plate length"),
  solePlateB: num("Sole plate width"),
  solePlateL: num("Sole plate length"),
  solePlateT: num("Sole plate thickness"),
  allowablePressure: num("Allowable pressure"),
  friction: num("Friction coefficient"),
  soil: z.enum(["", "soft-clay", "firm-clay", "stiff-clay", "loose-sand", "medium-sand", "dense-gravel", "hardcore"]),
  slabEffDepth: num("Slab effective depth"),
  fck: num("Concrete strength"),
  punchingCode: z.enum(["en1992", "aci318"]),
  // back-propping
  shoredLevels: num("Shored levels"),
  slabSelfWeight: num("Slab self-weight"),
  formworkLoad: num("Formwork self-weight"),
  constructionLoad: num("Construction load"),
  cycles: num("Cycles"),
}).superRefine((v, ctx) => {
  // Bearing and the back-propping sequence do not read a member length.
  if (v.length === "" && v.method !== "base-bearing" && v.method !== "backprop-sequence") {
    ctx.addIssue({ code: "custom", path: ["length"], message: "Enter the length (for a prop, its measured extension)." });
  }
});

export type CalculatorForm = z.infer<typeof calculatorFormSchema>;

export const CALCULATOR_DEFAULTS: CalculatorForm = {
  method: "en1065",
  units: "si",
  length: "",
  ends: "",
  k: "",
  shape: "chs",
  d: "",
  t: "",
  b: "",
  h: "",
  area: "",
  iMin: "",
  e: "",
  fy: "",
  steelGrade: "",
  curve: "",
  formed: "",
  gammaM1: "",
  strengthClass: "",
  timberType: "",
  kmod: "",
  gammaM: "",
  fc0k: "",
  e005: "",
  fcStar: "",
  eMin: "",
  c: "",
  propClass: "D",
  maxExtension: "",
  minExtension: "",
  table: "",
  braces: "1",
  designBasis: "lrfd",
  load: "",
  hssWeld: "",
  supplierInterpolation: "inverse-square",
  plumbTarget: "steel",
  plumbDeg: "",
  plumbOffset: "",
  eccentricity: "",
  checkCode: "en1993",
  angle: "",
  selfWeight: "",
  basePlateB: "",
  basePlateL: "",
  solePlateB: "",
  solePlateL: "",
  solePlateT: "",
  allowablePressure: "",
  friction: "",
  soil: "",
  slabEffDepth: "",
  fck: "",
  punchingCode: "en1992",
  shoredLevels: "2",
  slabSelfWeight: "",
  formworkLoad: "",
  constructionLoad: "",
  cycles: "",
};
