import { execFileSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { expect, test } from "vitest";
import { renderRecordPdf } from "@/lib/records/render-pdf";
import { recordInputFixture } from "@/tests/fixtures/records/record-input";

// Its own file so that the slow rasterising runs beside the other record tests.
const PDF_LOOK = path.resolve(process.cwd(), "../shared/tools/pdf-look");

test("every page of the record rasterises with the ink its text needs (pdf-look)", async (ctx) => {
  if (!fs.existsSync(PDF_LOOK)) {
    console.warn(`Skipping the ink check: ${PDF_LOOK} does not exist (CI copies shared/ beside the repository).`);
    ctx.skip();
    return;
  }
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "flueward-ink-"));
  try {
    const file = path.join(dir, "record.pdf");
    fs.writeFileSync(file, await renderRecordPdf(await recordInputFixture({ segments: 6, photos: 4 })));
    const pages = Number(/Pages:\s+(\d+)/.exec(execFileSync("pdfinfo", [file], { encoding: "utf8" }))?.[1] ?? 0);
    // Throws (and fails the test) on a non-zero exit: a page without ink, missing glyphs, font errors.
    execFileSync(PDF_LOOK, [file, path.join(dir, "look")], { encoding: "utf8", maxBuffer: 64 * 1024 * 1024 });
    expect(fs.readdirSync(path.join(dir, "look")).filter((f) => f.endsWith(".png"))).toHaveLength(pages);
  } finally {
    fs.rmSync(dir, { recursive: true, force: true });
  }
}, 300_000);
