import { describe, expect, test } from "vitest";
import {
  airSpaceSchema,
  combinationFactor,
  evaluateCombustionAir,
  grossAreaSqIn,
  indoorSameStoryAreaSqIn,
  outdoorOpeningAreaSqIn,
  prepareRulebook,
  requiredVolumeCuFt,
  singleOpeningAreaSqIn,
} from "@/lib/venting";
import { RB, furnace, only, waterHeater, withCode, withParams } from "@/tests/fixtures/venting/rulebook";

const FACTORS = { perKbtuhCuFt: 50, otherConstant: 21, fanConstant: 15, achThreshold: 0.4, achMax: 0.6 };

function space(over: Record<string, unknown>) {
  return airSpaceSchema.parse({ rooms: [{ id: "mech", lengthFt: 10, widthFt: 10, heightFt: 8 }], ...over });
}

describe("required volume", () => {
  // IFGC 304.5.1 (REFERENCE.md C1, found): 50 ft³ per 1,000 Btu/h.
  test("standard method: 120,000 Btu/h → 6,000 ft³", () => {
    expect(requiredVolumeCuFt(120_000, 0, null, FACTORS)).toEqual({ volumeCuFt: 6000, method: "standard", achUsed: null });
  });

  // IFGC 304.5.2 (REFERENCE.md C2, found): V = 21/ACH × I_other/1000 + 15/ACH × I_fan/1000, ACH ≤ 0.60 used.
  test("known infiltration at 0.30 ACH: 40,000 other + 80,000 fan", () => {
    // 21/0.3 × 40 + 15/0.3 × 80 = 70 × 40 + 50 × 80 = 2,800 + 4,000 = 6,800 ft³
    const r = requiredVolumeCuFt(40_000, 80_000, 0.3, FACTORS);
    expect(r.method).toBe("known_infiltration");
    expect(r.volumeCuFt).toBeCloseTo(6800, 9);
  });

  test("ACH above the maximum is clamped to 0.60", () => {
    // 21/0.6 × 100 = 3,500 ft³ (not 21/1.0 × 100 = 2,100)
    const r = requiredVolumeCuFt(100_000, 0, 1.0, FACTORS);
    expect(r).toMatchObject({ method: "known_infiltration", achUsed: 0.6 });
    expect(r.volumeCuFt).toBeCloseTo(3500, 9);
  });

  test("at the threshold either method may be used: the smaller volume", () => {
    // 0.40 ACH: infiltration 21/0.4 × 100 = 5,250 > standard 5,000 → standard
    expect(requiredVolumeCuFt(100_000, 0, 0.4, FACTORS)).toMatchObject({ method: "standard", volumeCuFt: 5000 });
    // just below the threshold the standard method is not allowed: 21/0.39 × 100 ≈ 5,384.6
    expect(requiredVolumeCuFt(100_000, 0, 0.39, FACTORS).volumeCuFt).toBeCloseTo(5384.615, 2);
  });
});

describe("opening areas", () => {
  // IFGC 304.5.3.1 (C3, found); 304.6.1 (C6, C7, found); 304.6.2 (C8, found / memory); 304.10 (C10, found)
  test.each([
    [50_000, 100], // 50 in² would be below the 100 in² minimum
    [100_000, 100], // exactly at the minimum
    [150_000, 150],
  ])("indoor same story for %s Btu/h → %s in² each", (input, area) => {
    expect(indoorSameStoryAreaSqIn(input, 1, 100)).toBe(area);
  });
  test("outdoor: vertical 1/4,000, horizontal 1/2,000, single 1/3,000 with the connector floor", () => {
    expect(outdoorOpeningAreaSqIn(120_000, 4000)).toBe(30);
    expect(outdoorOpeningAreaSqIn(120_000, 2000)).toBe(60);
    expect(singleOpeningAreaSqIn(120_000, 3000, 28.27)).toBe(40);
    expect(singleOpeningAreaSqIn(60_000, 3000, 28.27)).toBe(28.27);
  });
  test("gross grille from louver share", () => {
    expect(grossAreaSqIn(25, 0.25)).toBe(100);
    expect(grossAreaSqIn(25, 0.75)).toBeCloseTo(33.333, 3);
  });
  // IFGC 304.7 (C9, found): outdoor = full × (1 − available/required)
  test.each([
    [4800, 7500, 0.36],
    [0, 7500, 1],
    [8000, 7500, 0],
  ])("combination factor %s of %s ft³ → %s", (a, r, f) => {
    expect(combinationFactor(a, r)).toBeCloseTo(f, 9);
  });
});

