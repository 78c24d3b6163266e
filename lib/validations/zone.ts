// One schema for a zone (where on site), used by the form and parsed again by the server.
import { z } from "zod";

const optionalText = (label: string, max: number) =>
  z
    .string()
    .trim()
    .max(max, `${label} has at most ${max} characters.`)
    .nullable()
    .optional()
    .transform((v) => (v ? v : null));

export const zoneSchema = z.object({
  name: z.string({ error: () => "Give the zone a name." }).trim().min(1, "Give the zone a name, e.g. Level 2 slab, bays 1–4.").max(120, "A zone name has at most 120 characters."),
  level: optionalText("The level", 40),
  grid: optionalText("The grid", 60),
  area: optionalText("The area", 120),
});

export type ZoneInput = z.input<typeof zoneSchema>;
