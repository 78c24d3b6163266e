// Pure helpers of the register: the member schema's cross-field rules, the form's unit
// conversion, pasted supplier tables, the slab-load derivation and the photo processing.
import sharp from "sharp";
import { describe, expect, it } from "vitest";
import { toMemberInput, EMPTY_MEMBER_FORM } from "@/components/register/member-form-values";
import { processPhoto, exifTakenAt } from "@/lib/photos/process";
import { deriveSlabLoad } from "@/lib/register/slab-load";
import { memberCreateSchema, memberPatchSchema } from "@/lib/validations/member";
import { memberTypeSchema, parseTableCsv } from "@/lib/validations/member-type";

const TYPE = "7b0c1f5e-8a51-4d0e-9c55-0d4a9f0a1b2c";

describe("member schema", () => {
  it("needs a load when it is given directly, and a scheme and both spacings when it comes from the slab", () => {
    const direct = memberCreateSchema.safeParse({ tag: "P1", memberTypeId: TYPE, extensionMm: 2500 });
    expect(direct.success).toBe(false);
    expect(direct.error!.issues.map((i) => i.path.join("."))).toEqual(["loadN"]);
    const slab = memberCreateSchema.safeParse({ tag: "P1", memberTypeId: TYPE, extensionMm: 2500, loadSource: "slab", spacingXMm: 1200 });
    expect(slab.error!.issues.map((i) => i.path.join(".")).sort()).toEqual(["schemeId", "spacingYMm"]);
    const ok = memberCreateSchema.parse({ tag: " P1 ", memberTypeId: TYPE, extensionMm: 2500, loadN: 10 });
    expect(ok).toMatchObject({ tag: "P1", endConditions: "pinned-pinned", loadSource: "direct" });
  });

  it("refuses a patch of a field that is not the user's to set", () => {
    const r = memberPatchSchema.safeParse({ checkPass: true });
    expect(r.success).toBe(false);
    expect(r.error!.issues[0]!.code).toBe("unrecognized_keys");
  });
});

describe("form values to API input", () => {
  it("reads millimetres and kN on an SI site", () => {
    const { input, errors } = toMemberInput({ ...EMPTY_MEMBER_FORM, tag: "A", memberTypeId: TYPE, extension: "2.65 m", load: "12.5" }, "si");
    expect(errors).toEqual({});
    expect(input.extensionMm).toBeCloseTo(2650, 9);
    expect(input.loadN).toBeCloseTo(12500, 9);
  });

  it("reads feet-and-inches and kips on a US site (1 in = 25.4 mm; 1 kip = 4448.2216 N)", () => {
    const { input } = toMemberInput({ ...EMPTY_MEMBER_FORM, extension: `9' 6"`, load: "2" }, "us");
    expect(input.extensionMm).toBeCloseTo(114 * 25.4, 9);
    expect(input.loadN).toBeCloseTo(2 * 4448.2216152605, 6);
  });

  it("names the field of a value it cannot read", () => {
    const { errors } = toMemberInput({ ...EMPTY_MEMBER_FORM, extension: "2,650", load: "lots" }, "si");
    expect(errors.extension).toMatch(/comma/);
    expect(errors.load).toMatch(/Load/);
  });
});

describe("pasted supplier tables", () => {
  it("skips a header, converts kN to N and reports a bad line by number", () => {
    const r = parseTableCsv("length_mm,safe_kn\n1500,100\n2500;85\n3500\t62\n");
    expect(r.errors).toEqual([]);
    expect(r.rows).toEqual([
      { lengthMm: 1500, safeLoadN: 100000 },
      { lengthMm: 2500, safeLoadN: 85000 },
      { lengthMm: 3500, safeLoadN: 62000 },
    ]);
    const bad = parseTableCsv("1500,100\nabc,def\n2500");
    expect(bad.errors[0]).toMatch(/^Line 2:/);
    expect(bad.errors[1]).toMatch(/^Line 3: expected two values/);
  });

  it("a table whose lengths do not increase is refused at the row that breaks the order", () => {
    const r = memberTypeSchema.safeParse({ kind: "supplier-table", name: "T1", params: { table: [{ lengthMm: 2000, safeLoadN: 1 }, { lengthMm: 2000, safeLoadN: 1 }] } });
    expect(r.error!.issues[0]!.path.join(".")).toBe("params.table.1.lengthMm");
  });
});

describe("load from the slab", () => {
  it("derives the working load per member (EN 1991-1-1 Table A.1, EN 1991-1-6 Table 4.2)", () => {
    // 300 mm slab: 26 × 0.3 = 7.8 kN/m²; formwork 0.5; construction 10 % of 7.8 = 0.78 kN/m² (within 0.75–1.5).
    // (7.8 + 0.5 + 0.78) × 1.0 × 1.5 m² = 13.62 kN.
    const r = deriveSlabLoad({ reference: "S", slabThicknessMm: 300, concreteDensityKnM3: null, formworkKnM2: null, constructionKnM2: null }, 1000, 1500);
    expect(r.ok).toBe(true);
    if (r.ok) expect(r.info.loadPerMemberN).toBeCloseTo(13620, 6);
  });

  it("explains why a scheme without a slab cannot give a load", () => {
    const r = deriveSlabLoad({ reference: "TW-9", slabThicknessMm: null, concreteDensityKnM3: null, formworkKnM2: null, constructionKnM2: null }, 1000, 1000);
    expect(r).toEqual({ ok: false, fields: { loadSource: expect.stringMatching(/TW-9 gives no slab thickness/) } });
  });
});

describe("photo processing", () => {
  it("refuses bytes that are not an image, whatever they claim", async () => {
    const r = await processPhoto(Buffer.from("GIF89a? no, just text"));
    expect(r).toEqual({ ok: false, reason: expect.stringMatching(/not an image/) });
  });

  it("refuses an image format that is not a photo format", async () => {
    const gif = await sharp({ create: { width: 8, height: 8, channels: 3, background: "#000" } }).gif().toBuffer();
    const r = await processPhoto(gif);
    expect(r).toEqual({ ok: false, reason: expect.stringMatching(/GIF image; only JPEG, PNG, WebP or HEIF/) });
  });

  it("drops EXIF (with GPS) from every copy, keeps the taken-at time, and sizes the copies", async () => {
    const src = await sharp({ create: { width: 2400, height: 1200, channels: 3, background: "#456" } })
      .jpeg()
      .withExif({ IFD2: { DateTimeOriginal: "2023:11:02 14:15:16" }, IFD3: { GPSLatitudeRef: "N", GPSLatitude: "51/1 0/1 0/1" } })
      .toBuffer();
    const r = await processPhoto(src);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.photo.takenAt?.toISOString()).toBe("2023-11-02T14:15:16.000Z");
    for (const b of [r.photo.original, r.photo.display, r.photo.thumbnail]) expect((await sharp(b).metadata()).exif).toBeUndefined();
    const display = await sharp(r.photo.display).metadata();
    expect([display.width, display.height]).toEqual([1600, 800]);
    const thumb = await sharp(r.photo.thumbnail).metadata();
    expect([thumb.width, thumb.height]).toEqual([320, 320]);
    expect(exifTakenAt(undefined)).toBeNull();
  });
});
