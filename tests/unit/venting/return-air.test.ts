import fc from "fast-check";
import { describe, expect, test } from "vitest";
import {
  airflowFromRiseCfm,
  airflowFromTonsCfm,
  checkInputSchema,
  evaluateInspection,
  evaluateReturnAir,
  faceVelocityFpm,
  furnaceOutputBtuh,
  prepareRulebook,
  readingsSchema,
  requiredReturnAreaSqIn,
  returnAirSchema,
  rulebookContentSchema,
  validateRulebookContent,
  type Appliance,
  type Readings,
  type ReturnAir,
} from "@/lib/venting";
import { STARTER_RULEBOOK } from "@/db/seeds/data/starter-rulebook";
import { RB, TEST_CONTENT, furnace, only, waterHeater, withCode, withoutParams } from "@/tests/fixtures/venting/rulebook";

/** A return with the given fields; one 20 × 25 in open grille in a hallway unless openings are given. */
function ret(over: Record<string, unknown> = {}): ReturnAir {
  return returnAirSchema.parse({
    applianceId: "furnace",
    outputBtuh: 80_000,
    airflowCfm: 1_200,
    openings: [opening()],
    ...over,
  });
}

function opening(over: Record<string, unknown> = {}) {
  return { id: "r1", label: "Hall grille", widthIn: 20, heightIn: 25, freeAreaShare: 1, filterGrille: false, space: "hallway", fuelApplianceInSpace: false, ...over };
}

function run(ra: ReturnAir, appliances: Appliance[] = [furnace()], readings: Readings[] = [], rb = RB) {
  return evaluateReturnAir(ra, appliances, readings, rb);
}

describe("return-air sizing helpers", () => {
  test.each([
    // IMC 918.2 (2018), REFERENCE E4, found: 2 in² per 1,000 Btu/h of output.
    { outputBtuh: 80_000, perKbtuh: 2, expected: 160, source: "IMC 918.2: 80,000 Btu/h output → 160 in²" },
    { outputBtuh: 100_000, perKbtuh: 2, expected: 200, source: "IMC 918.2: 100,000 Btu/h output → 200 in²" },
    // IMC 918.3 (REFERENCE E4, found): heat pumps 6 in² per 1,000 Btu/h.
    { outputBtuh: 36_000, perKbtuh: 6, expected: 216, source: "IMC 918.3: heat pump 36,000 Btu/h at 6 in² → 216 in²" },
  ])("required return area: $source", ({ outputBtuh, perKbtuh, expected }) => {
    expect(requiredReturnAreaSqIn(outputBtuh, perKbtuh)).toBeCloseTo(expected, 9);
  });

  test("D7 worked example (sensible-heat relation, found): 100,000 Btu/h at 80 % → 80,000 output; 60 °F rise → about 1,235 cfm", () => {
    const output = furnaceOutputBtuh(100_000, 80);
    expect(output).toBe(80_000);
    // 80,000 ÷ (1.08 × 60) = 80,000 ÷ 64.8 = 1,234.57 cfm, worked by hand.
    expect(airflowFromRiseCfm(output, 60, 1.08)).toBeCloseTo(1234.57, 2);
    expect(Math.round(airflowFromRiseCfm(output, 60, 1.08)!)).toBe(1235);
  });

  test("E2 (HARDI technical guidance, found): 3 tons × 400 cfm per ton → 1,200 cfm", () => {
    expect(airflowFromTonsCfm(3, 400)).toBe(1200);
  });

  test("E3 face velocity, common practice (worked by hand): 1,200 cfm through a 20 × 25 in grille at 100 % free area → 345.6 fpm", () => {
    // 20 × 25 = 500 in² = 500 ÷ 144 = 3.472 ft²; 1,200 ÷ 3.472 = 345.6 fpm.
    expect(faceVelocityFpm(1200, 500)).toBeCloseTo(345.6, 1);
  });

  test("no airflow follows from a rise that is not positive, and no velocity from no free area", () => {
    expect(airflowFromRiseCfm(80_000, 0, 1.08)).toBeNull();
    expect(airflowFromRiseCfm(80_000, -5, 1.08)).toBeNull();
    expect(faceVelocityFpm(1200, 0)).toBeNull();
  });
});

