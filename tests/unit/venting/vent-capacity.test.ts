import { describe, expect, test } from "vitest";
import {
  deratePct,
  evaluateVentRun,
  extraTurns,
  lookupCapacity,
  prepareRulebook,
  smallestFittingDiameter,
  ventRunSchema,
  type VentRun,
} from "@/lib/venting";
import { RB, TEST_CONTENT, furnace, goodRun, only, waterHeater, withParams } from "@/tests/fixtures/venting/rulebook";

// Capacities come from the hand-built table in tests/fixtures/venting/rulebook.ts; each expected
// value is worked out by hand in the comment beside it.

const TB = { ventMaterial: "type_b", connectorMaterial: "type_b" } as const;

describe("capacity table lookup", () => {
  test("exact row: 4 in, 10 ft, lateral 0", () => {
    const r = lookupCapacity(RB, { ...TB, diameterIn: 4, heightFt: 10, lateralFt: 0 }, true);
    expect(r).toMatchObject({ ok: true, fanMinBtuh: 0, fanMaxBtuh: 100_000, naturalMaxBtuh: 60_000, interpolated: false, conservative: false });
  });

  test("between heights: 4 in at 15 ft, lateral 0", () => {
    // fan max: 100,000 + (140,000 − 100,000) × (15 − 10)/(20 − 10) = 120,000
    // nat max: 60,000 + (80,000 − 60,000) × 0.5 = 70,000
    const r = lookupCapacity(RB, { ...TB, diameterIn: 4, heightFt: 15, lateralFt: 0 }, true);
    expect(r).toMatchObject({ ok: true, fanMaxBtuh: 120_000, naturalMaxBtuh: 70_000, interpolated: true });
  });

  test("between heights and laterals: 4 in at 15 ft, lateral 5", () => {
    // fan max at lateral 0: 120,000; at lateral 10: 80,000 + 40,000 × 0.5 = 100,000; at 5: 110,000
    // fan min at lateral 0: 0; at 10: 20,000 + 10,000 × 0.5 = 25,000; at 5: 12,500
    // nat max at 0: 70,000; at 10: 50,000 + 20,000 × 0.5 = 60,000; at 5: 65,000
    const r = lookupCapacity(RB, { ...TB, diameterIn: 4, heightFt: 15, lateralFt: 5 }, true);
    expect(r).toMatchObject({ ok: true, fanMinBtuh: 12_500, fanMaxBtuh: 110_000, naturalMaxBtuh: 65_000 });
  });

  test("uneven position: 4 in at 12 ft, lateral 2.5", () => {
    // t = 0.2, u = 0.25. fan max at l0: 100,000 + 40,000 × 0.2 = 108,000; at l10: 80,000 + 40,000 × 0.2 = 88,000
    // at 2.5: 108,000 + (88,000 − 108,000) × 0.25 = 103,000
    const r = lookupCapacity(RB, { ...TB, diameterIn: 4, heightFt: 12, lateralFt: 2.5 }, true);
    expect(r.ok && r.fanMaxBtuh).toBeCloseTo(103_000, 6);
  });

  test("interpolation not allowed: the conservative rows (highest min, lowest max)", () => {
    // IFGC 504.2.17 (REFERENCE.md B6, found): interpolate, or use the conservative row.
    const rb = prepareRulebook(withParams({ capacity_interpolation_allowed: 0 }));
    const r = lookupCapacity(rb, { ...TB, diameterIn: 4, heightFt: 15, lateralFt: 5 }, false);
    // corners: max {100,000, 140,000, 80,000, 120,000} → 80,000; min {0, 0, 20,000, 30,000} → 30,000
    expect(r).toMatchObject({ ok: true, fanMinBtuh: 30_000, fanMaxBtuh: 80_000, naturalMaxBtuh: 50_000, conservative: true, interpolated: false });
  });

  test.each([
    { heightFt: 9.9, lateralFt: 0, reason: "height_outside" },
    { heightFt: 20.1, lateralFt: 0, reason: "height_outside" },
    { heightFt: 15, lateralFt: 10.5, reason: "second_outside" },
  ])("refuses to extrapolate: $heightFt ft / lateral $lateralFt", ({ heightFt, lateralFt, reason }) => {
    const r = lookupCapacity(RB, { ...TB, diameterIn: 4, heightFt, lateralFt }, true);
    expect(r).toMatchObject({ ok: false, reason });
  });

  test("edges of the table are inside it (10 ft and 20 ft, lateral 10)", () => {
    expect(lookupCapacity(RB, { ...TB, diameterIn: 4, heightFt: 20, lateralFt: 10 }, true)).toMatchObject({ ok: true, fanMaxBtuh: 120_000 });
  });

  test("a diameter the table lacks is a miss", () => {
    expect(lookupCapacity(RB, { ...TB, diameterIn: 6, heightFt: 15, lateralFt: 0 }, true)).toMatchObject({ ok: false, reason: "no_table" });
  });

  test("an empty cell in a corner means no value (not permitted)", () => {
    // 3 in at 15 ft, lateral 5: the 10 ft / lateral 10 corner has no fan values.
    const r = lookupCapacity(RB, { ...TB, diameterIn: 3, heightFt: 15, lateralFt: 5 }, true);
    expect(r).toMatchObject({ ok: true, fanMaxBtuh: null, fanMinBtuh: null });
    // natural: l0 = 35,000, l10 = 30,000 → 32,500
    expect(r.ok && r.naturalMaxBtuh).toBe(32_500);
  });
});

