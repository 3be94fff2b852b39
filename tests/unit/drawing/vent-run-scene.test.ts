import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { STARTER_RULEBOOK } from "@/db/seeds/data/starter-rulebook";
import example from "@/docs/examples/check-request.json";
import { buildVentRunScene, MAX_DRAWN_SLOPE, SLOPE_EXAGGERATION } from "@/lib/drawing/vent-run-scene";
import type { ScenePrimitive, VentRunScene } from "@/lib/drawing/scene-types";
import {
  applianceSchema,
  checkInputSchema,
  evaluateInspection,
  prepareRulebook,
  ventRunSchema,
  type ConnectorSegment,
  type Finding,
  type VentRun,
} from "@/lib/venting";

const RB = prepareRulebook(STARTER_RULEBOOK);
const APPLIANCE = applianceSchema.parse({ id: "furnace-1", label: "Basement furnace", kind: "furnace", draft: "fan_assisted", inputBtuh: 80_000, outletDiameterIn: 4 });

function run(segments: Partial<ConnectorSegment>[], extra: Partial<VentRun> = {}): VentRun {
  return ventRunSchema.parse({
    segments: segments.map((s, i) => ({ id: `seg-${i + 1}`, ...s })),
    vent: { material: "type_b", diameterIn: 4, heightFt: 18 },
    termination: { roofPitchPer12: 8, heightAboveRoofFt: 1.5 },
    ...extra,
  });
}

function failAt(path: string, itemId: string | null = null, status: Finding["status"] = "fail"): Finding {
  return {
    code: "connector.slope",
    status,
    title: "Connector slope",
    message: "test",
    citation: null,
    ruleRef: null,
    target: { section: "ventRun", itemId, field: null, path },
    safety: null,
  };
}

/** Every number a renderer would read from the scene. */
function coordinates(p: ScenePrimitive): number[] {
  switch (p.kind) {
    case "line":
      return [p.x1, p.y1, p.x2, p.y2];
    case "polyline":
    case "polygon":
      return p.points.flatMap((q) => [q.x, q.y]);
    case "rect":
      return [p.x, p.y, p.x + p.width, p.y + p.height];
    case "circle":
      return [p.cx - p.r, p.cy - p.r, p.cx + p.r, p.cy + p.r];
    case "text":
      return [p.x, p.y, p.size];
  }
}

function expectInside(scene: VentRunScene): void {
  for (const p of scene.primitives) {
    const c = coordinates(p);
    for (const v of c) expect(Number.isFinite(v)).toBe(true);
    if (p.kind === "text") {
      expect(p.x).toBeGreaterThanOrEqual(0);
      expect(p.x).toBeLessThanOrEqual(scene.width);
      expect(p.y).toBeGreaterThanOrEqual(0);
      expect(p.y).toBeLessThanOrEqual(scene.height);
      continue;
    }
    for (let i = 0; i < c.length; i += 2) {
      expect(c[i]!).toBeGreaterThanOrEqual(-1e-6);
      expect(c[i]!).toBeLessThanOrEqual(scene.width + 1e-6);
      expect(c[i + 1]!).toBeGreaterThanOrEqual(-1e-6);
      expect(c[i + 1]!).toBeLessThanOrEqual(scene.height + 1e-6);
    }
  }
}

const supportsOf = (scene: VentRunScene, id: string) => scene.primitives.filter((p) => p.role === "support" && p.kind === "polyline" && p.partId === id).length;