describe("return_air.area", () => {
  test.each([
    // IMC 918.2 (2018), REFERENCE E4, found: 80,000 Btu/h output needs 160 in² of free area.
    { openings: [opening({ widthIn: 16, heightIn: 10 })], status: "pass", free: 160, note: "16 × 10 in open = 160 in², exactly the IMC 918.2 minimum" },
    { openings: [opening({ widthIn: 14, heightIn: 10 })], status: "fail", free: 140, note: "14 × 10 in = 140 in² < 160 in²" },
    { openings: [opening({ widthIn: 20, heightIn: 10, freeAreaShare: 0.75 })], status: "fail", free: 150, note: "200 in² gross at 75 % free = 150 in²" },
    { openings: [opening({ widthIn: 10, heightIn: 10 }), opening({ id: "r2", widthIn: 10, heightIn: 6, space: "bedroom" })], status: "pass", free: 160, note: "two openings add up: 100 + 60 = 160 in²" },
    { openings: [opening({ freeAreaSqIn: 170, widthIn: null, heightIn: null })], status: "pass", free: 170, note: "stated free area replaces dimensions" },
  ])("80,000 Btu/h output: $note → $status", ({ openings, status, free }) => {
    const { findings, sizing } = run(ret({ openings }));
    const f = only(findings, "return_air.area");
    expect(f.status).toBe(status);
    expect(f.measured?.value).toBeCloseTo(free, 9);
    expect(f.required).toEqual({ value: 160, unit: "in²", comparator: "≥" });
    expect(f.citation).toContain("918.2");
    expect(sizing.requiredFreeAreaSqIn).toBe(160);
  });

  test("output from input × efficiency (D7: 100,000 Btu/h at 80 % → 80,000 Btu/h → 160 in² by IMC 918.2)", () => {
    const { findings, sizing } = run(ret({ outputBtuh: null, efficiencyPct: 80, openings: [opening({ widthIn: 16, heightIn: 10 })] }), [furnace({ inputBtuh: 100_000 })]);
    expect(sizing.outputBtuh).toBe(80_000);
    expect(sizing.outputSource).toBe("input_efficiency");
    expect(only(findings, "return_air.area").status).toBe("pass");
  });

  test("no output and no efficiency is needs-info naming the output", () => {
    const f = only(run(ret({ outputBtuh: null })).findings, "return_air.area");
    expect(f.status).toBe("needs-info");
    expect(f.target.path).toBe("returnAir.outputBtuh");
    expect(f.message).toContain("output");
  });

  test("efficiency without the furnace's input points at the appliance's input", () => {
    const f = only(run(ret({ outputBtuh: null, efficiencyPct: 95 }), [furnace({ inputBtuh: null })]).findings, "return_air.area");
    expect(f.status).toBe("needs-info");
    expect(f.target.path).toBe("appliances.0.inputBtuh");
  });

  test("no openings is needs-info; an opening without its free-area share is needs-info naming the share", () => {
    expect(only(run(ret({ openings: [] })).findings, "return_air.area").status).toBe("needs-info");
    const f = only(run(ret({ openings: [opening({ freeAreaShare: null })] })).findings, "return_air.area");
    expect(f.status).toBe("needs-info");
    expect(f.target.path).toBe("returnAir.openings.0.freeAreaShare");
  });

  test("a rulebook without the area per 1,000 Btu/h gives needs-info naming the table", () => {
    const rb = prepareRulebook(withoutParams("return_air_area_sqin_per_1000_btuh_output"));
    const f = only(run(ret(), [furnace()], [], rb).findings, "return_air.area");
    expect(f.status).toBe("needs-info");
    expect(f.citation).toBeNull();
    expect(f.message).toContain("Parameters");
  });
});

