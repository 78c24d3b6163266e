// Words for states, shown beside icons and colours (never colour alone).
export const MEMBER_STATUS_LABELS = {
  draft: "Draft",
  submitted: "Submitted",
  loaded: "Loaded",
  struck: "Struck",
  out_of_service: "Out of service",
} as const;

export const PERMIT_STATUS_LABELS = {
  requested: "Requested",
  issued: "Issued",
  refused: "Refused",
  expired: "Expired",
  withdrawn: "Withdrawn",
  closed: "Closed",
} as const;

/** A member's fields as people name them: the history's sentences and the outbox's edit view. */
export const MEMBER_FIELD_LABELS: Record<string, string> = {
  tag: "Tag",
  zoneId: "Zone",
  schemeId: "Scheme",
  memberTypeId: "Member type",
  extensionMm: "Measured extension",
  endConditions: "End conditions",
  loadSource: "Load",
  loadN: "Working load",
  level: "Level of props (1 = right under the slab being cast)",
  spacingXMm: "As-built spacing X",
  spacingYMm: "As-built spacing Y",
  notes: "Notes",
  status: "Status",
  planPosition: "Place on the zone plan",
  base: "Base",
};
