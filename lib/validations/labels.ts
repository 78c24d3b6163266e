// Which members a QR label sheet is for: chosen ids (POST) or the register's filters (GET), and
// where on a part-used sheet the first label goes.
import { z } from "zod";

export const MAX_LABELS = 500;
/** Cells on a sheet (3 across, 7 down), numbered 1–21 left to right, top to bottom. */
export const LABEL_CELLS = 21;

const START_MESSAGE = `Start must be a whole number from 1 to ${LABEL_CELLS}: the first free label on the sheet, counted left to right, top to bottom.`;

/**
 * The first free cell of a part-used sheet; 1 when not given. A number in JSON, or the text of a
 * query parameter; anything else (0, 22, 2.5, "two") is refused with the reason.
 */
export const labelStartSchema = z
  .union([z.number(), z.string().trim().regex(/^\+?\d+$/, START_MESSAGE).transform(Number)], { error: () => START_MESSAGE })
  .pipe(z.number().int(START_MESSAGE).min(1, START_MESSAGE).max(LABEL_CELLS, START_MESSAGE))
  .optional()
  .default(1);

export const labelsRequestSchema = z.object({
  memberIds: z
    .array(z.string().uuid("Each member id must be an id from this site's register."), {
      error: () => "The members must be a list of member ids.",
    })
    .min(1, "Choose at least one member to print a label for.")
    .max(MAX_LABELS, `At most ${MAX_LABELS} labels per sheet; print them in several sheets.`),
  start: labelStartSchema,
});