describe("return_air.velocity (quiet target 400 fpm, filter grille 300 fpm: ACCA Manual D as cited, common practice)", () => {
  test.each([
    // 1,200 cfm through 500 in² (20 × 25 in, 100 % free) = 345.6 fpm, worked by hand.
    { filterGrille: false, status: "pass", limit: 400, note: "345.6 fpm ≤ 400 fpm quiet target" },
    { filterGrille: true, status: "warn", limit: 300, note: "345.6 fpm > 300 fpm filter-grille maximum: a warning, not a failure" },
  ])("E3: 1,200 cfm, 20 × 25 in grille, filter $filterGrille → $status ($note)", ({ filterGrille, status, limit }) => {
    const { findings, sizing } = run(ret({ openings: [opening({ filterGrille })] }));
    const f = only(findings, "return_air.velocity");
    expect(f.status).toBe(status);
    expect(f.measured?.value).toBeCloseTo(345.6, 1);
    expect(f.required).toEqual({ value: limit, unit: "fpm", comparator: "≤" });
    expect(f.citation).toMatch(/common practice/);
    expect(sizing.openings[0]?.faceVelocityFpm).toBeCloseTo(345.6, 1);
  });

  test("E2 airflow: 3 tons × 400 cfm per ton (HARDI guidance) = 1,200 cfm through a 12 × 24 in grille at 75 % → 800 fpm, above the 400 fpm target", () => {
    // 12 × 24 × 0.75 = 216 in² = 1.5 ft²; 1,200 ÷ 1.5 = 800 fpm, worked by hand.
    const { findings, sizing } = run(ret({ airflowCfm: null, coolingTons: 3, openings: [opening({ widthIn: 12, heightIn: 24, freeAreaShare: 0.75 })] }));
    expect(sizing.airflowCfm).toBe(1200);
    expect(sizing.airflowSource).toBe("cooling_tons");
    const f = only(findings, "return_air.velocity");
    expect(f.status).toBe("warn");
    expect(f.measured?.value).toBeCloseTo(800, 9);
  });

  test("D7 airflow from the readings: 80,000 Btu/h output, supply 130 °F − return 70 °F = 60 °F → about 1,235 cfm", () => {
    const readings = [readingsSchema.parse({ applianceId: "furnace", supplyTempF: 130, returnTempF: 70 })];
    const { sizing } = run(ret({ airflowCfm: null }), [furnace()], readings);
    expect(sizing.airflowSource).toBe("temperature_rise");
    expect(sizing.temperatureRiseF).toBe(60);
    expect(sizing.airflowCfm).toBeCloseTo(1234.57, 2);
  });

  test("the airflow splits by free area, so two grilles of the same free-area share have the same face velocity", () => {
    // 1,200 cfm over 500 + 250 = 750 in² → 1,200 ÷ (750 ÷ 144) = 230.4 fpm each, worked by hand.
    const { sizing } = run(ret({ openings: [opening(), opening({ id: "r2", widthIn: 10, heightIn: 25, space: "bedroom" })] }));
    expect(sizing.openings.map((o) => o.airflowCfm)).toEqual([800, 400]);
    for (const o of sizing.openings) expect(o.faceVelocityFpm).toBeCloseTo(230.4, 1);
  });

  test("between the two limits with the filter question unanswered is needs-info asking about the filter", () => {
    const f = only(run(ret({ openings: [opening({ filterGrille: null })] })).findings, "return_air.velocity");
    expect(f.status).toBe("needs-info");
    expect(f.target.path).toBe("returnAir.openings.0.filterGrille");
  });

  test("no airflow source is needs-info naming the airflow", () => {
    const f = only(run(ret({ airflowCfm: null })).findings, "return_air.velocity");
    expect(f.status).toBe("needs-info");
    expect(f.target.path).toBe("returnAir.airflowCfm");
  });

  test("a rulebook without the cfm per ton gives needs-info naming the table", () => {
    const rb = prepareRulebook(withoutParams("return_air_cfm_per_ton"));
    const f = only(run(ret({ airflowCfm: null, coolingTons: 3 }), [furnace()], [], rb).findings, "return_air.velocity");
    expect(f.status).toBe("needs-info");
    expect(f.citation).toBeNull();
    expect(f.message).toContain("Parameters");
  });
});

