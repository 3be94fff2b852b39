import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { STARTER_RULEBOOK } from "@/db/seeds/data/starter-rulebook";
import { buildVentRunScene } from "@/lib/drawing/vent-run-scene";
import type { ScenePrimitive, VentRunScene } from "@/lib/drawing/scene-types";
import { applianceSchema, checkInputSchema, evaluateInspection, prepareRulebook, ventRunSchema, type Finding, type VentRun } from "@/lib/venting";

// A furnace and a water heater sharing one Type B vent: the most common common-vent job
// (IFGC 2021 504.3 / NFPA 54 13.2, multiple-appliance venting; from memory). Invented demo data.
const FURNACE = applianceSchema.parse({ id: "furnace", label: "Basement furnace", kind: "furnace", draft: "fan_assisted", inputBtuh: 100_000, outletDiameterIn: 4 });
const HEATER = applianceSchema.parse({ id: "heater", label: "Water heater", kind: "water_heater", draft: "natural", inputBtuh: 40_000, outletDiameterIn: 3 });
const APPLIANCES = [FURNACE, HEATER];

const SEGMENTS = [
  { id: "f-1", applianceId: "furnace", material: "single_wall", orientation: "vertical", lengthFt: 2, turns90: 1, clearanceIn: 6, supportsInstalled: 1 },
  { id: "f-2", applianceId: "furnace", material: "single_wall", orientation: "horizontal", lengthFt: 6, riseIn: 1.5, turns90: 1, clearanceIn: 5, supportsInstalled: 1 },
  { id: "h-1", applianceId: "heater", material: "type_b", orientation: "vertical", lengthFt: 1, turns90: 1 },
  { id: "h-2", applianceId: "heater", material: "type_b", orientation: "horizontal", lengthFt: 3, riseIn: 0.75, turns90: 1, supportsInstalled: 1 },
] as const;

function commonRun(extra: Partial<VentRun> = {}): VentRun {
  return ventRunSchema.parse({
    id: "common",
    applianceIds: ["furnace", "heater"],
    segments: SEGMENTS,
    vent: { material: "type_b", diameterIn: 5, heightFt: 20, serves: "common" },
    termination: { roofPitchPer12: 6, heightAboveRoofFt: 2 },
    ...extra,
  });
}

function failing(code: string, title: string, target: Finding["target"]): Finding {
  return { code: code as Finding["code"], status: "fail", title, message: "test", citation: null, ruleRef: null, target, safety: null };
}

const NO_CONNECTOR = (applianceId: string, index: number): Finding =>
  failing("common_vent.no_connector", "No connector assigned", { section: "appliances", itemId: applianceId, field: null, path: `appliances.${index}` });

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
      return [p.x, p.y];
  }
}

function expectInside(scene: VentRunScene): void {
  for (const p of scene.primitives) {
    const c = coordinates(p);
    for (let i = 0; i < c.length; i += 2) {
      expect(Number.isFinite(c[i]!) && Number.isFinite(c[i + 1]!)).toBe(true);
      expect(c[i]!).toBeGreaterThanOrEqual(-1e-6);
      expect(c[i]!).toBeLessThanOrEqual(scene.width + 1e-6);
      expect(c[i + 1]!).toBeGreaterThanOrEqual(-1e-6);
      expect(c[i + 1]!).toBeLessThanOrEqual(scene.height + 1e-6);
    }
    if (p.kind === "text") expect(p.text).not.toMatch(/NaN|Infinity|undefined/);
  }
}

/** Horizontal extent of the vent pipe as drawn. */
function ventSpan(scene: VentRunScene): { x0: number; x1: number } {
  const xs = scene.primitives.filter((p) => p.partId === "vent" && p.kind === "polygon").flatMap((p) => coordinates(p).filter((_, i) => i % 2 === 0));
  return { x0: Math.min(...xs), x1: Math.max(...xs) };
}

const texts = (scene: VentRunScene) => scene.primitives.flatMap((p) => (p.kind === "text" ? [p] : []));
const appBox = (scene: VentRunScene, partId: string) => scene.primitives.find((p) => p.kind === "rect" && p.partId === partId && (p.role === "appliance" || p.role === "appliance-fail"));

