import { describe, expect, test } from "vitest";
import { STARTER_RULEBOOK } from "@/db/seeds/data/starter-rulebook";
import { evaluateVentRun, prepareRulebook, supportsNeeded } from "@/lib/venting";
import { RB, furnace, goodRun, only, runWithSegment, withCode } from "@/tests/fixtures/venting/rulebook";

const seg = (findings: ReturnType<typeof evaluateVentRun>["findings"], code: string, id: string) =>
  withCode(findings, code).find((f) => f.target.itemId === id)!;

describe("clearance.combustibles", () => {
  // IFGC Table 503.10.5 (REFERENCE.md A12, A13, memory): single-wall 6 in (listed), 9 in (unlisted); Type B 1 in as listed.
  test.each([
    { material: "single_wall", listed: true, clearanceIn: 6, status: "pass", requiredIn: 6 },
    { material: "single_wall", listed: true, clearanceIn: 5.9, status: "fail", requiredIn: 6 },
    { material: "single_wall", listed: false, clearanceIn: 6, status: "fail", requiredIn: 9 },
    { material: "single_wall", listed: false, clearanceIn: 9, status: "pass", requiredIn: 9 },
    { material: "type_b", listed: true, clearanceIn: 1, status: "pass", requiredIn: 1 },
    { material: "type_b", listed: true, clearanceIn: 0.5, status: "fail", requiredIn: 1 },
  ])("$material, listed $listed, $clearanceIn in → $status", ({ material, listed, clearanceIn, status, requiredIn }) => {
    const r = evaluateVentRun(runWithSegment(1, { material, clearanceIn }), [furnace({ listed })], RB);
    const f = seg(r.findings, "clearance.combustibles", "s-run");
    expect(f.status).toBe(status);
    expect(f.required?.value).toBe(requiredIn);
    expect(f.citation).toContain("503.10.5");
  });

  test("the manual's clearance governs when entered", () => {
    const r = evaluateVentRun(runWithSegment(1, { material: "single_wall", clearanceIn: 4 }), [furnace({ manualClearanceIn: 4 })], RB);
    const f = seg(r.findings, "clearance.combustibles", "s-run");
    expect(f.status).toBe("pass");
    expect(f.citation).toContain("instructions");
  });

  test("unmeasured clearance is needs-info", () => {
    const f = seg(evaluateVentRun(runWithSegment(1, { clearanceIn: null }), [furnace()], RB).findings, "clearance.combustibles", "s-run");
    expect(f.status).toBe("needs-info");
    expect(f.target.path).toBe("ventRun.segments.1.clearanceIn");
  });

  test("no table row (Type B on an unlisted appliance) is needs-info naming the table", () => {
    const f = seg(evaluateVentRun(goodRun(), [furnace({ listed: false })], RB).findings, "clearance.combustibles", "s-run");
    expect(f.status).toBe("needs-info");
    expect(f.message).toContain("Clearance to combustibles");
  });
});

describe("supports.spacing", () => {
  // No model-code spacing (REFERENCE.md A9): the starter's 5 ft horizontal is a placeholder; the engine only divides.
  test.each([
    { lengthFt: 5, supportsInstalled: 1, needed: 1, status: "pass" }, // exactly one span (boundary)
    { lengthFt: 5.1, supportsInstalled: 1, needed: 2, status: "fail" },
    { lengthFt: 10, supportsInstalled: 2, needed: 2, status: "pass" },
    { lengthFt: 12, supportsInstalled: 2, needed: 3, status: "fail" },
  ])("$lengthFt ft with $supportsInstalled supports → $status", ({ lengthFt, supportsInstalled, needed, status }) => {
    const f = seg(evaluateVentRun(runWithSegment(1, { lengthFt, riseIn: lengthFt, supportsInstalled }), [furnace()], RB).findings, "supports.spacing", "s-run");
    expect(f.status).toBe(status);
    expect(f.required?.value).toBe(needed);
    expect(f.citation).toMatch(/Placeholder/);
  });

  test("supports not counted is needs-info", () => {
    expect(seg(evaluateVentRun(runWithSegment(1, { supportsInstalled: null }), [furnace()], RB).findings, "supports.spacing", "s-run").status).toBe("needs-info");
  });

  test.each([
    [0, 5, 0],
    [10, 10 / 3, 3], // floating-point 3.0000000000000004 must not round up to 4
    [7, 2, 4],
  ])("supportsNeeded(%s, %s) = %s", (len, spacing, n) => {
    expect(supportsNeeded(len, spacing)).toBe(n);
  });
});

