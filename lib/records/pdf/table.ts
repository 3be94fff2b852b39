import type { RGB } from "pdf-lib";
import type { Weight } from "./fonts";
import { leading, type Layout } from "./layout";
import { drawAligned, textWidth, wrapText, type TextStyle } from "./text";
import { COLOURS, SIZE } from "./theme";
import { rect, line } from "./draw";

export interface Column {
  readonly header: string;
  /** Width in points; the widths of a table add up to the layout width. */
  readonly width: number;
  readonly align?: "left" | "right" | "center";
}

/** One paragraph inside a cell. */
export interface CellBlock {
  readonly text: string;
  readonly weight?: Weight;
  readonly size?: number;
  readonly color?: RGB;
  /** Draws the text in white on a filled label of this colour (a status word). */
  readonly badge?: RGB;
  /** Space above this paragraph, pt. */
  readonly gapBefore?: number;
}

/** A cell: plain text, or paragraphs with their own styles. */
export type Cell = string | readonly CellBlock[];

export interface TableOptions {
  /** A subheading drawn above the table and kept on the same page as its header and first rows. */
  readonly title?: string;
  /** Printed above the repeated header on continued pages: "<caption> (continued)". */
  readonly caption?: string;
  readonly size?: number;
  /** Draw the header row (default true). */
  readonly header?: boolean;
  /** Shade every other row (default true). */
  readonly zebra?: boolean;
  /** Colour of a bar at the left edge of a row, e.g. the status colour. */
  readonly rowMark?: (rowIndex: number) => RGB | null;
}

interface Line {
  readonly text: string;
  readonly style: TextStyle;
  readonly badge?: RGB;
  readonly height: number;
}

const PAD_X = 4;
const PAD_Y = 3.5;

function cellLines(layout: Layout, cell: Cell, width: number, size: number): Line[] {
  const blocks: readonly CellBlock[] = typeof cell === "string" ? [{ text: cell }] : cell;
  const out: Line[] = [];
  for (const b of blocks) {
    const style: TextStyle = {
      weight: b.badge ? "bold" : (b.weight ?? "regular"),
      size: b.size ?? size,
      color: b.badge ? COLOURS.white : (b.color ?? COLOURS.body),
    };
    const lines = wrapText(layout.fonts, b.text, style, b.badge ? width - 6 : width);
    lines.forEach((text, i) => {
      const h = leading(style.size) + (b.badge ? 2 : 0) + (i === 0 ? (b.gapBefore ?? 0) : 0);
      out.push({ text, style, badge: b.badge, height: h });
    });
  }
  return out;
}

const sum = (ls: readonly Line[]): number => ls.reduce((a, l) => a + l.height, 0);

/**
 * Draws a table that flows over pages: rows are as tall as their wrapped text; a row that does
 * not fit moves to the next page, and one taller than a page is split between lines. The header
 * row is repeated at the top of every continued page.
 */
