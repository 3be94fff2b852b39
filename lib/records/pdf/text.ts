import type { PDFPage, RGB } from "pdf-lib";
import { text as drawRun } from "./draw";
import type { DocumentFonts, Weight } from "./fonts";

/** How a piece of text is set. */
export interface TextStyle {
  readonly weight: Weight;
  readonly size: number;
  readonly color: RGB;
}

/** Replaces characters that have no place in a one-line run (tabs, control characters). */
export function cleanText(text: string): string {
  // eslint-disable-next-line no-control-regex
  return text.replace(/\r\n?/g, "\n").replace(/\t/g, " ").replace(/[\u0000-\u0009\u000b-\u001f\u007f\u00ad\u200b]/g, "");
}

/** Width of one line of text, pt. */
export function textWidth(fonts: DocumentFonts, text: string, style: Pick<TextStyle, "weight" | "size">): number {
  return fonts.widthEm(text, style.weight) * style.size;
}

/** Draws one line of text with its left end at x and its baseline at y (PDF coordinates). */
export function drawLine(page: PDFPage, fonts: DocumentFonts, text: string, x: number, y: number, style: TextStyle): void {
  let cx = x;
  for (const run of fonts.runs(text, style.weight)) {
    if (run.text) drawRun(page, run.font, style.size, style.color, cx, y, run.text);
    cx += run.widthEm * style.size;
  }
}

/** Draws one line aligned within [x, x + width]. */
export function drawAligned(page: PDFPage, fonts: DocumentFonts, text: string, x: number, width: number, y: number, style: TextStyle, align: "left" | "right" | "center"): void {
  if (align === "left") return drawLine(page, fonts, text, x, y, style);
  const w = textWidth(fonts, text, style);
  drawLine(page, fonts, text, align === "right" ? x + width - w : x + (width - w) / 2, y, style);
}

/**
 * Breaks text into lines no wider than `maxWidth`, at spaces where possible; a word wider than
 * the line is split between characters. Line breaks in the text are kept. Never adds hyphens, so
 * the extracted text stays the text that was typed.
 */
export function wrapText(fonts: DocumentFonts, text: string, style: Pick<TextStyle, "weight" | "size">, maxWidth: number): string[] {
  const em = maxWidth / style.size;
  const space = fonts.widthEm(" ", style.weight);
  const lines: string[] = [];
  for (const para of cleanText(text).split("\n")) {
    const words = para.split(/ +/).filter((w) => w.length > 0);
    if (words.length === 0) {
      lines.push("");
      continue;
    }
    let line = "";
    let lineW = 0;
    for (const word of words) {
      let w = fonts.widthEm(word, style.weight);
      if (line && lineW + space + w <= em) {
        line += ` ${word}`;
        lineW += space + w;
        continue;
      }
      if (line) lines.push(line);
      line = "";
      lineW = 0;
      if (w <= em) {
        line = word;
        lineW = w;
        continue;
      }
      // A word longer than the line (a hash, a URL): split it between characters.
      let chunk = "";
      let chunkW = 0;
      for (const ch of word) {
        const cw = fonts.widthEm(ch, style.weight);
        if (chunk && chunkW + cw > em) {
          lines.push(chunk);
          chunk = "";
          chunkW = 0;
        }
        chunk += ch;
        chunkW += cw;
      }
      line = chunk;
      lineW = chunkW;
      w = chunkW;
    }
    if (line) lines.push(line);
  }
  return lines;
}
