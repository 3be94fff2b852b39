import zlib from "node:zlib";
import type { PDFDocument, PDFFont, PDFImage, PDFName, PDFPage, RGB } from "pdf-lib";

/**
 * The record's page content, written as PDF operators into one string per page and compressed
 * with Node's zlib when the document is finished. pdf-lib's drawing methods build an object per
 * operator and number (and write a full transform for every rectangle); a long record draws
 * thousands of runs of text and table rules, and this keeps rendering well under the budget.
 * Everything is painted in call order.
 */
interface PageContent {
  parts: string[];
  /** Text state outside any q/Q: font resource, size and fill colour last set. */
  fontKey: string;
  size: number;
  fill: string;
  readonly fonts: Map<PDFFont, PDFName>;
  readonly images: Map<PDFImage, PDFName>;
  readonly alphas: Map<number, PDFName>;
}

const contents = new WeakMap<PDFPage, PageContent>();

function content(page: PDFPage): PageContent {
  let c = contents.get(page);
  if (!c) {
    c = { parts: [], fontKey: "", size: 0, fill: "", fonts: new Map(), images: new Map(), alphas: new Map() };
    contents.set(page, c);
  }
  return c;
}

/** A number as PDF content writes it: at most two decimals, no exponent. */
export function num(v: number): string {
  const r = Math.round(v * 100) / 100;
  return Object.is(r, -0) ? "0" : String(r);
}

const colourText = new WeakMap<RGB, string>();
function colour3(c: RGB): string {
  let s = colourText.get(c);
  if (s === undefined) {
    s = `${num3(c.red)} ${num3(c.green)} ${num3(c.blue)}`;
    colourText.set(c, s);
  }
  return s;
}
const num3 = (v: number): string => String(Math.round(v * 1000) / 1000);

export interface ShapeStyle {
  readonly fill?: RGB;
  readonly stroke?: RGB;
  readonly lineWidth?: number;
  /** Dash pattern, in the same units as the path. */
  readonly dash?: readonly number[];
  /** Round caps and joins (drawings); butt caps otherwise. */
  readonly round?: boolean;
  /** Opacity of fill and stroke (0–1). */
  readonly opacity?: number;
}

/** Paints a path (PDF path operators, e.g. from {@link rectPath}) with a style, in its own q/Q. */
export function paint(page: PDFPage, path: string, style: ShapeStyle, transform?: readonly number[]): void {
  if (!style.fill && !style.stroke) return;
  const c = content(page);
  let s = "q ";
  if (transform) s += `${transform.map(num).join(" ")} cm `;
  if (style.opacity !== undefined && style.opacity < 1) s += `${alphaKey(page, c, style.opacity)} gs `;
  if (style.fill) s += `${colour3(style.fill)} rg `;
  if (style.stroke) {
    s += `${colour3(style.stroke)} RG ${num(style.lineWidth ?? 1)} w `;
    if (style.round) s += "1 J 1 j ";
    if (style.dash && style.dash.length) s += `[${style.dash.map(num).join(" ")}] 0 d `;
  }
  s += `${path} ${style.fill && style.stroke ? "B" : style.fill ? "f" : "S"} Q\n`;
  c.parts.push(s);
}

function alphaKey(page: PDFPage, c: PageContent, opacity: number): string {
  const a = Math.round(opacity * 100) / 100;
  let key = c.alphas.get(a);
  if (!key) {
    key = page.node.newExtGState("GS", page.doc.context.obj({ Type: "ExtGState", ca: a, CA: a }));
    c.alphas.set(a, key);
  }
  return key.toString();
}

export const rectPath = (x: number, y: number, w: number, h: number): string => `${num(x)} ${num(y)} ${num(w)} ${num(h)} re`;

export function rect(page: PDFPage, x: number, y: number, width: number, height: number, style: ShapeStyle): void {
  paint(page, rectPath(x, y, width, height), style);
}

export function line(page: PDFPage, x1: number, y1: number, x2: number, y2: number, colour: RGB, width: number): void {
  paint(page, `${num(x1)} ${num(y1)} m ${num(x2)} ${num(y2)} l`, { stroke: colour, lineWidth: width });
}

function fontKey(page: PDFPage, c: PageContent, font: PDFFont): string {
  let key = c.fonts.get(font);
  if (!key) {
    key = page.node.newFontDictionary(font.name, font.ref);
    c.fonts.set(font, key);
  }
  return key.toString();
}

/** Text encoders of the embedded fonts: a string to the hex glyph codes of the font's subset. */
const encoders = new WeakMap<PDFFont, (text: string) => string>();

export function registerEncoder(font: PDFFont, encode: (text: string) => string): void {
  encoders.set(font, encode);
}

/** Draws one run of text of one font with its baseline starting at (x, y). */
export function text(page: PDFPage, font: PDFFont, size: number, colour: RGB, x: number, y: number, value: string): void {
  const c = content(page);
  const key = fontKey(page, c, font);
  const hex = encoders.get(font)?.(value) ?? font.encodeText(value).toString().slice(1, -1);
  let s = "BT ";
  if (c.fontKey !== key || c.size !== size) {
    s += `${key} ${num(size)} Tf `;
    c.fontKey = key;
    c.size = size;
  }
  const fill = colour3(colour);
  if (c.fill !== fill) {
    s += `${fill} rg `;
    c.fill = fill;
  }
  s += `${num(x)} ${num(y)} Td <${hex}> Tj ET\n`;
  c.parts.push(s);
}

/** Draws an embedded image into the box (x, y, width, height). */
export function image(page: PDFPage, img: PDFImage, x: number, y: number, width: number, height: number): void {
  const c = content(page);
  let key = c.images.get(img);
  if (!key) {
    key = page.node.newXObject("Image", img.ref);
    c.images.set(img, key);
  }
  c.parts.push(`q ${num(width)} 0 0 ${num(height)} ${num(x)} ${num(y)} cm ${key.toString()} Do Q\n`);
}

/** Writes each page's content as one compressed stream (call once, after all drawing). */
export function finishPages(doc: PDFDocument, pages: readonly PDFPage[]): void {
  for (const page of pages) {
    const c = contents.get(page);
    if (!c) continue;
    const bytes = zlib.deflateSync(Buffer.from(c.parts.join(""), "latin1"), { level: 4 });
    const stream = doc.context.stream(new Uint8Array(bytes.buffer, bytes.byteOffset, bytes.length), { Filter: "FlateDecode" });
    page.node.addContentStream(doc.context.register(stream));
    contents.delete(page);
  }
}
