import type { PDFPage } from "pdf-lib";
import type { RecordInput } from "../record-input";
import { FOOTER_CAUTION } from "./caution";
import type { DocumentFonts } from "./fonts";
import type { Layout } from "./layout";
import { drawAligned, drawLine, textWidth, wrapText, type TextStyle } from "./text";
import { COLOURS, MARGIN, PAGE, SIZE } from "./theme";
import { line } from "./draw";

/** Lowest point any text of the frame reaches: well inside the paper, clear of a printer's edge. */
export const FRAME_INSET = 20;

/** The line at the top of every page after the first: whose record this is. Returns its height. */
export function runningHeader(input: RecordInput) {
  return (page: PDFPage, layout: Layout): number => {
    const style: TextStyle = { weight: "regular", size: SIZE.footer, color: COLOURS.muted };
    const y = PAGE.height - MARGIN.top + 4;
    const right = `${input.recordNumber} · Revision ${input.revision}`;
    const rw = textWidth(layout.fonts, right, { weight: "bold", size: SIZE.footer });
    const left = wrapText(layout.fonts, `${input.company.name} · Venting and combustion-air inspection record · ${input.job.reference}`, style, layout.width - rw - 20)[0] ?? "";
    drawLine(page, layout.fonts, left, layout.left, y, style);
    drawAligned(page, layout.fonts, right, layout.left, layout.width, y, { ...style, weight: "bold", color: COLOURS.ink }, "right");
    line(page, layout.left, y - 5, layout.right, y - 5, COLOURS.rule, 0.5);
    return 14;
  };
}

/** The footer of every page: record, revision, verification code, page n of N and the short caution. */
export function drawFooters(pages: readonly PDFPage[], fonts: DocumentFonts, input: RecordInput): void {
  const left = MARGIN.left;
  const width = PAGE.width - MARGIN.left - MARGIN.right;
  const meta: TextStyle = { weight: "regular", size: SIZE.footer, color: COLOURS.body };
  const caution: TextStyle = { weight: "regular", size: 7, color: COLOURS.muted };
  const cautionLines = wrapText(fonts, FOOTER_CAUTION, caution, width);
  const total = pages.length;
  pages.forEach((page, i) => {
    const ruleY = MARGIN.bottom - 16;
    line(page, left, ruleY, left + width, ruleY, COLOURS.rule, 0.6);
    let y = ruleY - 9.5;
    drawLine(page, fonts, `Record ${input.recordNumber} · Revision ${input.revision} · Verification code ${input.verificationCode}`, left, y, meta);
    drawAligned(page, fonts, `Page ${i + 1} of ${total}`, left, width, y, { ...meta, weight: "bold", color: COLOURS.ink }, "right");
    for (const l of cautionLines) {
      y -= 8.6;
      drawLine(page, fonts, l, left, y, caution);
    }
  });
}
