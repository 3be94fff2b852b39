import { describe, expect, test } from "vitest";
import { STARTER_RULEBOOK } from "@/db/seeds/data/starter-rulebook";
import { evaluateVentRun, prepareRulebook, terminationHeightRow, ventRunSchema } from "@/lib/venting";
import { RB, furnace, goodRun, only, withCode } from "@/tests/fixtures/venting/rulebook";
import { B1_ROWS } from "@/tests/fixtures/venting/termination-heights";

function withTermination(t: Record<string, unknown>, appliance = furnace()) {
  const run = ventRunSchema.parse({ ...goodRun(), termination: { listedCap: true, capSizeIn: 4, distanceToVerticalWallFt: 10, ...t } });
  return evaluateVentRun(run, [appliance], RB).findings;
}

describe("termination.height", () => {
  // IFGC Table 503.6.4; IRC G2427.6.3 (REFERENCE.md B1, found).
  test.each([
    { pitch: 0, minFt: 1.0 },
    { pitch: 6, minFt: 1.0 }, // top of the first row (boundary)
    { pitch: 6.01, minFt: 1.25 },
    { pitch: 7, minFt: 1.25 },
    { pitch: 8, minFt: 1.5 },
    { pitch: 12, minFt: 4.0 },
    { pitch: 21, minFt: 8.0 },
  ])("$pitch/12 roof needs $minFt ft", ({ pitch, minFt }) => {
    expect(terminationHeightRow(RB, pitch)?.row.minHeightFt).toBe(minFt);
    expect(only(withTermination({ roofPitchPer12: pitch, heightAboveRoofFt: minFt }), "termination.height").status).toBe("pass");
    expect(only(withTermination({ roofPitchPer12: pitch, heightAboveRoofFt: minFt - 0.01 }), "termination.height").status).toBe("fail");
  });

  test("steeper than the table is needs-info", () => {
    const f = only(withTermination({ roofPitchPer12: 22, heightAboveRoofFt: 10 }), "termination.height");
    expect(f.status).toBe("needs-info");
    expect(f.message).toContain("steeper");
  });

  // IFGC 503.6.4 (REFERENCE.md B2, found): caps over 12 in or closer than 8 ft to a wall: 2 ft, and 2 ft above anything within 10 ft.
  test.each([
    { capSizeIn: 14, distanceToVerticalWallFt: 10, heightAboveRoofFt: 2, nearby: 2, status: "pass" },
    { capSizeIn: 12, distanceToVerticalWallFt: 7.9, heightAboveRoofFt: 1.9, nearby: 3, status: "fail" },
    { capSizeIn: 12, distanceToVerticalWallFt: 8, heightAboveRoofFt: 1.0, nearby: 0, status: "pass" }, // exactly 8 ft, 12 in cap → pitch table
  ])("cap $capSizeIn in, wall $distanceToVerticalWallFt ft, $heightAboveRoofFt ft → $status", ({ nearby, status, ...t }) => {
    const f = withCode(withTermination({ ...t, roofPitchPer12: 4, heightAboveNearbyStructureFt: nearby }), "termination.height")[0]!;
    expect(f.status).toBe(status);
  });

  test("outside the pitch table the height above nearby structures is required", () => {
    const list = withCode(withTermination({ capSizeIn: 14, heightAboveRoofFt: 3, roofPitchPer12: 4 }), "termination.height");
    expect(list.map((f) => f.status)).toEqual(["pass", "needs-info"]);
    const list2 = withCode(withTermination({ capSizeIn: 14, heightAboveRoofFt: 3, roofPitchPer12: 4, heightAboveNearbyStructureFt: 1 }), "termination.height");
    expect(list2.map((f) => f.status)).toEqual(["pass", "fail"]);
  });

  test("missing height is needs-info", () => {
    expect(only(withTermination({ roofPitchPer12: 6 }), "termination.height").status).toBe("needs-info");
  });
});

