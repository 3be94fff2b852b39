import { describe, expect, test } from "vitest";
import { evaluateVentRun, prepareRulebook, requiredRiseIn } from "@/lib/venting";
import { RB, furnace, goodRun, only, runWithSegment, withCode, withoutParams } from "@/tests/fixtures/venting/rulebook";

const H = 1; // index of the horizontal segment in goodRun()

describe("connector.slope", () => {
  // IFGC 503.10.8 (REFERENCE.md A1, found): rise ≥ 1/4 in per ft of horizontal run.
  test.each([
    { lengthFt: 5, riseIn: 1.25, status: "pass", note: "exactly 1/4 in per ft (boundary)" },
    { lengthFt: 5, riseIn: 2, status: "pass", note: "steeper than required" },
    { lengthFt: 5, riseIn: 1.2, status: "fail", note: "just under 1/4 in per ft" },
    { lengthFt: 10, riseIn: 2.5, status: "pass", note: "10 ft needs 2.5 in (A1 worked example)" },
    { lengthFt: 10, riseIn: 0, status: "fail", note: "level run" },
    { lengthFt: 4, riseIn: -0.5, status: "fail", note: "sloping back toward the appliance" },
  ])("$lengthFt ft with $riseIn in rise → $status ($note)", ({ lengthFt, riseIn, status }) => {
    const f = only(evaluateVentRun(runWithSegment(H, { lengthFt, riseIn }), [furnace()], RB).findings, "connector.slope");
    expect(f.status).toBe(status);
    expect(f.required).toEqual({ value: lengthFt * 0.25, unit: "in", comparator: "≥" });
    expect(f.measured).toEqual({ value: riseIn, unit: "in" });
    expect(f.target.path).toBe(`ventRun.segments.${H}.riseIn`);
    expect(f.citation).toContain("503.10.8");
  });

  test("fail message says how much more rise is needed", () => {
    const f = only(evaluateVentRun(runWithSegment(H, { lengthFt: 8, riseIn: 1 }), [furnace()], RB).findings, "connector.slope");
    // 8 ft × 0.25 in/ft = 2 in required; 2 − 1 = 1 in more.
    expect(f.message).toContain("at least 2 in");
    expect(f.message).toContain("1 in more");
  });

  test("missing rise is needs-info, never a pass", () => {
    const f = only(evaluateVentRun(runWithSegment(H, { riseIn: null }), [furnace()], RB).findings, "connector.slope");
    expect(f.status).toBe("needs-info");
    expect(f.target.field).toBe("riseIn");
  });

  test("missing length is needs-info pointing at the length", () => {
    const f = only(evaluateVentRun(runWithSegment(H, { lengthFt: undefined }), [furnace()], RB).findings, "connector.slope");
    expect(f.status).toBe("needs-info");
    expect(f.target.path).toBe(`ventRun.segments.${H}.lengthFt`);
  });

  test("vertical segments are not slope-checked", () => {
    const findings = evaluateVentRun(goodRun(), [furnace()], RB).findings;
    expect(withCode(findings, "connector.slope").map((f) => f.target.itemId)).toEqual(["s-run"]);
  });

  test("a rulebook without the slope gives needs-info naming the table", () => {
    const rb = prepareRulebook(withoutParams("connector_min_slope_in_per_ft"));
    const f = only(evaluateVentRun(goodRun(), [furnace()], rb).findings, "connector.slope");
    expect(f.status).toBe("needs-info");
    expect(f.citation).toBeNull();
    expect(f.message).toContain("Parameters");
  });

  test("sizing reports the rise each horizontal segment needs", () => {
    const { sizing } = evaluateVentRun(runWithSegment(H, { lengthFt: 10 }), [furnace()], RB);
    expect(sizing.segments.find((s) => s.segmentId === "s-run")?.requiredRiseIn).toBe(2.5);
    expect(sizing.segments.find((s) => s.segmentId === "s-rise")?.requiredRiseIn).toBeNull();
    expect(requiredRiseIn(12, 0.25)).toBe(3);
  });
});
