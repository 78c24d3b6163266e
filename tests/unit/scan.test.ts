// Reading a member's QR label and deciding what it opens. The QR image is the label's own code
// (lib/pdf/labels.tsx draws it as vector paths), rasterised and read back with the same decoder
// the phone uses, so a label the app prints is one the app can read.
import sharp from "sharp";
import QRCode from "qrcode";
import { describe, expect, it } from "vitest";
import { memberUrl } from "@/lib/pdf/labels";
import { qrPath } from "@/lib/pdf/qr";
import { decodeQr } from "@/lib/scan/decode";
import { resolveScan } from "@/lib/scan/resolve";

const APP = "https://strutwise.example.test";
const SITE = "1b4e28ba-2fa1-41d2-883f-0016d3cca427";
const MEMBER = "6fa459ea-ee8a-4ca4-894e-db77e160355e";
const origins = [APP];

/** The label's QR path drawn at `px` pixels a module, as RGBA pixels (what a canvas gives). */
async function labelPixels(text: string, px = 6) {
  const { d, size } = qrPath(text);
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="${size * px}" height="${size * px}" viewBox="0 0 ${size} ${size}"><rect width="100%" height="100%" fill="#fff"/><path d="${d}" fill="#000"/></svg>`;
  const { data, info } = await sharp(Buffer.from(svg)).ensureAlpha().raw().toBuffer({ resolveWithObject: true });
  return { data: new Uint8ClampedArray(data.buffer, data.byteOffset, data.length), width: info.width, height: info.height };
}

describe("reading a label", () => {
  it("reads the member address from the QR code printed on the label", async () => {
    const url = memberUrl(APP, SITE, MEMBER);
    const img = await labelPixels(url);
    expect(decodeQr(img.data, img.width, img.height)).toBe(url);
  });

  it("reads a light-on-dark code only when asked to try harder (as for a chosen photo)", async () => {
    // A QR code of plain text, inverted (white modules on black), as some printed tags are.
    const png = await QRCode.toBuffer("WXW-L2-P01", { margin: 4, scale: 5, color: { dark: "#ffffff", light: "#000000" } });
    const { data, info } = await sharp(png).ensureAlpha().raw().toBuffer({ resolveWithObject: true });
    const px = new Uint8ClampedArray(data.buffer, data.byteOffset, data.length);
    expect(decodeQr(px, info.width, info.height)).toBeNull();
    expect(decodeQr(px, info.width, info.height, { thorough: true })).toBe("WXW-L2-P01");
  });

  it("finds nothing in a picture with no code, and in an empty one", async () => {
    const blank = new Uint8ClampedArray(200 * 200 * 4).fill(255);
    expect(decodeQr(blank, 200, 200, { thorough: true })).toBeNull();
    expect(decodeQr(new Uint8ClampedArray(0), 0, 0)).toBeNull();
  });
});

describe("what a scan opens", () => {
  it("opens the member page a label points to, on this app's address", () => {
    expect(resolveScan(memberUrl(APP, SITE, MEMBER), { origins })).toEqual({ kind: "open", href: `/sites/${SITE}/members/${MEMBER}` });
    // Labels printed with APP_URL still open when the browser reaches the app at another address of its own.
    expect(resolveScan(memberUrl(APP, SITE, MEMBER), { origins: ["http://127.0.0.1:3000", APP] })).toMatchObject({ kind: "open" });
    // The log form with a tag filled in is followed too, keeping the tag.
    expect(resolveScan(`${APP}/sites/${SITE}/members/new?tag=WXW%20P9`, { origins })).toEqual({ kind: "open", href: `/sites/${SITE}/members/new?tag=WXW%20P9` });
  });

  it("refuses an address on another origin, another scheme or a page that is not a member's", () => {
    for (const text of [
      `https://evil.example/sites/${SITE}/members/${MEMBER}`,
      `http://strutwise.example.test/sites/${SITE}/members/${MEMBER}`, // same host, other scheme: another origin
      `https://strutwise.example.test:8443/sites/${SITE}/members/${MEMBER}`,
      `//evil.example/sites/${SITE}/members/${MEMBER}`,
      "javascript:alert(1)",
    ]) {
      const r = resolveScan(text, { origins });
      expect(r.kind, text).toBe("refused");
    }
    expect(resolveScan(`https://evil.example/x`, { origins })).toMatchObject({ reason: expect.stringContaining("evil.example") });
    expect(resolveScan(`${APP}/api/v1/me`, { origins })).toMatchObject({ kind: "refused", reason: expect.stringMatching(/not a member's label/) });
    expect(resolveScan(`${APP}/sites/${SITE}/members/${MEMBER}/../../../account`, { origins }).kind).toBe("refused");
  });

  it("takes plain text as a tag, and refuses text that cannot be one", () => {
    expect(resolveScan("  WXW-L2-P01 ", { origins })).toEqual({ kind: "tag", tag: "WXW-L2-P01" });
    expect(resolveScan("", { origins })).toMatchObject({ kind: "refused", reason: expect.stringMatching(/Type the tag/) });
    expect(resolveScan("x".repeat(41), { origins })).toMatchObject({ kind: "refused", reason: expect.stringMatching(/at most 40/) });
    expect(resolveScan("<script>", { origins })).toMatchObject({ kind: "refused" });
  });
});
