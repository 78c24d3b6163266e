// The ground types of the base-bearing check's common-practice table (values in base-bearing.ts).
export const SOIL_IDS = ["soft-clay", "firm-clay", "stiff-clay", "loose-sand", "medium-sand", "dense-gravel", "hardcore"] as const;
