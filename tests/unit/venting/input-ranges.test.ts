import { describe, expect, test } from "vitest";
import { fieldErrorsFromZod } from "@/lib/errors";
import { inspectionDataSchema } from "@/lib/inspections/data";
import { checkInputSchema } from "@/lib/venting";

/**
 * Every numeric input has a range a residential or light-commercial job never leaves; outside it
 * the schema answers with a message naming the field, the range and its unit, keyed by the
 * field's path (what POST /api/check and the inspection autosave return as `fields`, and what the
 * editor shows beside the field). Ranges: common practice, chosen wide enough for any real job.
 */
const base = { appliances: [{ id: "a" }] };

type Case = readonly [path: string, body: Record<string, unknown>, message: string];

const CASES: readonly Case[] = [
  ["appliances.0.inputBtuh", { appliances: [{ id: "a", inputBtuh: 20_000_000 }] }, "Input must be between 0 and 10,000,000 Btu/h."],
  ["appliances.0.outletDiameterIn", { appliances: [{ id: "a", outletDiameterIn: 0.5 }] }, "Outlet diameter must be between 1 and 48 in."],
  ["ventRun.segments.0.lengthFt", { ventRun: { segments: [{ id: "s", lengthFt: 501 }] } }, "Length must be between 0 and 500 ft."],
  ["ventRun.segments.0.lengthFt", { ventRun: { segments: [{ id: "s", lengthFt: -1 }] } }, "Length must be between 0 and 500 ft."],
  ["ventRun.segments.0.diameterIn", { ventRun: { segments: [{ id: "s", diameterIn: 60 }] } }, "Diameter must be between 1 and 48 in."],
  ["ventRun.segments.0.turns90", { ventRun: { segments: [{ id: "s", turns90: 51 }] } }, "Turns of 90° must be a whole number between 0 and 50."],
  ["ventRun.segments.0.turns45", { ventRun: { segments: [{ id: "s", turns45: 1.5 }] } }, "Turns of 45° must be a whole number between 0 and 50."],
  ["ventRun.vent.heightFt", { ventRun: { vent: { heightFt: 301 } } }, "Vent height must be between 0 and 300 ft."],
  ["ventRun.termination.roofPitchPer12", { ventRun: { termination: { roofPitchPer12: 49 } } }, "Roof pitch must be between 0 and 48 in per 12."],
  ["ventRun.termination.nearbyOpenings.0.distanceFt", { ventRun: { termination: { nearbyOpenings: [{ id: "o", kind: "door", distanceFt: 900 }] } } }, "Distance to the opening must be between 0 and 500 ft."],
  ["airSpace.rooms.0.heightFt", { airSpace: { rooms: [{ id: "r", heightFt: 400 }] } }, "Room height must be between 0 and 300 ft."],
  ["airSpace.airChangesPerHour", { airSpace: { airChangesPerHour: 0 } }, "Air changes per hour must be between 0.01 and 10 ACH."],
  ["airSpace.openings.0.freeAreaShare", { airSpace: { openings: [{ id: "p", kind: "indoor_same_story", freeAreaShare: 75 }] } }, "Free-area share must be between 0 and 1 (a share: 0.75 for 75 %)."],
  ["readings.0.flueO2Pct", { readings: [{ applianceId: "a", flueO2Pct: 21 }] }, "Flue O2 must be between 0 and 20.9 %."],
  ["readings.0.flueCoPpm", { readings: [{ applianceId: "a", flueCoPpm: 12_000 }] }, "Flue CO must be between 0 and 10,000 ppm."],
  ["readings.0.draftInWc", { readings: [{ applianceId: "a", draftInWc: -2 }] }, "Draft must be between −1 and 1 in. w.c."],
  ["readings.0.supplyTempF", { readings: [{ applianceId: "a", supplyTempF: 700 }] }, "Supply temperature must be between −60 and 600 °F."],
  ["readings.0.spillageSeconds", { readings: [{ applianceId: "a", spillageSeconds: 4000 }] }, "Spillage time must be between 0 and 3,600 s."],
  ["readings.0.meterSecondsPerRev", { readings: [{ applianceId: "a", meterSecondsPerRev: 0 }] }, "Seconds per revolution must be between 1 and 3,600 s."],
  ["readings.0.meterDialCuFt", { readings: [{ applianceId: "a", meterDialCuFt: 0 }] }, "Meter dial size must be more than 0 and at most 100 ft³."],
  ["readings.0.heatingValueBtuPerCuFt", { readings: [{ applianceId: "a", heatingValueBtuPerCuFt: 100 }] }, "Heating value must be between 500 and 3,500 Btu/ft³."],
  ["removedAppliances.0.inputBtuh", { removedAppliances: [{ id: "x", inputBtuh: -5 }] }, "Input must be between 0 and 10,000,000 Btu/h."],
];

describe("out-of-range inputs get a message naming the field, the range and the unit", () => {
  test.each(CASES)("%s", (path, body, message) => {
    const parsed = checkInputSchema.safeParse({ ...base, ...body });
    expect(parsed.success).toBe(false);
    if (parsed.success) return;
    // What the API sends back as `fields` (lib/errors fieldErrorsFromZod): path → message.
    expect(fieldErrorsFromZod(parsed.error)).toEqual({ [path]: message });
  });

  test("the inspection autosave's schema gives the same message at the same path (the editor's fields use these paths)", () => {
    const parsed = inspectionDataSchema.safeParse({ appliances: [{ id: "a" }], ventRun: { segments: [{ id: "s", lengthFt: 501 }] } });
    expect(parsed.success).toBe(false);
    if (!parsed.success) expect(fieldErrorsFromZod(parsed.error)).toEqual({ "ventRun.segments.0.lengthFt": "Length must be between 0 and 500 ft." });
  });

  test("a word or Infinity where a number belongs names the field and its unit", () => {
    for (const lengthFt of ["ten", Number.POSITIVE_INFINITY, Number.NaN]) {
      const parsed = checkInputSchema.safeParse({ ...base, ventRun: { segments: [{ id: "s", lengthFt }] } });
      expect(parsed.success).toBe(false);
      if (!parsed.success) expect(fieldErrorsFromZod(parsed.error)["ventRun.segments.0.lengthFt"]).toBe("Length must be a number in ft.");
    }
  });

  test("the ends of each range, empty values and negative rises and heights where they make sense are accepted", () => {
    const ok = checkInputSchema.safeParse({
      appliances: [{ id: "a", inputBtuh: 10_000_000, outletDiameterIn: 1, manualClearanceIn: null }],
      ventRun: {
        segments: [{ id: "s", lengthFt: 500, diameterIn: 48, riseIn: -2, turns90: 50, clearanceIn: 0 }],
        vent: { heightFt: 300, lateralFt: 0 },
        termination: { roofPitchPer12: 0, heightAboveNearbyStructureFt: -3, nearbyOpenings: [{ id: "o", kind: "door", distanceFt: 0, ventAboveFt: -4 }] },
      },
      airSpace: { airChangesPerHour: 0.01, rooms: [{ id: "r", lengthFt: 0, volumeCuFt: 10_000_000 }] },
      readings: [{ applianceId: "a", flueO2Pct: 20.9, draftInWc: 1, supplyTempF: -60, meterSecondsPerRev: 3600, heatingValueBtuPerCuFt: 500, meterDialCuFt: 0.5 }],
    });
    expect(ok.success, ok.success ? "" : JSON.stringify(ok.error.issues)).toBe(true);
  });
});