describe("return_air.draft_hood_distance (IMC 601.5; IRC M1602.2, REFERENCE E1: 10 ft)", () => {
  test.each([
    { distanceToDraftHoodFt: 10, status: "pass", note: "exactly 10 ft (boundary)" },
    { distanceToDraftHoodFt: 14, status: "pass", note: "beyond 10 ft" },
    { distanceToDraftHoodFt: 9.5, status: "fail", note: "under 10 ft" },
  ])("$distanceToDraftHoodFt ft from the water heater's draft hood → $status ($note)", ({ distanceToDraftHoodFt, status }) => {
    const ra = ret({ openings: [opening({ space: "appliance_room", fuelApplianceInSpace: true, distanceToDraftHoodFt, soleReturnSource: false })] });
    const f = only(run(ra, [furnace(), waterHeater()]).findings, "return_air.draft_hood_distance");
    expect(f.status).toBe(status);
    expect(f.required).toEqual({ value: 10, unit: "ft", comparator: "≥" });
    expect(f.citation).toContain("601.5");
  });

  test("an appliance-room opening without the distance is needs-info naming the distance", () => {
    const f = only(run(ret({ openings: [opening({ space: "appliance_room", fuelApplianceInSpace: null })] })).findings, "return_air.draft_hood_distance");
    expect(f.status).toBe("needs-info");
    expect(f.target.path).toBe("returnAir.openings.0.distanceToDraftHoodFt");
  });

  test("with no fuel-burning appliance in the space the rule does not apply, and the finding says so", () => {
    const f = only(run(ret()).findings, "return_air.draft_hood_distance");
    expect(f.status).toBe("not-applicable");
    expect(f.message).toContain("does not apply");
  });

  test("unanswered whether the space holds a fuel-burning appliance is needs-info", () => {
    const f = only(run(ret({ openings: [opening({ fuelApplianceInSpace: null })] })).findings, "return_air.draft_hood_distance");
    expect(f.status).toBe("needs-info");
    expect(f.target.field).toBe("fuelApplianceInSpace");
  });
});

