// Reads a QR code from an image's pixels (RGBA, as a canvas's getImageData gives them) with jsQR,
// a pure-JavaScript QR reader: the same function reads camera frames and chosen photos in the
// browser, and label images in the tests.
import jsQR from "jsqr";

/** The text of the QR code in the image, or null when none can be read. */
export function decodeQr(rgba: Uint8ClampedArray, width: number, height: number, { thorough = false }: { thorough?: boolean } = {}): string | null {
  if (width <= 0 || height <= 0 || rgba.length < width * height * 4) return null;
  // Camera frames: normal (dark on light) codes only, for speed; a photo: both ways round.
  const code = jsQR(rgba, width, height, { inversionAttempts: thorough ? "attemptBoth" : "dontInvert" });
  return code?.data ? code.data : null;
}
