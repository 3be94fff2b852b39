import type { PDFPage, RGB } from "pdf-lib";
import QRCode from "qrcode";
import { paint, rect } from "./draw";

/** The dark modules of a QR code as PDF rectangles in module units (runs of a row merged), y down. */
const recent = new Map<string, { d: string; size: number }>();

export function qrPath(text: string): { d: string; size: number } {
  const have = recent.get(text);
  if (have) return have;
  const { modules } = QRCode.create(text, { errorCorrectionLevel: "M" });
  const n = modules.size;
  const parts: string[] = [];
  for (let row = 0; row < n; row++) {
    let col = 0;
    while (col < n) {
      if (!modules.get(row, col)) {
        col++;
        continue;
      }
      const start = col;
      while (col < n && modules.get(row, col)) col++;
      parts.push(`${start} ${row} ${col - start} 1 re`);
    }
  }
  const out = { d: parts.join(" "), size: n };
  // A record is often rendered twice in a row (preview, then the stored copy): keep a few.
  if (recent.size >= 16) recent.delete(recent.keys().next().value as string);
  recent.set(text, out);
  return out;
}

/**
 * Draws a QR code as vector squares with its top-left corner at (x, top), `side` points wide
 * including the quiet zone of four modules that scanners need.
 */
export function drawQr(page: PDFPage, text: string, x: number, top: number, side: number, colour: RGB, paper: RGB): void {
  const { d, size } = qrPath(text);
  const quiet = 4;
  const m = side / (size + 2 * quiet);
  rect(page, x, top - side, side, side, { fill: paper });
  paint(page, d, { fill: colour }, [m, 0, 0, -m, x + quiet * m, top - quiet * m]);
}
