import { describe, expect, test } from "vitest";
import { STARTER_RULEBOOK } from "@/db/seeds/data/starter-rulebook";
import {
  airFreeCoPpm,
  airflowCfm,
  airSpaceSchema,
  clockedFlowCuFtPerH,
  clockedInputBtuh,
  deratePct,
  evaluateCombustionAir,
  evaluateVentRun,
  grossAreaSqIn,
  indoorSameStoryAreaSqIn,
  outdoorOpeningAreaSqIn,
  prepareRulebook,
  requiredRiseIn,
  requiredVolumeCuFt,
  roomVolumeCuFt,
  terminationHeightRow,
  ventRunSchema,
} from "@/lib/venting";
import { furnace, only } from "@/tests/fixtures/venting/rulebook";

/**
 * Expected values from outside the project: ../shared/REFERENCE.md rows and worked examples
 * (which restate published model codes and public guides). Each case names its row and the
 * confidence given there. These run against the starter rulebook, so they also check that the
 * starter holds the commonly published values.
 */
const RB = prepareRulebook(STARTER_RULEBOOK);
const p = (key: string) => STARTER_RULEBOOK.parameters.find((x) => x.key === key)!.value;

describe("vent connectors", () => {
  test("10 ft horizontal connector → at least 2.5 in of rise (A1, IFGC 503.10.8, found)", () => {
    expect(requiredRiseIn(10, p("connector_min_slope_in_per_ft"))).toBe(2.5);
  });

  test.each([
    ["single_wall", 15], // A2, IFGC 503.10.9, found: 75 % of 20 ft
    ["type_b", 20], // A3, IFGC 503.10.9, found: 100 % of 20 ft
  ])("20 ft vent → %s connector at most %s ft horizontal (A2/A3)", (material, maxFt) => {
    const run = ventRunSchema.parse({
      segments: [{ id: "s", material, diameterIn: 4, lengthFt: maxFt, orientation: "horizontal", riseIn: maxFt }],
      vent: { material: "type_b", diameterIn: 4, heightFt: 20, lateralFt: 0 },
    });
    const f = only(evaluateVentRun(run, [furnace()], RB).findings, "connector.horizontal_length");
    expect(f.required?.value).toBe(maxFt);
    expect(f.status).toBe("pass");
  });

  test("4 in connector → 6 ft assumed length (A4, IFGC 504.3.2, found)", () => {
    expect(p("connector_max_length_ft_per_in_diameter") * 4).toBe(6);
  });

  test("extra elbows: two extra 90° and one extra 45° → −25 % (B7, IFGC 504.2.3, found)", () => {
    const rule = { assumed90WithLateral: p("capacity_assumed_90_turns_with_lateral"), lossPer45Pct: p("capacity_loss_per_extra_45_turn_pct"), lossPer90Pct: p("capacity_loss_per_extra_90_turn_pct") };
    expect(deratePct({ turns45: 1, turns90: 4, hasLateral: true }, rule)).toBe(25);
  });

  test("single-wall clearance 6 in listed, 9 in unlisted (A12/A13, IFGC Table 503.10.5, memory)", () => {
    expect(RB.clearances.get("single_wall|listed")?.value).toBe(6);
    expect(RB.clearances.get("single_wall|unlisted")?.value).toBe(9);
  });
});

describe("termination", () => {
  test.each([
    [5, 1.0],
    [8, 1.5],
    [12, 4.0],
  ])("%s/12 roof → %s ft (B1, IFGC Table 503.6.4, found)", (pitch, ft) => {
    expect(terminationHeightRow(RB, pitch)?.row.minHeightFt).toBe(ft);
  });

  test("vent ≥ 5 ft above the highest collar (B3, IFGC 503.6.5, found)", () => {
    expect(p("vent_min_height_above_collar_ft")).toBe(5);
  });
});