describe("a furnace and a water heater on one common vent", () => {
  test.each([343, 700, 520])("at %d units both appliances are drawn, each with its own connector joining the vent at its own tee", (widthPx) => {
    const scene = buildVentRunScene({ ventRun: commonRun(), appliances: APPLIANCES, findings: [], widthPx });
    expect(scene.appliances.map((a) => [a.partId, a.segmentIds])).toEqual([
      ["appliance:furnace", ["f-1", "f-2"]],
      ["appliance:heater", ["h-1", "h-2"]],
    ]);
    const vent = ventSpan(scene);
    for (const app of scene.appliances) {
      expect(appBox(scene, app.partId)).toBeDefined();
      // Its connector starts at its own collar and ends at its tee, level with the branch.
      const segs = app.segmentIds.map((id) => scene.segments.find((s) => s.id === id)!);
      expect(segs[0]!.start.x).toBeCloseTo(app.collar.x, 6);
      expect(segs[0]!.start.y).toBeCloseTo(app.collar.y, 6);
      for (let k = 1; k < segs.length; k++) expect(segs[k]!.start).toEqual(segs[k - 1]!.end);
      expect(app.junction).not.toBeNull();
      expect(app.junction!.y).toBeCloseTo(segs.at(-1)!.end.y, 6);
      // The tee sits on the vent.
      expect(app.junction!.x).toBeGreaterThanOrEqual(vent.x0);
      expect(app.junction!.x).toBeLessThanOrEqual(vent.x1);
      expect(scene.primitives.some((p) => p.partId === `junction:${app.id}`)).toBe(true);
    }
    // One appliance on each side of the vent, boxes apart.
    const [f, h] = scene.appliances;
    expect(f!.collar.x).toBeLessThan(vent.x0);
    expect(h!.collar.x).toBeGreaterThan(vent.x1);
    const fb = appBox(scene, "appliance:furnace");
    const hb = appBox(scene, "appliance:heater");
    if (fb?.kind === "rect" && hb?.kind === "rect") expect(fb.x + fb.width).toBeLessThan(hb.x);
    expectInside(scene);
  });

  test("the connector with the taller rise joins the vent higher up", () => {
    // Furnace: 2 ft up + 1.5 in; water heater: 1 ft up + 0.75 in (the entered run).
    const scene = buildVentRunScene({ ventRun: commonRun(), appliances: APPLIANCES, findings: [] });
    const [f, h] = scene.appliances;
    expect(f!.junction!.y).toBeLessThan(h!.junction!.y);
    // And the water heater's tee is the lowest, so the vent begins just below it.
    const ventBottom = Math.max(...scene.primitives.filter((p) => p.partId === "vent" && p.kind === "polygon").flatMap((p) => coordinates(p).filter((_, i) => i % 2 === 1)));
    expect(ventBottom).toBeGreaterThan(h!.junction!.y);
    expect(ventBottom - h!.junction!.y).toBeLessThan(20);
  });

  test("each appliance is labelled with its label, kind, input and connector, and the vent as common", () => {
    const scene = buildVentRunScene({ ventRun: commonRun(), appliances: APPLIANCES, findings: [] });
    const t = texts(scene).map((p) => p.text);
    expect(t).toEqual(expect.arrayContaining(["Basement furnace", "Furnace · 100,000 Btu/h", "connector: segments 1–2", "Water heater", "40,000 Btu/h", "connector: segments 3–4"]));
    expect(t.some((x) => x.startsWith("Common vent: Type B 5 in"))).toBe(true);
    expect(scene.title).toBe("Side view of the common vent serving Basement furnace and Water heater");
    expect(scene.summary).toContain("Basement furnace: 2 connector segments; Water heater: 2 connector segments");
  });

  test("each segment keeps its true slope on either side of the vent", () => {
    const scene = buildVentRunScene({ ventRun: commonRun(), appliances: APPLIANCES, findings: [] });
    for (const id of ["f-2", "h-2"]) {
      const s = scene.segments.find((q) => q.id === id)!;
      // Rise over run, up positive, whichever way the connector runs toward the vent.
      expect((s.start.y - s.end.y) / Math.abs(s.end.x - s.start.x)).toBeCloseTo(s.drawnSlope, 9);
      expect(s.drawnSlope).toBeGreaterThan(0);
    }
    // The water heater's connector runs right to left into its tee.
    const h2 = scene.segments.find((q) => q.id === "h-2")!;
    expect(h2.end.x).toBeLessThan(h2.start.x);
  });

  test("supports, turns and clearance marks are drawn on each connector as on a single one", () => {
    const scene = buildVentRunScene({ ventRun: commonRun(), appliances: APPLIANCES, findings: [] });
    const supports = (id: string) => scene.primitives.filter((p) => p.role === "support" && p.partId === id).length;
    expect([supports("f-1"), supports("f-2"), supports("h-1"), supports("h-2")]).toEqual([1, 1, 0, 1]);
    for (const id of ["f-1", "f-2", "h-1", "h-2"]) expect(scene.primitives.some((p) => p.role === "turn" && p.partId === id)).toBe(true);
    expect(scene.primitives.some((p) => p.role === "combustible" && p.partId === "f-2")).toBe(true);
  });
});

