import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { STARTER_RULEBOOK } from "@/db/seeds/data/starter-rulebook";
import {
  applianceSchema,
  evaluateInspection,
  evaluateVentRun,
  lengthMultipleLossPct,
  lookupInGrid,
  prepareRulebook,
  ventRunSchema,
  type Appliance,
  type Finding,
  type PreparedRulebook,
} from "@/lib/venting";
import { EXAMPLE_1, EXAMPLE_4, EXAMPLE_5A } from "@/tests/fixtures/venting/appendix-b";

/** A natural-draft water heater and a furnace sharing one Type B vent. */
function appliances(furnace: Partial<Appliance>, heater: Partial<Appliance> = {}): Appliance[] {
  return [
    applianceSchema.parse({ id: "wh", label: "Water heater", kind: "water_heater", category: "I", draft: "natural", inputBtuh: 35_000, outletDiameterIn: 3, listed: true, ...heater }),
    applianceSchema.parse({ id: "f", label: "Furnace", kind: "furnace", category: "I", draft: "natural", inputBtuh: 150_000, outletDiameterIn: 6, listed: true, ...furnace }),
  ];
}

interface ConnectorSpec {
  diameterIn: number;
  /** Vertical rise straight off the outlet, ft. */
  verticalFt: number;
  horizontalFt: number;
  /** Rise of the horizontal piece, in. */
  riseIn: number;
  turns90?: number;
  material?: "single_wall" | "type_b";
}

function commonRun(wh: ConnectorSpec, f: ConnectorSpec, vent: { diameterIn: number; heightFt: number; turns90?: number; turns45?: number; lateralFt?: number; manifoldLengthFt?: number }) {
  const segs = (id: string, c: ConnectorSpec) => [
    { id: `${id}-up`, applianceId: id, material: c.material ?? "single_wall", diameterIn: c.diameterIn, lengthFt: c.verticalFt, orientation: "vertical" },
    { id: `${id}-across`, applianceId: id, material: c.material ?? "single_wall", diameterIn: c.diameterIn, lengthFt: c.horizontalFt, orientation: "horizontal", riseIn: c.riseIn, turns90: c.turns90 ?? 0 },
  ];
  return ventRunSchema.parse({
    applianceIds: ["wh", "f"],
    segments: [...segs("wh", wh), ...segs("f", f)],
    vent: { material: "type_b", serves: "common", lateralFt: 0, turns45: 0, turns90: 0, ...vent },
  });
}

function byCode(findings: readonly Finding[], code: string, itemPrefix?: string): Finding {
  const hits = findings.filter((f) => f.code === code && (itemPrefix === undefined || (f.target.itemId ?? "").startsWith(itemPrefix)));
  expect(hits, `${code} ${itemPrefix ?? ""}`).toHaveLength(1);
  return hits[0]!;
}

describe("2018 IFGC Appendix B, Example 4: two draft-hood appliances (NAT+NAT), Table 504.3(2)", () => {
  const rb = prepareRulebook(EXAMPLE_4);
  // Water heater: R 2 ft (1 ft up, 4 ft across rising 12 in); furnace: R 3 ft (2 ft up, 8 ft across rising 12 in); H 30 ft.
  const run = commonRun({ diameterIn: 3, verticalFt: 1, horizontalFt: 4, riseIn: 12 }, { diameterIn: 6, verticalFt: 2, horizontalFt: 8, riseIn: 12 }, { diameterIn: 6, heightFt: 30 });
  const { findings, sizing } = evaluateVentRun(run, appliances({}), rb);

  test("water heater: a 3 in connector (37,000 Btu/h NAT max at H 30, R 2) serves 35,000 Btu/h", () => {
    const f = byCode(findings, "connector.capacity", "wh");
    expect(f.status).toBe("pass");
    expect(f.required).toEqual({ value: 37_000, unit: "Btu/h", comparator: "≤" });
    expect(f.smallest).toEqual({ value: 3, unit: "in" });
  });

  test("furnace: 5 in (120,000) is too small, a 6 in connector (172,000) is the example's answer", () => {
    const f = byCode(findings, "connector.capacity", "f-");
    expect(f.status).toBe("pass");
    expect(f.required?.value).toBe(172_000);
    expect(f.smallest).toEqual({ value: 6, unit: "in" });
    expect(sizing.common?.connectors.find((c) => c.applianceId === "f")?.smallestDiameterIn).toBe(6);
  });

  test("common vent: 6 in NAT+NAT 257,000 holds the combined 185,000 Btu/h", () => {
    const f = byCode(findings, "vent.capacity");
    expect(f.status).toBe("pass");
    expect(f.measured).toEqual({ value: 185_000, unit: "Btu/h" });
    expect(f.required).toEqual({ value: 257_000, unit: "Btu/h", comparator: "≤" });
    expect(f.message).toContain("NAT+NAT");
    expect(sizing.common?.column).toBe("nat_nat");
    expect(sizing.common?.smallestDiameterIn).toBe(6);
  });

  test("a 5 in furnace connector fails and names the 6 in that works", () => {
    const small = commonRun({ diameterIn: 3, verticalFt: 1, horizontalFt: 4, riseIn: 12 }, { diameterIn: 5, verticalFt: 2, horizontalFt: 7, riseIn: 12 }, { diameterIn: 6, heightFt: 30 });
    const f = byCode(evaluateVentRun(small, appliances({ outletDiameterIn: 5 }), rb).findings, "connector.capacity", "f-");
    expect(f.status).toBe("fail");
    expect(f.required?.value).toBe(120_000);
    expect(f.message).toContain("smallest connector the tables allow is 6 in");
  });
});

