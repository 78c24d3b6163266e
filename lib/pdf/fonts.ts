// Fonts for every PDF: static Inter WOFF files that ship with the app (react-pdf cannot read WOFF2
// or variable fonts). Registering is idempotent, so each PDF module may call it.
import path from "node:path";
import { Font } from "@react-pdf/renderer";

export const PDF_FONT_FAMILY = "Inter";
const FONT_DIR = path.join(process.cwd(), "lib", "pdf", "fonts");
let registered = false;

export function registerPdfFonts() {
  if (registered) return;
  Font.register({
    family: PDF_FONT_FAMILY,
    fonts: [
      { src: path.join(FONT_DIR, "inter-latin-400-normal.woff"), fontWeight: 400 },
      { src: path.join(FONT_DIR, "inter-latin-700-normal.woff"), fontWeight: 700 },
    ],
  });
  // Tags and references must stay whole: never split a word with a hyphen.
  Font.registerHyphenationCallback((word) => [word]);
  registered = true;
}