describe("air.volume", () => {
  test.each([
    { inputBtuh: 16_000, status: "pass" }, // 800 ft³ needed, 800 available (boundary)
    { inputBtuh: 16_001, status: "fail" },
    { inputBtuh: 10_000, status: "pass" },
  ])("$inputBtuh Btu/h in an 800 ft³ room → $status", ({ inputBtuh, status }) => {
    const f = only(evaluateCombustionAir(space({}), [furnace({ inputBtuh })], RB).findings, "air.volume");
    expect(f.status).toBe(status);
    expect(f.measured).toEqual({ value: 800, unit: "ft³" });
    expect(f.citation).toContain("304.5.1");
  });

  // IFGC 304.1 (REFERENCE.md C12, found): direct-vent appliances are left out.
  test("direct-vent appliances do not count", () => {
    const r = evaluateCombustionAir(space({}), [furnace({ draft: "direct_vent", category: "IV", inputBtuh: 100_000 }), waterHeater({ inputBtuh: 16_000 })], RB);
    expect(only(r.findings, "air.volume").status).toBe("pass");
    expect(r.sizing.totalInputBtuh).toBe(16_000);
  });

  test("only direct-vent appliances: no volume needed", () => {
    const f = only(evaluateCombustionAir(space({}), [furnace({ draft: "direct_vent" })], RB).findings, "air.volume");
    expect(f.status).toBe("pass");
    expect(f.message).toContain("direct-vent");
  });

  test("a room without dimensions is needs-info pointing at it", () => {
    const f = only(evaluateCombustionAir(space({ rooms: [{ id: "mech", lengthFt: 10, widthFt: 10 }] }), [furnace()], RB).findings, "air.volume");
    expect(f.status).toBe("needs-info");
    expect(f.target.path).toBe("airSpace.rooms.0.heightFt");
  });

  test("missing appliance input is needs-info", () => {
    expect(only(evaluateCombustionAir(space({}), [furnace({ inputBtuh: null })], RB).findings, "air.volume").status).toBe("needs-info");
  });

  test("rooms open to the appliance room count; rooms behind too-small openings do not", () => {
    const rooms = [
      { id: "mech", lengthFt: 10, widthFt: 10, heightFt: 8 },
      { id: "hall", volumeCuFt: 1000, openToApplianceRoom: true },
      { id: "den", lengthFt: 20, widthFt: 10, heightFt: 8 },
    ];
    const small = [
      { id: "hi", kind: "indoor_same_story", roomId: "den", widthIn: 10, heightIn: 9 },
      { id: "lo", kind: "indoor_same_story", roomId: "den", widthIn: 10, heightIn: 10 },
    ];
    // 60,000 Btu/h → 3,000 ft³. mech 800 + hall 1,000 = 1,800; den 1,600 counts only through two ≥ 100 in² openings.
    const r1 = evaluateCombustionAir(space({ rooms, openings: small }), [furnace({ inputBtuh: 60_000 })], RB);
    expect(only(r1.findings, "air.volume")).toMatchObject({ status: "fail", measured: { value: 1800 } });
    expect(withCode(r1.findings, "air.openings").map((f) => f.status)).toEqual(["fail", "pass"]);
    const big = small.map((o) => ({ ...o, heightIn: 10 }));
    const r2 = evaluateCombustionAir(space({ rooms, openings: big }), [furnace({ inputBtuh: 60_000 })], RB);
    expect(only(r2.findings, "air.volume")).toMatchObject({ status: "pass", measured: { value: 3400 } });
  });

  test("known ACH uses the infiltration method", () => {
    // 0.3 ACH, 16,000 fan-assisted: 15/0.3 × 16 = 800 ft³ → pass exactly
    const f = only(evaluateCombustionAir(space({ airChangesPerHour: 0.3 }), [furnace({ inputBtuh: 16_000 })], RB).findings, "air.volume");
    expect(f.status).toBe("pass");
    expect(f.required?.value).toBeCloseTo(800, 9);
    expect(f.message).toContain("known-infiltration");
  });
});

