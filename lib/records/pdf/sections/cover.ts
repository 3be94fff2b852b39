import { FINDING_STATUSES } from "@/lib/venting";
import { CAUTION_CO, CAUTION_GOVERNS, CAUTION_PASS_MEANING, CAUTION_TITLE } from "../caution";
import type { RenderContext } from "../context";
import { STATUS_COLOURS, STATUS_EXPLAINED, STATUS_WORDS, utcDate, utcDateTime } from "../format";
import { leading } from "../layout";
import { drawQr } from "../qr";
import { drawAligned, drawLine, textWidth, wrapText, type TextStyle } from "../text";
import { COLOURS, SIZE } from "../theme";
import { line, num, paint, rect, rectPath } from "../draw";

export const RECORD_TITLE = "Venting and combustion-air inspection record";

/** Draws wrapped lines at (x, y) downward; returns the new y. */
function lines(ctx: RenderContext, text: string, x: number, y: number, width: number, style: TextStyle, lh = leading(style.size)): number {
  for (const l of wrapText(ctx.fonts, text, style, width)) {
    drawLine(ctx.layout.page, ctx.fonts, l, x, y - style.size, style);
    y -= lh;
  }
  return y;
}

/** Label and value side by side; the value wraps. Returns the new y. */
function field(ctx: RenderContext, label: string, value: string, x: number, y: number, width: number, labelWidth: number, bold = false): number {
  const ls: TextStyle = { weight: "regular", size: SIZE.small, color: COLOURS.muted };
  const vs: TextStyle = { weight: bold ? "bold" : "regular", size: SIZE.body, color: COLOURS.ink };
  drawLine(ctx.layout.page, ctx.fonts, label, x, y - vs.size, ls);
  const after = lines(ctx, value || "not recorded", x + labelWidth, y, width - labelWidth, vs);
  return after - 2;
}

/**
 * Page 1: who did the work and for whom, which record this is, the verification code with its
 * QR code, a summary of the findings and the caution box.
 */
