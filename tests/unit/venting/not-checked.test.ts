import { readFileSync } from "node:fs";
import { describe, expect, test } from "vitest";
import {
  airSpaceSchema,
  checkInputSchema,
  evaluateCombustionAir,
  evaluateInspection,
  evaluateReadings,
  evaluateVentRun,
  prepareRulebook,
  readingsSchema,
  type RulebookContent,
} from "@/lib/venting";
import { RB, TEST_CONTENT, furnace, goodRun, only, waterHeater, withParams, withoutParams } from "@/tests/fixtures/venting/rulebook";

/**
 * A check whose rulebook lacks the value it needs says "Not checked" with the reason (needs-info),
 * never a pass and never nothing. Each case removes one value from the test rulebook and feeds a
 * reading or a run that would pass with it.
 */
const NOT_CHECKED = /^Not checked: the rulebook has no value for /;

function readingsOf(over: Record<string, unknown>) {
  return readingsSchema.parse({ applianceId: "furnace", ...over });
}

describe("a missing rulebook value is 'not checked', never a pass", () => {
  test("ambient CO below the stop level with no caution level is not a pass", () => {
    // 5 ppm would pass against a 10 ppm caution level (REFERENCE.md D8, found: 0–9 normal).
    const rb = prepareRulebook(withoutParams("ambient_co_marginal_ppm"));
    const f = only(evaluateReadings(readingsOf({ ambientCoPpm: 5 }), furnace(), rb), "readings.ambient_co");
    expect(f.status).toBe("needs-info");
    expect(f.message).toMatch(NOT_CHECKED);
    expect(f.message).toContain("ambient CO caution level");
    // At or above the stop level it still fails: that needs only the stop level.
    expect(only(evaluateReadings(readingsOf({ ambientCoPpm: 40 }), furnace(), rb), "readings.ambient_co").status).toBe("fail");
  });

  test("a flue CO limit missing for the appliance kind", () => {
    const content: RulebookContent = { ...structuredClone(TEST_CONTENT), flueCoLimits: TEST_CONTENT.flueCoLimits.filter((r) => r.applianceKind !== "water_heater") };
    const f = only(evaluateReadings(readingsOf({ applianceId: "wh", flueCoPpm: 10, flueO2Pct: 8 }), waterHeater(), prepareRulebook(content)), "readings.co_air_free");
    expect(f.status).toBe("needs-info");
    expect(f.message).toMatch(NOT_CHECKED);
    expect(f.message).toContain("flue CO limit for water heater appliances");
    expect(f.message).toContain('"Flue CO limits"');
  });

  test("a support spacing of 0 is no usable value: not checked, not 'Infinity supports'", () => {
    const content = structuredClone(TEST_CONTENT);
    for (const r of content.supportSpacing) r.maxSpacingFt = 0;
    const r = evaluateVentRun(goodRun(), [furnace()], prepareRulebook(content));
    for (const f of r.findings.filter((x) => x.code === "supports.spacing")) {
      expect(f.status).toBe("needs-info");
      expect(f.message).toMatch(NOT_CHECKED);
    }
    expect(r.sizing.segments.every((s) => s.supportsNeeded === null)).toBe(true);
  });

  test("known-infiltration with a highest ACH of 0 is not checked rather than dividing by zero", () => {
    const rb = prepareRulebook(withParams({ infiltration_ach_max: 0 }));
    const space = airSpaceSchema.parse({ rooms: [{ id: "r", volumeCuFt: 100_000 }], airChangesPerHour: 0.3 });
    const f = only(evaluateCombustionAir(space, [furnace()], rb).findings, "air.volume");
    expect(f.status).toBe("needs-info");
    expect(f.message).toMatch(NOT_CHECKED);
  });

  test.each([
    ["connector_min_slope_in_per_ft", "connector.slope"],
    ["vent_min_height_above_collar_ft", "vent.min_height"],
    ["termination_listed_cap_max_in", "termination.height"],
  ] as const)("without %s, %s is not checked", (key, code) => {
    const r = evaluateVentRun(goodRun(), [furnace()], prepareRulebook(withoutParams(key)));
    for (const f of r.findings.filter((x) => x.code === code)) {
      expect(f.status).toBe("needs-info");
      expect(f.message).toMatch(NOT_CHECKED);
    }
    expect(r.findings.some((x) => x.code === code)).toBe(true);
  });

  test.each([
    ["draft_max_inwc", "readings.draft", { draftInWc: -0.02 }],
    ["spillage_max_seconds", "readings.spillage", { spillageSeconds: 5 }],
    ["input_rate_tolerance_pct", "readings.input_rate", { meterDialCuFt: 1, meterSecondsPerRev: 45, heatingValueBtuPerCuFt: 1000 }],
    ["ambient_co_max_ppm", "readings.ambient_co", { ambientCoPpm: 0 }],
  ] as const)("without %s, %s is not checked", (key, code, reading) => {
    const f = only(evaluateReadings(readingsOf(reading), furnace({ draft: "natural" }), prepareRulebook(withoutParams(key))), code);
    expect(f.status).toBe("needs-info");
    expect(f.message).toMatch(NOT_CHECKED);
  });
});

describe("against a rulebook with no values at all, nothing that needs one passes", () => {
  // Checks whose requirement is not a rulebook number may still pass: the appliance outlet
  // (connector diameter), the rating plate (temperature rise), a locked joint, open space.
  const NO_RULEBOOK_NUMBER = new Set(["connector.diameter", "joints.locked", "passage.single_wall", "readings.temperature_rise", "vent.category"]);
  const EMPTY: RulebookContent = {
    ...structuredClone(TEST_CONTENT),
    parameters: [],
    connectorLengthShare: [],
    clearances: [],
    supportSpacing: [],
    fasteners: [],
    prohibitedPassages: [],
    terminationHeights: [],
    terminationDistances: [],
    capacity: [],
    louverShares: [],
    flueCoLimits: [],
  };

  test("the documented example request: every rulebook-based finding is needs-info, most of them 'Not checked'", () => {
    const input = checkInputSchema.parse(JSON.parse(readFileSync("docs/examples/check-request.json", "utf8")));
    const r = evaluateInspection(input, prepareRulebook(EMPTY));
    const passing = r.findings.filter((f) => f.status === "pass" && !NO_RULEBOOK_NUMBER.has(f.code));
    expect(passing.map((f) => `${f.code}: ${f.message}`)).toEqual([]);
    const notChecked = new Set(r.findings.filter((f) => NOT_CHECKED.test(f.message)).map((f) => f.code));
    for (const code of ["connector.slope", "connector.horizontal_length", "clearance.combustibles", "supports.spacing", "joints.fasteners", "termination.height", "readings.ambient_co", "readings.co_air_free", "readings.draft", "readings.input_rate"]) {
      expect(notChecked).toContain(code);
    }
  });

  test("the same request against the full test rulebook does check them (the audit above is not vacuous)", () => {
    const input = checkInputSchema.parse(JSON.parse(readFileSync("docs/examples/check-request.json", "utf8")));
    const r = evaluateInspection(input, RB);
    expect(r.findings.filter((f) => NOT_CHECKED.test(f.message))).toEqual([]);
  });
});