describe("return_air.location (starter table: IMC 918.6; IRC M1602.2, from memory)", () => {
  test.each([
    { space: "hallway", status: "pass" },
    { space: "bedroom", status: "pass" },
    { space: "bathroom", status: "fail" },
    { space: "closet", status: "fail" },
    { space: "toilet_room", status: "fail" },
    { space: "kitchen", status: "fail" },
    { space: "garage", status: "fail" },
    { space: "unconditioned_space", status: "fail" },
  ])("drawing from a $space → $status", ({ space, status }) => {
    const f = only(run(ret({ openings: [opening({ space })] })).findings, "return_air.location");
    expect(f.status).toBe(status);
    expect(f.citation).toMatch(/M1602\.2/);
    expect(f.ruleRef?.table).toBe("returnAirSpaces");
  });

  test("a prohibited space whose exception the installer confirms is a warning that names the exception", () => {
    const f = only(run(ret({ openings: [opening({ space: "kitchen", exceptionApplies: true })] })).findings, "return_air.location");
    expect(f.status).toBe("warn");
    expect(f.message).toContain("10 ft from the cooking appliances");
  });

  test("the appliance room as the sole return source fails; with the exception confirmed it is a warning", () => {
    const sole = opening({ space: "appliance_room", distanceToDraftHoodFt: 12, soleReturnSource: true, fuelApplianceInSpace: null });
    const f = only(run(ret({ openings: [sole] })).findings, "return_air.location");
    expect(f.status).toBe("fail");
    expect(f.target.field).toBe("soleReturnSource");
    expect(f.citation).toContain("918.6");
    const g = only(run(ret({ openings: [{ ...sole, exceptionApplies: true }] })).findings, "return_air.location");
    expect(g.status).toBe("warn");
  });

  test("the appliance room beside a return from another space is not the sole source", () => {
    const ra = ret({ openings: [opening({ space: "appliance_room", distanceToDraftHoodFt: 12 }), opening({ id: "r2", space: "living_area" })] });
    const findings = withCode(run(ra).findings, "return_air.location");
    expect(findings.map((f) => f.status)).toEqual(["pass", "pass"]);
  });

  test("a single appliance-room opening without the sole-source answer is needs-info", () => {
    const f = only(run(ret({ openings: [opening({ space: "appliance_room", distanceToDraftHoodFt: 12, fuelApplianceInSpace: null })] })).findings, "return_air.location");
    expect(f.status).toBe("needs-info");
    expect(f.target.field).toBe("soleReturnSource");
  });

  test("no space is needs-info; 'other' is needs-info, never a pass", () => {
    expect(only(run(ret({ openings: [opening({ space: null })] })).findings, "return_air.location").status).toBe("needs-info");
    expect(only(run(ret({ openings: [opening({ space: "other" })] })).findings, "return_air.location").status).toBe("needs-info");
  });

  test("a rulebook stored before the return-air spaces table still parses and validates; the location check says the table lacks the row", () => {
    const old: Record<string, unknown> = structuredClone(TEST_CONTENT);
    delete old.returnAirSpaces;
    expect(rulebookContentSchema.safeParse(old).success).toBe(true);
    expect(validateRulebookContent(old)).toEqual([]);
    const f = only(run(ret(), [furnace()], [], prepareRulebook(old)).findings, "return_air.location");
    expect(f.status).toBe("needs-info");
    expect(f.message).toContain("Return-air spaces");
  });
});

describe("return air in a whole check request", () => {
  test("evaluateInspection adds the return-air findings and sizing when there is a furnace", () => {
    const input = checkInputSchema.parse({ appliances: [furnace()], returnAir: { outputBtuh: 80_000, airflowCfm: 1200, openings: [opening()] } });
    const result = evaluateInspection(input, RB);
    expect(result.sizing.returnAir?.applianceId).toBe("furnace");
    expect(result.findings.filter((f) => f.target.section === "returnAir").map((f) => f.code).sort()).toEqual(
      ["return_air.area", "return_air.draft_hood_distance", "return_air.location", "return_air.velocity"].sort(),
    );
  });

  test("without a furnace the return air is not checked", () => {
    const input = checkInputSchema.parse({ appliances: [waterHeater()], returnAir: { openings: [] } });
    const result = evaluateInspection(input, RB);
    expect(result.sizing.returnAir).toBeNull();
    expect(result.findings.some((f) => f.target.section === "returnAir")).toBe(false);
  });

  test("the starter rulebook validates with the new parameters and table", () => {
    expect(validateRulebookContent(STARTER_RULEBOOK)).toEqual([]);
    expect(STARTER_RULEBOOK.returnAirSpaces.length).toBeGreaterThan(0);
  });
});

describe("input ranges", () => {
  test.each([
    { field: "outputBtuh", value: -1, words: "Furnace output" },
    { field: "efficiencyPct", value: 120, words: "Furnace efficiency" },
    { field: "coolingTons", value: 0, words: "Cooling capacity" },
    { field: "temperatureRiseF", value: 500, words: "Temperature rise" },
    { field: "airflowCfm", value: Number.POSITIVE_INFINITY, words: "Airflow" },
  ])("$field = $value is refused with a message naming the field and its range", ({ field, value, words }) => {
    const r = returnAirSchema.safeParse({ [field]: value });
    expect(r.success).toBe(false);
    const issue = r.error!.issues.find((i) => i.path[0] === field)!;
    expect(issue.message).toContain(words);
    expect(issue.message).toMatch(/(at most|and) [\d,]+ /);
  });

  test("a free-area share of 0 or above 1 is refused", () => {
    for (const freeAreaShare of [0, 1.5]) {
      const r = returnAirSchema.safeParse({ openings: [{ id: "a", freeAreaShare }] });
      expect(r.success).toBe(false);
      expect(r.error!.issues[0]!.message).toContain("free-area share");
    }
  });
});