export function drawTable(layout: Layout, columns: readonly Column[], rows: readonly (readonly Cell[])[], opts: TableOptions = {}): void {
  const size = opts.size ?? SIZE.table;
  const showHeader = opts.header ?? true;
  const zebra = opts.zebra ?? true;
  const xs: number[] = [];
  let acc = layout.left;
  for (const c of columns) {
    xs.push(acc);
    acc += c.width;
  }
  const headerStyle: TextStyle = { weight: "bold", size: size - 0.5, color: COLOURS.ink };
  const headerLines = columns.map((c) => wrapText(layout.fonts, c.header, headerStyle, c.width - 2 * PAD_X));
  const headerH = showHeader ? Math.max(...headerLines.map((l) => l.length)) * leading(headerStyle.size) + 2 * PAD_Y : 0;
  const captionH = opts.caption ? leading(SIZE.small) + 2 : 0;

  const drawHeader = (continued: boolean): void => {
    if (continued && opts.caption) {
      drawAligned(layout.page, layout.fonts, `${opts.caption} (continued)`, layout.left, layout.width, layout.y - SIZE.small, { weight: "regular", size: SIZE.small, color: COLOURS.muted }, "left");
      layout.y -= captionH;
    }
    if (!showHeader) return;
    const top = layout.y;
    rect(layout.page, layout.left, top - headerH, layout.width, headerH, { fill: COLOURS.band });
    line(layout.page, layout.left, top - headerH, layout.right, top - headerH, COLOURS.rule, 0.8);
    columns.forEach((c, i) => {
      const lines = headerLines[i] ?? [];
      lines.forEach((t, j) => {
        drawAligned(layout.page, layout.fonts, t, (xs[i] ?? 0) + PAD_X, c.width - 2 * PAD_X, top - PAD_Y - headerStyle.size - j * leading(headerStyle.size) + 1, headerStyle, c.align ?? "left");
      });
    });
    layout.y -= headerH;
  };

  const prepared = rows.map((row) => columns.map((c, i) => cellLines(layout, row[i] ?? "", c.width - 2 * PAD_X, size)));
  const heights = prepared.map((cells) => Math.max(...cells.map(sum)) + 2 * PAD_Y);
  const totalH = heights.reduce((a, h) => a + h, 0);
  // Small tables stay whole; longer ones start with at least a few rows under their header.
  const keep = Math.min(totalH, Math.max(heights[0] ?? 0, 110));
  const titleStyle: TextStyle = { weight: "bold", size: SIZE.subheading, color: COLOURS.ink };
  const titleH = opts.title ? leading(SIZE.subheading) + 8 : 0;
  layout.ensure(titleH + headerH + keep + 2);
  if (opts.title) {
    layout.gap(4);
    drawAligned(layout.page, layout.fonts, opts.title, layout.left, layout.width, layout.y - SIZE.subheading, titleStyle, "left");
    layout.y -= titleH - 4;
  }
  drawHeader(false);
  let fresh = false;

  prepared.forEach((cells, rowIndex) => {
    let pending = cells.map((ls) => [...ls]);
    for (;;) {
      const need = Math.max(...pending.map(sum)) + 2 * PAD_Y;
      const room = layout.remaining;
      let take: Line[][];
      let last: boolean;
      if (need <= room) {
        take = pending;
        last = true;
      } else if (!fresh && need <= layout.fullPage - headerH - captionH) {
        layout.addPage();
        drawHeader(true);
        fresh = true;
        continue;
      } else {
        // Taller than a page: draw the lines that fit, the rest continues overleaf.
        take = pending.map((ls) => {
          const out: Line[] = [];
          let h = 2 * PAD_Y;
          for (const l of ls) {
            if (h + l.height > room) break;
            out.push(l);
            h += l.height;
          }
          return out;
        });
        if (take.every((t) => t.length === 0)) {
          layout.addPage();
          drawHeader(true);
          fresh = true;
          continue;
        }
        last = false;
      }
      const h = Math.max(...take.map(sum)) + 2 * PAD_Y;
      const top = layout.y;
      if (zebra && rowIndex % 2 === 1) rect(layout.page, layout.left, top - h, layout.width, h, { fill: COLOURS.zebra });
      const mark = opts.rowMark?.(rowIndex) ?? null;
      if (mark) rect(layout.page, layout.left, top - h, 2.2, h, { fill: mark });
      take.forEach((ls, i) => {
        const col = columns[i];
        if (!col) return;
        let y = top - PAD_Y;
        for (const l of ls) {
          const base = y - l.height + (leading(l.style.size) - l.style.size) / 2 + (l.badge ? 1 : 0) + 1.2;
          const x = (xs[i] ?? 0) + PAD_X;
          if (l.badge) {
            const w = textWidth(layout.fonts, l.text, l.style) + 6;
            rect(layout.page, x, base - 2.2, w, l.style.size + 3, { fill: l.badge });
            drawAligned(layout.page, layout.fonts, l.text, x + 3, w, base, l.style, "left");
          } else {
            drawAligned(layout.page, layout.fonts, l.text, x, col.width - 2 * PAD_X, base, l.style, col.align ?? "left");
          }
          y -= l.height;
        }
      });
      layout.y -= h;
      line(layout.page, layout.left, layout.y, layout.right, layout.y, COLOURS.hairline, 0.4);
      fresh = false;
      if (last) break;
      pending = pending.map((ls, i) => ls.slice(take[i]?.length ?? 0));
      layout.addPage();
      drawHeader(true);
      fresh = true;
    }
  });
  layout.gap(6);
}

/** Column widths from shares of the layout width (the last column takes the rounding rest). */
export function columnsFrom(layout: Layout, spec: readonly { header: string; share: number; align?: Column["align"] }[]): Column[] {
  const total = spec.reduce((a, s) => a + s.share, 0);
  let used = 0;
  return spec.map((s, i) => {
    const width = i === spec.length - 1 ? layout.width - used : Math.round((layout.width * s.share) / total * 10) / 10;
    used += width;
    return { header: s.header, width, align: s.align };
  });
}
