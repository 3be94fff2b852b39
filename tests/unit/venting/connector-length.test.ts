import { describe, expect, test } from "vitest";
import { connectorLengthLossPct, evaluateVentRun, ventRunSchema } from "@/lib/venting";
import { RB, furnace, goodRun, only, runWithSegment, waterHeater, withCode } from "@/tests/fixtures/venting/rulebook";

describe("connector.horizontal_length", () => {
  // IFGC 503.10.9 (REFERENCE.md A2, A3, found): single-wall ≤ 75 % of vent height; Type B ≤ 100 %.
  test.each([
    { material: "type_b", lengthFt: 15, heightFt: 15, status: "pass", maxFt: 15 }, // 100 % × 15 = 15 (boundary)
    { material: "type_b", lengthFt: 15.5, heightFt: 15, status: "fail", maxFt: 15 },
    { material: "single_wall", lengthFt: 15, heightFt: 20, status: "pass", maxFt: 15 }, // 75 % × 20 = 15 (boundary)
    { material: "single_wall", lengthFt: 15.1, heightFt: 20, status: "fail", maxFt: 15 },
    { material: "single_wall", lengthFt: 6, heightFt: 6, status: "fail", maxFt: 4.5 }, // 0.75 × 6 = 4.5
  ])("$material $lengthFt ft on a $heightFt ft vent → $status", ({ material, lengthFt, heightFt, status, maxFt }) => {
    const base = goodRun({ vent: { material: "type_b", diameterIn: 4, heightFt, lateralFt: 0, serves: "single" } });
    const run = runWithSegment(1, { material, lengthFt, riseIn: lengthFt }, base);
    const f = only(evaluateVentRun(run, [furnace()], RB).findings, "connector.horizontal_length");
    expect(f.status).toBe(status);
    expect(f.required?.value).toBeCloseTo(maxFt, 9);
    expect(f.measured?.value).toBe(lengthFt);
  });

  test("mixed materials use the stricter share", () => {
    // One single-wall horizontal piece makes the whole connector limited to 75 %: 0.75 × 20 = 15 ft.
    const run = ventRunSchema.parse({
      ...goodRun({ vent: { material: "type_b", diameterIn: 4, heightFt: 20, lateralFt: 0 } }),
      segments: [
        { id: "a", material: "type_b", diameterIn: 4, lengthFt: 10, orientation: "horizontal", riseIn: 3 },
        { id: "b", material: "single_wall", diameterIn: 4, lengthFt: 6, orientation: "horizontal", riseIn: 2 },
      ],
    });
    const f = only(evaluateVentRun(run, [furnace()], RB).findings, "connector.horizontal_length");
    expect(f.status).toBe("fail"); // 16 > 15
    expect(f.required?.value).toBe(15);
  });

  test("missing vent height is needs-info", () => {
    const run = goodRun({ vent: { material: "type_b", diameterIn: 4, lateralFt: 0 } });
    const f = only(evaluateVentRun(run, [furnace()], RB).findings, "connector.horizontal_length");
    expect(f.status).toBe("needs-info");
    expect(f.target.path).toBe("ventRun.vent.heightFt");
  });

  test("a horizontal segment without length is needs-info", () => {
    const f = only(evaluateVentRun(runWithSegment(1, { lengthFt: null }), [furnace()], RB).findings, "connector.horizontal_length");
    expect(f.status).toBe("needs-info");
  });

  test("sizing gives the longest horizontal connector the vent allows", () => {
    expect(evaluateVentRun(goodRun(), [furnace()], RB).sizing.maxHorizontalConnectorFt).toBe(15);
  });
});

describe("connector.length_per_diameter", () => {
  // IFGC 504.3.2 (REFERENCE.md A4, found): tables assume 1.5 ft per inch of connector diameter (4 in → 6 ft);
  // IFGC 504.3.3 (A5, found): −10 % max capacity per extra multiple of that length.
  function commonRun(furnaceConnectorFt: number) {
    return ventRunSchema.parse({
      applianceIds: ["furnace", "wh"],
      segments: [
        { id: "f1", applianceId: "furnace", material: "type_b", diameterIn: 4, lengthFt: furnaceConnectorFt, orientation: "horizontal", riseIn: furnaceConnectorFt },
        { id: "w1", applianceId: "wh", material: "type_b", diameterIn: 3, lengthFt: 4.5, orientation: "horizontal", riseIn: 2 },
      ],
      vent: { material: "type_b", diameterIn: 5, heightFt: 20, lateralFt: 0, serves: "common" },
    });
  }

  test.each([
    { lengthFt: 6, status: "pass" }, // exactly 1.5 × 4 (boundary)
    { lengthFt: 5, status: "pass" },
    { lengthFt: 6.5, status: "warn" },
  ])("4 in connector of $lengthFt ft → $status", ({ lengthFt, status }) => {
    const list = withCode(evaluateVentRun(commonRun(lengthFt), [furnace(), waterHeater()], RB).findings, "connector.length_per_diameter");
    expect(list).toHaveLength(2);
    const f = list.find((x) => x.target.itemId === "f1")!;
    expect(f.status).toBe(status);
    expect(f.required).toEqual({ value: 6, unit: "ft", comparator: "≤" });
    // 3 in water-heater connector: 1.5 × 3 = 4.5 ft, exactly at the limit.
    expect(list.find((x) => x.target.itemId === "w1")!.status).toBe("pass");
  });

  test("the warning states the capacity reduction", () => {
    const f = withCode(evaluateVentRun(commonRun(12.5), [furnace(), waterHeater()], RB).findings, "connector.length_per_diameter")[0]!;
    // 12.5 ft / 6 ft = 2.08 → third started multiple → two extra multiples → 2 × 10 % = 20 %.
    expect(f.message).toContain("20 %");
  });

  test("not applied to a single-appliance vent", () => {
    expect(withCode(evaluateVentRun(goodRun(), [furnace()], RB).findings, "connector.length_per_diameter")).toHaveLength(0);
  });

  test.each([
    [6, 6, 0],
    [6.01, 6, 10],
    [12, 6, 10], // exactly two multiples: one extra
    [12.01, 6, 20],
    [100, 6, 100], // capped at 100 %
  ])("loss for %s ft against %s ft is %s %%", (len, assumed, pct) => {
    expect(connectorLengthLossPct(len, assumed, 10)).toBe(pct);
  });
});