describe("2018 IFGC Appendix B, Example 5a: draft-hood water heater with a fan-assisted furnace (FAN+NAT), Table 504.3(2)", () => {
  const rb = prepareRulebook(EXAMPLE_5A);
  const heater = { inputBtuh: 35_000, outletDiameterIn: 4 };
  const furnace = { draft: "fan_assisted" as const, inputBtuh: 100_000, outletDiameterIn: 4 };
  // Water heater R 2 ft with 4 ft horizontal; furnace R 3 ft with 6 ft horizontal (= 1.5 ft × 4 in, no reduction).
  const make = (commonIn: number, whIn = 4) =>
    commonRun({ diameterIn: whIn, verticalFt: 1, horizontalFt: 4, riseIn: 12 }, { diameterIn: 4, verticalFt: 2, horizontalFt: 6, riseIn: 12 }, { diameterIn: commonIn, heightFt: 30 });

  test("water heater: 3 in would hold 37,000 but is below the 4 in draft hood; the smallest that works is 4 in (67,000)", () => {
    const r = evaluateVentRun(make(5), appliances(furnace, heater), rb);
    const f = byCode(r.findings, "connector.capacity", "wh");
    expect(f.status).toBe("pass");
    expect(f.required?.value).toBe(67_000);
    expect(f.smallest?.value).toBe(4);
    const small = evaluateVentRun(make(5, 3), appliances(furnace, heater), rb);
    const diameter = small.findings.find((x) => x.code === "connector.diameter" && x.target.itemId?.startsWith("wh"));
    expect(diameter?.status).toBe("fail");
  });

  test("furnace: a 4 in connector, 100,000 between the 85,000 FAN min and 119,000 FAN max", () => {
    const f = byCode(evaluateVentRun(make(5), appliances(furnace, heater), rb).findings, "connector.capacity", "f-");
    expect(f.status).toBe("pass");
    expect(f.required).toEqual({ value: 85_000, upperValue: 119_000, unit: "Btu/h", comparator: "between" });
  });

  test("common vent: 4 in FAN+NAT (132,000) is short of 135,000; 5 in (202,000) is the example's answer", () => {
    const four = byCode(evaluateVentRun(make(4), appliances(furnace, heater), rb).findings, "vent.capacity");
    expect(four.status).toBe("fail");
    expect(four.required?.value).toBe(132_000);
    expect(four.smallest).toEqual({ value: 5, unit: "in" });
    const five = byCode(evaluateVentRun(make(5), appliances(furnace, heater), rb).findings, "vent.capacity");
    expect(five.status).toBe("pass");
    expect(five.required?.value).toBe(202_000);
    expect(five.message).toContain("FAN+NAT");
  });

  test("connector longer than 1.5 ft per inch: 8 ft on a 4 in natural-draft connector loses 10 % of its own max (IFGC 504.3.3: 67,000 → 60,300)", () => {
    const long = commonRun({ diameterIn: 4, verticalFt: 1, horizontalFt: 8, riseIn: 12 }, { diameterIn: 4, verticalFt: 2, horizontalFt: 6, riseIn: 12 }, { diameterIn: 5, heightFt: 30 });
    const r = evaluateVentRun(long, appliances(furnace, heater), rb);
    const f = byCode(r.findings, "connector.capacity", "wh");
    expect(f.required?.value).toBeCloseTo(60_300, 6);
    const lengthFinding = r.findings.find((x) => x.code === "connector.length_per_diameter" && x.target.itemId?.startsWith("wh"));
    expect(lengthFinding?.status).toBe("warn");
    expect(lengthFinding?.message).toContain("connector's own maximum capacity");
  });

  test("a longer fan-assisted connector takes its minimum from the single-appliance table; without that row it is needs-info, never a pass (IFGC 504.3.3 item 2)", () => {
    const long = commonRun({ diameterIn: 4, verticalFt: 1, horizontalFt: 4, riseIn: 12 }, { diameterIn: 4, verticalFt: 2, horizontalFt: 9, riseIn: 12 }, { diameterIn: 5, heightFt: 30 });
    const f = byCode(evaluateVentRun(long, appliances(furnace, heater), rb).findings, "connector.capacity", "f-");
    expect(f.status).toBe("needs-info");
  });

  test("outside the table's heights the common vent is needs-info, never extrapolated (IFGC 504.3, G10)", () => {
    const tall = commonRun({ diameterIn: 4, verticalFt: 1, horizontalFt: 4, riseIn: 12 }, { diameterIn: 4, verticalFt: 2, horizontalFt: 6, riseIn: 12 }, { diameterIn: 5, heightFt: 35 });
    const r = evaluateVentRun(tall, appliances(furnace, heater), rb);
    expect(byCode(r.findings, "vent.capacity").status).toBe("needs-info");
    expect(r.findings.filter((x) => x.code === "connector.capacity").every((x) => x.status === "needs-info")).toBe(true);
  });
});

