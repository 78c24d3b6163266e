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