export function drawCover(ctx: RenderContext): void {
  const { layout, input, fonts } = ctx;
  const page = layout.page;
  const c = input.company;

  // Company block (left) and record block (right).
  const recordW = 170;
  const companyW = layout.width - recordW - 16;
  let yl = layout.y;
  yl = lines(ctx, c.name, layout.left, yl, companyW, { weight: "bold", size: SIZE.company, color: COLOURS.ink });
  yl -= 1;
  const meta: TextStyle = { weight: "regular", size: SIZE.small, color: COLOURS.body };
  yl = lines(ctx, `Licence no. ${c.licenceNumber || "not recorded"}`, layout.left, yl, companyW, meta);
  yl = lines(ctx, [c.phone, c.email].filter(Boolean).join("   ·   "), layout.left, yl, companyW, meta);
  yl = lines(ctx, c.address, layout.left, yl, companyW, meta);

  const rx = layout.right - recordW;
  const rs: TextStyle = { weight: "regular", size: SIZE.small, color: COLOURS.body };
  const rev = `Revision ${input.revision}${input.supersedesRevision !== null ? `, corrects revision ${input.supersedesRevision}` : ""}`;
  const approved = `Approved ${utcDate(input.inspection.approvedAt)}`;
  const infoLines = [...wrapText(fonts, rev, rs, recordW - 20), ...wrapText(fonts, approved, rs, recordW - 20)];
  const boxTop = layout.y;
  const boxH = 8 + leading(SIZE.footer) + 1 + 18 + infoLines.length * leading(SIZE.small) + 6;
  rect(page, rx, boxTop - boxH, recordW, boxH, { fill: COLOURS.band, stroke: COLOURS.rule, lineWidth: 0.8 });
  let yr = boxTop - 8;
  drawLine(page, fonts, "RECORD", rx + 10, yr - SIZE.footer, { weight: "bold", size: SIZE.footer, color: COLOURS.accent });
  yr -= leading(SIZE.footer) + 1;
  drawLine(page, fonts, input.recordNumber, rx + 10, yr - 13, { weight: "bold", size: 13, color: COLOURS.ink });
  yr -= 18;
  for (const l of infoLines) {
    drawLine(page, fonts, l, rx + 10, yr - SIZE.small, rs);
    yr -= leading(SIZE.small);
  }
  yr -= 6;

  layout.y = Math.min(yl, yr) - 8;
  line(page, layout.left, layout.y, layout.right, layout.y, COLOURS.accent, 2);
  layout.y -= 16;

  // Title.
  layout.y = lines(ctx, RECORD_TITLE, layout.left, layout.y, layout.width, { weight: "bold", size: SIZE.title, color: COLOURS.ink });
  layout.y = lines(ctx, `The gas-appliance venting and combustion air at this site, checked against ${c.name}'s rulebook and signed off by its installer and supervisor.`, layout.left, layout.y, layout.width, { weight: "regular", size: SIZE.body, color: COLOURS.muted });
  layout.y -= 10;

  // Job details (left) and verification (right).
  const qrSide = 92;
  const verifyW = 150;
  const detailsW = layout.width - verifyW - 20;
  const top = layout.y;
  let yd = top;
  const lw = 92;
  yd = field(ctx, "Job reference", input.job.reference, layout.left, yd, detailsW, lw, true);
  yd = field(ctx, "Customer", input.job.customerName, layout.left, yd, detailsW, lw);
  yd = field(ctx, "Site address", input.job.siteAddress, layout.left, yd, detailsW, lw);
  yd = field(ctx, "Submitted", utcDateTime(input.inspection.submittedAt), layout.left, yd, detailsW, lw);
  yd = field(ctx, "Approved", utcDateTime(input.inspection.approvedAt), layout.left, yd, detailsW, lw);
  yd = field(ctx, "Rulebook", `${input.rulebook.name}, version ${input.rulebook.versionNumber}`, layout.left, yd, detailsW, lw);
  yd = field(ctx, "Record issued", utcDateTime(input.generatedAt), layout.left, yd, detailsW, lw);

  const vx = layout.right - verifyW;
  rect(page, vx, top - 4 - qrSide - 64, verifyW, qrSide + 68, { stroke: COLOURS.rule, lineWidth: 0.8 });
  drawQr(page, input.verifyUrl, vx + (verifyW - qrSide) / 2, top - 4, qrSide, COLOURS.ink, COLOURS.white);
  let yv = top - 4 - qrSide - 2;
  const vl: TextStyle = { weight: "regular", size: SIZE.footer, color: COLOURS.muted };
  drawAligned(page, fonts, "Verification code", vx, verifyW, yv - SIZE.footer, vl, "center");
  yv -= leading(SIZE.footer);
  const codeStyle: TextStyle = { weight: "bold", size: 11, color: COLOURS.ink };
  drawAligned(page, fonts, input.verificationCode, vx, verifyW, yv - 11, codeStyle, "center");
  yv -= 15;
  for (const l of wrapText(fonts, input.verifyUrl, vl, verifyW - 12).slice(0, 3)) {
    drawAligned(page, fonts, l, vx + 6, verifyW - 12, yv - SIZE.footer, vl, "center");
    yv -= leading(SIZE.footer);
  }
  layout.y = Math.min(yd, top - qrSide - 72) - 8;

  drawSummary(ctx);
  drawCaution(ctx);
}