describe("properties", () => {
  const openingArb = fc.record({
    widthIn: fc.double({ min: 0.5, max: 240, noNaN: true }),
    heightIn: fc.double({ min: 0.5, max: 240, noNaN: true }),
    freeAreaShare: fc.double({ min: 0.01, max: 1, noNaN: true }),
    filterGrille: fc.boolean(),
    space: fc.constantFrom("living_area", "hallway", "appliance_room", "kitchen", "other"),
    distanceToDraftHoodFt: fc.option(fc.double({ min: 0, max: 500, noNaN: true }), { nil: null }),
  });
  const returnArb = fc.record({
    outputBtuh: fc.option(fc.double({ min: 1, max: 1_000_000, noNaN: true }), { nil: null }),
    efficiencyPct: fc.double({ min: 1, max: 100, noNaN: true }),
    airflowCfm: fc.option(fc.double({ min: 1, max: 20_000, noNaN: true }), { nil: null }),
    coolingTons: fc.option(fc.double({ min: 0.1, max: 50, noNaN: true }), { nil: null }),
    temperatureRiseF: fc.option(fc.double({ min: 0.1, max: 200, noNaN: true }), { nil: null }),
    openings: fc.array(openingArb, { maxLength: 4 }),
  });

  test("no input in range yields NaN or Infinity in the sizing or the messages", () => {
    fc.assert(
      fc.property(returnArb, fc.double({ min: 1, max: 1_000_000, noNaN: true }), (raw, inputBtuh) => {
        const ra = returnAirSchema.parse({ ...raw, openings: raw.openings.map((o, i) => ({ id: `o${i}`, ...o })) });
        const { findings, sizing } = run(ra, [furnace({ inputBtuh })]);
        const numbers = [sizing.outputBtuh, sizing.airflowCfm, sizing.requiredFreeAreaSqIn, sizing.totalFreeAreaSqIn, ...sizing.openings.flatMap((o) => [o.freeAreaSqIn, o.airflowCfm, o.faceVelocityFpm])];
        for (const v of numbers) if (v !== null) expect(Number.isFinite(v)).toBe(true);
        for (const f of findings) {
          expect(f.message).not.toMatch(/NaN|Infinity/);
          if (f.measured) expect(Number.isFinite(f.measured.value)).toBe(true);
        }
      }),
      { numRuns: 300 },
    );
  });

  test("a larger free area never gives a higher face velocity", () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 20_000, noNaN: true }), fc.double({ min: 1, max: 20_000, noNaN: true }), fc.double({ min: 0, max: 20_000, noNaN: true }), (cfm, area, extra) => {
        expect(faceVelocityFpm(cfm, area + extra)!).toBeLessThanOrEqual(faceVelocityFpm(cfm, area)!);
      }),
    );
  });

  test("enlarging a grille never raises the velocity the check measures", () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 120, noNaN: true }), fc.double({ min: 1, max: 120, noNaN: true }), fc.double({ min: 0, max: 60, noNaN: true }), (w, h, grow) => {
        const small = run(ret({ openings: [opening({ widthIn: w, heightIn: h })] })).sizing.openings[0]!.faceVelocityFpm!;
        const large = run(ret({ openings: [opening({ widthIn: w + grow, heightIn: h })] })).sizing.openings[0]!.faceVelocityFpm!;
        expect(large).toBeLessThanOrEqual(small * (1 + 1e-12));
      }),
    );
  });
});
