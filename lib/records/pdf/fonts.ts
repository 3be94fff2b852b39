import fs from "node:fs";
import path from "node:path";
import fontkit from "@pdf-lib/fontkit";
import { PDFHexString, type PDFDocument, type PDFFont } from "pdf-lib";
import { registerEncoder } from "./draw";

/**
 * The record's typefaces, read from the installed font packages. The primary face is the app's
 * own typeface; the fallback covers symbols and scripts the primary face lacks (a customer name
 * or a note can hold anything), so that no glyph is ever drawn as an empty box.
 */
const FONT_FILES = {
  regular: ["node_modules", "@expo-google-fonts", "public-sans", "400Regular", "PublicSans_400Regular.ttf"],
  bold: ["node_modules", "@expo-google-fonts", "public-sans", "700Bold", "PublicSans_700Bold.ttf"],
  fallbackRegular: ["node_modules", "dejavu-fonts-ttf", "ttf", "DejaVuSans.ttf"],
  fallbackBold: ["node_modules", "dejavu-fonts-ttf", "ttf", "DejaVuSans-Bold.ttf"],
} as const;

type FaceKey = keyof typeof FONT_FILES;
export type Weight = "regular" | "bold";

/** Advance widths and coverage of one face, measured without pdf-lib's shaping (fast, and never narrower). */
export interface FaceMetrics {
  readonly bytes: Uint8Array;
  has(codePoint: number): boolean;
  /** Advance of one code point in em units (1 = the font size). */
  advance(codePoint: number): number;
}

interface FontkitGlyph {
  readonly id: number;
  readonly advanceWidth: number;
}
interface FontkitFont {
  readonly unitsPerEm: number;
  hasGlyphForCodePoint(codePoint: number): boolean;
  glyphForCodePoint(codePoint: number): FontkitGlyph;
}

const faces = new Map<FaceKey, FaceMetrics>();
/** Parsed fonts by their bytes: parsing a face once per process instead of once per record. */
const parsed = new Map<Uint8Array, unknown>();

/**
 * fontkit for pdf-lib, handing out the font already parsed for the same bytes. A fontkit font
 * is read-only once parsed; each document still makes its own subset of it.
 */
const sharedFontkit = {
  ...fontkit,
  create(bytes: Uint8Array, postscriptName?: string) {
    const have = parsed.get(bytes);
    if (have) return have;
    const font = fontkit.create(bytes, postscriptName);
    parsed.set(bytes, font);
    return font;
  },
} as typeof fontkit;

/** The parts of pdf-lib's subsetting embedder that encoding a glyph touches. */
interface SubsetEmbedder {
  readonly font: FontkitFont;
  readonly subset: { includeGlyph(glyph: FontkitGlyph): number };
  readonly glyphs: FontkitGlyph[];
  readonly glyphIdMap: Map<number, number>;
  readonly glyphCache: { invalidate(): void };
  encodeText(text: string): PDFHexString;
}

/**
 * Replaces pdf-lib's text encoding for one font with a per-character lookup. pdf-lib shapes
 * every string with the font's full OpenType layout (most of a record's render time) and then
 * ignores the positions; with ligatures off, shaping maps each character to its own glyph, which
 * is what this does directly.
 */
function fastEncoding(font: PDFFont): void {
  const embedder = (font as unknown as { embedder?: Partial<SubsetEmbedder> }).embedder;
  if (!embedder?.font || !embedder.subset || !embedder.glyphs || !embedder.glyphIdMap || !embedder.glyphCache) return;
  const e = embedder as SubsetEmbedder;
  const codes = new Map<number, string>();
  const encode = (text: string): string => {
    let hex = "";
    let added = false;
    for (const ch of text) {
      const cp = ch.codePointAt(0) ?? 0x3f;
      let code = codes.get(cp);
      if (code === undefined) {
        const glyph = e.font.glyphForCodePoint(cp);
        const id = e.subset.includeGlyph(glyph);
        e.glyphs[id - 1] = glyph;
        e.glyphIdMap.set(glyph.id, id);
        code = id.toString(16).padStart(4, "0");
        codes.set(cp, code);
        added = true;
      }
      hex += code;
    }
    if (added) e.glyphCache.invalidate();
    return hex;
  };
  e.encodeText = (text: string): PDFHexString => PDFHexString.of(encode(text));
  registerEncoder(font, encode);
}

function loadFace(key: FaceKey): FaceMetrics {
  const cached = faces.get(key);
  if (cached) return cached;
  const file = path.join(/* turbopackIgnore: true */ process.cwd(), ...FONT_FILES[key]);
  const bytes = new Uint8Array(fs.readFileSync(file));
  const font = sharedFontkit.create(bytes) as unknown as FontkitFont;
  const upm = font.unitsPerEm;
  const widths = new Map<number, number>();
  const coverage = new Map<number, boolean>();
  const face: FaceMetrics = {
    bytes,
    has(cp) {
      let v = coverage.get(cp);
      if (v === undefined) {
        v = font.hasGlyphForCodePoint(cp);
        coverage.set(cp, v);
      }
      return v;
    },
    advance(cp) {
      let w = widths.get(cp);
      if (w === undefined) {
        w = font.glyphForCodePoint(cp).advanceWidth / upm;
        widths.set(cp, w);
      }
      return w;
    },
  };
  faces.set(key, face);
  return face;
}