describe("slope geometry", () => {
  test.each([
    [8, 1.5],
    [8, 2],
    [4, 0.5],
    [10, -1],
    [3, 0],
  ])("a %d ft horizontal segment rising %d in keeps its true slope and is drawn at it × the exaggeration", (lengthFt, riseIn) => {
    const scene = buildVentRunScene({ ventRun: run([{ orientation: "vertical", lengthFt: 2 }, { orientation: "horizontal", lengthFt, riseIn }]), appliances: [APPLIANCE], findings: [] });
    const seg = scene.segments[1]!;
    const trueSlope = riseIn / (12 * lengthFt);
    expect(seg.trueSlope).toBeCloseTo(trueSlope, 12);
    expect(seg.drawnSlope).toBeCloseTo(trueSlope * SLOPE_EXAGGERATION, 12);
    // On screen y grows downward, so a rise is a negative dy.
    const dx = seg.end.x - seg.start.x;
    const dy = seg.start.y - seg.end.y;
    expect(dx).toBeGreaterThan(0);
    expect(dy / dx).toBeCloseTo(trueSlope * SLOPE_EXAGGERATION, 9);
  });

  test("the label states the true rise over the length", () => {
    const scene = buildVentRunScene({ ventRun: run([{ orientation: "horizontal", lengthFt: 8, riseIn: 1.5 }]), appliances: [APPLIANCE], findings: [] });
    expect(scene.primitives.some((p) => p.kind === "text" && p.text === "1: 1.5 in / 8 ft")).toBe(true);
  });

  test("a steep entry is drawn no steeper than the cap, with the true slope kept", () => {
    const scene = buildVentRunScene({ ventRun: run([{ orientation: "horizontal", lengthFt: 2, riseIn: 12 }]), findings: [] });
    expect(scene.segments[0]!.trueSlope).toBeCloseTo(0.5);
    expect(scene.segments[0]!.drawnSlope).toBe(MAX_DRAWN_SLOPE);
  });

  test("vertical segments go straight up", () => {
    const scene = buildVentRunScene({ ventRun: run([{ orientation: "vertical", lengthFt: 3 }]), findings: [] });
    const s = scene.segments[0]!;
    expect(s.end.x).toBeCloseTo(s.start.x, 9);
    expect(s.end.y).toBeLessThan(s.start.y);
    expect(s.trueSlope).toBeNull();
  });

  test("a segment twice as long is drawn twice as long", () => {
    const scene = buildVentRunScene({ ventRun: run([{ orientation: "horizontal", lengthFt: 3, riseIn: 1 }, { orientation: "horizontal", lengthFt: 6, riseIn: 2 }]), findings: [] });
    const [a, b] = scene.segments as [VentRunScene["segments"][0], VentRunScene["segments"][0]];
    expect((b.end.x - b.start.x) / (a.end.x - a.start.x)).toBeCloseTo(2, 9);
  });
});

describe("roof", () => {
  test.each([0, 3, 6, 8, 12, 18])("the roof line of a %d/12 roof is at atan(pitch / 12)", (pitch) => {
    const scene = buildVentRunScene({
      ventRun: run([{ orientation: "vertical", lengthFt: 2 }, { orientation: "horizontal", lengthFt: 6, riseIn: 2 }], { termination: { roofPitchPer12: pitch, heightAboveRoofFt: 2, nearbyOpenings: [] } }),
      findings: [],
    });
    expect(scene.roof).not.toBeNull();
    const { start, end, angleRad } = scene.roof!;
    expect(angleRad).toBeCloseTo(Math.atan(pitch / 12), 12);
    expect(Math.atan2(end.y - start.y, end.x - start.x)).toBeCloseTo(Math.atan(pitch / 12), 9);
    const line = scene.primitives.find((p) => p.kind === "line" && p.role === "roof" && p.strokeWidth > 1);
    expect(line?.kind).toBe("line");
    if (line?.kind === "line") expect(Math.atan2(line.y2 - line.y1, line.x2 - line.x1)).toBeCloseTo(Math.atan(pitch / 12), 9);
  });

  test("the termination height is dimensioned with its value", () => {
    const scene = buildVentRunScene({ ventRun: run([{ orientation: "vertical", lengthFt: 2 }]), findings: [] });
    expect(scene.primitives.some((p) => p.kind === "text" && p.text === "1.5 ft")).toBe(true);
    expect(scene.primitives.some((p) => p.kind === "text" && p.text === "roof 8/12")).toBe(true);
    expect(scene.primitives.filter((p) => p.role === "dimension").length).toBeGreaterThanOrEqual(3);
  });

  test("no termination: no roof, and a note says so", () => {
    const scene = buildVentRunScene({ ventRun: run([{ orientation: "vertical", lengthFt: 2 }], { termination: null }), findings: [] });
    expect(scene.roof).toBeNull();
    expect(scene.primitives.some((p) => p.kind === "text" && p.text === "Termination not entered")).toBe(true);
  });
});

describe("supports", () => {
  test.each([0, 1, 2, 3, 7])("%d supports installed → that many hangers on the segment", (n) => {
    const scene = buildVentRunScene({
      ventRun: run([{ orientation: "vertical", lengthFt: 2, supportsInstalled: 1 }, { orientation: "horizontal", lengthFt: 8, riseIn: 2, supportsInstalled: n }]),
      findings: [],
    });
    expect(supportsOf(scene, "seg-2")).toBe(n);
    expect(supportsOf(scene, "seg-1")).toBe(1);
    expect(scene.segments[1]!.supports).toBe(n);
  });

  test("supports not entered draw none", () => {
    const scene = buildVentRunScene({ ventRun: run([{ orientation: "horizontal", lengthFt: 4, riseIn: 1 }]), findings: [] });
    expect(supportsOf(scene, "seg-1")).toBe(0);
  });
});

