/**
 * Engine benchmark: evaluates 10,000 varied vent runs and 10,000 air spaces against the starter
 * rulebook and prints median and 99th-percentile microseconds per evaluation.
 * Run: npx tsx bench/venting.bench.ts   (writes bench/results/venting.json)
 * Goals: median < 20 µs per vent run, < 5 µs per air space, < 50 µs per two-appliance common vent.
 */
import { mkdirSync, writeFileSync } from "node:fs";
import { performance } from "node:perf_hooks";
import { STARTER_RULEBOOK } from "../db/seeds/data/starter-rulebook";
import {
  airSpaceSchema,
  applianceSchema,
  evaluateCombustionAir,
  evaluateVentRun,
  prepareRulebook,
  ventRunSchema,
  type AirSpace,
  type Appliance,
  type VentRun,
} from "../lib/venting";

const N = 10_000;
const WARMUP = 2_000;

// Small deterministic generator so runs are comparable between machines and commits.
let seed = 0x2f6b1d;
const rand = () => {
  seed = (seed * 1664525 + 1013904223) >>> 0;
  return seed / 2 ** 32;
};
const pick = <T>(xs: readonly T[]): T => xs[Math.floor(rand() * xs.length)]!;
const between = (a: number, b: number) => Math.round((a + rand() * (b - a)) * 100) / 100;

function appliance(i: number): Appliance {
  return applianceSchema.parse({
    id: `a${i}`,
    label: "Furnace",
    kind: pick(["furnace", "boiler", "water_heater"] as const),
    fuel: "natural_gas",
    inputBtuh: pick([30_000, 40_000, 60_000, 80_000, 100_000, 120_000]),
    category: "I",
    draft: pick(["natural", "fan_assisted"] as const),
    outletDiameterIn: pick([3, 4, 5]),
    listed: rand() > 0.1,
  });
}

function ventRun(i: number): VentRun {
  const nSeg = 1 + Math.floor(rand() * 4);
  const segments = [];
  for (let s = 0; s < nSeg; s++) {
    const horizontal = rand() > 0.4;
    segments.push({
      id: `s${i}-${s}`,
      material: pick(["single_wall", "type_b"] as const),
      diameterIn: pick([3, 4, 5, 6]),
      lengthFt: between(0.5, 8),
      orientation: horizontal ? "horizontal" : "vertical",
      riseIn: horizontal ? between(-0.5, 3) : null,
      turns45: Math.floor(rand() * 2),
      turns90: Math.floor(rand() * 2),
      clearanceIn: rand() > 0.05 ? between(0.5, 10) : null,
      supportsInstalled: Math.floor(rand() * 3),
      fastenersPerJoint: Math.floor(rand() * 4),
      joints: 1 + Math.floor(rand() * 3),
      sectionsLocked: rand() > 0.1,
      passesThrough: pick(["none", "none", "none", "attic", "wall", "floor"] as const),
      thimble: rand() > 0.5,
    });
  }
  return ventRunSchema.parse({
    segments,
    vent: { material: "type_b", diameterIn: pick([3, 4, 5, 6, 7]), heightFt: between(5, 32), lateralFt: pick([0, 0, 2, 4]), turns90: Math.floor(rand() * 2), serves: "single" },
    termination: {
      roofPitchPer12: between(0, 14),
      heightAboveRoofFt: between(0.5, 6),
      listedCap: rand() > 0.2,
      capSizeIn: pick([4, 6, 14]),
      distanceToVerticalWallFt: between(2, 20),
      heightAboveNearbyStructureFt: between(0, 4),
      nearbyOpenings: rand() > 0.5 ? [{ id: `o${i}`, kind: pick(["door", "operable_window", "mechanical_inlet"] as const), distanceFt: between(1, 12), ventAboveFt: between(-2, 4) }] : [],
    },
  });
}

/** A furnace and a water heater on one Type B vent, each with its own connector. */
function commonVentCase(i: number): { run: VentRun; appliances: Appliance[] } {
  const furnace = applianceSchema.parse({ id: `f${i}`, label: "Furnace", kind: "furnace", inputBtuh: pick([60_000, 80_000, 100_000, 120_000]), category: "I", draft: pick(["natural", "fan_assisted"] as const), outletDiameterIn: pick([4, 5]), listed: true });
  const heater = applianceSchema.parse({ id: `w${i}`, label: "Water heater", kind: "water_heater", inputBtuh: pick([30_000, 40_000, 50_000]), category: "I", draft: "natural", outletDiameterIn: pick([3, 4]), listed: true });
  const connector = (owner: string, d: number) => [
    { id: `${owner}-up`, applianceId: owner, material: pick(["single_wall", "type_b"] as const), diameterIn: d, lengthFt: between(0.5, 3), orientation: "vertical", clearanceIn: between(1, 8), supportsInstalled: 1, fastenersPerJoint: 3, joints: 1, sectionsLocked: true, passesThrough: "none" },
    { id: `${owner}-across`, applianceId: owner, material: pick(["single_wall", "type_b"] as const), diameterIn: d, lengthFt: between(1, 9), orientation: "horizontal", riseIn: between(0.5, 3), turns90: Math.floor(rand() * 3), clearanceIn: between(1, 8), supportsInstalled: 1, fastenersPerJoint: 3, joints: 1, sectionsLocked: true, passesThrough: "none" },
  ];
  const run = ventRunSchema.parse({
    applianceIds: [furnace.id, heater.id],
    segments: [...connector(furnace.id, pick([4, 5, 6])), ...connector(heater.id, pick([3, 4]))],
    vent: { material: "type_b", diameterIn: pick([4, 5, 6, 7]), heightFt: between(6, 30), lateralFt: pick([0, 0, 1]), turns90: Math.floor(rand() * 2), serves: "common", manifoldLengthFt: pick([0, 0, 0, 1]) },
    termination: { roofPitchPer12: between(0, 12), heightAboveRoofFt: between(0.5, 4), listedCap: true, capSizeIn: 6, distanceToVerticalWallFt: between(2, 20), nearbyOpenings: [] },
  });
  return { run, appliances: [furnace, heater] };
}

