// An edit waiting on the phone, in words: the field's label and its value in the site's units, so
// an edit conflict can be read side by side ("Measured extension: 2700 mm on this phone, 2400 mm on
// the server") instead of request keys in newtons and millimetres.
import { formatForceFor, formatLengthFor, type UnitSystem } from "@/lib/client/format";
import { END_CONDITION_IDS, endConditionInfo } from "@/lib/engineering/effective-length";
import type { EndCondition } from "@/lib/engineering/types";
import { MEMBER_FIELD_LABELS, MEMBER_STATUS_LABELS } from "@/lib/labels";

/** What the edit form knows that the request does not: the site's units and the names of its choices. */
export type EditDisplay = { unitSystem: UnitSystem; names: Record<string, string> };

export function editFieldLabel(key: string): string {
  return MEMBER_FIELD_LABELS[key] ?? key;
}

/** The value of one edited field as a person reads it; `member` is the server's record for the plan place. */
export function editValueText(key: string, value: unknown, display: EditDisplay | undefined, member?: Record<string, unknown>): string {
  const units = display?.unitSystem ?? "si";
  if (key === "planPosition") {
    const placed = member ? member.planX != null && member.planY != null : value != null;
    return placed ? "Placed" : "Not placed";
  }
  if (value == null || value === "") return "—";
  switch (key) {
    case "extensionMm":
    case "spacingXMm":
    case "spacingYMm":
      return typeof value === "number" ? formatLengthFor(value, units) : String(value);
    case "loadN":
      return typeof value === "number" ? formatForceFor(value, units) : String(value);
    case "zoneId":
    case "schemeId":
    case "memberTypeId":
      return display?.names[String(value)] ?? "Another choice (not on this phone's list)";
    case "status":
      return MEMBER_STATUS_LABELS[value as keyof typeof MEMBER_STATUS_LABELS] ?? String(value);
    case "endConditions":
      return END_CONDITION_IDS.includes(value as EndCondition) ? endConditionInfo(value as EndCondition).label : String(value);
    case "loadSource":
      return value === "slab" ? "The scheme's slab" : "Typed working load";
    case "base":
      return "Base details";
    default:
      return typeof value === "object" ? JSON.stringify(value) : String(value);
  }
}