describe("termination.distance", () => {
  // IFGC 503.8; IRC G2427.8 (REFERENCE.md B5, found): mechanical draft: 4 ft below/beside or 1 ft above a door,
  // window or gravity inlet; 3 ft above a forced-air inlet within 10 ft.
  const catIV = furnace({ category: "IV", draft: "fan_assisted" });
  test.each([
    { kind: "door", distanceFt: 4, ventAboveFt: 0, status: "pass" },
    { kind: "door", distanceFt: 3.9, ventAboveFt: 1, status: "pass" },
    { kind: "operable_window", distanceFt: 3.9, ventAboveFt: 0.9, status: "fail" },
    { kind: "mechanical_inlet", distanceFt: 10, ventAboveFt: 0, status: "pass" },
    { kind: "mechanical_inlet", distanceFt: 6, ventAboveFt: 3, status: "pass" },
    { kind: "mechanical_inlet", distanceFt: 6, ventAboveFt: 2, status: "fail" },
    { kind: "gravity_inlet", distanceFt: 2, ventAboveFt: null, status: "needs-info" },
  ])("$kind at $distanceFt ft, vent $ventAboveFt ft above → $status", ({ status, ...o }) => {
    const f = only(withTermination({ heightAboveRoofFt: 2, roofPitchPer12: 4, nearbyOpenings: [{ id: "o1", ...o }] }, catIV), "termination.distance");
    expect(f.status).toBe(status);
    expect(f.target.itemId).toBe("o1");
  });

  // IFGC 503.8 / IRC G2427.8 (REFERENCE.md B5, found) are mechanical-draft rules: a natural-draft
  // vent 1 ft from a door is not judged by them, and the finding says so instead of staying silent.
  test("rows for mechanical draft are not applicable to a natural-draft vent, with the reason", () => {
    const findings = withTermination({ heightAboveRoofFt: 2, roofPitchPer12: 4, nearbyOpenings: [{ id: "o1", kind: "door", distanceFt: 1 }] });
    const f = only(findings, "termination.distance");
    expect(f.status).toBe("not-applicable");
    expect(f.message).toBe("Not applicable: the rulebook's distances from a door are for mechanical-draft vents, and this vent is natural-draft.");
    expect(f.target.path).toBe("ventRun.termination.nearbyOpenings.0.distanceFt");
  });

  test("an opening with no row for any vent system is not checked", () => {
    const content = { ...STARTER_RULEBOOK, terminationDistances: STARTER_RULEBOOK.terminationDistances.filter((r) => r.opening !== "operable_window") };
    const run = ventRunSchema.parse({ ...goodRun(), termination: { listedCap: true, capSizeIn: 4, distanceToVerticalWallFt: 10, heightAboveRoofFt: 2, roofPitchPer12: 4, nearbyOpenings: [{ id: "o1", kind: "operable_window", distanceFt: 1 }] } });
    const f = only(evaluateVentRun(run, [furnace({ category: "IV", draft: "fan_assisted" })], prepareRulebook(content)).findings, "termination.distance");
    expect(f.status).toBe("needs-info");
    expect(f.message).toMatch(/^Not checked: the rulebook has no value for the distance from a termination to an operable window/);
  });
});

describe("vent.min_height and vent.category", () => {
  // IFGC 503.6.5; IRC G2427.6.4 (REFERENCE.md B3, found): ≥ 5 ft above the highest collar.
  test.each([
    { heightFt: 5, status: "pass" },
    { heightFt: 4.99, status: "fail" },
    { heightFt: null, status: "needs-info" },
  ])("vent $heightFt ft → $status", ({ heightFt, status }) => {
    const run = ventRunSchema.parse({ ...goodRun(), vent: { ...goodRun().vent, heightFt } });
    expect(only(evaluateVentRun(run, [furnace()], RB).findings, "vent.min_height").status).toBe(status);
  });

  test("a Category IV appliance skips the Category I checks with a caution", () => {
    const findings = evaluateVentRun(goodRun(), [furnace({ category: "IV" })], RB).findings;
    expect(only(findings, "vent.category").status).toBe("warn");
    // Each skipped Category I check says it does not apply, and why; none passes or fails.
    for (const code of ["connector.slope", "connector.horizontal_length", "vent.capacity", "vent.min_height", "termination.height"]) {
      const f = only(findings, code);
      expect(f.status).toBe("not-applicable");
      expect(f.message).toMatch(/^Not applicable: ".+" is a Category I rule and Furnace is Category IV; the manufacturer's instructions govern/);
    }
    // Connector length per diameter is a common-vent rule: on a single vent it is not listed at all.
    expect(withCode(findings, "connector.length_per_diameter")).toHaveLength(0);
    expect(withCode(findings, "clearance.combustibles").length).toBeGreaterThan(0);
  });

  test("a direct-vent appliance on the run skips the Category I checks as not applicable", () => {
    const run = ventRunSchema.parse({ ...goodRun(), applianceIds: ["f1"] });
    const findings = evaluateVentRun(run, [furnace({ id: "f1", draft: "direct_vent", category: null })], RB).findings;
    expect(only(findings, "vent.capacity").status).toBe("not-applicable");
    expect(only(findings, "vent.capacity").message).toContain("direct-vent (sealed combustion)");
  });

  test("unknown category and draft is needs-info but the checks still run", () => {
    const findings = evaluateVentRun(goodRun(), [furnace({ category: null, draft: null })], RB).findings;
    expect(only(findings, "vent.category").status).toBe("needs-info");
    expect(withCode(findings, "connector.slope")).toHaveLength(1);
  });
});

describe("every row of the roof-pitch table (REFERENCE.md B1, IFGC Table 503.6.4, found)", () => {
  test.each(B1_ROWS)("above $from/12 up to $to/12 → $minFt ft", ({ from, to, minFt }) => {
    // the top of each row belongs to it; just above its start too
    expect(terminationHeightRow(RB, to)?.row.minHeightFt).toBe(minFt);
    expect(terminationHeightRow(RB, from + 0.01)?.row.minHeightFt).toBe(minFt);
    expect(terminationHeightRow(RB, to)?.row.citation).toContain("503.6.4");
  });
});