describe("failing parts on a common vent", () => {
  test("a failing segment of the second appliance is highlighted, and only it", () => {
    const slope = failing("connector.slope", "Connector slope", { section: "ventRun", itemId: "h-2", field: "riseIn", path: "ventRun.segments.3.riseIn" });
    const scene = buildVentRunScene({ ventRun: commonRun(), appliances: APPLIANCES, findings: [slope] });
    expect(scene.segments.filter((s) => s.highlight).map((s) => s.id)).toEqual(["h-2"]);
    expect(scene.primitives.some((p) => p.partId === "h-2" && p.role === "connector-fail" && p.highlight)).toBe(true);
    expect(scene.primitives.some((p) => p.partId === "h-2" && p.role === "halo")).toBe(true);
    for (const id of ["f-1", "f-2", "h-1"]) expect(scene.primitives.some((p) => p.partId === id && p.highlight)).toBe(false);
    expect(texts(scene).some((p) => p.role === "label-fail" && p.text.startsWith("Connector slope"))).toBe(true);
    // The water heater's connector line says it has a failing part; the furnace's does not.
    expect(texts(scene).find((p) => p.text === "connector: segments 3–4")?.role).toBe("label-fail");
    expect(texts(scene).find((p) => p.text === "connector: segments 1–2")?.role).toBe("label-muted");
    expect(scene.failingParts.map((p) => [p.partId, p.label])).toEqual([["h-2", "Segment 4, Water heater connector"]]);
  });

  test("an appliance finding highlights that appliance only", () => {
    const f = failing("appliance.category", "Appliance category", { section: "appliances", itemId: "furnace", field: null, path: "appliances.0" });
    const scene = buildVentRunScene({ ventRun: commonRun(), appliances: APPLIANCES, findings: [f] });
    expect(appBox(scene, "appliance:furnace")?.role).toBe("appliance-fail");
    expect(appBox(scene, "appliance:heater")?.role).toBe("appliance");
    expect(scene.appliances.map((a) => a.highlight)).toEqual([true, false]);
    expect(scene.failingParts).toEqual([expect.objectContaining({ partId: "appliance:furnace", kind: "appliance", label: "Basement furnace" })]);
  });

  test("a vent finding highlights the common vent and its tees", () => {
    const f = failing("vent.capacity", "Vent capacity", { section: "ventRun", itemId: null, field: "diameterIn", path: "ventRun.vent.diameterIn" });
    const scene = buildVentRunScene({ ventRun: commonRun(), appliances: APPLIANCES, findings: [f] });
    expect(scene.primitives.some((p) => p.partId === "vent" && p.role === "vent-fail")).toBe(true);
    for (const id of ["furnace", "heater"]) expect(scene.primitives.some((p) => p.partId === `junction:${id}` && p.role === "vent-fail")).toBe(true);
  });
});

