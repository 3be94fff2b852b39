import type { PDFImage } from "pdf-lib";
import { PHOTO_TAG_LABELS } from "@/lib/schemas/photo";
import { attachmentLabel, type RenderContext } from "../context";
import { utcDateTime } from "../format";
import { leading } from "../layout";
import { drawTable, type Cell } from "../table";
import { drawAligned, drawLine, wrapText, type TextStyle } from "../text";
import { COLOURS, SIZE } from "../theme";
import { image, line, rect } from "../draw";

const body: TextStyle = { weight: "regular", size: SIZE.body, color: COLOURS.body };
const muted: TextStyle = { weight: "regular", size: SIZE.small, color: COLOURS.muted };
const strong: TextStyle = { weight: "bold", size: SIZE.body, color: COLOURS.ink };

export function drawJustifications(ctx: RenderContext, number: number): void {
  const { layout, input } = ctx;
  layout.heading(number, "Justifications", 50);
  if (input.justifications.length === 0) {
    layout.paragraph("No finding was left as found with a written justification.", body);
    return;
  }
  layout.paragraph("Findings left as found, each with the installer's written reason (for example the manufacturer's instructions that allow it) and the reference it rests on.", { ...body, color: COLOURS.muted }, { after: 6 });
  input.justifications.forEach((j, i) => {
    layout.ensure(leading(SIZE.body) * 3);
    layout.paragraph(`${i + 1}. ${j.title}`, strong, { after: 1 });
    layout.paragraph(j.text, body, { indent: 14, after: 1 });
    layout.paragraph(`Reference: ${j.reference.trim() || "none given"}`, muted, { indent: 14, after: 7 });
  });
}

function tagLabel(tag: string): string {
  return (PHOTO_TAG_LABELS as Record<string, string>)[tag] ?? tag;
}

/** Photos two to a row, each scaled to fit its frame and captioned. */
export function drawPhotos(ctx: RenderContext, number: number): void {
  const { layout, input, photos } = ctx;
  layout.heading(number, "Photos", 230);
  if (input.photos.length === 0) {
    layout.paragraph("No photo was attached to this inspection.", body);
    return;
  }
  const gap = 14;
  const cellW = (layout.width - gap) / 2;
  const frameH = Math.round(cellW * 0.66);
  const capBold: TextStyle = { weight: "bold", size: SIZE.small, color: COLOURS.ink };
  for (let i = 0; i < input.photos.length; i += 2) {
    const pair = [0, 1].map((k) => i + k).filter((k) => k < input.photos.length);
    const captions = pair.map((k) => {
      const p = input.photos[k]!;
      const tag = p.tag && p.tag !== "none" ? `${tagLabel(p.tag)} · ` : "";
      return {
        title: wrapText(ctx.fonts, `Photo ${k + 1}. ${p.caption.trim() || "No caption"}`, capBold, cellW),
        meta: wrapText(ctx.fonts, `${tag}Attached to ${attachmentLabel(input, p.attachedTo)}`, muted, cellW),
      };
    });
    const capH = Math.max(...captions.map((c) => c.title.length * leading(capBold.size) + c.meta.length * leading(muted.size)));
    layout.ensure(frameH + 6 + capH + 4);
    const top = layout.y;
    pair.forEach((k, j) => {
      const x = layout.left + j * (cellW + gap);
      const img: PDFImage | undefined = photos[k];
      rect(layout.page, x, top - frameH, cellW, frameH, { fill: COLOURS.band });
      if (img) {
        const s = Math.min(cellW / img.width, frameH / img.height);
        const w = img.width * s;
        const h = img.height * s;
        image(layout.page, img, x + (cellW - w) / 2, top - frameH + (frameH - h) / 2, w, h);
      }
      let y = top - frameH - 6;
      const cap = captions[j]!;
      for (const l of cap.title) {
        drawLine(layout.page, ctx.fonts, l, x, y - capBold.size, capBold);
        y -= leading(capBold.size);
      }
      for (const l of cap.meta) {
        drawLine(layout.page, ctx.fonts, l, x, y - muted.size, muted);
        y -= leading(muted.size);
      }
    });
    layout.y = top - frameH - 6 - capH - 12;
  }
}

