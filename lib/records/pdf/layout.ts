import type { PDFDocument, PDFPage } from "pdf-lib";
import type { DocumentFonts } from "./fonts";
import { drawLine, wrapText, type TextStyle } from "./text";
import { COLOURS, CONTENT_WIDTH, MARGIN, PAGE, SIZE } from "./theme";
import { line } from "./draw";

/** Line height for a font size. */
export const leading = (size: number): number => size * 1.32;

/**
 * A flowing layout: a cursor moving down the page, a new page when the next block does not fit.
 * Coordinates are PDF points with y up; `y` is the top of the space still free on the page.
 */
export class Layout {
  readonly pages: PDFPage[] = [];
  page!: PDFPage;
  y = 0;
  readonly left = MARGIN.left;
  readonly right = PAGE.width - MARGIN.right;
  readonly width = CONTENT_WIDTH;
  readonly bottom = MARGIN.bottom;
  readonly top = PAGE.height - MARGIN.top;

  constructor(
    readonly doc: PDFDocument,
    readonly fonts: DocumentFonts,
    /** Draws what goes at the top of every page after the first; returns the height it used. */
    private readonly runningHeader: (page: PDFPage, layout: Layout) => number,
  ) {
    this.addPage();
  }

  /** Starts a new page and moves the cursor to its top. */
  addPage(): void {
    this.page = this.doc.addPage([PAGE.width, PAGE.height]);
    this.pages.push(this.page);
    this.y = this.top;
    if (this.pages.length > 1) this.y -= this.runningHeader(this.page, this);
  }

  /** Space left above the bottom margin. */
  get remaining(): number {
    return this.y - this.bottom;
  }

  /** Height a fresh page offers below its running header. */
  get fullPage(): number {
    return this.top - this.bottom - 22;
  }

  /** Starts a new page unless `height` still fits. Returns true when it broke the page. */
  ensure(height: number): boolean {
    if (height <= this.remaining) return false;
    this.addPage();
    return true;
  }

  gap(height: number): void {
    this.y = Math.max(this.bottom, this.y - height);
  }

  /** Wraps and draws a paragraph, continuing on the next page when it runs out of room. */
  paragraph(text: string, style: TextStyle, opts: { indent?: number; width?: number; after?: number } = {}): void {
    const indent = opts.indent ?? 0;
    const width = opts.width ?? this.width - indent;
    const lh = leading(style.size);
    for (const line of wrapText(this.fonts, text, style, width)) {
      this.ensure(lh);
      drawLine(this.page, this.fonts, line, this.left + indent, this.y - style.size, style);
      this.y -= lh;
    }
    this.gap(opts.after ?? 4);
  }

  /**
   * A section heading, kept with at least `keep` points of what follows: a heading never sits
   * alone at the foot of a page.
   */
  heading(number: number, text: string, keep = 90): void {
    const h = 30;
    if (this.y < this.top - 1) this.gap(10);
    this.ensure(h + keep);
    const style: TextStyle = { weight: "bold", size: SIZE.heading, color: COLOURS.ink };
    const num = `${number}`;
    drawLine(this.page, this.fonts, num, this.left, this.y - SIZE.heading, { ...style, color: COLOURS.accent });
    drawLine(this.page, this.fonts, text, this.left + 18, this.y - SIZE.heading, style);
    this.y -= SIZE.heading + 6;
    line(this.page, this.left, this.y, this.right, this.y, COLOURS.accent, 1.2);
    this.y -= 10;
  }

  /** A smaller heading inside a section. */
  subheading(text: string, keep = 60): void {
    this.gap(4);
    this.ensure(20 + keep);
    drawLine(this.page, this.fonts, text, this.left, this.y - SIZE.subheading, { weight: "bold", size: SIZE.subheading, color: COLOURS.ink });
    this.y -= leading(SIZE.subheading) + 4;
  }
}
