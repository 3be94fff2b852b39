import { PDFDocument } from "pdf-lib";
import type { RecordInput } from "../record-input";
import type { RenderContext } from "./context";
import { finishPages } from "./draw";
import { DocumentFonts } from "./fonts";
import { drawFooters, runningHeader } from "./frame";
import { Layout } from "./layout";
import { drawCombustionAir } from "./sections/air";
import { drawJustifications, drawPhotos, drawRulebook, drawSignOff, embedSignatures } from "./sections/closing";
import { drawCover, RECORD_TITLE } from "./sections/cover";
import { drawFindings } from "./sections/findings";
import { drawAppliances, drawSegments, drawVentRunDrawing } from "./sections/installation";
import { drawNotes, drawReadings, drawSiteChecks } from "./sections/readings";
import { drawReturnAir } from "./sections/return-air";

/** Every string in the input, to find characters the primary typeface lacks before drawing. */
function strings(value: unknown, out: string[] = []): string[] {
  if (typeof value === "string") {
    if (!value.startsWith("data:")) out.push(value);
  }
  else if (Array.isArray(value)) for (const v of value) strings(v, out);
  else if (value && typeof value === "object" && !(value instanceof Uint8Array)) for (const v of Object.values(value)) strings(v, out);
  return out;
}

/**
 * Renders the signed record of an approved inspection as a PDF: page 1 with the company, the
 * job, the verification code and QR code, a summary and the caution box; then appliances,
 * findings by area, the vent-run drawing (vector), connector segments, combustion air,
 * return air, readings, site checks, justifications, photos, the rulebook and the sign-off. Every page
 * carries the record number, revision, verification code, page n of N and a short caution.
 *
 * Deterministic: the same input gives the same bytes (dates come from `input.generatedAt`).
 */
export async function renderRecordPdf(input: RecordInput): Promise<Uint8Array> {
  const doc = await PDFDocument.create({ updateMetadata: false });
  const when = new Date(input.generatedAt);
  doc.setTitle(`${RECORD_TITLE} ${input.recordNumber}, revision ${input.revision}`);
  doc.setAuthor(input.company.name);
  doc.setSubject(`${input.job.reference}: ${input.job.siteAddress}`);
  doc.setKeywords([input.recordNumber, `revision ${input.revision}`, input.verificationCode]);
  doc.setCreator("Flueward");
  doc.setProducer("Flueward");
  doc.setLanguage("en-US");
  doc.setCreationDate(when);
  doc.setModificationDate(when);

  const fonts = await DocumentFonts.embed(doc);
  const texts = strings(input);
  await fonts.prepare(texts, "regular");
  await fonts.prepare(texts, "bold");

  const photos = [];
  for (const p of input.photos) photos.push(await doc.embedJpg(p.jpegBytes));
  const layout = new Layout(doc, fonts, runningHeader(input));
  const ctx: RenderContext = { input, layout, fonts, photos };
  const signatures = await embedSignatures(ctx);

  drawCover(ctx);
  let n = 0;
  drawAppliances(ctx, ++n);
  drawFindings(ctx, ++n);
  drawVentRunDrawing(ctx, ++n);
  drawSegments(ctx, ++n);
  drawCombustionAir(ctx, ++n);
  drawReturnAir(ctx, ++n);
  drawReadings(ctx, ++n);
  drawSiteChecks(ctx, ++n);
  drawNotes(ctx);
  drawJustifications(ctx, ++n);
  drawPhotos(ctx, ++n);
  drawRulebook(ctx, ++n);
  drawSignOff(ctx, ++n, signatures);
  drawFooters(layout.pages, fonts, input);
  finishPages(doc, layout.pages);

  return doc.save({ useObjectStreams: true });
}
