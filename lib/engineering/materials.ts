// Material presets with the clause each number comes from. Values whose source
// says "to be confirmed against …" were recalled from the published table and
// could not be re-read from the standard while writing this; the working
// prints that note so a checker confirms them against a copy of the standard.

import type { LoadDuration, ServiceClass, SourceRef, TimberType } from "./types";

/** 1 ksi = 1000 lbf/in² = 1000 × 4.4482216152605 N / 645.16 mm² (exact definitions of lbf and inch). */
export const KSI_TO_MPA = (1000 * 4.4482216152605) / 645.16;

export const E_STEEL_EN_MPA = 210_000; // EN 1993-1-1 §3.2.6(1)
export const E_STEEL_AISC_MPA = 200_000; // AISC 360-16 uses E = 29 000 ksi, stated as 200 000 MPa in its SI text

export interface SteelGrade {
  id: string;
  label: string;
  /** Nominal yield strength for the thinnest range the source lists. */
  fyMpa: number;
  /** Thickness up to which fyMpa applies, and the value beyond it (EN grades only). */
  tLimitMm?: number;
  fyThickMpa?: number;
  /** Yield by thickness from the product standard: [thickness up to (mm), f_y (MPa)], thinnest first. */
  productBands?: readonly (readonly [number, number])[];
  productSource?: SourceRef;
  /** Hollow-section yield where it differs from the shaped value (ASTM A500 round vs rectangular). */
  fyRoundMpa?: number;
  family: "EN" | "ASTM";
  source: SourceRef;
}

const EN_TABLE_3_1: SourceRef = { source: "EN 1993-1-1 Table 3.1", note: "nominal f_y of EN 10025-2, EN 10210-1 and EN 10219-1 steels" };
const EN10025: SourceRef = {
  source: "EN 10025-2:2019 Table 7",
  note: "minimum yield strength ReH by nominal thickness; EN 10210-1 and EN 10219-1 use the same steps to 40 mm",
  toConfirm: "value to be confirmed against EN 10025-2:2019 Table 7",
};
const EN10025_4: SourceRef = { ...EN10025, source: "EN 10025-4 / EN 10025-3", toConfirm: "value to be confirmed against EN 10025-4 and EN 10025-3" };
const BANDS = (a: number, b: number, c: number, d: number, e: number) =>
  [
    [16, a],
    [40, b],
    [63, c],
    [80, d],
    [100, e],
  ] as const;

/** AISC Manual 15th edition Table 2-4 (ASTM specification minimum Fy), with the grade's values as the note. */
const AISC_TABLE_2_4 = (note: string): SourceRef => ({ source: "AISC Steel Construction Manual 15th ed. Table 2-4", note: `ASTM specification minimum Fy: ${note}`, toConfirm: "value to be confirmed against AISC Manual Table 2-4" });

export const STEEL_GRADES: readonly SteelGrade[] = [
  { id: "S235", label: "S235", fyMpa: 235, tLimitMm: 40, fyThickMpa: 215, productBands: BANDS(235, 225, 215, 215, 215), productSource: EN10025, family: "EN", source: EN_TABLE_3_1 },
  { id: "S275", label: "S275", fyMpa: 275, tLimitMm: 40, fyThickMpa: 255, productBands: BANDS(275, 265, 255, 245, 235), productSource: EN10025, family: "EN", source: EN_TABLE_3_1 },
  { id: "S355", label: "S355", fyMpa: 355, tLimitMm: 40, fyThickMpa: 335, productBands: BANDS(355, 345, 335, 325, 315), productSource: EN10025, family: "EN", source: EN_TABLE_3_1 },
  { id: "S420", label: "S420", fyMpa: 420, tLimitMm: 40, fyThickMpa: 390, productBands: BANDS(420, 400, 390, 370, 360), productSource: EN10025_4, family: "EN", source: EN_TABLE_3_1 },
  { id: "S460", label: "S460", fyMpa: 460, tLimitMm: 40, fyThickMpa: 430, productBands: BANDS(460, 440, 430, 410, 400), productSource: EN10025_4, family: "EN", source: EN_TABLE_3_1 },
  { id: "A36", label: "ASTM A36", fyMpa: 36 * KSI_TO_MPA, family: "ASTM", source: AISC_TABLE_2_4("A36 Fy = 36 ksi") },
  { id: "A992", label: "ASTM A992", fyMpa: 50 * KSI_TO_MPA, family: "ASTM", source: AISC_TABLE_2_4("A992 Fy = 50 ksi") },
  {
    id: "A500-B",
    label: "ASTM A500 Gr. B",
    fyMpa: 46 * KSI_TO_MPA,
    fyRoundMpa: 42 * KSI_TO_MPA,
    family: "ASTM",
    source: AISC_TABLE_2_4("A500 Gr. B Fy = 46 ksi rectangular, 42 ksi round"),
  },
  {
    id: "A500-C",
    label: "ASTM A500 Gr. C",
    fyMpa: 50 * KSI_TO_MPA,
    fyRoundMpa: 46 * KSI_TO_MPA,
    family: "ASTM",
    source: AISC_TABLE_2_4("A500 Gr. C Fy = 50 ksi rectangular, 46 ksi round"),
  },
  { id: "A53-B", label: "ASTM A53 Gr. B pipe", fyMpa: 35 * KSI_TO_MPA, family: "ASTM", source: AISC_TABLE_2_4("A53 Gr. B Fy = 35 ksi") },
];

