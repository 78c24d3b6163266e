// The inspection checklist a site engineer or supervisor works through at each member.
// Pure data, shared by the phone form, the API and the e-mails.
export const INSPECTION_CHECKS = [
  { key: "plumb", label: "Plumb, within the site's tolerance" },
  { key: "bearing", label: "Bearing and base or sole plate sound" },
  { key: "head", label: "Head secure" },
  { key: "pins", label: "Correct pins and fixings fitted" },
  { key: "condition", label: "No damage or corrosion" },
  { key: "bracing", label: "Lacing and bracing in place" },
  { key: "load", label: "Load as expected" },
] as const;

export type InspectionCheckKey = (typeof INSPECTION_CHECKS)[number]["key"];

const LABELS: Record<string, string> = Object.fromEntries(INSPECTION_CHECKS.map((c) => [c.key, c.label]));

/** The words for a checklist item; an outside system's own item is shown as it sent it. */
export function checkLabel(key: string): string {
  return LABELS[key] ?? key;
}

export const INSPECTION_RESULT_LABELS = { pass: "Passed", fail: "Failed" } as const;
