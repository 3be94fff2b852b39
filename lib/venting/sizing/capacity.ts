import { atLeast, atMost } from "../compare";
import type { ConnectorMaterial, VentMaterial } from "../enums";
import type { CapacityGrid, GridTableKey, IndexedRow, PreparedRulebook, RuleRef } from "../rulebook/prepare";

/** What to look up in the capacity table. */
export interface CapacityQuery {
  readonly ventMaterial: VentMaterial;
  readonly connectorMaterial: ConnectorMaterial;
  readonly diameterIn: number;
  /** Total vent height from the collar or draft hood to the top, ft. */
  readonly heightFt: number;
  /** Total lateral (horizontal connector plus vent offsets), ft. */
  readonly lateralFt: number;
}

/** Capacity values at one point of the table (before derating). */
export interface CapacityValues {
  readonly fanMinBtuh: number | null;
  readonly fanMaxBtuh: number | null;
  readonly naturalMaxBtuh: number | null;
  /** True when the point lies between rows and the values were interpolated. */
  readonly interpolated: boolean;
  /** True when the point lies between rows and conservative row values were used instead. */
  readonly conservative: boolean;
  readonly citation: string;
  readonly ref: RuleRef;
}

/** Why a lookup gave no values. */
export type CapacityMiss =
  | { readonly reason: "no_table" }
  | { readonly reason: "height_outside"; readonly minFt: number; readonly maxFt: number }
  /** Outside the second axis: the lateral (single-appliance table) or the connector rise (connector table). */
  | { readonly reason: "second_outside"; readonly minFt: number; readonly maxFt: number }
  | { readonly reason: "missing_row"; readonly heightFt: number; readonly secondFt: number };

/** Result of {@link lookupCapacity}. */
export type CapacityLookup = ({ readonly ok: true } & CapacityValues) | ({ readonly ok: false } & CapacityMiss);

/** Index of the bracketing pair `[lo, hi]` of `x` in an ascending list, or null outside it. */
function bracket(xs: readonly number[], x: number): [number, number] | null {
  const n = xs.length;
  if (n === 0) return null;
  if (x < xs[0]! - 1e-9 || x > xs[n - 1]! + 1e-9) return null;
  for (let i = 0; i < n; i++) {
    const v = xs[i]!;
    if (Math.abs(v - x) <= 1e-9) return [i, i];
    if (v > x) return [i - 1, i];
  }
  return [n - 1, n - 1];
}

type Field = "fanMinBtuh" | "fanMaxBtuh" | "naturalMaxBtuh";

/**
 * Linear interpolation between two table values at fraction `t` (0 → a, 1 → b).
 * Exposed so that its bounds can be tested: the result always lies between a and b.
 */
export function lerp(a: number, b: number, t: number): number {
  return a + (b - a) * t;
}

function combine<K extends GridTableKey>(
  corners: readonly IndexedRow<K>[],
  field: Field,
  t: number,
  u: number,
  interpolate: boolean,
): number | null {
  const [c00, c10, c01, c11] = corners as [IndexedRow<K>, IndexedRow<K>, IndexedRow<K>, IndexedRow<K>];
  const v00 = c00.row[field];
  const v10 = c10.row[field];
  const v01 = c01.row[field];
  const v11 = c11.row[field];
  if (v00 === null || v10 === null || v01 === null || v11 === null) return null;
  if (interpolate) return lerp(lerp(v00, v10, t), lerp(v01, v11, t), u);
  // Conservative: the highest minimum and the lowest maximum of the surrounding rows.
  return field === "fanMinBtuh" ? Math.max(v00, v10, v01, v11) : Math.min(v00, v10, v01, v11);
}

/** Finds the grid of one diameter for a material pair. */
export function capacityGrid(rb: PreparedRulebook, ventMaterial: VentMaterial, connectorMaterial: ConnectorMaterial, diameterIn: number): CapacityGrid | undefined {
  const grids = rb.capacity.get(`${ventMaterial}|${connectorMaterial}`);
  if (!grids) return undefined;
  for (const g of grids) if (g.diameterIn === diameterIn) return g;
  return undefined;
}

/**
 * Reads the capacity table at a height and lateral. Between rows it interpolates (height, then
 * lateral) when `interpolate` is true, otherwise it takes the conservative rows. It never
 * extrapolates: a point outside the table's heights or laterals is a miss.
 */
export function lookupCapacity(rb: PreparedRulebook, q: CapacityQuery, interpolate: boolean): CapacityLookup {
  const grid = capacityGrid(rb, q.ventMaterial, q.connectorMaterial, q.diameterIn);
  if (!grid) return { ok: false, reason: "no_table" };
  return lookupInGrid(grid, q.heightFt, q.lateralFt, interpolate);
}

/**
 * {@link lookupCapacity} on a known grid: the single-appliance table (second axis: lateral) or a
 * multiple-appliance connector table (second axis: connector rise).
 */