describe("2018 IFGC Appendix B, Example 1: single draft-hood appliance, Table 504.2(2)", () => {
  const rb = prepareRulebook(EXAMPLE_1);
  const heater = [applianceSchema.parse({ id: "a", label: "Boiler", kind: "boiler", category: "I", draft: "natural", inputBtuh: 120_000, outletDiameterIn: 5, listed: true })];
  const run = (turns90: number) =>
    ventRunSchema.parse({
      segments: [{ id: "s", material: "single_wall", diameterIn: 5, lengthFt: 5, orientation: "horizontal", riseIn: 15, turns90 }],
      vent: { material: "type_b", diameterIn: 5, heightFt: 10, lateralFt: 0 },
    });

  test("(a) two 90° elbows: a 5 in vent (122,000) serves 120,000", () => {
    const f = byCode(evaluateVentRun(run(2), heater, rb).findings, "vent.capacity");
    expect(f.status).toBe("pass");
    expect(f.required?.value).toBe(122_000);
  });

  test("(b) three 90° elbows: 10 % off → 109,800 for 5 in, so 6 in (167,400) is needed", () => {
    const r = evaluateVentRun(run(3), heater, rb);
    const f = byCode(r.findings, "vent.capacity");
    expect(f.status).toBe("fail");
    expect(f.required?.value).toBeCloseTo(109_800, 6);
    expect(f.smallest).toEqual({ value: 6, unit: "in" });
  });
});

