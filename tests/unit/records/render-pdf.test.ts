import { execFileSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { CAUTION_CO, CAUTION_GOVERNS, FOOTER_CAUTION } from "@/lib/records/pdf/caution";
import { FRAME_INSET } from "@/lib/records/pdf/frame";
import { MARGIN } from "@/lib/records/pdf/theme";
import type { RecordInput } from "@/lib/records/record-input";
import { renderRecordPdf } from "@/lib/records/render-pdf";
import { recordInputFixture } from "@/tests/fixtures/records/record-input";

let dir = "";
let short: RecordInput;
let long: RecordInput;
let shortPdf = "";
let longPdf = "";
let longBytes: Uint8Array;

/** Text as pdftotext extracts it, with all whitespace removed: wrapping cannot split a match. */
const squash = (s: string): string => s.replace(/\s+/g, "");
const text = (file: string, args: string[] = []): string => execFileSync("pdftotext", [...args, file, "-"], { encoding: "utf8", maxBuffer: 64 * 1024 * 1024 });
const pageCount = (file: string): number => Number(/Pages:\s+(\d+)/.exec(execFileSync("pdfinfo", [file], { encoding: "utf8" }))?.[1] ?? 0);
const pageText = (file: string, n: number): string => text(file, ["-f", String(n), "-l", String(n)]);

async function write(name: string, input: RecordInput): Promise<{ file: string; bytes: Uint8Array }> {
  const bytes = await renderRecordPdf(input);
  const file = path.join(dir, name);
  fs.writeFileSync(file, bytes);
  return { file, bytes };
}

beforeAll(async () => {
  dir = fs.mkdtempSync(path.join(os.tmpdir(), "flueward-pdf-"));
  short = await recordInputFixture();
  long = await recordInputFixture({ segments: 30, photos: 20, longText: true, supersedesRevision: 1 });
  shortPdf = (await write("short.pdf", short)).file;
  const l = await write("long.pdf", long);
  longPdf = l.file;
  longBytes = l.bytes;
}, 120_000);

afterAll(() => {
  if (dir) fs.rmSync(dir, { recursive: true, force: true });
});

describe("renderRecordPdf: what the record says", () => {
  test("the fixture is realistic: real engine findings of every status the example gives", () => {
    expect(short.findings.length).toBeGreaterThan(30);
    expect(new Set(short.findings.map((f) => f.status))).toEqual(new Set(["pass", "fail", "needs-info", "not-applicable"]));
    expect(long.data.ventRun?.segments).toHaveLength(30);
    expect(long.photos).toHaveLength(20);
    expect(long.job.siteAddress.length).toBeGreaterThanOrEqual(300);
  });

  test.each([
    ["short", () => shortPdf, () => short],
    ["long", () => longPdf, () => long],
  ])("%s record: caution, every finding's message, signers, verification code and record number", (_name, file, input) => {
    const all = squash(text(file()));
    for (const caution of [CAUTION_GOVERNS, CAUTION_CO]) expect(all).toContain(squash(caution));
    const missing = input().findings.filter((f) => !all.includes(squash(f.message)));
    expect(missing.map((f) => `${f.code}@${f.target.path}: ${f.message}`)).toEqual([]);
    for (const s of [input().installer.signedName, input().supervisor.signedName, input().verificationCode, input().recordNumber, input().job.siteAddress, input().job.customerName]) {
      expect(all).toContain(squash(s));
    }
    for (const word of ["PASS", "FAIL", "NEEDSINFO"]) expect(all).toContain(word);
  });

  test("every page has the footer: record, revision, verification code, page n of N and the short caution", () => {
    const n = pageCount(shortPdf);
    for (let i = 1; i <= n; i++) {
      const t = squash(pageText(shortPdf, i));
      expect(t).toContain(squash(`Page ${i} of ${n}`));
      expect(t).toContain(squash(`Record ${short.recordNumber} · Revision ${short.revision} · Verification code ${short.verificationCode}`));
      expect(t).toContain(squash(FOOTER_CAUTION));
    }
  });

  test("page 1 carries the caution box, the verify URL under the QR code and the summary counts", () => {
    const p1 = squash(pageText(shortPdf, 1));
    expect(p1).toContain(squash(CAUTION_GOVERNS));
    expect(p1).toContain(squash(short.verifyUrl));
    expect(p1).toContain(squash(`Summary of the ${short.summary.total} checks`));
    expect(p1).toContain(squash(short.company.licenceNumber));
  });

  test("a correcting revision says which revision it corrects", () => {
    expect(squash(pageText(longPdf, 1))).toContain(squash("Revision 2, corrects revision 1"));
  });

  test("the record never calls the installation safe", () => {
    const t = text(shortPdf).replace(/\s+/g, " ");
    expect(t).not.toMatch(/\b(installation|appliance|venting|system) (is|was) safe\b/i);
    expect(t).not.toMatch(/\bsafe to use\b/i);
  });

  test("justified failures point to their justification, which is printed with its reference", () => {
    const all = squash(text(shortPdf));
    expect(short.justifications.length).toBeGreaterThan(0);
    for (const j of short.justifications) {
      expect(all).toContain(squash(j.text));
      expect(all).toContain(squash(j.reference));
    }
    expect(all).toContain(squash("Left as found with a written justification: see Justifications, item 1."));
  });
});

describe("renderRecordPdf: layout of a long inspection", () => {
  test("produces several pages and repeats the segments table's header on each continued page", () => {
    const n = pageCount(longPdf);
    expect(n).toBeGreaterThan(10);
    const withHeader: number[] = [];
    for (let i = 1; i <= n; i++) {
      const t = pageText(longPdf, i);
      if (/Connector segments/.test(t) && ["Material", "Dia.", "Clearance", "Fasteners", "Passes", "Checks"].every((w) => t.includes(w))) withHeader.push(i);
    }
    expect(withHeader.length).toBeGreaterThan(1);
    expect(squash(pageText(longPdf, withHeader[1]!))).toContain("Connectorsegments(continued)");
  });

  test("20 photos paginate, each with its caption", () => {
    const all = squash(text(longPdf));
    for (let i = 0; i < long.photos.length; i++) expect(all).toContain(squash(`Photo ${i + 1}. ${long.photos[i]!.caption}`));
  });

  test("no word runs off the page: every word box lies inside the margins", () => {
    const html = execFileSync("pdftotext", ["-bbox", longPdf, "-"], { encoding: "utf8", maxBuffer: 64 * 1024 * 1024 });
    const pages = html.split("<page ").slice(1);
    expect(pages.length).toBe(pageCount(longPdf));
    const outside: string[] = [];
    pages.forEach((p, i) => {
      const [, w, h] = /width="([\d.]+)" height="([\d.]+)"/.exec(p) ?? [];
      const width = Number(w);
      const height = Number(h);
      for (const m of p.matchAll(/<word xMin="([\d.-]+)" yMin="([\d.-]+)" xMax="([\d.-]+)" yMax="([\d.-]+)">([^<]*)<\/word>/g)) {
        const [x0, y0, x1, y1] = [Number(m[1]), Number(m[2]), Number(m[3]), Number(m[4])];
        if (x0 < MARGIN.left - 1 || x1 > width - MARGIN.right + 1 || y0 < FRAME_INSET || y1 > height - FRAME_INSET) outside.push(`page ${i + 1}: "${m[5]}" at ${x0},${y0}–${x1},${y1}`);
      }
    });
    expect(outside).toEqual([]);
  });

  test("is deterministic: the same input gives byte-identical PDFs", async () => {
    const again = await renderRecordPdf(long);
    expect(Buffer.compare(Buffer.from(again), Buffer.from(longBytes))).toBe(0);
    const a = await renderRecordPdf(short);
    const b = await renderRecordPdf(short);
    expect(Buffer.compare(Buffer.from(a), Buffer.from(b))).toBe(0);
  }, 60_000);

  test("dates in the PDF's metadata are the record's generatedAt", () => {
    const info = execFileSync("pdfinfo", ["-isodates", shortPdf], { encoding: "utf8" });
    expect(info).toMatch(/CreationDate:\s+2026-03-14T15:30:00/);
    expect(info).toMatch(/ModDate:\s+2026-03-14T15:30:00/);
  });
});

describe("renderRecordPdf: fonts and rendering", () => {
  test("pdffonts lists only embedded fonts, the app's typeface among them", () => {
    const rows = execFileSync("pdffonts", [shortPdf], { encoding: "utf8" }).trim().split("\n").slice(2);
    expect(rows.length).toBeGreaterThanOrEqual(2);
    expect(rows.some((r) => r.startsWith("PublicSans"))).toBe(true);
    for (const r of rows) expect(r.split(/\s+/).at(-5), r).toBe("yes");
  });

  test("characters the primary typeface lacks are drawn with the embedded fallback face", async () => {
    const input = await recordInputFixture();
    const odd = { ...input, job: { ...input.job, customerName: "Zoë Ševčík → unit ✓" } };
    const file = (await write("fallback.pdf", odd)).file;
    expect(squash(text(file))).toContain(squash("Zoë Ševčík → unit ✓"));
    const fonts = execFileSync("pdffonts", [file], { encoding: "utf8" });
    expect(fonts).toMatch(/DejaVuSans/);
    for (const r of fonts.trim().split("\n").slice(2)) expect(r.split(/\s+/).at(-5), r).toBe("yes");
  });

  test("a record without drawn signatures says the names were typed only", async () => {
    const input = await recordInputFixture();
    const file = (await write("unsigned.pdf", { ...input, installer: { ...input.installer, signaturePng: null }, supervisor: { ...input.supervisor, signaturePng: "data:image/png;base64,bm90IGEgcG5n" } })).file;
    const all = squash(text(file));
    expect(all.split(squash("No drawn signature: typed name only")).length - 1).toBe(2);
    expect(all).toContain(squash(input.installer.signedName));
  });
});
