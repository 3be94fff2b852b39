import { describe, expect, test } from "vitest";
import { failuresByPart } from "@/lib/drawing/finding-targets";
import { evaluateVentRun } from "@/lib/venting";
import { RB, furnace, goodRun } from "@/tests/fixtures/venting/rulebook";

describe("the drawing marks only failures", () => {
  test("Category I checks that do not apply to a Category IV appliance are not drawn as failures", () => {
    const run = goodRun({ vent: { ...goodRun().vent, heightFt: 1 } }); // a 1 ft vent would fail vent.min_height (REFERENCE.md B3: ≥ 5 ft)
    const findings = evaluateVentRun(run, [furnace({ category: "IV" })], RB).findings;
    expect(findings.filter((f) => f.code === "vent.min_height").map((f) => f.status)).toEqual(["not-applicable"]);
    const parts = failuresByPart(findings, run.segments.map((s) => s.id), ["furnace"]);
    expect(parts.vent.codes).toEqual([]);
    expect(parts.termination.codes).toEqual([]);
    // The same run on a Category I furnace is drawn with the failing vent.
    const cat1 = failuresByPart(evaluateVentRun(run, [furnace()], RB).findings, run.segments.map((s) => s.id), ["furnace"]);
    expect(cat1.vent.codes).toContain("vent.min_height");
  });
});