describe("joints.fasteners and joints.locked", () => {
  // IFGC 503.10.6 (REFERENCE.md A8, found / practice): joints mechanically fastened; 3 screws per single-wall joint is common practice.
  test.each([
    { material: "single_wall", fastenersPerJoint: 3, status: "pass" },
    { material: "single_wall", fastenersPerJoint: 2, status: "fail" },
    { material: "type_b", fastenersPerJoint: 0, status: "pass" },
  ])("$material with $fastenersPerJoint per joint → $status", ({ material, fastenersPerJoint, status }) => {
    const f = seg(evaluateVentRun(runWithSegment(1, { material, fastenersPerJoint }), [furnace()], RB).findings, "joints.fasteners", "s-run");
    expect(f.status).toBe(status);
  });

  test("fastener count missing is needs-info; a jointless piece is not checked", () => {
    const r = evaluateVentRun(runWithSegment(1, { material: "single_wall", fastenersPerJoint: null }), [furnace()], RB);
    expect(seg(r.findings, "joints.fasteners", "s-run").status).toBe("needs-info");
    const r2 = evaluateVentRun(runWithSegment(1, { joints: 0, fastenersPerJoint: null }), [furnace()], RB);
    expect(seg(r2.findings, "joints.fasteners", "s-run")).toBeUndefined();
  });

  test.each([
    { sectionsLocked: true, status: "pass" },
    { sectionsLocked: false, status: "fail" },
    { sectionsLocked: null, status: "needs-info" },
  ])("sections locked $sectionsLocked → $status", ({ sectionsLocked, status }) => {
    const f = seg(evaluateVentRun(runWithSegment(1, { sectionsLocked }), [furnace()], RB).findings, "joints.locked", "s-run");
    expect(f.status).toBe(status);
  });
});

describe("passage.single_wall", () => {
  // IRC G2427.10.2.2 (REFERENCE.md A10, found); IFGC 503.10.14–15 (A11, found / memory).
  test.each([
    { material: "single_wall", passesThrough: "attic", status: "fail" },
    { material: "single_wall", passesThrough: "crawl_space", status: "fail" },
    { material: "single_wall", passesThrough: "concealed_space", status: "fail" },
    { material: "single_wall", passesThrough: "floor", status: "fail" },
    { material: "single_wall", passesThrough: "ceiling", status: "fail" },
    { material: "single_wall", passesThrough: "none", status: "pass" },
    { material: "type_b", passesThrough: "attic", status: "pass" }, // A10: Type B is what attics call for
    { material: "type_b", passesThrough: "wall", status: "pass" },
    { material: "single_wall", passesThrough: "wall", thimble: true, status: "pass" },
    { material: "single_wall", passesThrough: "wall", thimble: false, status: "fail" },
    { material: "single_wall", passesThrough: "wall", thimble: null, status: "needs-info" },
    { material: "single_wall", passesThrough: null, status: "needs-info" },
  ])("$material through $passesThrough (thimble $thimble) → $status", ({ material, passesThrough, thimble, status }) => {
    const f = seg(evaluateVentRun(runWithSegment(1, { material, passesThrough, thimble }), [furnace()], RB).findings, "passage.single_wall", "s-run");
    expect(f.status).toBe(status);
    if (status === "fail") expect(f.safety).toBe("concealed_single_wall");
  });

  test("a passage the rulebook has no row for is not checked, never a pass", () => {
    const content = { ...STARTER_RULEBOOK, prohibitedPassages: STARTER_RULEBOOK.prohibitedPassages.filter((r) => !(r.material === "type_b" && r.passage === "attic")) };
    const f = seg(evaluateVentRun(runWithSegment(1, { material: "type_b", passesThrough: "attic" }), [furnace()], prepareRulebook(content)).findings, "passage.single_wall", "s-run");
    expect(f.status).toBe("needs-info");
    expect(f.message).toMatch(/^Not checked: the rulebook has no value for whether type-b pipe may pass through an attic; add it to the "/);
    expect(f.citation).toBeNull();
  });
});
