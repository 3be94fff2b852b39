import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { STARTER_RULEBOOK } from "@/db/seeds/data/starter-rulebook";
import {
  AIR_OPENING_KINDS,
  APPLIANCE_KINDS,
  checkInputSchema,
  DRAFT_TYPES,
  evaluateInspection,
  LOUVER_TYPES,
  PASSAGES,
  prepareRulebook,
  TERMINATION_OPENINGS,
  VENT_CATEGORIES,
  type Finding,
} from "@/lib/venting";
import { fmt } from "@/lib/venting/format";

/**
 * Random check requests with every number inside the schema's ranges, against the starter
 * rulebook: no finding may show NaN, Infinity or "undefined", and every number a message shows
 * must carry its unit. The ranges are the ones the schemas state (lengths 0–500 ft, heights
 * 0–300 ft, diameters 1–48 in, inputs 0–10,000,000 Btu/h, O2 0–20.9 %, ...).
 */
const RB = prepareRulebook(STARTER_RULEBOOK);

const num = (min: number, max: number) => fc.option(fc.double({ min, max, noNaN: true, noDefaultInfinity: true }), { nil: null });
const int = (min: number, max: number) => fc.option(fc.integer({ min, max }), { nil: null });
const pick = <T,>(values: readonly T[]) => fc.option(fc.constantFrom(...values), { nil: null });
const bool = fc.option(fc.boolean(), { nil: null });
// Labels without digits, so that every digit in a message is a number the engine put there.
const label = fc.constantFrom("Basement furnace", "Water heater", "Attic unit", "");

const applianceIds = ["a1", "a2"] as const;

const appliance = (id: string) =>
  fc.record({
    id: fc.constant(id),
    label,
    kind: pick(APPLIANCE_KINDS),
    fuel: pick(["natural_gas", "propane"] as const),
    inputBtuh: num(0, 10_000_000),
    category: pick(VENT_CATEGORIES),
    draft: pick(DRAFT_TYPES),
    outletDiameterIn: num(1, 48),
    listed: bool,
    manualClearanceIn: fc.option(num(0, 120), { nil: undefined }),
    condensing: bool,
  });

const segment = (i: number) =>
  fc.record({
    id: fc.constant(`s${i}`),
    applianceId: pick(applianceIds),
    material: pick(["single_wall", "type_b"] as const),
    diameterIn: num(1, 48),
    lengthFt: num(0, 500),
    orientation: pick(["horizontal", "vertical"] as const),
    riseIn: num(-600, 600),
    turns45: int(0, 50),
    turns90: int(0, 50),
    clearanceIn: num(0, 120),
    supportsInstalled: int(0, 500),
    fastenersPerJoint: int(0, 20),
    joints: int(0, 500),
    sectionsLocked: bool,
    passesThrough: pick(PASSAGES),
    thimble: bool,
  });

const ventRun = fc.record({
  applianceIds: fc.option(fc.subarray([...applianceIds], { minLength: 1 }), { nil: null }),
  segments: fc.tuple(segment(0), segment(1), segment(2)).chain((segs) => fc.subarray(segs)),
  vent: fc.record({
    material: pick(["type_b", "single_wall", "masonry_lined"] as const),
    diameterIn: num(1, 48),
    heightFt: num(0, 300),
    lateralFt: num(0, 500),
    turns45: int(0, 50),
    turns90: int(0, 50),
    serves: pick(["single", "common"] as const),
  }),
  termination: fc.option(
    fc.record({
      roofPitchPer12: num(0, 48),
      heightAboveRoofFt: num(0, 300),
      capSizeIn: num(1, 48),
      listedCap: bool,
      distanceToVerticalWallFt: num(0, 500),
      heightAboveNearbyStructureFt: num(-300, 300),
      nearbyOpenings: fc.array(fc.record({ id: fc.constantFrom("o1", "o2"), kind: fc.constantFrom(...TERMINATION_OPENINGS), distanceFt: num(0, 500), ventAboveFt: num(-300, 300) }), { maxLength: 2 }),
    }),
    { nil: null },
  ),
});

const airSpace = fc.record({
  rooms: fc.array(
    fc.record({
      id: fc.constantFrom("r1", "r2", "r3"),
      label,
      lengthFt: num(0, 500),
      widthFt: num(0, 500),
      heightFt: num(0, 300),
      volumeCuFt: fc.option(num(0, 10_000_000), { nil: undefined }),
      openToApplianceRoom: bool,
    }),
    { maxLength: 3 },
  ),
  airChangesPerHour: num(0.01, 10),
  openings: fc.array(
    fc.record({
      id: fc.constantFrom("p1", "p2", "p3"),
      kind: fc.constantFrom(...AIR_OPENING_KINDS),
      roomId: fc.option(fc.constantFrom("r1", "r2", "r3"), { nil: null }),
      position: pick(["high", "low"] as const),
      widthIn: num(0, 600),
      heightIn: num(0, 600),
      diameterIn: num(0, 120),
      louver: fc.constantFrom(...LOUVER_TYPES),
      freeAreaShare: num(0, 1),
      freeAreaSqIn: fc.option(num(0, 100_000), { nil: undefined }),
    }),
    { maxLength: 3 },
  ),
});