export function drawRulebook(ctx: RenderContext, number: number): void {
  const { layout, input } = ctx;
  const rb = input.rulebook;
  layout.heading(number, "Rulebook", 160);
  const kw = 130;
  const rows: Cell[][] = [
    ["Name", rb.name],
    ["Version", String(rb.versionNumber)],
    ["Edition", rb.edition || "not stated"],
    ...(rb.demoDataNote ? [["Demo data", rb.demoDataNote] as Cell[]] : []),
    ["Content SHA-256", rb.contentSha256],
  ].map(([k, v]) => [[{ text: k as string, color: COLOURS.muted }], v as Cell]);
  drawTable(layout, [{ header: "", width: kw }, { header: "", width: layout.width - kw }], rows, { header: false });
  const citations: string[] = [];
  for (const f of input.findings) if (f.citation && !citations.includes(f.citation)) citations.push(f.citation);
  layout.subheading(`Citations used by the findings (${citations.length})`, 30);
  if (citations.length === 0) layout.paragraph("None.", body);
  citations.forEach((c, i) => layout.paragraph(`${i + 1}. ${c}`, { ...body, size: SIZE.small }, { indent: 4, after: 2 }));
}

function dataUrlPng(url: string | null): Uint8Array | null {
  const m = url ? /^data:image\/png;base64,([A-Za-z0-9+/=\s]+)$/.exec(url) : null;
  if (!m?.[1]) return null;
  return new Uint8Array(Buffer.from(m[1], "base64"));
}

/** Embeds the signature images up front (async), so that drawing stays synchronous. */
export async function embedSignatures(ctx: Pick<RenderContext, "input" | "layout">): Promise<{ installer: PDFImage | null; supervisor: PDFImage | null }> {
  const one = async (url: string | null): Promise<PDFImage | null> => {
    const bytes = dataUrlPng(url);
    if (!bytes) return null;
    try {
      return await ctx.layout.doc.embedPng(bytes);
    } catch {
      return null;
    }
  };
  return { installer: await one(ctx.input.installer.signaturePng), supervisor: await one(ctx.input.supervisor.signaturePng) };
}

export function drawSignOff(ctx: RenderContext, number: number, signatures: { installer: PDFImage | null; supervisor: PDFImage | null }): void {
  const { layout, input } = ctx;
  const boxH = 150;
  layout.heading(number, "Sign-off", boxH + 50);
  layout.paragraph(
    `The installer signed the inspection when submitting it; the supervisor signed when approving it, which issued this record (revision ${input.revision}). Scan the code on page 1 or open ${input.verifyUrl} to confirm that this record is genuine and current.`,
    { ...body, color: COLOURS.muted },
    { after: 8 },
  );
  layout.ensure(boxH + 4);
  const gap = 14;
  const w = (layout.width - gap) / 2;
  const top = layout.y;
  const people = [
    { role: "Installer", who: input.installer, img: signatures.installer, what: "Signed on submitting" },
    { role: "Supervisor", who: input.supervisor, img: signatures.supervisor, what: "Signed on approving" },
  ];
  people.forEach((p, j) => {
    const x = layout.left + j * (w + gap);
    const page = layout.page;
    rect(page, x, top - boxH, w, boxH, { stroke: COLOURS.rule, lineWidth: 0.8 });
    rect(page, x, top - 20, w, 20, { fill: COLOURS.band });
    drawLine(page, ctx.fonts, p.role.toUpperCase(), x + 10, top - 13.5, { weight: "bold", size: SIZE.small, color: COLOURS.accent });
    const sigTop = top - 28;
    const sigH = 62;
    const sigW = w - 20;
    if (p.img) {
      const s = Math.min(sigW / p.img.width, sigH / p.img.height);
      image(page, p.img, x + 10, sigTop - sigH + (sigH - p.img.height * s) / 2, p.img.width * s, p.img.height * s);
    } else {
      drawAligned(page, ctx.fonts, "No drawn signature: typed name only", x + 10, sigW, sigTop - sigH / 2, muted, "center");
    }
    line(page, x + 10, sigTop - sigH - 2, x + w - 10, sigTop - sigH - 2, COLOURS.muted, 0.6);
    let y = sigTop - sigH - 8;
    for (const l of wrapText(ctx.fonts, p.who.signedName || "name not recorded", strong, sigW).slice(0, 2)) {
      drawLine(page, ctx.fonts, l, x + 10, y - strong.size, strong);
      y -= leading(strong.size);
    }
    drawLine(page, ctx.fonts, `${p.what}: ${utcDateTime(p.who.signedAt)}`, x + 10, y - muted.size, muted);
  });
  layout.y = top - boxH - 10;
}