describe("derating for extra turns", () => {
  // IFGC 504.2.3; NFPA 54 13.1.3 (REFERENCE.md B7, found): tables with a lateral assume two 90° turns;
  // each extra turn ≤ 45°: −5 %; > 45° to 90°: −10 %. Zero lateral assumes no turns.
  const rule = { assumed90WithLateral: 2, lossPer45Pct: 5, lossPer90Pct: 10 };
  test.each([
    { turns45: 0, turns90: 2, hasLateral: true, pct: 0 },
    { turns45: 0, turns90: 3, hasLateral: true, pct: 10 },
    { turns45: 2, turns90: 2, hasLateral: true, pct: 10 },
    { turns45: 1, turns90: 4, hasLateral: true, pct: 25 },
    { turns45: 2, turns90: 1, hasLateral: true, pct: 5 }, // one unused assumed turn absorbs one 45°
    { turns45: 0, turns90: 1, hasLateral: false, pct: 10 },
    { turns45: 0, turns90: 12, hasLateral: false, pct: 100 }, // capped
  ])("$turns45 × 45° + $turns90 × 90°, lateral $hasLateral → −$pct %", ({ pct, ...t }) => {
    expect(deratePct(t, rule)).toBe(pct);
  });

  test("extra turns split", () => {
    expect(extraTurns({ turns45: 3, turns90: 3, hasLateral: true }, rule)).toEqual({ extra45: 3, extra90: 1 });
  });
});

function run(over: { heightFt?: number; diameterIn?: number; lateralFt?: number; turns90?: number; turns45?: number; horizontalFt?: number }): VentRun {
  return ventRunSchema.parse({
    segments: [
      { id: "s1", material: "type_b", diameterIn: over.diameterIn ?? 4, lengthFt: over.horizontalFt ?? 0, orientation: "horizontal", riseIn: 10, turns90: over.turns90 ?? 0, turns45: over.turns45 ?? 0 },
    ],
    vent: { material: "type_b", diameterIn: over.diameterIn ?? 4, heightFt: over.heightFt ?? 15, lateralFt: over.lateralFt ?? 0, serves: "single" },
  });
}