describe("single-appliance rules named by the code", () => {
  const rb = prepareRulebook(STARTER_RULEBOOK);
  const fan = (inputBtuh: number, outletDiameterIn: number) =>
    [applianceSchema.parse({ id: "a", label: "Furnace", kind: "furnace", category: "I", draft: "fan_assisted", inputBtuh, outletDiameterIn, listed: true })];
  const vertical = (ventIn: number, heightFt: number) =>
    ventRunSchema.parse({
      segments: [{ id: "s", material: "type_b", diameterIn: ventIn, lengthFt: 2, orientation: "vertical" }],
      vent: { material: "type_b", diameterIn: ventIn, heightFt, lateralFt: 0, turns45: 0, turns90: 0 },
    });

  test("fan-assisted on a vent one size smaller: the table maximum is reduced 10 % in the numbers (IFGC 504.2.2, found)", () => {
    const full = prepareRulebook({ ...structuredClone(STARTER_RULEBOOK), parameters: STARTER_RULEBOOK.parameters.filter((p) => p.key !== "vent_reduction_fan_max_loss_pct") });
    const reduced = byCode(evaluateVentRun(vertical(4, 20), fan(60_000, 5), rb).findings, "vent.capacity");
    const withoutRule = byCode(evaluateVentRun(vertical(4, 20), fan(60_000, 5), full).findings, "vent.capacity");
    expect(withoutRule.status).toBe("needs-info");
    const sameSize = byCode(evaluateVentRun(vertical(4, 20), fan(60_000, 4), rb).findings, "vent.capacity");
    expect(reduced.required?.upperValue).toBeCloseTo(sameSize.required!.upperValue! * 0.9, 6);
    expect(reduced.message).toContain("10 % reduction of the fan-assisted maximum");
  });

  test.each([
    ["3 in vent on a 4 in draft hood, 20 ft", 3, 4, "natural", 20, "3 in vent is never allowed on a 4 in draft-hood outlet"],
    ["4 in vent on a 6 in outlet, 20 ft: two sizes down", 4, 6, "fan_assisted", 20, "only one table size smaller is allowed"],
    ["4 in vent on a 5 in outlet, 8 ft: too short", 4, 5, "fan_assisted", 8, "at least 10 ft high"],
  ] as const)("a failing downsizing names the rule that fails: %s (IFGC 504.2.2, found)", (_, ventIn, outletIn, draft, heightFt, words) => {
    const a = [applianceSchema.parse({ id: "a", label: "Heater", kind: "water_heater", category: "I", draft, inputBtuh: 30_000, outletDiameterIn: outletIn, listed: true })];
    const f = evaluateVentRun(vertical(ventIn, heightFt), a, rb).findings.find((x) => x.code === "connector.diameter" && x.target.path === "ventRun.vent.diameterIn")!;
    expect(f.status).toBe("fail");
    expect(f.message).toContain(words);
  });

  test.each([
    [7, 3, "pass"], // 49 / 9 = 5.4 times
    [8, 3, "fail"], // 64 / 9 = 7.1 times
  ] as const)("a %s in vent on a %s in outlet: flow area against 7 × the outlet (IFGC table notes, 504.3.21 — from memory): %s", (ventIn, outletIn, status) => {
    const a = [applianceSchema.parse({ id: "a", label: "Heater", kind: "water_heater", category: "I", draft: "natural", inputBtuh: 30_000, outletDiameterIn: outletIn, listed: true })];
    const f = byCode(evaluateVentRun(vertical(ventIn, 20), a, rb).findings, "vent.area_ratio");
    expect(f.status).toBe(status);
    expect(f.measured?.value).toBeCloseTo((ventIn * ventIn) / (outletIn * outletIn), 9);
  });
});

describe("connector length loss per extra multiple (IFGC 504.3.3: 4 in → 6 ft; over 6 up to 12 ft is −10 %)", () => {
  test.each([
    [6, 0],
    [6.5, 10],
    [12, 10],
    [12.1, 20],
  ])("%s ft of horizontal length on a 4 in connector → −%s %", (lengthFt, pct) => {
    expect(lengthMultipleLossPct(lengthFt, 6, 10)).toBe(pct);
  });
});