/** One box per status with its count and its word. */
function drawSummary(ctx: RenderContext): void {
  const { layout, input, fonts } = ctx;
  const page = layout.page;
  const order = [...FINDING_STATUSES].reverse(); // fail, needs-info, warn, not applicable, pass
  drawLine(page, fonts, `Summary of the ${input.summary.total} checks in this record`, layout.left, layout.y - SIZE.subheading, { weight: "bold", size: SIZE.subheading, color: COLOURS.ink });
  layout.y -= leading(SIZE.subheading) + 4;
  const gap = 8;
  const w = (layout.width - gap * (order.length - 1)) / order.length;
  const h = 44;
  order.forEach((status, i) => {
    const x = layout.left + i * (w + gap);
    const count = input.summary.counts[status] ?? 0;
    rect(page, x, layout.y - h, w, h, { fill: COLOURS.zebra, stroke: COLOURS.hairline, lineWidth: 0.6 });
    rect(page, x, layout.y - h, 3.5, h, { fill: STATUS_COLOURS[status] });
    const num = String(count);
    drawLine(page, fonts, num, x + 12, layout.y - 22, { weight: "bold", size: 18, color: STATUS_COLOURS[status] });
    const nx = x + 12 + textWidth(fonts, num, { weight: "bold", size: 18 }) + 8;
    // A long word ("NOT APPLICABLE") shrinks to fit its box rather than run into the next one.
    let wordSize: number = SIZE.small;
    while (wordSize > 5 && textWidth(fonts, STATUS_WORDS[status], { weight: "bold", size: wordSize }) > x + w - nx - 4) wordSize -= 0.5;
    drawLine(page, fonts, STATUS_WORDS[status], nx, layout.y - 15, { weight: "bold", size: wordSize, color: COLOURS.ink });
    const ex: TextStyle = { weight: "regular", size: SIZE.footer, color: COLOURS.muted };
    wrapText(fonts, STATUS_EXPLAINED[status], ex, x + w - nx - 5)
      .slice(0, 2)
      .forEach((l, k) => drawLine(page, fonts, l, nx, layout.y - 26 - k * 9, ex));
  });
  layout.y -= h + 12;
}

/** The caution box: prominent border and tint, never left out. */
export function drawCaution(ctx: RenderContext): void {
  const { layout, fonts } = ctx;
  const pad = 11;
  const innerW = layout.width - 2 * pad - 6;
  const titleStyle: TextStyle = { weight: "bold", size: 10.5, color: COLOURS.cautionBorder };
  const body: TextStyle = { weight: "regular", size: SIZE.body, color: COLOURS.cautionInk };
  const strong: TextStyle = { weight: "bold", size: SIZE.body, color: COLOURS.cautionInk };
  const blocks: { lines: string[]; style: TextStyle }[] = [
    { lines: wrapText(fonts, CAUTION_GOVERNS, body, innerW), style: body },
    { lines: wrapText(fonts, CAUTION_CO, strong, innerW), style: strong },
    { lines: wrapText(fonts, CAUTION_PASS_MEANING, body, innerW), style: body },
  ];
  const lh = leading(SIZE.body);
  const h = pad + 10.5 + 8 + blocks.reduce((a, b) => a + b.lines.length * lh + 5, 0) + pad - 5;
  layout.ensure(h + 4);
  const page = layout.page;
  const top = layout.y;
  rect(page, layout.left, top - h, layout.width, h, { fill: COLOURS.cautionFill, stroke: COLOURS.cautionBorder, lineWidth: 1.6 });
  rect(page, layout.left, top - h, 6, h, { fill: COLOURS.cautionBorder });
  const x = layout.left + 6 + pad;
  // A warning triangle drawn as a path, so it needs no glyph.
  const ty = top - pad + 0.5;
  paint(page, `${num(x + 6)} ${num(ty)} m ${num(x + 12)} ${num(ty - 10.5)} l ${num(x)} ${num(ty - 10.5)} l h`, { fill: COLOURS.cautionBorder });
  paint(page, `${rectPath(x + 5.3, ty - 7.2, 1.4, 4)} ${rectPath(x + 5.3, ty - 9.4, 1.4, 1.4)}`, { fill: COLOURS.cautionFill });
  drawLine(page, fonts, CAUTION_TITLE, x + 18, top - pad - 9, titleStyle);
  let y = top - pad - 10.5 - 8;
  for (const b of blocks) {
    for (const l of b.lines) {
      drawLine(page, fonts, l, x, y - b.style.size, b.style);
      y -= lh;
    }
    y -= 5;
  }
  layout.y = top - h - 12;
}
