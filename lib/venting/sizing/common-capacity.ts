import { atMost } from "../compare";
import type { ConnectorMaterial, VentMaterial } from "../enums";
import type { Appliance, VentRun } from "../inputs";
import type { CapacityGrid, CommonVentGrid, PreparedRulebook, RuleRef } from "../rulebook/prepare";
import { extraTurns, fits, lerp, limitsFor, lookupInGrid, type CapacityLimits, type CapacityLookup } from "./capacity";

/**
 * Multiple-appliance venting (two or more Category I appliances on one vent): each connector is
 * read from the connector table at the total vent height H and its rise R, the common vent from
 * the common-vent table at H, in the column the appliances' draft types choose. Every adjustment
 * comes from a rulebook value with its citation. Pure: the checks turn these answers into findings.
 */

/** Column of the common-vent table, chosen from the draft types of the appliances. */
export type CommonVentColumn = "fan_fan" | "fan_nat" | "nat_nat";

/** Row field of each column. */
export const COMMON_COLUMN_FIELD = {
  fan_fan: "fanFanMaxBtuh",
  fan_nat: "fanNatMaxBtuh",
  nat_nat: "natNatMaxBtuh",
} as const satisfies Record<CommonVentColumn, string>;

/** The column for a set of appliances: all fan-assisted, all natural draft, or a mix. */
export function commonVentColumn(drafts: readonly ("natural" | "fan_assisted")[]): CommonVentColumn {
  const fan = drafts.filter((d) => d === "fan_assisted").length;
  if (fan === drafts.length) return "fan_fan";
  if (fan === 0) return "nat_nat";
  return "fan_nat";
}

/** What the tables need of one appliance's connector, measured as the code measures it. */
export interface ConnectorProfile {
  readonly material: ConnectorMaterial;
  /** Smallest diameter along the connector, in. */
  readonly diameterIn: number;
  /** Rise R from the outlet to where the gases join the common vent: vertical lengths plus the rise of horizontal pieces, ft. */
  readonly riseFt: number;
  /** Horizontal length (the length the tables' per-inch-of-diameter limit is measured on), ft. */
  readonly horizontalFt: number;
  readonly turns45: number;
  readonly turns90: number;
}

/** Rulebook values the connector sizing uses, already read (with what to say when one is missing). */
export interface ConnectorRules {
  readonly interpolate: boolean;
  readonly assumed90: number;
  readonly lossPer45Pct: number;
  readonly lossPer90Pct: number;
  /** Horizontal length the tables assume per inch of connector diameter, ft/in. */
  readonly lengthFtPerIn: number;
  /** Loss of the connector's maximum for each extra multiple of that length, %. */
  readonly lengthLossPct: number;
}

/** The connector's limits at one diameter. */
export interface ConnectorLimits extends CapacityLimits {
  readonly diameterIn: number;
  /** Reduction of the maximum for extra turns and extra length, %. */
  readonly deratePct: number;
  readonly turnsLossPct: number;
  readonly lengthLossPct: number;
  /** Horizontal length the tables assume for this diameter, ft. */
  readonly assumedLengthFt: number;
  /** The fan-assisted minimum came from the single-appliance table (connector longer than assumed). */
  readonly minFromSingleTable: boolean;
  readonly interpolated: boolean;
  readonly conservative: boolean;
  readonly citation: string;
  readonly ref: RuleRef;
}

/** Why a connector or common-vent reading gave no limits. */
export type TableMiss =
  | { readonly reason: "no_table" }
  | { readonly reason: "height_outside"; readonly minFt: number; readonly maxFt: number }
  | { readonly reason: "second_outside"; readonly minFt: number; readonly maxFt: number }
  | { readonly reason: "missing_row"; readonly heightFt: number; readonly secondFt: number }
  | { readonly reason: "min_outside_single_table" };

/** Result of reading a connector's limits. */
export type ConnectorReading = ({ readonly ok: true } & ConnectorLimits) | ({ readonly ok: false } & TableMiss);

/**
 * Capacity loss for a connector longer than the assumed horizontal length: one loss step for each
 * started multiple of the assumed length beyond the first (6 ft assumed: over 6 up to 12 ft is one
 * step). Zero within the assumed length.
 */
export function lengthMultipleLossPct(horizontalFt: number, assumedFt: number, lossPerMultiplePct: number): number {
  if (assumedFt <= 0 || atMost(horizontalFt, assumedFt)) return 0;
  const extraMultiples = Math.ceil(horizontalFt / assumedFt - 1e-9) - 1;
  return Math.min(100, extraMultiples * lossPerMultiplePct);
}

