import fc from "fast-check";
import { describe, expect, test } from "vitest";
import {
  airSpaceSchema,
  evaluateCombustionAir,
  evaluateVentRun,
  indoorDifferentStoriesAreaSqIn,
  indoorSameStoryAreaSqIn,
  lerp,
  lookupCapacity,
  outdoorOpeningAreaSqIn,
  requiredVolumeCuFt,
  singleOpeningAreaSqIn,
  type Finding,
} from "@/lib/venting";
import { RB, furnace, runWithSegment } from "@/tests/fixtures/venting/rulebook";

const FACTORS = { perKbtuhCuFt: 50, otherConstant: 21, fanConstant: 15, achThreshold: 0.4, achMax: 0.6 };
const input = fc.integer({ min: 0, max: 1_000_000 });
const ach = fc.option(fc.double({ min: 0.05, max: 2, noNaN: true }), { nil: null });
const RANK = { "not-applicable": 0, pass: 0, warn: 1, "needs-info": 2, fail: 3 } as const;
const worstOf = (fs: Finding[], code: string) => Math.max(-1, ...fs.filter((f) => f.code === code).map((f) => RANK[f.status]));

describe("more input never needs less air or opening area", () => {
  test("required volume is monotone in each input, at any ACH", () => {
    fc.assert(
      fc.property(input, input, fc.nat(100_000), fc.nat(100_000), ach, (other, fan, dOther, dFan, a) => {
        const v1 = requiredVolumeCuFt(other, fan, a, FACTORS).volumeCuFt;
        const v2 = requiredVolumeCuFt(other + dOther, fan + dFan, a, FACTORS).volumeCuFt;
        expect(v2).toBeGreaterThanOrEqual(v1 - 1e-9);
      }),
    );
  });

  test("opening areas are monotone in input", () => {
    fc.assert(
      fc.property(input, fc.nat(100_000), fc.double({ min: 0, max: 500, noNaN: true }), (i, d, conn) => {
        expect(indoorSameStoryAreaSqIn(i + d, 1, 100)).toBeGreaterThanOrEqual(indoorSameStoryAreaSqIn(i, 1, 100));
        expect(indoorDifferentStoriesAreaSqIn(i + d, 2)).toBeGreaterThanOrEqual(indoorDifferentStoriesAreaSqIn(i, 2));
        expect(outdoorOpeningAreaSqIn(i + d, 4000)).toBeGreaterThanOrEqual(outdoorOpeningAreaSqIn(i, 4000));
        expect(singleOpeningAreaSqIn(i + d, 3000, conn)).toBeGreaterThanOrEqual(singleOpeningAreaSqIn(i, 3000, conn));
      }),
    );
  });

  test("through the evaluator: a bigger appliance never turns a failing air space into a passing one", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1_000, max: 200_000 }), fc.nat(100_000), fc.integer({ min: 100, max: 10_000 }), (i, d, vol) => {
        const space = airSpaceSchema.parse({ rooms: [{ id: "r", volumeCuFt: vol }] });
        const a = evaluateCombustionAir(space, [furnace({ inputBtuh: i })], RB).findings;
        const b = evaluateCombustionAir(space, [furnace({ inputBtuh: i + d })], RB).findings;
        expect(worstOf(b, "air.volume")).toBeGreaterThanOrEqual(worstOf(a, "air.volume"));
      }),
    );
  });
});

describe("a longer or flatter run never passes where a shorter or steeper one fails", () => {
  const codes = ["connector.slope", "connector.horizontal_length", "vent.capacity", "supports.spacing"];
  test("lengthening the horizontal segment or lowering its rise never improves a finding", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.5, max: 14, noNaN: true }),
        fc.double({ min: 0, max: 6, noNaN: true }),
        fc.double({ min: 0, max: 5, noNaN: true }),
        fc.double({ min: 0, max: 3, noNaN: true }),
        (lengthFt, riseIn, moreFt, lessRiseIn) => {
          const short = evaluateVentRun(runWithSegment(1, { lengthFt, riseIn }), [furnace()], RB).findings;
          const long = evaluateVentRun(runWithSegment(1, { lengthFt: lengthFt + moreFt, riseIn: riseIn - lessRiseIn }), [furnace()], RB).findings;
          for (const c of codes) expect(worstOf(long, c)).toBeGreaterThanOrEqual(worstOf(short, c));
        },
      ),
    );
  });
});

describe("interpolated capacities lie between their neighbours", () => {
  test("lerp stays within its ends", () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 1e6 }), fc.integer({ min: 0, max: 1e6 }), fc.double({ min: 0, max: 1, noNaN: true }), (a, b, t) => {
        const v = lerp(a, b, t);
        expect(v).toBeGreaterThanOrEqual(Math.min(a, b) - 1e-6);
        expect(v).toBeLessThanOrEqual(Math.max(a, b) + 1e-6);
      }),
    );
  });

  test("table lookups between rows lie within the four surrounding cells", () => {
    fc.assert(
      fc.property(fc.double({ min: 10, max: 20, noNaN: true }), fc.double({ min: 0, max: 10, noNaN: true }), fc.constantFrom(4, 5), (h, l, d) => {
        const r = lookupCapacity(RB, { ventMaterial: "type_b", connectorMaterial: "type_b", diameterIn: d, heightFt: h, lateralFt: l }, true);
        expect(r.ok).toBe(true);
        if (!r.ok) return;
        const corners = [
          [10, 0],
          [20, 0],
          [10, 10],
          [20, 10],
        ].map(([ch, cl]) => lookupCapacity(RB, { ventMaterial: "type_b", connectorMaterial: "type_b", diameterIn: d, heightFt: ch!, lateralFt: cl! }, true));
        for (const field of ["fanMinBtuh", "fanMaxBtuh", "naturalMaxBtuh"] as const) {
          const vals = corners.map((c) => (c.ok ? c[field]! : NaN));
          expect(r[field]!).toBeGreaterThanOrEqual(Math.min(...vals) - 1e-6);
          expect(r[field]!).toBeLessThanOrEqual(Math.max(...vals) + 1e-6);
        }
      }),
    );
  });
});
