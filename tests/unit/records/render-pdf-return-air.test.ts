import { execFileSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { RETURN_AIR_CAUTION } from "@/lib/records/pdf/sections/return-air";
import type { RecordInput } from "@/lib/records/record-input";
import { renderRecordPdf } from "@/lib/records/render-pdf";
import { recordInputFixture } from "@/tests/fixtures/records/record-input";

const squash = (s: string): string => s.replace(/\s+/g, "");
let dir = "";
let input: RecordInput;
let all = "";

beforeAll(async () => {
  dir = fs.mkdtempSync(path.join(os.tmpdir(), "flueward-pdf-ra-"));
  input = await recordInputFixture();
  const file = path.join(dir, "record.pdf");
  fs.writeFileSync(file, await renderRecordPdf(input));
  all = squash(execFileSync("pdftotext", [file, "-"], { encoding: "utf8", maxBuffer: 64 * 1024 * 1024 }));
}, 120_000);

afterAll(() => {
  if (dir) fs.rmSync(dir, { recursive: true, force: true });
});

describe("the record's return-air section", () => {
  test("prints the caution, the values with their units and sources, and every return-air finding", () => {
    expect(all).toContain(squash(RETURN_AIR_CAUTION));
    // 76,000 Btu/h output × 2 in² per 1,000 Btu/h (IMC 918.2, starter rulebook) = 152 in².
    expect(all).toContain(squash("Return free area needed: 152 in²; the openings give 562 in²"));
    expect(all).toContain(squash("Airflow: 1,200 cfm (rating-plate airflow, as entered)"));
    // 1,200 cfm ÷ (562 in² ÷ 144) = 307 fpm through each opening, worked by hand.
    expect(all).toContain(squash("307 fpm"));
    const findings = input.findings.filter((f) => f.target.section === "returnAir");
    expect(findings.map((f) => f.code)).toContain("return_air.draft_hood_distance");
    for (const f of findings) {
      expect(all).toContain(squash(f.message));
      expect(all).toContain(squash(f.citation ?? "no rulebook value"));
    }
  });

  test("the basement return 6 ft from a draft hood is a FAIL against the 10 ft of IMC 601.5 (REFERENCE E1)", () => {
    const f = input.findings.find((x) => x.code === "return_air.draft_hood_distance" && x.target.itemId === "ret-basement");
    expect(f?.status).toBe("fail");
    expect(f?.required).toEqual({ value: 10, unit: "ft", comparator: "≥" });
  });
});
