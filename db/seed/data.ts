// The demo scenario: an invented contractor with two invented sites, and a second invented
// organisation that exists only to prove that one organisation never sees another's data.
export const DEMO_PASSWORD = "strutwise-demo";

export const DEMO_ORG = { name: "Larkfield Frame & Civils Ltd", slug: "larkfield" };
export const OTHER_ORG = { name: "Brackenfield Builders", slug: "brackenfield" };

export const DEMO_USERS = [
  { email: "admin@demo.example", name: "Daniel Reyes", role: "admin", orgAdmin: true },
  { email: "coordinator@demo.example", name: "Priya Natarajan", role: "coordinator" },
  { email: "engineer@demo.example", name: "Tomasz Wilk", role: "engineer" },
  { email: "supervisor@demo.example", name: "Grace Okafor", role: "supervisor" },
  { email: "designer@demo.example", name: "Hamish Doyle", role: "designer" },
  { email: "manager@demo.example", name: "Aoife Brennan", role: "manager" },
] as const;

export const OTHER_USERS = [{ email: "admin@other.example", name: "Lena Sorby", role: "admin", orgAdmin: true }] as const;

export const DEMO_SITES = [
  {
    key: "wharf",
    name: "Wexcombe Wharf — Block B",
    code: "WXW-B",
    address: "Wharf Road, Wexcombe",
    zones: [
      { key: "l1", name: "Level 1 slab, bays 1–4", level: "L1", grid: "A–D / 1–4", area: "Residential core" },
      { key: "l2", name: "Level 2 slab, bays 1–4", level: "L2", grid: "A–D / 1–4", area: "Residential core" },
      { key: "tb", name: "Level 2 transfer beam", level: "L2", grid: "C / 2–3", area: "Podium" },
      { key: "l3", name: "Level 3 slab, bays 5–7", level: "L3", grid: "D–F / 5–7", area: "East wing" },
    ],
    schemes: [
      { key: "bp", reference: "TW-WXW-014", title: "Back-propping L1 under L2 pour", category: 2, slabThicknessMm: 250, spacingMm: 1200, designLoadN: 24000, zone: "l1" },
      { key: "fw", reference: "TW-WXW-021", title: "Transfer beam falsework", category: 3, slabThicknessMm: 900, spacingMm: 900, designLoadN: 60000, zone: "tb" },
      { key: "l3", reference: "TW-WXW-030", title: "L3 slab soffit propping", category: 1, slabThicknessMm: 225, spacingMm: 1200, designLoadN: 22000, zone: "l3" },
    ],
  },
  {
    key: "orchard",
    name: "Orchard Row Basement",
    code: "ORB",
    address: "Orchard Row, Halbury",
    zones: [
      { key: "nw", name: "North retaining wall", level: "B1", grid: "1–6 / A", area: "Basement perimeter" },
      { key: "ramp", name: "Ramp excavation", level: "B1", grid: "6–8 / A–C", area: "Car park ramp" },
      { key: "pit", name: "Lift pit", level: "B2", grid: "3 / B", area: "Core" },
    ],
    schemes: [
      { key: "rs", reference: "TW-ORB-003", title: "Raking shores to north wall", category: 2, slabThicknessMm: null, spacingMm: 2400, designLoadN: 45000, zone: "nw" },
      { key: "ts", reference: "TW-ORB-007", title: "Trench support to lift pit", category: 1, slabThicknessMm: null, spacingMm: 1500, designLoadN: 20000, zone: "pit" },
    ],
  },
] as const;

export const OTHER_SITE = { name: "Tanner's Yard", code: "TY-1", address: "Tanner's Yard, Crossmoor" };

/** The organisation's member library. Supplier tables are invented for the demo. */
export const DEMO_MEMBER_TYPES = [
  { key: "propD", name: "EN 1065 class D prop, 1.98–3.35 m", kind: "en1065-prop", supplier: "Demo hire stock", params: { propClass: "D" }, min: 1980, max: 3350 },
  { key: "propB", name: "EN 1065 class B prop, 1.75–3.12 m", kind: "en1065-prop", supplier: "Demo hire stock", params: { propClass: "B" }, min: 1750, max: 3120 },
  { key: "propE", name: "EN 1065 class E prop, 2.50–4.00 m", kind: "en1065-prop", supplier: "Demo hire stock", params: { propClass: "E" }, min: 2500, max: 4000 },
  {
    key: "heavy",
    name: "Heavy-duty shore HD60 (supplier table)",
    kind: "supplier-table",
    supplier: "Invented supplier table for the demo",
    params: {
      table: [
        { lengthMm: 1500, safeLoadN: 100000 },
        { lengthMm: 2500, safeLoadN: 85000 },
        { lengthMm: 3500, safeLoadN: 62000 },
        { lengthMm: 4500, safeLoadN: 41000 },
      ],
    },
    min: 1500,
    max: 4500,
  },
  {
    key: "chs",
    name: "CHS 168.3×6.3 S355 raking strut",
    kind: "steel-section",
    supplier: "Fabricated",
    params: { section: { shape: "chs", dMm: 168.3, tMm: 6.3 }, fyMpa: 355, grade: "S355", formed: "hot-finished" },
    min: null,
    max: null,
  },
  {
    key: "timber",
    name: "Timber post 150×150 C24",
    kind: "timber-section",
    supplier: "Site stock",
    params: { section: { shape: "rect", bMm: 150, hMm: 150 }, strengthClass: "C24", timberType: "solid" },
    min: null,
    max: null,
  },
  {
    key: "trench",
    name: "Trench strut size 2 (supplier table)",
    kind: "trench-strut",
    supplier: "Invented supplier table for the demo",
    params: {
      table: [
        { lengthMm: 700, safeLoadN: 40000 },
        { lengthMm: 1000, safeLoadN: 36000 },
        { lengthMm: 1300, safeLoadN: 30000 },
        { lengthMm: 1600, safeLoadN: 22000 },
      ],
    },
    min: 700,
    max: 1600,
  },
] as const;