describe("failing parts", () => {
  const segments = [
    { orientation: "vertical" as const, lengthFt: 2 },
    { orientation: "horizontal" as const, lengthFt: 8, riseIn: 1 },
    { orientation: "horizontal" as const, lengthFt: 4, riseIn: 1 },
  ];
  const highlighted = (scene: VentRunScene) => scene.segments.filter((s) => s.highlight).map((s) => s.id);

  test.each([
    ["by path", [failAt("ventRun.segments.1.riseIn")], ["seg-2"]],
    ["by item id", [failAt("ventRun.other", "seg-3")], ["seg-3"]],
    ["by the segment path itself", [failAt("ventRun.segments.0")], ["seg-1"]],
    ["not by a pass", [failAt("ventRun.segments.1.riseIn", "seg-2", "pass")], []],
    ["not by a warning or needs-info", [failAt("ventRun.segments.1.riseIn", "seg-2", "warn"), failAt("ventRun.segments.2.riseIn", null, "needs-info")], []],
    ["not by a longer index sharing digits", [failAt("ventRun.segments.12.riseIn")], []],
    ["not by the vent", [failAt("ventRun.vent.diameterIn")], []],
    ["several", [failAt("ventRun.segments.0.lengthFt"), failAt("ventRun.segments.2.riseIn")], ["seg-1", "seg-3"]],
  ] as const)("a segment is highlighted exactly when a fail finding targets it: %s", (_name, findings, expected) => {
    const scene = buildVentRunScene({ ventRun: run(segments), appliances: [APPLIANCE], findings });
    expect(highlighted(scene)).toEqual(expected);
    for (const p of scene.primitives) {
      if (p.partId && p.partId.startsWith("seg-") && p.highlight) expect(expected as readonly string[]).toContain(p.partId);
    }
    for (const id of expected) {
      expect(scene.primitives.some((p) => p.partId === id && p.role === "connector-fail" && p.highlight)).toBe(true);
      expect(scene.primitives.some((p) => p.kind === "text" && p.partId === id && p.role === "label-fail" && p.text.startsWith("Connector slope"))).toBe(true);
    }
  });

  test("vent and termination failures highlight the vent and the termination", () => {
    const vent = { ...failAt("ventRun.vent.diameterIn"), code: "vent.capacity" as const, title: "Vent capacity" };
    const term = { ...failAt("ventRun.termination.heightAboveRoofFt"), code: "termination.height" as const, title: "Termination height" };
    const scene = buildVentRunScene({ ventRun: run(segments), appliances: [APPLIANCE], findings: [vent, term] });
    expect(scene.primitives.some((p) => p.role === "vent-fail" && p.highlight)).toBe(true);
    expect(scene.primitives.some((p) => p.role === "termination-fail" && p.highlight)).toBe(true);
    expect(scene.failingParts.map((p) => p.kind)).toEqual(["vent", "termination"]);
    expect(scene.summary).toContain("Vent capacity");
    expect(scene.summary).toContain("Termination height");
  });

  test("the worked example: segment 2 and the vent fail, as the engine says", () => {
    const input = checkInputSchema.parse(example);
    const { findings } = evaluateInspection(input, RB);
    const scene = buildVentRunScene({ ventRun: input.ventRun, appliances: input.appliances, findings });
    expect(scene.segments.map((s) => s.highlight)).toEqual([false, true]);
    expect(scene.segments[1]!.findingCodes).toEqual(expect.arrayContaining(["connector.slope", "clearance.combustibles", "supports.spacing"]));
    expect(scene.failingParts.map((p) => p.partId)).toEqual(["seg-2", "vent"]);
    expect(scene.summary).toMatch(/^Vent run: 2 connector segments, 8 ft horizontal, 2 ft vertical; .*2 failing parts: Segment 2 \(Connector slope/);
    expectInside(scene);
  });
});

describe("incomplete and extreme input", () => {
  test("no segments: the appliance and a note", () => {
    const scene = buildVentRunScene({ ventRun: ventRunSchema.parse({}), appliances: [APPLIANCE], findings: [] });
    expect(scene.segments).toEqual([]);
    expect(scene.primitives.some((p) => p.role === "appliance")).toBe(true);
    expect(scene.primitives.some((p) => p.kind === "text" && p.text.startsWith("No connector segments"))).toBe(true);
    expectInside(scene);
  });

  test("no vent run and no appliances at all still draws", () => {
    const scene = buildVentRunScene({ ventRun: null });
    expect(scene.primitives.length).toBeGreaterThan(0);
    expectInside(scene);
  });

  test("a missing length is drawn at a nominal length, dashed, and labelled", () => {
    const scene = buildVentRunScene({ ventRun: run([{ orientation: "horizontal", riseIn: 1 }, { orientation: "horizontal", lengthFt: 4, riseIn: 1 }]), findings: [] });
    const s = scene.segments[0]!;
    expect(s.nominalLength).toBe(true);
    expect(s.lengthFt).toBeNull();
    expect(s.trueSlope).toBeNull();
    const pipe = scene.primitives.find((p) => p.partId === "seg-1" && p.role === "connector");
    expect(pipe && "dash" in pipe && pipe.dash?.length).toBeTruthy();
    expect(scene.primitives.some((p) => p.kind === "text" && p.text === "1: 1 in / length?")).toBe(true);
  });

  test("a very long horizontal run is shortened with break marks and keeps its label", () => {
    const scene = buildVentRunScene({ ventRun: run([{ orientation: "vertical", lengthFt: 2 }, { orientation: "horizontal", lengthFt: 150, riseIn: 40 }]), findings: [] });
    expect(scene.segments[1]!.shortened).toBe(true);
    expect(scene.primitives.some((p) => p.role === "break" && p.partId === "seg-2")).toBe(true);
    expect(scene.primitives.some((p) => p.kind === "text" && p.text === "2: 40 in / 150 ft")).toBe(true);
    // Shortening changes the length, never the drawn slope.
    const s = scene.segments[1]!;
    expect((s.start.y - s.end.y) / (s.end.x - s.start.x)).toBeCloseTo(s.drawnSlope, 9);
    expectInside(scene);
  });

  test.each([343, 700])("30 segments at %d units: bounded labels, every part inside", (widthPx) => {
    const segs = Array.from({ length: 30 }, (_, i) => ({
      orientation: (i % 4 === 0 ? "vertical" : "horizontal") as "vertical" | "horizontal",
      lengthFt: 1 + (i % 5),
      riseIn: i % 3,
      supportsInstalled: 1,
      clearanceIn: 6,
      turns90: i % 4 === 3 ? 1 : 0,
    }));
    const findings = Array.from({ length: 30 }, (_, i) => failAt(`ventRun.segments.${i}.riseIn`));
    const scene = buildVentRunScene({ ventRun: run(segs), appliances: [APPLIANCE], findings, widthPx });
    expect(scene.segments).toHaveLength(30);
    const texts = scene.primitives.filter((p) => p.kind === "text");
    expect(texts.length).toBeLessThanOrEqual(60);
    expect(scene.segments.filter((s) => s.labelled).length).toBeLessThanOrEqual(10);
    expect(scene.segments.every((s) => s.highlight)).toBe(true);
    expect(texts.some((t) => t.text.startsWith("30 failing segments"))).toBe(true);
    expectInside(scene);
  });

  const num = fc.oneof(fc.constant(undefined), fc.constant(null), fc.double({ min: -1e6, max: 1e6, noNaN: true }), fc.double({ min: 0, max: 50, noNaN: true }), fc.integer({ min: 0, max: 40 }));
  const cnt = fc.oneof(fc.constant(undefined), fc.constant(null), fc.integer({ min: 0, max: 60 }));
  const segment = fc.record(
    {
      id: fc.string({ minLength: 1, maxLength: 6 }),
      material: fc.constantFrom("single_wall", "type_b", null, undefined),
      orientation: fc.constantFrom("horizontal", "vertical", null, undefined),
      lengthFt: num,
      riseIn: num,
      supportsInstalled: cnt,
      turns90: cnt,
      turns45: cnt,
      clearanceIn: num,
      passesThrough: fc.constantFrom("none", "attic", "wall", "floor", "ceiling", null, undefined),
      thimble: fc.constantFrom(true, false, null, undefined),
    },
    { requiredKeys: [] },
  );
  const ventRunArb = fc.record(
    {
      segments: fc.array(segment, { maxLength: 35 }),
      vent: fc.record({ material: fc.constantFrom("type_b", "single_wall", "masonry_lined", null), heightFt: num, lateralFt: num, diameterIn: num }, { requiredKeys: [] }),
      termination: fc.oneof(fc.constant(null), fc.record({ roofPitchPer12: num, heightAboveRoofFt: num }, { requiredKeys: [] })),
    },
    { requiredKeys: [] },
  );

  test("random, incomplete input never yields NaN or Infinity, and everything stays in the viewBox", () => {
    fc.assert(
      fc.property(ventRunArb, fc.constantFrom(343, 500, 700), fc.array(fc.nat(40), { maxLength: 5 }), (vr, widthPx, failIdx) => {
        const findings = failIdx.map((i) => failAt(`ventRun.segments.${i}.riseIn`));
        const scene = buildVentRunScene({ ventRun: vr as never, appliances: [APPLIANCE], findings, widthPx });
        expectInside(scene);
        for (const s of scene.segments) for (const v of [s.start.x, s.start.y, s.end.x, s.end.y, s.drawnSlope]) expect(Number.isFinite(v)).toBe(true);
        expect(scene.summary).not.toMatch(/NaN|Infinity|undefined/);
        for (const p of scene.primitives) if (p.kind === "text") expect(p.text).not.toMatch(/NaN|Infinity|undefined/);
      }),
      { numRuns: 200 },
    );
  });
});