describe("the common vent and its connectors on the starter rulebook", () => {
  const rb = prepareRulebook(STARTER_RULEBOOK);

  test("an appliance with no connector assigned is a finding, as is a segment with no appliance", () => {
    const run = ventRunSchema.parse({
      applianceIds: ["wh", "f"],
      segments: [
        { id: "f-1", applianceId: "f", material: "type_b", diameterIn: 5, lengthFt: 3, orientation: "vertical" },
        { id: "x-1", material: "type_b", diameterIn: 4, lengthFt: 2, orientation: "vertical" },
      ],
      vent: { material: "type_b", diameterIn: 5, heightFt: 20, lateralFt: 0, serves: "common" },
    });
    const fs = evaluateVentRun(run, appliances({ outletDiameterIn: 5 }), rb).findings.filter((f) => f.code === "common_vent.no_connector");
    expect(fs.map((f) => f.target.path).sort()).toEqual(["appliances.0", "ventRun.segments.1.applianceId"]);
    expect(fs.every((f) => f.status === "needs-info")).toBe(true);
  });

  test("turns and a manifold in the common vent reduce its maximum; each missing rule is needs-info", () => {
    const base = commonRun({ diameterIn: 4, verticalFt: 1, horizontalFt: 4, riseIn: 12, material: "type_b" }, { diameterIn: 5, verticalFt: 2, horizontalFt: 5, riseIn: 12, material: "type_b" }, { diameterIn: 6, heightFt: 20 });
    const turned = { ...base, vent: { ...base.vent, turns90: 1, turns45: 1, manifoldLengthFt: 1 } };
    const a = appliances({ outletDiameterIn: 5, inputBtuh: 100_000, draft: "fan_assisted" }, { outletDiameterIn: 4 });
    const plain = byCode(evaluateVentRun(base, a, rb).findings, "vent.capacity");
    const reduced = byCode(evaluateVentRun(turned, a, rb).findings, "vent.capacity");
    // 10 % per 90°, 5 % per 45°, 10 % for a manifold (starter values from memory of IFGC 504.3.4–504.3.6): 25 % in all.
    expect(reduced.required!.value).toBeCloseTo(plain.required!.value * 0.75, 6);
    const noRule = prepareRulebook({ ...structuredClone(STARTER_RULEBOOK), parameters: STARTER_RULEBOOK.parameters.filter((p) => p.key !== "common_vent_manifold_loss_pct") });
    expect(byCode(evaluateVentRun(turned, a, noRule).findings, "vent.capacity").status).toBe("needs-info");
  });

  test("removing one of three appliances re-checks the two left against the multiple-appliance tables", () => {
    const run = commonRun({ diameterIn: 4, verticalFt: 1, horizontalFt: 4, riseIn: 12, material: "type_b" }, { diameterIn: 5, verticalFt: 2, horizontalFt: 5, riseIn: 12, material: "type_b" }, { diameterIn: 6, heightFt: 20 });
    const three = [...appliances({ outletDiameterIn: 5, inputBtuh: 100_000, draft: "fan_assisted" }, { outletDiameterIn: 4 }), applianceSchema.parse({ id: "old", label: "Old boiler", kind: "boiler", category: "I", draft: "natural", inputBtuh: 90_000, outletDiameterIn: 5 })];
    const r = evaluateInspection({ appliances: three, ventRun: { ...run, applianceIds: ["wh", "f", "old"] }, removedAppliances: [{ id: "old", label: "Old boiler", inputBtuh: 90_000 }] }, rb);
    const orphan = byCode(r.findings, "common_vent.orphaned");
    expect(orphan.message).toContain("multiple-appliance tables");
    expect(orphan.status).not.toBe("needs-info");
  });
});

describe("properties of the multiple-appliance sizing (starter demo tables)", () => {
  const rb: PreparedRulebook = prepareRulebook(STARTER_RULEBOOK);

  test("a larger diameter never has less capacity, in every connector and common-vent column", () => {
    for (const grids of rb.ventConnectorCapacity.values()) {
      for (let i = 1; i < grids.length; i++) {
        for (const [key, cell] of grids[i]!.cells) {
          const smaller = grids[i - 1]!.cells.get(key);
          if (!smaller) continue;
          for (const field of ["fanMaxBtuh", "naturalMaxBtuh"] as const) {
            const a = smaller.row[field];
            const b = cell.row[field];
            if (a !== null && b !== null) expect(b).toBeGreaterThanOrEqual(a);
          }
        }
      }
    }
    for (const grids of rb.commonVentCapacity.values()) {
      for (let i = 1; i < grids.length; i++) {
        for (const [h, cell] of grids[i]!.cells) {
          const smaller = grids[i - 1]!.cells.get(h);
          for (const field of ["fanFanMaxBtuh", "fanNatMaxBtuh", "natNatMaxBtuh"] as const) {
            const a = smaller?.row[field];
            const b = cell.row[field];
            if (a != null && b !== null) expect(b).toBeGreaterThanOrEqual(a);
          }
        }
      }
    }
  });

  test("interpolated connector values lie between the rows around them", () => {
    const grid = rb.ventConnectorCapacity.get("type_b|type_b")!.find((g) => g.diameterIn === 5)!;
    fc.assert(
      fc.property(fc.double({ min: 6, max: 30, noNaN: true }), fc.double({ min: 1, max: 3, noNaN: true }), (h, r) => {
        const v = lookupInGrid(grid, h, r, true);
        if (!v.ok) return false;
        const corner = (hh: number, rr: number) => grid.cells.get(`${hh}|${rr}`)!.row.naturalMaxBtuh!;
        const hs = grid.heightsFt;
        const h0 = [...hs].reverse().find((x) => x <= h)!;
        const h1 = hs.find((x) => x >= h)!;
        const r0 = Math.floor(r);
        const r1 = Math.ceil(r);
        const around = [corner(h0, r0), corner(h1, r0), corner(h0, r1), corner(h1, r1)];
        return v.naturalMaxBtuh! >= Math.min(...around) - 1e-6 && v.naturalMaxBtuh! <= Math.max(...around) + 1e-6;
      }),
      { numRuns: 300 },
    );
  });

  test("the smallest diameter that works passes, and the next smaller table size does not", () => {
    const diameters = [3, 4, 5, 6, 7, 8];
    fc.assert(
      fc.property(
        fc.integer({ min: 10_000, max: 200_000 }),
        fc.integer({ min: 20_000, max: 250_000 }),
        fc.constantFrom(6, 8, 10, 15, 20, 30),
        fc.boolean(),
        (whInput, fInput, heightFt, furnaceFan) => {
          const a = appliances({ inputBtuh: fInput, outletDiameterIn: 3, draft: furnaceFan ? "fan_assisted" : "natural" }, { inputBtuh: whInput, outletDiameterIn: 3 });
          const at = (whIn: number, fIn: number, ventIn: number) =>
            evaluateVentRun(
              commonRun({ diameterIn: whIn, verticalFt: 1, horizontalFt: 3, riseIn: 12, material: "type_b" }, { diameterIn: fIn, verticalFt: 1, horizontalFt: 3, riseIn: 12, material: "type_b" }, { diameterIn: ventIn, heightFt }),
              a,
              rb,
            );
          const first = at(4, 4, 8);
          const sizing = first.sizing.common!;
          for (const c of sizing.connectors) {
            if (c.smallestDiameterIn === null) continue;
            const prefix = c.applianceId === "wh" ? "wh" : "f-";
            const other = 4;
            const ok = c.applianceId === "wh" ? at(c.smallestDiameterIn, other, 8) : at(other, c.smallestDiameterIn, 8);
            expect(byCode(ok.findings, "connector.capacity", prefix).status).toBe("pass");
            const smaller = diameters.filter((d) => d < c.smallestDiameterIn!).at(-1);
            if (smaller !== undefined) {
              const bad = c.applianceId === "wh" ? at(smaller, other, 8) : at(other, smaller, 8);
              expect(byCode(bad.findings, "connector.capacity", prefix).status).not.toBe("pass");
            }
          }
          if (sizing.smallestDiameterIn !== null) {
            const ventIn = sizing.smallestDiameterIn;
            expect(byCode(at(4, 4, ventIn).findings, "vent.capacity").status).toBe("pass");
          }
        },
      ),
      { numRuns: 60 },
    );
  });
});