export function findSteelGrade(id: string): SteelGrade | undefined {
  return STEEL_GRADES.find((g) => g.id.toLowerCase() === id.trim().toLowerCase());
}

export interface TimberClass {
  id: string;
  fc0kMpa: number;
  e005Mpa: number;
  timberType: TimberType;
  source: SourceRef;
}

const EN338: SourceRef = { source: "EN 338:2016 Table 1", toConfirm: "value to be confirmed against EN 338:2016 Table 1" };
const EN14080: SourceRef = { source: "EN 14080:2013 Table 5", toConfirm: "value to be confirmed against EN 14080:2013 Table 5" };

export const TIMBER_CLASSES: readonly TimberClass[] = [
  { id: "C14", fc0kMpa: 16, e005Mpa: 4700, timberType: "solid", source: EN338 },
  { id: "C16", fc0kMpa: 17, e005Mpa: 5400, timberType: "solid", source: EN338 },
  { id: "C18", fc0kMpa: 18, e005Mpa: 6000, timberType: "solid", source: EN338 },
  { id: "C20", fc0kMpa: 19, e005Mpa: 6400, timberType: "solid", source: EN338 },
  { id: "C22", fc0kMpa: 20, e005Mpa: 6700, timberType: "solid", source: EN338 },
  { id: "C24", fc0kMpa: 21, e005Mpa: 7400, timberType: "solid", source: EN338 },
  { id: "C27", fc0kMpa: 22, e005Mpa: 7700, timberType: "solid", source: EN338 },
  { id: "C30", fc0kMpa: 24, e005Mpa: 8000, timberType: "solid", source: EN338 },
  { id: "C35", fc0kMpa: 25, e005Mpa: 8700, timberType: "solid", source: EN338 },
  { id: "C40", fc0kMpa: 27, e005Mpa: 9400, timberType: "solid", source: EN338 },
  { id: "C45", fc0kMpa: 29, e005Mpa: 10100, timberType: "solid", source: EN338 },
  { id: "C50", fc0kMpa: 30, e005Mpa: 10700, timberType: "solid", source: EN338 },
  { id: "GL24h", fc0kMpa: 24, e005Mpa: 9600, timberType: "glulam", source: EN14080 },
  { id: "GL28h", fc0kMpa: 28, e005Mpa: 10500, timberType: "glulam", source: EN14080 },
  { id: "GL32h", fc0kMpa: 32, e005Mpa: 11800, timberType: "glulam", source: EN14080 },
];

export function findTimberClass(id: string): TimberClass | undefined {
  return TIMBER_CLASSES.find((c) => c.id.toLowerCase() === id.trim().toLowerCase());
}

/** EN 1995-1-1 Table 3.1, solid timber, glulam and LVL rows. */
export const KMOD: Record<ServiceClass, Record<LoadDuration, number>> = {
  1: { permanent: 0.6, "long-term": 0.7, "medium-term": 0.8, "short-term": 0.9, instantaneous: 1.1 },
  2: { permanent: 0.6, "long-term": 0.7, "medium-term": 0.8, "short-term": 0.9, instantaneous: 1.1 },
  3: { permanent: 0.5, "long-term": 0.55, "medium-term": 0.65, "short-term": 0.7, instantaneous: 0.9 },
};

/** EN 1995-1-1 Table 2.3 recommended γM (a National Annex may set others). */
export const GAMMA_M_TIMBER: Record<TimberType, number> = { solid: 1.3, round: 1.3, glulam: 1.25, lvl: 1.2 };

/** EN 1995-1-1 §6.3.2 eq. (6.29). */
export const BETA_C: Record<TimberType, number> = { solid: 0.2, round: 0.2, glulam: 0.1, lvl: 0.1 };

/** NDS 2018 §3.7.1 c: sawn lumber 0.8, round timber poles and piles 0.85, glulam and SCL 0.9. */
export const NDS_C: Record<TimberType, number> = { solid: 0.8, round: 0.85, glulam: 0.9, lvl: 0.9 };