/** A stretch of text drawn with one font. */
export interface Run {
  readonly text: string;
  readonly font: PDFFont;
  readonly widthEm: number;
}

const REPLACEMENT = 0x3f; // "?"
const ASCII = /^[\x20-\x7e]*$/;

/**
 * The fonts embedded in one document. The fallback faces are embedded only when a text needs
 * them, so a record in plain Latin text carries two fonts.
 */
export class DocumentFonts {
  private readonly embedded = new Map<FaceKey, PDFFont>();
  private readonly primary: Record<Weight, FaceMetrics>;
  private readonly fallback: Record<Weight, FaceMetrics>;

  private constructor(private readonly doc: PDFDocument) {
    this.primary = { regular: loadFace("regular"), bold: loadFace("bold") };
    this.fallback = { regular: loadFace("fallbackRegular"), bold: loadFace("fallbackBold") };
  }

  /** Registers fontkit and embeds the primary faces (subset: only the glyphs used are written). */
  static async embed(doc: PDFDocument): Promise<DocumentFonts> {
    doc.registerFontkit(sharedFontkit);
    const fonts = new DocumentFonts(doc);
    await fonts.pdfFont("regular");
    await fonts.pdfFont("bold");
    return fonts;
  }

  private async pdfFont(key: FaceKey): Promise<PDFFont> {
    const have = this.embedded.get(key);
    if (have) return have;
    const face = loadFace(key);
    // Ligatures off: every character keeps its own glyph, so extracted text matches the input.
    const font = await this.doc.embedFont(face.bytes, { subset: true, features: { liga: false, clig: false, calt: false, dlig: false } });
    fastEncoding(font);
    this.embedded.set(key, font);
    return font;
  }

  /** Embeds the fallback faces if `texts` hold characters the primary face lacks. */
  async prepare(texts: Iterable<string>, weight: Weight): Promise<void> {
    const key: FaceKey = weight === "bold" ? "fallbackBold" : "fallbackRegular";
    if (this.embedded.has(key)) return;
    for (const t of texts) {
      // Plain ASCII (most of a record) is in every face: skip it quickly.
      if (/^[\x20-\x7e\n]*$/.test(t)) continue;
      for (const ch of t) {
        const cp = ch.codePointAt(0) ?? REPLACEMENT;
        if (cp < 0x7f) continue;
        if (!this.primary[weight].has(cp) && this.fallback[weight].has(cp)) {
          await this.pdfFont(key);
          return;
        }
      }
    }
  }

  /** Which face draws a code point: the primary, the fallback (if embedded), else a replacement. */
  private pick(cp: number, weight: Weight): { face: FaceMetrics; key: FaceKey; cp: number } {
    const p = this.primary[weight];
    if (p.has(cp)) return { face: p, key: weight, cp };
    const fk: FaceKey = weight === "bold" ? "fallbackBold" : "fallbackRegular";
    if (this.embedded.has(fk) && this.fallback[weight].has(cp)) return { face: this.fallback[weight], key: fk, cp };
    return { face: p, key: weight, cp: REPLACEMENT };
  }

  /** Width of a single-line text in em units. */
  widthEm(text: string, weight: Weight): number {
    let w = 0;
    for (const ch of text) {
      const pick = this.pick(ch.codePointAt(0) ?? REPLACEMENT, weight);
      w += pick.face.advance(pick.cp);
    }
    return w;
  }

  /** Splits a single-line text into runs of one font each, replacing characters no face has. */
  runs(text: string, weight: Weight): Run[] {
    // Printable ASCII is always in the primary face: one run.
    if (ASCII.test(text)) return [{ text, font: this.embedded.get(weight) as PDFFont, widthEm: this.widthEm(text, weight) }];
    const out: Run[] = [];
    let cur = "";
    let curKey: FaceKey | null = null;
    let curW = 0;
    for (const ch of text) {
      const pick = this.pick(ch.codePointAt(0) ?? REPLACEMENT, weight);
      if (curKey !== null && pick.key !== curKey) {
        out.push({ text: cur, font: this.embedded.get(curKey) as PDFFont, widthEm: curW });
        cur = "";
        curW = 0;
      }
      curKey = pick.key;
      cur += pick.cp === REPLACEMENT && ch !== "?" ? "?" : ch;
      curW += pick.face.advance(pick.cp);
    }
    if (curKey !== null && cur) out.push({ text: cur, font: this.embedded.get(curKey) as PDFFont, widthEm: curW });
    return out;
  }
}
