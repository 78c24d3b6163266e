// The fields of a site's settings, shared by "Add a site" and the site settings page.
import type { FieldDef } from "./api-form";

export type SiteDefaults = {
  name?: string;
  code?: string;
  address?: string | null;
  units?: "si" | "us";
  basis?: "eurocode" | "aisc-lrfd" | "aisc-asd";
  inspectionIntervalDays?: number;
  permitValidityDays?: number;
  permitWarningHours?: number;
  timezone?: string;
};

export function siteFormFields(d: SiteDefaults = {}): FieldDef[] {
  const zones = Intl.supportedValuesOf("timeZone");
  return [
    { name: "name", label: "Site name", type: "text", defaultValue: d.name ?? "" },
    { name: "code", label: "Site code", type: "text", defaultValue: d.code ?? "", hint: "2–12 letters or digits, printed on permits and QR labels (e.g. WXB)." },
    { name: "address", label: "Address (optional)", type: "text", autoComplete: "street-address", defaultValue: d.address ?? "" },
    {
      name: "units",
      label: "Units",
      type: "select",
      defaultValue: d.units ?? "si",
      options: [
        { value: "si", label: "SI (mm, kN, MPa)" },
        { value: "us", label: "US (in, kip, ksi)" },
      ],
    },
    {
      name: "basis",
      label: "Design basis for steel checks",
      type: "select",
      defaultValue: d.basis ?? "eurocode",
      options: [
        { value: "eurocode", label: "Eurocode (EN 1993-1-1)" },
        { value: "aisc-lrfd", label: "AISC 360 — LRFD" },
        { value: "aisc-asd", label: "AISC 360 — ASD" },
      ],
    },
    { name: "inspectionIntervalDays", label: "Inspection interval (days)", type: "number", defaultValue: d.inspectionIntervalDays ?? 7, hint: "How long a passed inspection stays in date." },
    { name: "permitValidityDays", label: "Permit validity (days)", type: "number", defaultValue: d.permitValidityDays ?? 7, hint: "How long an issued permit to load or to strike is valid." },
    { name: "permitWarningHours", label: "Expiry warning (hours before)", type: "number", defaultValue: d.permitWarningHours ?? 24, hint: "When the site manager and coordinators are alerted before a permit expires." },
    {
      name: "timezone",
      label: "Time zone",
      type: "select",
      defaultValue: d.timezone ?? "Europe/London",
      options: zones.map((z) => ({ value: z, label: z.replace(/_/g, " ") })),
    },
  ];
}
