import type { PDFPage, RGB } from "pdf-lib";
import QRCode from "qrcode";

/** The dark modules of a QR code as one SVG path in module units (runs of a row merged). */
export function qrPath(text: string): { d: string; size: number } {
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
      parts.push(`M${start} ${row}h${col - start}v1h${start - col}z`);
    }
  }
  return { d: parts.join(""), size: n };
}

/**
 * Draws a QR code as vector squares with its top-left corner at (x, top), `side` points wide
 * including the quiet zone of four modules that scanners need.
 */
export function drawQr(page: PDFPage, text: string, x: number, top: number, side: number, colour: RGB, paper: RGB): void {
  const { d, size } = qrPath(text);
  const quiet = 4;
  const m = side / (size + 2 * quiet);
  page.drawRectangle({ x, y: top - side, width: side, height: side, color: paper });
  page.drawSvgPath(d, { x: x + quiet * m, y: top - quiet * m, scale: m, color: colour });
}
