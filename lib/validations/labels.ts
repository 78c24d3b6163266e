// Which members a QR label sheet is for: chosen ids (POST) or the register's filters (GET).
import { z } from "zod";

export const MAX_LABELS = 500;

export const labelsRequestSchema = z.object({
  memberIds: z
    .array(z.string().uuid("Each member id must be an id from this site's register."), {
      error: () => "The members must be a list of member ids.",
    })
    .min(1, "Choose at least one member to print a label for.")
    .max(MAX_LABELS, `At most ${MAX_LABELS} labels per sheet; print them in several sheets.`),
});