export function lookupInGrid<K extends GridTableKey>(grid: CapacityGrid<K>, heightFt: number, secondFt: number, interpolate: boolean): CapacityLookup {
  const hs = grid.heightsFt;
  const ls = grid.secondAxisFt;
  const lateralFt = secondFt;
  const hb = bracket(hs, heightFt);
  if (!hb) return { ok: false, reason: "height_outside", minFt: hs[0] ?? 0, maxFt: hs[hs.length - 1] ?? 0 };
  const lb = bracket(ls, lateralFt);
  if (!lb) return { ok: false, reason: "second_outside", minFt: ls[0] ?? 0, maxFt: ls[ls.length - 1] ?? 0 };
  const h0 = hs[hb[0]]!;
  const h1 = hs[hb[1]]!;
  const l0 = ls[lb[0]]!;
  const l1 = ls[lb[1]]!;
  const corners: IndexedRow<K>[] = [];
  for (const [h, l] of [
    [h0, l0],
    [h1, l0],
    [h0, l1],
    [h1, l1],
  ] as const) {
    const c = grid.cells.get(`${h}|${l}`);
    if (!c) return { ok: false, reason: "missing_row", heightFt: h, secondFt: l };
    corners.push(c);
  }
  const t = h1 === h0 ? 0 : (heightFt - h0) / (h1 - h0);
  const u = l1 === l0 ? 0 : (lateralFt - l0) / (l1 - l0);
  const between = t !== 0 || u !== 0;
  const first = corners[0]!;
  let citation = first.row.citation;
  for (const c of corners) if (c.row.citation !== citation && !citation.includes(c.row.citation)) citation += `; ${c.row.citation}`;
  return {
    ok: true,
    fanMinBtuh: combine(corners, "fanMinBtuh", t, u, interpolate || !between),
    fanMaxBtuh: combine(corners, "fanMaxBtuh", t, u, interpolate || !between),
    naturalMaxBtuh: combine(corners, "naturalMaxBtuh", t, u, interpolate || !between),
    interpolated: between && interpolate,
    conservative: between && !interpolate,
    citation,
    ref: first.ref,
  };
}

/** Turns a run has, and the rulebook's derating rule. */
export interface TurnsInput {
  readonly turns45: number;
  readonly turns90: number;
  /** True when the run has a lateral (then the table already assumes some 90° turns). */
  readonly hasLateral: boolean;
}

/** Rulebook derating values. */
export interface DerateRule {
  readonly assumed90WithLateral: number;
  readonly lossPer45Pct: number;
  readonly lossPer90Pct: number;
}

/**
 * Turns beyond those the table assumes. With a lateral the table assumes `assumed90WithLateral`
 * turns of 90°; unused assumed turns absorb 45° turns. Without a lateral it assumes none.
 */
export function extraTurns(turns: TurnsInput, rule: DerateRule): { extra45: number; extra90: number } {
  const assumed = turns.hasLateral ? rule.assumed90WithLateral : 0;
  const extra90 = Math.max(0, turns.turns90 - assumed);
  const spare = Math.max(0, assumed - turns.turns90);
  const extra45 = Math.max(0, turns.turns45 - spare);
  return { extra45, extra90 };
}

/** Percentage by which the maximum capacity is reduced for extra turns (0–100). */
export function deratePct(turns: TurnsInput, rule: DerateRule): number {
  const { extra45, extra90 } = extraTurns(turns, rule);
  return Math.min(100, extra45 * rule.lossPer45Pct + extra90 * rule.lossPer90Pct);
}

/** Limits an appliance must fall within, after derating. */
export interface CapacityLimits {
  readonly minBtuh: number | null;
  /** Null when the table gives no value for this draft type (size not permitted). */
  readonly maxBtuh: number | null;
}

/** The limits that apply to an appliance of the given draft, with the maximum derated. */
export function limitsFor(values: CapacityValues, fanAssisted: boolean, derate: number): CapacityLimits {
  const factor = 1 - derate / 100;
  if (fanAssisted) {
    return { minBtuh: values.fanMinBtuh, maxBtuh: values.fanMaxBtuh === null ? null : values.fanMaxBtuh * factor };
  }
  return { minBtuh: null, maxBtuh: values.naturalMaxBtuh === null ? null : values.naturalMaxBtuh * factor };
}

/** Whether an input lies within the limits (a missing maximum never fits). */
export function fits(inputBtuh: number, limits: CapacityLimits): boolean {
  if (limits.maxBtuh === null) return false;
  if (limits.minBtuh !== null && !atLeast(inputBtuh, limits.minBtuh)) return false;
  return atMost(inputBtuh, limits.maxBtuh);
}

/** Smallest table diameter (not below `atLeastIn`) that fits an input. */
export interface SmallestDiameter {
  readonly diameterIn: number;
  readonly limits: CapacityLimits;
}

/**
 * The smallest diameter in the capacity table for which the input lies between the minimum and
 * the derated maximum at the given height and lateral; null when none fits or the point is
 * outside every grid.
 */
export function smallestFittingDiameter(
  rb: PreparedRulebook,
  q: Omit<CapacityQuery, "diameterIn">,
  inputBtuh: number,
  fanAssisted: boolean,
  derate: number,
  interpolate: boolean,
  atLeastIn = 0,
): SmallestDiameter | null {
  const grids = rb.capacity.get(`${q.ventMaterial}|${q.connectorMaterial}`);
  if (!grids) return null;
  for (const g of grids) {
    if (g.diameterIn < atLeastIn) continue;
    const v = lookupInGrid(g, q.heightFt, q.lateralFt, interpolate);
    if (!v.ok) continue;
    const limits = limitsFor(v, fanAssisted, derate);
    if (fits(inputBtuh, limits)) return { diameterIn: g.diameterIn, limits };
  }
  return null;
}
