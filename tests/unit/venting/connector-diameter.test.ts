import { describe, expect, test } from "vitest";
import { evaluateVentRun, ventReductionConsidered, ventRunSchema } from "@/lib/venting";
import { RB, furnace, goodRun, runWithSegment, waterHeater, withCode } from "@/tests/fixtures/venting/rulebook";

describe("connector.diameter", () => {
  // NFPA 54 13.1.2; IFGC 504.2.2 (REFERENCE.md A7, found): connector not smaller than the outlet.
  test.each([
    { diameterIn: 4, status: "pass" }, // equal to the 4 in outlet (boundary)
    { diameterIn: 5, status: "pass" },
    { diameterIn: 3, status: "fail" },
  ])("$diameterIn in connector on a 4 in outlet → $status", ({ diameterIn, status }) => {
    const f = withCode(evaluateVentRun(runWithSegment(1, { diameterIn }), [furnace()], RB).findings, "connector.diameter").find((x) => x.target.section === "ventRun" && x.target.itemId !== null)!;
    expect(f.status).toBe(status);
    expect(f.required).toEqual({ value: 4, unit: "in", comparator: "≥" });
    expect(f.citation).toContain("outlet");
  });

  test("missing outlet diameter is needs-info on the appliance", () => {
    const list = withCode(evaluateVentRun(goodRun(), [furnace({ outletDiameterIn: null })], RB).findings, "connector.diameter");
    expect(list.every((f) => f.status === "needs-info")).toBe(true);
    expect(list[0]!.target.path).toBe("appliances.0.outletDiameterIn");
  });

  // IFGC 504.2.2; NFPA 54 13.1.2 (REFERENCE.md B8, found): a vent smaller than the outlet only
  // when ≥ 10 ft high, one size at most, never a 3 in vent on a 4 in draft hood.
  test.each([
    { ventIn: 4, heightFt: 15, status: "pass" },
    { ventIn: 3, heightFt: 10, draft: "fan_assisted", status: "warn" }, // exactly 10 ft (boundary)
    { ventIn: 3, heightFt: 9.9, draft: "fan_assisted", status: "fail" },
    { ventIn: 3, heightFt: 15, draft: "natural", status: "fail" }, // 3 on a 4 in draft hood
  ])("vent $ventIn in, $heightFt ft ($draft) → $status", ({ ventIn, heightFt, draft, status }) => {
    const run = goodRun({ vent: { material: "type_b", diameterIn: ventIn, heightFt, lateralFt: 0, serves: "single" } });
    const f = withCode(evaluateVentRun(run, [furnace(draft ? { draft: draft as "natural" } : {})], RB).findings, "connector.diameter").find((x) => x.target.path === "ventRun.vent.diameterIn")!;
    expect(f.status).toBe(status);
  });

  test.each([
    [5, 6, 10, 10, false, true],
    [4, 6, 20, 10, false, false], // two sizes down
    [3, 4, 20, 10, true, false], // 3 in on a 4 in draft hood
    [3, 4, 20, 10, false, true], // fan-assisted may be considered
    [12, 13, 20, 10, false, false], // outlet over 12 in
  ])("reduction %s on %s at %s ft (min %s, natural %s) → %s", (v, o, h, min, nat, ok) => {
    expect(ventReductionConsidered(v, o, h, min, nat)).toBe(ok);
  });

  // IFGC 504.3.8 (REFERENCE.md B9, found): common vent area ≥ area of the largest connector.
  test.each([
    { ventIn: 4, status: "pass" },
    { ventIn: 3.5, status: "fail" },
  ])("common vent $ventIn in with a 4 in largest connector → $status", ({ ventIn, status }) => {
    const run = ventRunSchema.parse({
      segments: [
        { id: "f1", applianceId: "furnace", material: "type_b", diameterIn: 4, lengthFt: 3, orientation: "horizontal", riseIn: 1 },
        { id: "w1", applianceId: "wh", material: "type_b", diameterIn: 3, lengthFt: 3, orientation: "horizontal", riseIn: 1 },
      ],
      vent: { material: "type_b", diameterIn: ventIn, heightFt: 20, lateralFt: 0, serves: "common" },
    });
    const f = withCode(evaluateVentRun(run, [furnace(), waterHeater()], RB).findings, "connector.diameter").find((x) => x.target.path === "ventRun.vent.diameterIn")!;
    expect(f.status).toBe(status);
    expect(f.required?.value).toBe(4);
  });
});
