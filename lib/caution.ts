/** The caution every calculation, permit and capacity screen, PDF and e-mail carries. */
export const CAUTION_TEXT =
  "Results are for checking by a competent temporary works designer. Supplier data and local codes govern. No member may be loaded without a valid permit to load.";
