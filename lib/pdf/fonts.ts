// Fonts for every PDF: static Inter WOFF files that ship with the app (react-pdf cannot read WOFF2
// or variable fonts). Registering is idempotent, so each PDF module may call it.
//
// Each WOFF is unpacked once, when first registered, into the plain TrueType font it wraps (WOFF
// 1.0: the same tables, each zlib-compressed): the PDF library's font reader would otherwise
// inflate the compressed tables again, in JavaScript, for every document it lays out — most of
// the time a permit's PDF took.
import fs from "node:fs";
import path from "node:path";
import { inflateSync } from "node:zlib";
import { Font } from "@react-pdf/renderer";

export const PDF_FONT_FAMILY = "Inter";
const FONT_DIR = path.join(process.cwd(), "lib", "pdf", "fonts");
let registered = false;

/**
 * WOFF 1.0 (W3C Recommendation "WOFF File Format 1.0", 2012, §4–§5) → the sfnt (TrueType/OpenType)
 * font it carries: header and table directory rewritten, each table inflated if it was compressed.
 */
export function woffToSfnt(woff: Buffer): Buffer {
  if (woff.length < 44 || woff.readUInt32BE(0) !== 0x774f4646) throw new Error("not a WOFF 1.0 font (no 'wOFF' signature)");
  const flavor = woff.readUInt32BE(4);
  const numTables = woff.readUInt16BE(12);
  const tables: { tag: number; checksum: number; data: Buffer }[] = [];
  for (let i = 0; i < numTables; i++) {
    const e = 44 + i * 20;
    const offset = woff.readUInt32BE(e + 4);
    const compLength = woff.readUInt32BE(e + 8);
    const origLength = woff.readUInt32BE(e + 12);
    const stored = woff.subarray(offset, offset + compLength);
    const data = compLength < origLength ? inflateSync(stored) : Buffer.from(stored);
    if (data.length !== origLength) throw new Error(`WOFF table ${i} unpacks to ${data.length} bytes, not the ${origLength} it declares`);
    tables.push({ tag: woff.readUInt32BE(e), checksum: woff.readUInt32BE(e + 16), data });
  }
  // The sfnt offset table's binary-search fields (OpenType spec, "Table directory").
  let pow2 = 1;
  while (pow2 * 2 <= numTables) pow2 *= 2;
  const head = Buffer.alloc(12 + numTables * 16);
  head.writeUInt32BE(flavor, 0);
  head.writeUInt16BE(numTables, 4);
  head.writeUInt16BE(pow2 * 16, 6);
  head.writeUInt16BE(Math.log2(pow2), 8);
  head.writeUInt16BE(numTables * 16 - pow2 * 16, 10);
  const parts: Buffer[] = [head];
  let offset = head.length;
  tables.forEach((t, i) => {
    const r = 12 + i * 16;
    head.writeUInt32BE(t.tag, r);
    head.writeUInt32BE(t.checksum, r + 4);
    head.writeUInt32BE(offset, r + 8);
    head.writeUInt32BE(t.data.length, r + 12);
    const padded = Buffer.alloc((t.data.length + 3) & ~3);
    t.data.copy(padded);
    parts.push(padded);
    offset += padded.length;
  });
  return Buffer.concat(parts);
}

const asTrueType = (file: string) => `data:font/ttf;base64,${woffToSfnt(fs.readFileSync(path.join(FONT_DIR, file))).toString("base64")}`;

export function registerPdfFonts() {
  if (registered) return;
  Font.register({
    family: PDF_FONT_FAMILY,
    fonts: [
      { src: asTrueType("inter-latin-400-normal.woff"), fontWeight: 400 },
      { src: asTrueType("inter-latin-700-normal.woff"), fontWeight: 700 },
    ],
  });
  // Tags and references must stay whole: never split a word with a hyphen.
  Font.registerHyphenationCallback((word) => [word]);
  registered = true;
}