describe("air.openings", () => {
  // 20 × 30 × 8 = 4,800 ft³; 150,000 Btu/h needs 7,500 ft³ (C1 worked example).
  const bigRoom = [{ id: "bsmt", lengthFt: 20, widthFt: 30, heightFt: 8 }];
  const appliance = furnace({ inputBtuh: 150_000, draft: "natural" });

  test("same-story openings need two", () => {
    const rooms = [...bigRoom, { id: "den", volumeCuFt: 5000 }];
    const r = evaluateCombustionAir(space({ rooms, openings: [{ id: "a", kind: "indoor_same_story", roomId: "den", widthIn: 15, heightIn: 10 }] }), [appliance], RB);
    const list = withCode(r.findings, "air.openings");
    expect(list.map((f) => f.status)).toEqual(["pass", "fail"]); // 150 in² ≥ 150, but only one opening
  });

  test("two outdoor vertical openings with the combination method", () => {
    // full size 150,000/4,000 = 37.5 in²; factor 1 − 4,800/7,500 = 0.36 → 13.5 in² each
    const openings = [
      { id: "hi", kind: "outdoor_direct_or_vertical_duct", position: "high", widthIn: 6, heightIn: 9, louver: "wood" }, // 54 × 0.25 = 13.5
      { id: "lo", kind: "outdoor_direct_or_vertical_duct", position: "low", widthIn: 6, heightIn: 8, louver: "wood" }, // 48 × 0.25 = 12
    ];
    const r = evaluateCombustionAir(space({ rooms: bigRoom, openings }), [appliance], RB);
    expect(only(r.findings, "air.volume").status).toBe("warn");
    const list = withCode(r.findings, "air.openings");
    expect(list.map((f) => f.status)).toEqual(["pass", "fail"]);
    expect(list[0]!.required?.value).toBeCloseTo(13.5, 9);
    const lo = r.sizing.openings.find((o) => o.openingId === "lo")!;
    expect(lo.requiredGrossAreaSqIn).toBeCloseTo(54, 9); // 13.5 / 0.25
    expect(list[1]!.message).toContain("gross opening of at least 54 in²");
  });

  test("without the combination method the full size is required", () => {
    const rb = prepareRulebook(withParams({ combination_method_allowed: 0 }));
    const openings = [
      { id: "hi", kind: "outdoor_horizontal_duct", widthIn: 10, heightIn: 7.5 },
      { id: "lo", kind: "outdoor_horizontal_duct", widthIn: 10, heightIn: 7.4 },
    ];
    // 150,000 / 2,000 = 75 in² each
    const r = evaluateCombustionAir(space({ rooms: bigRoom, openings }), [appliance], rb);
    expect(withCode(r.findings, "air.openings").map((f) => [f.status, f.required?.value])).toEqual([
      ["pass", 75],
      ["fail", 75],
    ]);
  });

  test("single high opening is not less than the connector area", () => {
    // No indoor volume: a 1 ft³ closet. 30,000 Btu/h / 3,000 = 10 in²; an 8 in outlet is 50.27 in² → 50.27 governs
    const r = evaluateCombustionAir(
      space({ rooms: [{ id: "c", volumeCuFt: 1 }], openings: [{ id: "s", kind: "outdoor_single_high", diameterIn: 8 }] }),
      [waterHeater({ inputBtuh: 30_000, outletDiameterIn: 8 })],
      RB,
    );
    const f = only(r.findings, "air.openings");
    expect(f.required?.value).toBeCloseTo((Math.PI * 64) / 4, 9);
    expect(f.status).toBe("pass");
  });

  // IFGC 304.6.2 (REFERENCE.md C8, found / memory): one high outdoor opening ≥ 1 in² per 3,000 Btu/h
  // AND ≥ the sum of the connector areas in the space. Without a connector diameter the second
  // half cannot be checked: a 100 in² opening for 30,000 Btu/h (10 in² by input) is not a pass.
  test("single high opening with an unknown connector diameter needs it, naming what to enter", () => {
    const r = evaluateCombustionAir(
      space({ rooms: [{ id: "c", volumeCuFt: 1 }], openings: [{ id: "s", kind: "outdoor_single_high", widthIn: 10, heightIn: 10 }] }),
      [waterHeater({ inputBtuh: 30_000, outletDiameterIn: null })],
      RB,
    );
    const f = only(r.findings, "air.openings");
    expect(f.status).toBe("needs-info");
    expect(f.message).toMatch(/^Enter the connector diameter of Water heater \(or its outlet diameter\)/);
    expect(f.target.path).toBe("airSpace.openings.0");
    expect(f.citation).toContain("304.6.2");
    expect(r.sizing.openings[0]).toMatchObject({ openingId: "s", requiredFreeAreaSqIn: null, freeAreaSqIn: 100 });
  });

  test("single high opening too small for the input alone fails even without the connector diameter", () => {
    // 30,000 / 3,000 = 10 in² by input (C8), less the 1 ft³ of the 1,500 ft³ the closet holds
    // (C9 combination: × (1 − 1/1,500)); 3 × 3 = 9 in² given.
    const r = evaluateCombustionAir(
      space({ rooms: [{ id: "c", volumeCuFt: 1 }], openings: [{ id: "s", kind: "outdoor_single_high", widthIn: 3, heightIn: 3 }] }),
      [waterHeater({ inputBtuh: 30_000, outletDiameterIn: null })],
      RB,
    );
    const f = only(r.findings, "air.openings");
    expect(f.status).toBe("fail");
    expect(f.required?.value).toBeCloseTo(10 * (1 - 1 / 1500), 9);
  });

  test("the connector diameter from the vent run stands in for an unknown outlet", () => {
    // An 8 in connector is 50.27 in² (C8 floor), above 30,000 / 3,000 = 10 in².
    const r = evaluateCombustionAir(
      space({ rooms: [{ id: "c", volumeCuFt: 1 }], openings: [{ id: "s", kind: "outdoor_single_high", diameterIn: 8 }] }),
      [waterHeater({ inputBtuh: 30_000, outletDiameterIn: null })],
      RB,
      { connectorDiameterIn: { wh: 8 } },
    );
    const f = only(r.findings, "air.openings");
    expect(f.status).toBe("pass");
    expect(f.required?.value).toBeCloseTo((Math.PI * 64) / 4, 9);
  });

  test("a louver of unknown share needs the maker's figure", () => {
    const r = evaluateCombustionAir(space({ rooms: bigRoom, openings: [{ id: "s", kind: "outdoor_single_high", widthIn: 10, heightIn: 10, louver: "other" }] }), [appliance], RB);
    const f = only(r.findings, "air.openings");
    expect(f.status).toBe("needs-info");
    expect(f.target.field).toBe("freeAreaShare");
  });

  test("outdoor openings are not required when indoor air suffices", () => {
    const r = evaluateCombustionAir(space({ openings: [{ id: "s", kind: "outdoor_single_high", widthIn: 4, heightIn: 4 }] }), [furnace({ inputBtuh: 10_000 })], RB);
    expect(only(r.findings, "air.openings").message).toContain("not required");
  });
});

describe("air.opening_dimension", () => {
  // IFGC 304.5.3, 304.11 (REFERENCE.md C5, found): ≥ 3 in.
  test.each([
    { opening: { widthIn: 3, heightIn: 40 }, status: "pass" },
    { opening: { widthIn: 2.9, heightIn: 40 }, status: "fail" },
    { opening: { diameterIn: 3 }, status: "pass" },
    { opening: { freeAreaSqIn: 100 }, status: "needs-info" },
  ])("$opening → $status", ({ opening, status }) => {
    const r = evaluateCombustionAir(space({ openings: [{ id: "o", kind: "outdoor_single_high", ...opening }] }), [furnace({ inputBtuh: 10_000 })], RB);
    expect(only(r.findings, "air.opening_dimension").status).toBe(status);
  });
});
