// QR codes for PDFs, drawn as vector squares so they print sharp at any size.
import QRCode from "qrcode";

/** The QR code of `text` as one SVG path of unit squares, with a two-module quiet zone. */
export function qrPath(text: string): { d: string; size: number } {
  const qr = QRCode.create(text, { errorCorrectionLevel: "M" });
  const n = qr.modules.size;
  // One rectangle per horizontal run of dark modules: a fraction of the path a square per module
  // would need, which is what makes a sheet of hundreds of labels quick to lay out.
  let d = "";
  for (let r = 0; r < n; r++) {
    for (let c = 0; c < n; c++) {
      if (!qr.modules.get(r, c)) continue;
      let run = 1;
      while (c + run < n && qr.modules.get(r, c + run)) run++;
      d += `M${c + 2} ${r + 2}h${run}v1h-${run}z`;
      c += run - 1;
    }
  }
  return { d, size: n + 4 };
}
