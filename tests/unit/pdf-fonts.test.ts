// The PDF fonts: each shipped WOFF unpacked to the TrueType font it wraps (W3C "WOFF File Format
// 1.0" §4–§5), checked against the OpenType spec's table directory and 'head' table.
import fs from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { woffToSfnt } from "@/lib/pdf/fonts";

const dir = path.join(process.cwd(), "lib", "pdf", "fonts");

describe("woffToSfnt", () => {
  for (const file of fs.readdirSync(dir).filter((f) => f.endsWith(".woff")))
    it(`${file}: every table unpacked to its declared size, 'head' magic number 0x5F0F3CF5`, () => {
      const woff = fs.readFileSync(path.join(dir, file));
      const ttf = woffToSfnt(woff);
      // The sfnt is the size the WOFF header says it was (totalSfntSize, §4).
      expect(ttf.length).toBe(woff.readUInt32BE(16));
      expect(ttf.readUInt32BE(0)).toBe(woff.readUInt32BE(4)); // flavor → sfnt version
      const n = ttf.readUInt16BE(4);
      expect(n).toBe(woff.readUInt16BE(12));
      const tags = Array.from({ length: n }, (_, i) => ttf.toString("latin1", 12 + i * 16, 16 + i * 16));
      expect(tags).toContain("head");
      expect(tags).toContain("glyf");
      const i = tags.indexOf("head");
      const headOffset = ttf.readUInt32BE(12 + i * 16 + 8);
      expect(ttf.readUInt32BE(headOffset + 12)).toBe(0x5f0f3cf5);
    });

  it("refuses a file that is not WOFF 1.0", () => {
    expect(() => woffToSfnt(Buffer.from("not a font at all, not a font at all, not a font"))).toThrow(/not a WOFF 1.0 font/);
  });
});