function readConnectorAt(
  rb: PreparedRulebook,
  ventMaterial: VentMaterial,
  c: ConnectorProfile,
  grid: CapacityGrid<"ventConnectorCapacity">,
  heightFt: number,
  fanAssisted: boolean,
  rules: ConnectorRules,
): ConnectorReading {
  const diameterIn = grid.diameterIn;
  const look: CapacityLookup = lookupInGrid(grid, heightFt, c.riseFt, rules.interpolate);
  if (!look.ok) return look;
  const { extra45, extra90 } = extraTurns({ turns45: c.turns45, turns90: c.turns90, hasLateral: true }, { assumed90WithLateral: rules.assumed90, lossPer45Pct: rules.lossPer45Pct, lossPer90Pct: rules.lossPer90Pct });
  const turnsLossPct = extra45 * rules.lossPer45Pct + extra90 * rules.lossPer90Pct;
  const assumedLengthFt = rules.lengthFtPerIn * diameterIn;
  const lengthLossPct = lengthMultipleLossPct(c.horizontalFt, assumedLengthFt, rules.lengthLossPct);
  const derate = Math.min(100, turnsLossPct + lengthLossPct);
  let limits = limitsFor(look, fanAssisted, derate);
  let minFromSingleTable = false;
  let citation = look.citation;
  if (fanAssisted && lengthLossPct > 0) {
    // A connector longer than the tables assume takes its fan-assisted minimum from the
    // single-appliance table, read at its own diameter with its horizontal length as the lateral.
    const single = rb.capacity.get(`${ventMaterial}|${c.material}`)?.find((g) => g.diameterIn === diameterIn);
    const s = single ? lookupInGrid(single, heightFt, c.horizontalFt, rules.interpolate) : null;
    if (!s || !s.ok) return { ok: false, reason: "min_outside_single_table" };
    limits = { minBtuh: s.fanMinBtuh, maxBtuh: limits.maxBtuh };
    minFromSingleTable = true;
    if (!citation.includes(s.citation)) citation += `; ${s.citation}`;
  }
  return {
    ok: true,
    ...limits,
    diameterIn,
    deratePct: derate,
    turnsLossPct,
    lengthLossPct,
    assumedLengthFt,
    minFromSingleTable,
    interpolated: look.interpolated,
    conservative: look.conservative,
    citation,
    ref: look.ref,
  };
}

/** Reads one connector's limits at its own diameter. */
export function connectorLimits(
  rb: PreparedRulebook,
  ventMaterial: VentMaterial,
  c: ConnectorProfile,
  heightFt: number,
  fanAssisted: boolean,
  rules: ConnectorRules,
): ConnectorReading {
  const grid = rb.ventConnectorCapacity.get(`${ventMaterial}|${c.material}`)?.find((g) => g.diameterIn === c.diameterIn);
  if (!grid) return { ok: false, reason: "no_table" };
  return readConnectorAt(rb, ventMaterial, c, grid, heightFt, fanAssisted, rules);
}

/**
 * The smallest connector diameter in the company's connector table, not below `atLeastIn` (the
 * appliance's outlet), whose limits hold the input at this height and rise, with the same turns
 * and horizontal length (the allowed length grows with the diameter). Null when none fits.
 */
export function smallestConnectorDiameter(
  rb: PreparedRulebook,
  ventMaterial: VentMaterial,
  c: ConnectorProfile,
  heightFt: number,
  inputBtuh: number,
  fanAssisted: boolean,
  rules: ConnectorRules,
  atLeastIn = 0,
): number | null {
  const grids = rb.ventConnectorCapacity.get(`${ventMaterial}|${c.material}`);
  if (!grids) return null;
  for (const g of grids) {
    if (g.diameterIn < atLeastIn) continue;
    const r = readConnectorAt(rb, ventMaterial, c, g, heightFt, fanAssisted, rules);
    if (r.ok && fits(inputBtuh, r)) return g.diameterIn;
  }
  return null;
}

/** The common vent's maximum at one diameter, before and after the code's reductions. */
export interface CommonVentLimit {
  readonly diameterIn: number;
  /** Table value, null when the table gives none for this column (size not permitted). */
  readonly tableMaxBtuh: number | null;
  readonly maxBtuh: number | null;
  readonly deratePct: number;
  readonly interpolated: boolean;
  readonly conservative: boolean;
  readonly citation: string;
  readonly ref: RuleRef;
}