describe("combustion air", () => {
  test("150,000 Btu/h in 20 × 30 × 8 ft: 7,500 ft³ required, 4,800 available → more air needed (C1, found; utility guide example)", () => {
    const volume = roomVolumeCuFt(20, 30, 8);
    expect(volume).toBe(4800);
    const req = requiredVolumeCuFt(150_000, 0, null, { perKbtuhCuFt: p("air_volume_per_1000_btuh_cuft"), otherConstant: 21, fanConstant: 15, achThreshold: 0.4, achMax: 0.6 });
    expect(req.volumeCuFt).toBe(7500);
    const f = only(
      evaluateCombustionAir(airSpaceSchema.parse({ rooms: [{ id: "r", lengthFt: 20, widthFt: 30, heightFt: 8 }] }), [furnace({ inputBtuh: 150_000, draft: "natural" })], RB).findings,
      "air.volume",
    );
    expect(f).toMatchObject({ status: "fail", measured: { value: 4800 }, required: { value: 7500 } });
  });

  test("known infiltration: 21/ACH and 15/ACH, ACH above 0.60 not used (C2, IFGC 304.5.2, found)", () => {
    const f = { perKbtuhCuFt: 50, otherConstant: p("infiltration_constant_other_cuft"), fanConstant: p("infiltration_constant_fan_cuft"), achThreshold: p("infiltration_ach_threshold"), achMax: p("infiltration_ach_max") };
    // 0.35 ACH, 100,000 other: 21/0.35 × 100 = 6,000 ft³
    expect(requiredVolumeCuFt(100_000, 0, 0.35, f).volumeCuFt).toBeCloseTo(6000, 9);
  });

  test("indoor openings 1 in²/1,000 Btu/h, ≥ 100 in² (C3, IFGC 304.5.3.1, found)", () => {
    expect(indoorSameStoryAreaSqIn(150_000, p("opening_indoor_same_story_sqin_per_1000_btuh"), p("opening_indoor_min_area_sqin"))).toBe(150);
    expect(indoorSameStoryAreaSqIn(60_000, 1, 100)).toBe(100);
  });

  test("outdoor openings 1/4,000 direct, 1/2,000 horizontal, 1/3,000 single (C6–C8, IFGC 304.6, found)", () => {
    expect(outdoorOpeningAreaSqIn(100_000, p("opening_outdoor_vertical_btuh_per_sqin"))).toBe(25);
    expect(outdoorOpeningAreaSqIn(100_000, p("opening_outdoor_horizontal_btuh_per_sqin"))).toBe(50);
    expect(outdoorOpeningAreaSqIn(120_000, p("opening_outdoor_single_btuh_per_sqin"))).toBe(40);
  });

  test("25 in² free through a wood louver → 100 in² gross; metal → 33.3 in² (C10, IFGC 304.10, found)", () => {
    expect(grossAreaSqIn(25, RB.louverShares.get("wood")!.value)).toBe(100);
    expect(grossAreaSqIn(25, RB.louverShares.get("metal")!.value)).toBeCloseTo(33.3, 1);
  });

  test("minimum opening dimension 3 in (C5, IFGC 304.5.3 / 304.11, found)", () => {
    expect(p("opening_min_dimension_in")).toBe(3);
  });
});

describe("readings", () => {
  test("1 ft³ dial, 36 s, 1,000 Btu/ft³ → 100 ft³/h, 100,000 Btu/h (D6, found)", () => {
    expect(clockedFlowCuFtPerH(1, 36)).toBe(100);
    expect(clockedInputBtuh(1, 36, 1000)).toBe(100_000);
  });

  test("100,000 Btu/h at 80 % with a 60 °F rise → about 1,235 cfm (D7, found)", () => {
    expect(airflowCfm(100_000 * 0.8, 60)).toBeCloseTo(1234.6, 1);
  });

  test("air-free CO: 100 ppm at 6 % O2 → 140 ppm (D3, combustion-analysis practice, memory)", () => {
    // 100 × 20.9 / 14.9 = 140.27
    expect(airFreeCoPpm(100, 6)).toBeCloseTo(140.27, 2);
  });

  test("flue CO limits: furnace 400, water heater 200 ppm air-free (D2, Appendix D Table D.6, memory)", () => {
    expect(RB.flueCoLimits.get("furnace")?.value).toBe(400);
    expect(RB.flueCoLimits.get("water_heater")?.value).toBe(200);
  });

  test("spillage past 60 s fails (D4, BPI procedure, found); ambient CO ≥ 30 ppm stops work (D1, IRC Appendix D, found)", () => {
    expect(p("spillage_max_seconds")).toBe(60);
    expect(p("ambient_co_max_ppm")).toBe(30);
  });

  test("draft about −0.01 in w.c. ≈ −2.5 Pa (D5, found; common practice)", () => {
    expect(p("draft_max_inwc") * 249.0889).toBeCloseTo(-2.49, 2);
  });
});