describe("an appliance on the run without a connector", () => {
  const withoutHeater = () => commonRun({ segments: ventRunSchema.parse({ segments: SEGMENTS.slice(0, 2) }).segments });

  test("is drawn with a no-connector mark and no tee", () => {
    const scene = buildVentRunScene({ ventRun: withoutHeater(), appliances: APPLIANCES, findings: [] });
    const heater = scene.appliances.find((a) => a.id === "heater")!;
    expect(heater.noConnector).toBe(true);
    expect(heater.junction).toBeNull();
    expect(heater.segmentIds).toEqual([]);
    expect(scene.primitives.some((p) => p.partId === "junction:heater")).toBe(false);
    expect(scene.primitives.some((p) => p.partId === "appliance:heater" && p.kind === "line" && p.dash)).toBe(true);
    expect(texts(scene).find((p) => p.text === "no connector")?.partId).toBe("appliance:heater");
    expect(texts(scene).some((p) => p.text === "connector: none")).toBe(true);
    // Not failed until the engine says so.
    expect(appBox(scene, "appliance:heater")?.role).toBe("appliance");
    expectInside(scene);
  });

  test.each([343, 700])("is marked failed at %d units when the engine reports common_vent.no_connector", (widthPx) => {
    const scene = buildVentRunScene({ ventRun: withoutHeater(), appliances: APPLIANCES, findings: [NO_CONNECTOR("heater", 1)], widthPx });
    expect(appBox(scene, "appliance:heater")?.role).toBe("appliance-fail");
    expect(texts(scene).find((p) => p.text === "no connector")?.role).toBe("label-fail");
    expect(scene.primitives.some((p) => p.partId === "appliance:heater" && p.role === "connector-fail" && p.kind === "line")).toBe(true);
    expect(appBox(scene, "appliance:furnace")?.role).toBe("appliance");
    expect(scene.failingParts.map((p) => p.partId)).toEqual(["appliance:heater"]);
    expect(scene.summary).toContain("Water heater: no connector");
    expectInside(scene);
  });

  test("the finding found by the appliance's index alone marks it too", () => {
    const f = { ...NO_CONNECTOR("heater", 1), target: { section: "appliances" as const, itemId: null, field: null, path: "appliances.1" } };
    const scene = buildVentRunScene({ ventRun: withoutHeater(), appliances: APPLIANCES, findings: [f] });
    expect(texts(scene).find((p) => p.text === "no connector")?.role).toBe("label-fail");
  });
});

describe("which appliances the run serves", () => {
  test("without applianceIds, every non-direct-vent appliance is on the vent (as the engine reads it)", () => {
    const direct = applianceSchema.parse({ id: "direct", label: "Wall furnace", kind: "furnace", draft: "direct_vent", inputBtuh: 30_000 });
    const scene = buildVentRunScene({ ventRun: commonRun({ applianceIds: null }), appliances: [...APPLIANCES, direct], findings: [] });
    expect(scene.appliances.map((a) => a.id)).toEqual(["furnace", "heater"]);
  });

  test("a segment with no appliance chosen continues the connector before it and says so", () => {
    const segs = [...SEGMENTS.slice(0, 3), { ...SEGMENTS[3], applianceId: null }];
    const scene = buildVentRunScene({ ventRun: commonRun({ segments: ventRunSchema.parse({ segments: segs }).segments }), appliances: APPLIANCES, findings: [] });
    expect(scene.appliances[1]!.segmentIds).toEqual(["h-1", "h-2"]);
    expect(texts(scene).some((p) => p.text === "appliance not chosen")).toBe(true);
  });
});

describe("a run with one appliance is drawn as before", () => {
  const single = ventRunSchema.parse({ segments: SEGMENTS.slice(0, 2), vent: { material: "type_b", diameterIn: 4, heightFt: 18 }, termination: { roofPitchPer12: 8, heightAboveRoofFt: 1.5 } });

  test.each([343, 700])("at %d units: naming the appliance, or adding a direct-vent one that is not on the vent, changes nothing", (widthPx) => {
    const plain = buildVentRunScene({ ventRun: single, appliances: [FURNACE], findings: [], widthPx });
    const named = buildVentRunScene({ ventRun: { ...single, applianceIds: ["furnace"] }, appliances: [FURNACE], findings: [], widthPx });
    const direct = applianceSchema.parse({ id: "direct", label: "Wall furnace", kind: "furnace", draft: "direct_vent", inputBtuh: 30_000 });
    const withDirect = buildVentRunScene({ ventRun: single, appliances: [FURNACE, direct], findings: [], widthPx });
    expect(named.primitives).toEqual(plain.primitives);
    expect(withDirect.primitives).toEqual(plain.primitives);
    expect(plain.appliances.map((a) => a.partId)).toEqual(["appliance"]);
    expect(plain.primitives.some((p) => p.partId?.startsWith("junction:"))).toBe(false);
    expect(plain.title).toBe("Side view of the vent run from Basement furnace");
    expect(texts(plain).some((p) => p.text.startsWith("Vent: Type B"))).toBe(true);
  });
});

