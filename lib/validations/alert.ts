// Alert preferences: per kind, e-mail at once, daily digest only, or in the app only.
import { z } from "zod";
import { ALERT_KINDS, DELIVERIES } from "@/lib/alerts/kinds";

export const alertPreferencesSchema = z.object({
  preferences: z
    .array(
      z.object({
        kind: z.enum(ALERT_KINDS, { error: () => `The alert kind must be one of: ${ALERT_KINDS.join(", ")}.` }),
        delivery: z.enum(DELIVERIES, { error: () => `The delivery must be one of: ${DELIVERIES.join(", ")}.` }),
      }),
      { error: () => "The preferences must be a list, each an alert kind with its delivery." },
    )
    .min(1, "Give at least one preference.")
    .max(ALERT_KINDS.length, "One preference per kind."),
});
export type AlertPreferencesInput = z.infer<typeof alertPreferencesSchema>;