describe("vent.capacity", () => {
  test.each([
    // 4 in, 15 ft, lateral 5 (all in the connector): fan 12,500–110,000; natural ≤ 65,000
    { appliance: furnace({ inputBtuh: 110_000 }), status: "pass", note: "fan max exactly (boundary)" },
    { appliance: furnace({ inputBtuh: 110_001 }), status: "fail", note: "one over the fan max" },
    { appliance: furnace({ inputBtuh: 12_500 }), status: "pass", note: "fan min exactly (boundary)" },
    { appliance: furnace({ inputBtuh: 12_000 }), status: "fail", note: "under the fan min: vent too big" },
    { appliance: furnace({ draft: "natural", inputBtuh: 65_000 }), status: "pass", note: "natural max exactly" },
    { appliance: furnace({ draft: "natural", inputBtuh: 66_000 }), status: "fail", note: "over the natural max" },
  ])("$note → $status", ({ appliance, status }) => {
    const f = only(evaluateVentRun(run({ horizontalFt: 5, turns90: 2 }), [appliance], RB).findings, "vent.capacity");
    expect(f.status).toBe(status);
    expect(f.citation).toBe("Hand-built test table");
    expect(f.measured?.unit).toBe("Btu/h");
  });

  test("derated maximum: three extra 90° turns on 110,000 → 77,000", () => {
    // 2 assumed + 3 extra 90° → −30 %: 110,000 × 0.7 = 77,000
    const r = evaluateVentRun(run({ horizontalFt: 5, turns90: 5 }), [furnace({ inputBtuh: 78_000 })], RB);
    const f = only(r.findings, "vent.capacity");
    expect(f.status).toBe("fail");
    expect(f.required).toMatchObject({ comparator: "between", value: 12_500 });
    expect(f.required?.upperValue).toBeCloseTo(77_000, 6);
    expect(f.message).toContain("30 %");
    expect(r.sizing.capacity?.deratePct).toBe(30);
  });

  test("lateral counts the vent's own offset with the horizontal connector", () => {
    // 3 ft connector + 2 ft vent lateral = 5 ft → fan max 110,000 at 15 ft
    const r = evaluateVentRun(run({ horizontalFt: 3, lateralFt: 2, turns90: 2 }), [furnace()], RB);
    expect(r.sizing.capacity).toMatchObject({ lateralFt: 5, maxBtuh: 110_000, minBtuh: 12_500 });
  });

  test("outside the table is needs-info with the table's range, never a pass", () => {
    const f = only(evaluateVentRun(run({ heightFt: 25 }), [furnace()], RB).findings, "vent.capacity");
    expect(f.status).toBe("needs-info");
    expect(f.message).toContain("10–20 ft");
    expect(f.message).toContain("does not extrapolate");
  });

  test("a size the table marks empty is a fail (not permitted)", () => {
    const f = only(evaluateVentRun(run({ diameterIn: 3, horizontalFt: 5, turns90: 2 }), [furnace({ outletDiameterIn: 3, inputBtuh: 30_000 })], RB).findings, "vent.capacity");
    expect(f.status).toBe("fail");
    expect(f.message).toContain("not permitted");
  });

  test("missing input or vent height is needs-info", () => {
    expect(only(evaluateVentRun(run({}), [furnace({ inputBtuh: null })], RB).findings, "vent.capacity").status).toBe("needs-info");
    const noHeight = ventRunSchema.parse({ ...run({}), vent: { material: "type_b", diameterIn: 4, lateralFt: 0 } });
    expect(only(evaluateVentRun(noHeight, [furnace()], RB).findings, "vent.capacity").target.path).toBe("ventRun.vent.heightFt");
  });

  test("a common vent with no multiple-appliance tables in the rulebook is needs-info, never a pass", () => {
    const noTables = prepareRulebook({ ...structuredClone(TEST_CONTENT), ventConnectorCapacity: [], commonVentCapacity: [] });
    const r = ventRunSchema.parse({ ...goodRun(), vent: { ...goodRun().vent, serves: "common" } });
    const f = only(evaluateVentRun(r, [furnace(), waterHeater()], noTables).findings, "vent.capacity");
    expect(f.status).toBe("needs-info");
    expect(f.message).toContain("common vent table has no rows");
  });

  test("smallest diameter that fits", () => {
    // 150,000 Btu/h fan-assisted at 15 ft, lateral 5: 4 in max 110,000 (no);
    // 5 in: max l0 = 180,000, l10 = 150,000 → 165,000; min l10 = 37,500 → 18,750 → fits.
    const q = { ...TB, heightFt: 15, lateralFt: 5 };
    expect(smallestFittingDiameter(RB, q, 150_000, true, 0, true)?.diameterIn).toBe(5);
    expect(smallestFittingDiameter(RB, q, 170_000, true, 0, true)).toBeNull();
    // 20,000 natural: 3 in max 32,500 fits
    expect(smallestFittingDiameter(RB, q, 20_000, false, 0, true)?.diameterIn).toBe(3);
    // never below the outlet
    expect(smallestFittingDiameter(RB, q, 20_000, false, 0, true, 4)?.diameterIn).toBe(4);
    const f = only(evaluateVentRun(run({ horizontalFt: 5, turns90: 2 }), [furnace({ inputBtuh: 150_000 })], RB).findings, "vent.capacity");
    expect(f.message).toContain("smallest diameter the table allows is 5 in");
  });

  test("a rulebook that cannot derate reports needs-info when turns are present", () => {
    const c = structuredClone(TEST_CONTENT);
    c.parameters = c.parameters.filter((p) => p.key !== "capacity_loss_per_extra_90_turn_pct");
    const f = only(evaluateVentRun(run({ horizontalFt: 5, turns90: 3 }), [furnace()], prepareRulebook(c)).findings, "vent.capacity");
    expect(f.status).toBe("needs-info");
  });
});