describe("rules a rulebook lacks are not checked, never a verdict", () => {
  const without = (key: string) => prepareRulebook({ ...structuredClone(STARTER_RULEBOOK), parameters: STARTER_RULEBOOK.parameters.filter((p) => p.key !== key) });
  const vertical = (ventIn: number) =>
    ventRunSchema.parse({
      segments: [{ id: "s", material: "type_b", diameterIn: ventIn, lengthFt: 2, orientation: "vertical" }],
      vent: { material: "type_b", diameterIn: ventIn, heightFt: 20, lateralFt: 0, turns45: 0, turns90: 0 },
    });

  test("a vent one size smaller with no reduction height in the rulebook", () => {
    const a = [applianceSchema.parse({ id: "a", label: "Furnace", kind: "furnace", category: "I", draft: "fan_assisted", inputBtuh: 60_000, outletDiameterIn: 5 })];
    const f = evaluateVentRun(vertical(4), a, without("vent_reduction_min_height_ft")).findings.find((x) => x.code === "connector.diameter" && x.target.path === "ventRun.vent.diameterIn")!;
    expect(f.status).toBe("needs-info");
    expect(f.message).toMatch(/^Not checked/);
  });

  test("an over-length connector with no loss per extra length in the rulebook", () => {
    const run = commonRun({ diameterIn: 4, verticalFt: 1, horizontalFt: 9, riseIn: 12 }, { diameterIn: 5, verticalFt: 1, horizontalFt: 4, riseIn: 12 }, { diameterIn: 6, heightFt: 20 });
    const fs = evaluateVentRun(run, appliances({ outletDiameterIn: 5 }, { outletDiameterIn: 4 }), without("connector_capacity_loss_per_extra_length_multiple_pct")).findings;
    const f = fs.find((x) => x.code === "connector.length_per_diameter" && x.target.itemId?.startsWith("wh"))!;
    expect(f.status).toBe("needs-info");
    expect(f.message).toMatch(/^Not checked/);
    expect(fs.find((x) => x.code === "connector.capacity" && x.target.itemId?.startsWith("wh"))?.status).toBe("needs-info");
  });
});