const readings = (id: string) =>
  fc.record({
    applianceId: fc.constant(id),
    draftInWc: num(-1, 1),
    spillageSeconds: num(0, 3600),
    flueCoPpm: num(0, 10_000),
    flueO2Pct: num(0, 20.9),
    ambientCoPpm: num(0, 10_000),
    supplyTempF: num(-60, 600),
    returnTempF: num(-60, 600),
    nameplateRiseMinF: num(0, 200),
    nameplateRiseMaxF: num(0, 200),
    meterDialCuFt: fc.option(fc.double({ min: 0.01, max: 100, noNaN: true }), { nil: null }),
    meterSecondsPerRev: num(1, 3600),
    heatingValueBtuPerCuFt: num(500, 3500),
  });

const checkInput = fc.record({
  appliances: fc.tuple(appliance("a1"), appliance("a2")).chain((as) => fc.subarray(as, { minLength: 1 })),
  ventRun: fc.option(ventRun, { nil: null }),
  airSpace: fc.option(airSpace, { nil: null }),
  readings: fc.tuple(readings("a1"), readings("a2")).chain((rs) => fc.subarray(rs)),
  removedAppliances: fc.option(fc.constant([{ id: "a2", label: "Water heater", inputBtuh: 40_000 }]), { nil: null }),
});

/** Units a number in a message may carry, longest first. */
const UNITS = ["in. w.c.", "in per ft", "in²", "ft³", "ft", "in", "Btu/h", "ppm", "%", "°F", "s", "ACH", "supports", "support", "fasteners", "fastener", "openings", "opening", "/12", "×"];
/** A number as `fmt` writes it (true minus, thousands commas), not part of a word or a pitch's "/12". */
const NUMBER = /(?<![\w./,−-])−?\d{1,3}(?:,\d{3})*(?:\.\d+)?|(?<![\w./,−-])−?\d+(?:\.\d+)?/g;

/** Numbers in a message not followed by a unit (a range "35–65 °F" takes its unit from the end). */
function unitlessNumbers(message: string): string[] {
  const bad: string[] = [];
  for (const m of message.matchAll(NUMBER)) {
    let rest = message.slice(m.index + m[0].length);
    const range = /^–−?\d[\d,]*(?:\.\d+)?/.exec(rest);
    if (range) rest = rest.slice(range[0].length);
    rest = rest.replace(/^ /, "");
    if (!UNITS.some((u) => rest.startsWith(u) && !/^[A-Za-z²³]/.test(rest.slice(u.length)))) bad.push(`${m[0]} → "${rest.slice(0, 20)}"`);
  }
  return bad;
}

function problems(f: Finding): string[] {
  const out: string[] = [];
  if (/NaN|Infinity|undefined|null/.test(f.message)) out.push(`message: ${f.message}`);
  for (const q of [f.measured, f.required]) {
    if (!q) continue;
    if (!Number.isFinite(q.value)) out.push(`value ${q.value} ${q.unit}`);
    if ("upperValue" in q && q.upperValue !== undefined && !Number.isFinite(q.upperValue)) out.push(`upper ${q.upperValue}`);
    if (!q.unit) out.push("a value without a unit");
  }
  for (const n of unitlessNumbers(f.message)) out.push(`${f.code}: number without unit ${n} in "${f.message}"`);
  return out;
}

/** Paths of every number in a value that is not finite (JSON would hide them as null). */
function nonFinite(value: unknown, path = "sizing"): string[] {
  if (typeof value === "number") return Number.isFinite(value) ? [] : [`${path} = ${value}`];
  if (value && typeof value === "object") return Object.entries(value).flatMap(([k, v]) => nonFinite(v, `${path}.${k}`));
  return [];
}

describe("no input in range produces a non-finite number or a number without its unit", () => {
  test("the unit matcher itself: catches a bare number, accepts units, ranges and pitches", () => {
    expect(unitlessNumbers("at least 2 needed")).toHaveLength(1);
    expect(unitlessNumbers("Rises 1.5 in over 8 ft; a roof of 8/12 pitch; 35–65 °F; 1,000 Btu/h; −0.02 in. w.c.; 5.3 %")).toEqual([]);
  });

  test("random in-range requests against the starter rulebook", () => {
    fc.assert(
      fc.property(checkInput, (raw) => {
        const parsed = checkInputSchema.safeParse(raw);
        // Every generated value is inside the schema's ranges, so the request must be accepted.
        expect(parsed.success, parsed.success ? "" : JSON.stringify(parsed.error.issues.slice(0, 3))).toBe(true);
        if (!parsed.success) return;
        const result = evaluateInspection(parsed.data, RB);
        const found = result.findings.flatMap(problems);
        expect(found).toEqual([]);
        for (const n of Object.values(result.summary.counts)) expect(Number.isFinite(n)).toBe(true);
        expect(nonFinite(result.sizing)).toEqual([]);
      }),
      { numRuns: 300 },
    );
  });

  test("fmt never prints NaN or Infinity and groups thousands", () => {
    fc.assert(
      fc.property(fc.double(), fc.integer({ min: 0, max: 6 }), (v, digits) => {
        const s = fmt(v, digits);
        expect(s).not.toMatch(/NaN|Infinity|e[+-]/);
      }),
    );
    // Thousands separated by commas, a true minus (the message style of the engine).
    expect(fmt(10_000_000, 0)).toBe("10,000,000");
    expect(fmt(-1234.567)).toBe("−1,234.57");
  });
});
