// Names in the seeded demo data that tests look things up by (integration and e2e alike).
export const WHARF = "Wexcombe Wharf — Block B";
export const ORCHARD = "Orchard Row Basement";
export const L2 = "Level 2 slab, bays 1–4";
export const BP = "TW-WXW-014";
