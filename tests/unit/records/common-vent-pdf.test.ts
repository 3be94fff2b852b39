import { execFileSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { expect, test } from "vitest";
import { STARTER_RULEBOOK } from "@/db/seeds/data/starter-rulebook";
import { evaluateInspectionData } from "@/lib/inspections/evaluate";
import type { InspectionData } from "@/lib/inspections/data";
import { renderRecordPdf } from "@/lib/records/render-pdf";
import { DEFAULT_SITE_CHECK_ITEMS } from "@/lib/site-checks";
import { prepareRulebook } from "@/lib/venting";
import { recordInputFixture } from "@/tests/fixtures/records/record-input";

/** Text as pdftotext extracts it, with all whitespace removed: wrapping cannot split a match. */
const squash = (s: string): string => s.replace(/\s+/g, "");

test("the record's drawing shows a furnace and a water heater on one common vent, each with its connector", async () => {
  const input = await recordInputFixture();
  const [first] = input.data.appliances;
  const run = input.data.ventRun!;
  // Invented demo data: the documented example's furnace with a natural-draft water heater beside it.
  const appliances: InspectionData["appliances"] = [
    { ...first!, label: "Basement furnace", inputBtuh: 100_000 },
    { ...first!, id: "water-heater-1", label: "Water heater", kind: "water_heater", draft: "natural", inputBtuh: 40_000, outletDiameterIn: 3 },
  ];
  const [s1, s2] = run.segments;
  const data: InspectionData = {
    ...input.data,
    appliances,
    ventRun: {
      ...run,
      applianceIds: [first!.id, "water-heater-1"],
      segments: [
        s1!,
        s2!,
        { ...s1!, id: "seg-3", applianceId: "water-heater-1", material: "type_b", diameterIn: 3, lengthFt: 1 },
        { ...s2!, id: "seg-4", applianceId: "water-heater-1", material: "type_b", diameterIn: 3, lengthFt: 3, riseIn: 0.75 },
      ],
      vent: { ...run.vent, diameterIn: 5, heightFt: 20, serves: "common" },
    },
  };
  const evaluation = evaluateInspectionData(data, prepareRulebook(STARTER_RULEBOOK), DEFAULT_SITE_CHECK_ITEMS);
  const bytes = await renderRecordPdf({ ...input, appliances, data, findings: evaluation.findings, summary: evaluation.summary, sizing: evaluation.sizing });

  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "flueward-common-vent-"));
  try {
    const file = path.join(dir, "record.pdf");
    fs.writeFileSync(file, bytes);
    const text = squash(execFileSync("pdftotext", [file, "-"], { encoding: "utf8", maxBuffer: 64 * 1024 * 1024 }));
    expect(text).toContain(squash("Common vent serving Basement furnace and Water heater (Basement furnace: 2 connector segments; Water heater: 2 connector segments)"));
    for (const label of ["Common vent: Type B 5 in", "connector: segments 1–2", "connector: segments 3–4", "Furnace · 100,000 Btu/h", "40,000 Btu/h"]) expect(text).toContain(squash(label));
  } finally {
    fs.rmSync(dir, { recursive: true, force: true });
  }
}, 60_000);