/** Result of reading the common-vent table. */
export type CommonVentReading = ({ readonly ok: true } & CommonVentLimit) | ({ readonly ok: false } & TableMiss);

/** Reductions of the common vent's maximum, in percent, already summed from their rules. */
export interface CommonVentDerate {
  readonly pct: number;
}

function readCommonGrid(grid: CommonVentGrid, heightFt: number, column: CommonVentColumn, interpolate: boolean, deratePct: number): CommonVentReading {
  const hs = grid.heightsFt;
  if (hs.length === 0 || heightFt < hs[0]! - 1e-9 || heightFt > hs[hs.length - 1]! + 1e-9) {
    return { ok: false, reason: "height_outside", minFt: hs[0] ?? 0, maxFt: hs[hs.length - 1] ?? 0 };
  }
  let lo = hs[0]!;
  let hi = hs[hs.length - 1]!;
  for (const h of hs) {
    if (h <= heightFt + 1e-9) lo = h;
    if (h >= heightFt - 1e-9) {
      hi = h;
      break;
    }
  }
  const a = grid.cells.get(lo)!;
  const b = grid.cells.get(hi)!;
  const field = COMMON_COLUMN_FIELD[column];
  const va = a.row[field];
  const vb = b.row[field];
  const between = lo !== hi;
  const citation = a.row.citation === b.row.citation ? a.row.citation : `${a.row.citation}; ${b.row.citation}`;
  const base = { diameterIn: grid.diameterIn, deratePct, interpolated: between && interpolate, conservative: between && !interpolate, citation, ref: a.ref };
  if (va === null || vb === null) return { ok: true, ...base, tableMaxBtuh: null, maxBtuh: null };
  // Capacity grows with height: between rows the conservative value is the lower row's.
  const tableMax = !between ? va : interpolate ? lerp(va, vb, (heightFt - lo) / (hi - lo)) : Math.min(va, vb);
  return { ok: true, ...base, tableMaxBtuh: tableMax, maxBtuh: tableMax * (1 - deratePct / 100) };
}

/** Reads the common-vent table at a diameter and height, for a column, with the reductions applied. */
export function commonVentLimit(
  rb: PreparedRulebook,
  ventMaterial: VentMaterial,
  connectorMaterial: ConnectorMaterial,
  diameterIn: number,
  heightFt: number,
  column: CommonVentColumn,
  interpolate: boolean,
  deratePct: number,
): CommonVentReading {
  const grid = rb.commonVentCapacity.get(`${ventMaterial}|${connectorMaterial}`)?.find((g) => g.diameterIn === diameterIn);
  if (!grid) return { ok: false, reason: "no_table" };
  return readCommonGrid(grid, heightFt, column, interpolate, deratePct);
}

/** The smallest common-vent diameter, not below `atLeastIn`, whose reduced maximum holds the combined input. */
export function smallestCommonVentDiameter(
  rb: PreparedRulebook,
  ventMaterial: VentMaterial,
  connectorMaterial: ConnectorMaterial,
  heightFt: number,
  column: CommonVentColumn,
  interpolate: boolean,
  deratePct: number,
  totalInputBtuh: number,
  atLeastIn = 0,
): number | null {
  const grids = rb.commonVentCapacity.get(`${ventMaterial}|${connectorMaterial}`);
  if (!grids) return null;
  for (const g of grids) {
    if (g.diameterIn < atLeastIn) continue;
    const r = readCommonGrid(g, heightFt, column, interpolate, deratePct);
    if (r.ok && r.maxBtuh !== null && atMost(totalInputBtuh, r.maxBtuh)) return g.diameterIn;
  }
  return null;
}

/** The connector material the common-vent table is read for: single-wall when any connector is. */
export function commonConnectorMaterial(materials: readonly ConnectorMaterial[]): ConnectorMaterial {
  return materials.includes("single_wall") ? "single_wall" : "type_b";
}

/** Turn counts of the common vent itself (every turn there reduces its capacity). */
export function commonVentTurns(run: VentRun): { turns45: number; turns90: number } {
  return { turns45: run.vent.turns45 ?? 0, turns90: run.vent.turns90 ?? 0 };
}

/** Draft types the tables know, or null for an appliance that is neither natural nor fan-assisted. */
export function tableDraft(a: Appliance): "natural" | "fan_assisted" | null {
  return a.draft === "natural" || a.draft === "fan_assisted" ? a.draft : null;
}