function airSpace(i: number): AirSpace {
  const rooms = [{ id: `r${i}`, lengthFt: between(6, 30), widthFt: between(6, 30), heightFt: between(7, 10) }];
  if (rand() > 0.5) rooms.push({ id: `r${i}b`, lengthFt: between(6, 30), widthFt: between(6, 30), heightFt: 8 });
  const openings = [];
  if (rooms.length > 1) {
    openings.push({ id: `i${i}a`, kind: "indoor_same_story", roomId: `r${i}b`, widthIn: between(6, 20), heightIn: between(6, 14), louver: pick(["none", "metal"] as const) });
    openings.push({ id: `i${i}b`, kind: "indoor_same_story", roomId: `r${i}b`, widthIn: between(6, 20), heightIn: between(6, 14), louver: "none" });
  }
  if (rand() > 0.4) {
    const kind = pick(["outdoor_direct_or_vertical_duct", "outdoor_horizontal_duct", "outdoor_single_high"] as const);
    openings.push({ id: `x${i}a`, kind, widthIn: between(3, 14), heightIn: between(3, 14), louver: pick(["wood", "metal", "none"] as const) });
    if (kind !== "outdoor_single_high") openings.push({ id: `x${i}b`, kind, widthIn: between(3, 14), heightIn: between(3, 14), louver: "metal" });
  }
  return airSpaceSchema.parse({ rooms, openings, airChangesPerHour: rand() > 0.7 ? between(0.2, 1) : null });
}

function stats(samplesUs: Float64Array) {
  const s = Float64Array.from(samplesUs).sort();
  const at = (q: number) => s[Math.min(s.length - 1, Math.floor(q * s.length))]!;
  let sum = 0;
  for (const v of s) sum += v;
  return { medianUs: at(0.5), p99Us: at(0.99), meanUs: sum / s.length, maxUs: s[s.length - 1]! };
}

function time<T>(inputs: readonly T[], fn: (x: T) => unknown): Float64Array {
  const out = new Float64Array(inputs.length);
  let sink = 0;
  for (let i = 0; i < inputs.length; i++) {
    const t0 = performance.now();
    const r = fn(inputs[i]!);
    out[i] = (performance.now() - t0) * 1000;
    if (r) sink++;
  }
  if (sink < 0) console.log(sink);
  return out;
}

const rb = prepareRulebook(STARTER_RULEBOOK);
const runs: { run: VentRun; appliances: Appliance[] }[] = [];
const spaces: { space: AirSpace; appliances: Appliance[] }[] = [];
const commons: { run: VentRun; appliances: Appliance[] }[] = [];
for (let i = 0; i < N + WARMUP; i++) {
  const a = appliance(i);
  runs.push({ run: ventRun(i), appliances: [a] });
  commons.push(commonVentCase(i));
  spaces.push({ space: airSpace(i), appliances: rand() > 0.5 ? [a, appliance(i + N * 3)] : [a] });
}

let findingsVent = 0;
let findingsAir = 0;
let findingsCommon = 0;
time(runs.slice(0, WARMUP), (x) => evaluateVentRun(x.run, x.appliances, rb));
time(spaces.slice(0, WARMUP), (x) => evaluateCombustionAir(x.space, x.appliances, rb));
time(commons.slice(0, WARMUP), (x) => evaluateVentRun(x.run, x.appliances, rb));
const vent = stats(time(runs.slice(WARMUP), (x) => (findingsVent += evaluateVentRun(x.run, x.appliances, rb).findings.length)));
const air = stats(time(spaces.slice(WARMUP), (x) => (findingsAir += evaluateCombustionAir(x.space, x.appliances, rb).findings.length)));
const common = stats(time(commons.slice(WARMUP), (x) => (findingsCommon += evaluateVentRun(x.run, x.appliances, rb).findings.length)));

const result = {
  node: process.version,
  date: new Date().toISOString(),
  evaluations: N,
  ventRun: { ...vent, goalMedianUs: 20, meetsGoal: vent.medianUs < 20, findingsPerEvaluation: findingsVent / N },
  airSpace: { ...air, goalMedianUs: 5, meetsGoal: air.medianUs < 5, findingsPerEvaluation: findingsAir / N },
  commonVent: { ...common, goalMedianUs: 50, meetsGoal: common.medianUs < 50, findingsPerEvaluation: findingsCommon / N },
};
mkdirSync(new URL("./results/", import.meta.url), { recursive: true });
writeFileSync(new URL("./results/venting.json", import.meta.url), `${JSON.stringify(result, null, 2)}\n`);
const f = (v: number) => v.toFixed(2).padStart(7);
console.log(`vent run   (${N}): median ${f(vent.medianUs)} µs  p99 ${f(vent.p99Us)} µs  (goal median < 20 µs) ${vent.medianUs < 20 ? "OK" : "MISSED"}`);
console.log(`air space  (${N}): median ${f(air.medianUs)} µs  p99 ${f(air.p99Us)} µs  (goal median < 5 µs) ${air.medianUs < 5 ? "OK" : "MISSED"}`);
console.log(`common vent (${N}): median ${f(common.medianUs)} µs  p99 ${f(common.p99Us)} µs  (goal median < 50 µs) ${common.medianUs < 50 ? "OK" : "MISSED"}`);
console.log("written bench/results/venting.json");