describe("half-typed input", () => {
  const num = fc.oneof(fc.constant(undefined), fc.constant(null), fc.double({ min: -1e6, max: 1e6, noNaN: true }), fc.double({ min: 0, max: 40, noNaN: true }));
  const segment = fc.record(
    {
      id: fc.string({ minLength: 1, maxLength: 4 }),
      applianceId: fc.constantFrom("furnace", "heater", "boiler", "nobody", null, undefined),
      material: fc.constantFrom("single_wall", "type_b", null, undefined),
      orientation: fc.constantFrom("horizontal", "vertical", null, undefined),
      lengthFt: num,
      riseIn: num,
      supportsInstalled: fc.oneof(fc.constant(undefined), fc.integer({ min: 0, max: 9 })),
      turns90: fc.oneof(fc.constant(undefined), fc.integer({ min: 0, max: 4 })),
      clearanceIn: num,
      passesThrough: fc.constantFrom("none", "attic", "wall", null, undefined),
    },
    { requiredKeys: [] },
  );
  const appliance = (id: string) =>
    fc.record(
      {
        id: fc.constant(id),
        label: fc.constantFrom("", "Basement furnace", "A very long appliance label that will not fit", undefined),
        kind: fc.constantFrom("furnace", "water_heater", "boiler", "other", undefined),
        draft: fc.constantFrom("natural", "fan_assisted", "direct_vent", undefined),
        inputBtuh: num,
      },
      { requiredKeys: ["id"] },
    );
  const input = fc.record({
    appliances: fc.tuple(appliance("furnace"), appliance("heater"), appliance("boiler")).chain((all) => fc.subarray(all, { minLength: 0 })),
    applianceIds: fc.constantFrom(undefined, null, ["furnace", "heater"], ["furnace", "heater", "boiler"], ["heater"], []),
    segments: fc.array(segment, { maxLength: 12 }),
    vent: fc.record({ material: fc.constantFrom("type_b", "single_wall", "masonry_lined", null), heightFt: num, lateralFt: num, diameterIn: num }, { requiredKeys: [] }),
    termination: fc.oneof(fc.constant(null), fc.record({ roofPitchPer12: num, heightAboveRoofFt: num }, { requiredKeys: [] })),
    widthPx: fc.constantFrom(343, 520, 700),
    failing: fc.array(fc.constantFrom("ventRun.segments.0.riseIn", "ventRun.segments.3.lengthFt", "ventRun.vent.heightFt", "appliances.1"), { maxLength: 3 }),
  });

  test("draws every time, with finite coordinates inside the drawing (the scene is total)", () => {
    fc.assert(
      fc.property(input, (i) => {
        const findings = i.failing.map((path) =>
          path.startsWith("appliances") ? NO_CONNECTOR("heater", 1) : failing("connector.slope", "Connector slope", { section: "ventRun", itemId: null, field: null, path }),
        );
        const scene = buildVentRunScene({ ventRun: { applianceIds: i.applianceIds, segments: i.segments, vent: i.vent, termination: i.termination } as never, appliances: i.appliances as never, findings, widthPx: i.widthPx });
        expectInside(scene);
        expect(scene.summary).not.toMatch(/NaN|Infinity|undefined/);
        for (const a of scene.appliances) for (const v of [a.collar.x, a.collar.y, a.junction?.x ?? 0, a.junction?.y ?? 0]) expect(Number.isFinite(v)).toBe(true);
        // Every segment is drawn on exactly one connector when several appliances are drawn.
        if (scene.appliances.length > 1) expect(scene.appliances.flatMap((a) => a.segmentIds).length).toBe(scene.segments.length);
      }),
      { numRuns: 150 },
    );
  });
});

describe("with the engine's own findings", () => {
  test("a furnace and a water heater checked by the engine draw on one common vent", () => {
    const RB = prepareRulebook(STARTER_RULEBOOK);
    const input = checkInputSchema.parse({ rulebookVersionId: 1, appliances: APPLIANCES, ventRun: commonRun() });
    const { findings } = evaluateInspection(input, RB);
    const scene = buildVentRunScene({ ventRun: input.ventRun, appliances: input.appliances, findings });
    expect(scene.appliances.map((a) => a.id)).toEqual(["furnace", "heater"]);
    expect(scene.appliances.every((a) => a.junction !== null)).toBe(true);
    expectInside(scene);
  });
});
