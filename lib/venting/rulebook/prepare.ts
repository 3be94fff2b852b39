import type { ConnectorMaterial, RatedLouverType, ApplianceKind, ReturnAirSpace } from "../enums";
import type { ParameterKey } from "./parameters";
import {
  rulebookContentSchema,
  type RulebookContent,
  type RulebookRow,
  type RulebookTableKey,
  type TerminationHeightRow,
} from "./tables";
import type { RulebookIssue } from "./validate";
import { validateRulebookContent } from "./validate-content";

/** Where in the rulebook a value came from. */
export interface RuleRef {
  readonly table: RulebookTableKey;
  readonly rowIndex: number;
}

/** A rulebook value with its citation and location. */
export interface Cited<T> {
  readonly value: T;
  readonly citation: string;
  readonly ref: RuleRef;
}

/** A rulebook row with its index. */
export interface IndexedRow<K extends RulebookTableKey> {
  readonly row: RulebookRow<K>;
  readonly ref: RuleRef;
}

/** The tables read as two-way grids: single-appliance (height × lateral) and connector (height × rise). */
export type GridTableKey = "capacity" | "ventConnectorCapacity";

/** One diameter's capacity grid for a vent/connector material pair. */
export interface CapacityGrid<K extends GridTableKey = "capacity"> {
  readonly diameterIn: number;
  /** Heights present, ascending. */
  readonly heightsFt: readonly number[];
  /** Values of the second axis present, ascending: laterals (single appliance) or connector rises. */
  readonly secondAxisFt: readonly number[];
  /** Cells keyed `${heightFt}|${secondAxisFt}`. */
  readonly cells: ReadonlyMap<string, IndexedRow<K>>;
}

/** One diameter's column of the common vent table for a vent/connector material pair. */
export interface CommonVentGrid {
  readonly diameterIn: number;
  /** Heights present, ascending. */
  readonly heightsFt: readonly number[];
  /** Cells keyed by height. */
  readonly cells: ReadonlyMap<number, IndexedRow<"commonVentCapacity">>;
}

/** A rulebook indexed once for fast evaluation. Create with {@link prepareRulebook}. */
export interface PreparedRulebook {
  readonly content: RulebookContent;
  /** Validation problems; evaluation still runs, using what is there. */
  readonly issues: readonly RulebookIssue[];
  readonly params: ReadonlyMap<ParameterKey, Cited<number>>;
  readonly connectorShare: ReadonlyMap<ConnectorMaterial, Cited<number>>;
  /** Keyed `${pipeMaterial}|${applianceListing}`. */
  readonly clearances: ReadonlyMap<string, Cited<number>>;
  /** Keyed `${material}|${orientation}`. */
  readonly supportSpacing: ReadonlyMap<string, Cited<number>>;
  readonly fasteners: ReadonlyMap<ConnectorMaterial, Cited<number>>;
  /** Keyed `${material}|${passage}`. */
  readonly passages: ReadonlyMap<string, IndexedRow<"prohibitedPassages">>;
  /** Rows sorted by pitch. */
  readonly terminationHeights: readonly IndexedRow<"terminationHeights">[];
  readonly terminationDistances: readonly IndexedRow<"terminationDistances">[];
  /** Keyed `${ventMaterial}|${connectorMaterial}`, grids sorted by diameter. */
  readonly capacity: ReadonlyMap<string, readonly CapacityGrid[]>;
  /** Multiple-appliance connector tables, keyed `${ventMaterial}|${connectorMaterial}`, grids sorted by diameter. */
  readonly ventConnectorCapacity: ReadonlyMap<string, readonly CapacityGrid<"ventConnectorCapacity">[]>;
  /** Multiple-appliance common vent tables, keyed `${ventMaterial}|${connectorMaterial}`, sorted by diameter. */
  readonly commonVentCapacity: ReadonlyMap<string, readonly CommonVentGrid[]>;
  readonly louverShares: ReadonlyMap<RatedLouverType, Cited<number>>;
  readonly flueCoLimits: ReadonlyMap<ApplianceKind, Cited<number>>;
  /** Where return air may be drawn from, by space. */
  readonly returnAirSpaces: ReadonlyMap<ReturnAirSpace, IndexedRow<"returnAirSpaces">>;
}

/** Thrown by {@link prepareRulebook} when the content does not have the rulebook's structure. */
export class RulebookInvalidError extends Error {
  readonly issues: readonly RulebookIssue[];
  constructor(issues: readonly RulebookIssue[]) {
    super(`The rulebook cannot be used: ${issues[0]?.message ?? "its structure is invalid"}`);
    this.name = "RulebookInvalidError";
    this.issues = issues;
  }
}

const cache = new WeakMap<object, PreparedRulebook>();

function cited<K extends RulebookTableKey>(table: K, rowIndex: number, value: number, citation: string): Cited<number> {
  return { value, citation, ref: { table, rowIndex } };
}

function buildGrids<K extends GridTableKey>(table: K, rows: readonly RulebookRow<K>[], second: (row: RulebookRow<K>) => number): Map<string, CapacityGrid<K>[]> {
  const byPair = new Map<string, Map<number, { heights: Set<number>; seconds: Set<number>; cells: Map<string, IndexedRow<K>> }>>();
  rows.forEach((row, rowIndex) => {
    const pair = `${row.ventMaterial}|${row.connectorMaterial}`;
    let diams = byPair.get(pair);
    if (!diams) byPair.set(pair, (diams = new Map()));
    let g = diams.get(row.diameterIn);
    if (!g) diams.set(row.diameterIn, (g = { heights: new Set(), seconds: new Set(), cells: new Map() }));
    const s2 = second(row);
    g.heights.add(row.heightFt);
    g.seconds.add(s2);
    g.cells.set(`${row.heightFt}|${s2}`, { row, ref: { table, rowIndex } });
  });
  const out = new Map<string, CapacityGrid<K>[]>();
  for (const [pair, diams] of byPair) {
    const grids: CapacityGrid<K>[] = [];
    for (const [diameterIn, g] of diams) {
      grids.push({
        diameterIn,
        heightsFt: [...g.heights].sort((a, b) => a - b),
        secondAxisFt: [...g.seconds].sort((a, b) => a - b),
        cells: g.cells,
      });
    }
    grids.sort((a, b) => a.diameterIn - b.diameterIn);
    out.set(pair, grids);
  }
  return out;
}

function buildCommonVent(rows: readonly RulebookRow<"commonVentCapacity">[]): Map<string, CommonVentGrid[]> {
  const byPair = new Map<string, Map<number, Map<number, IndexedRow<"commonVentCapacity">>>>();
  rows.forEach((row, rowIndex) => {
    const pair = `${row.ventMaterial}|${row.connectorMaterial}`;
    let diams = byPair.get(pair);
    if (!diams) byPair.set(pair, (diams = new Map()));
    let cells = diams.get(row.diameterIn);
    if (!cells) diams.set(row.diameterIn, (cells = new Map()));
    cells.set(row.heightFt, { row, ref: { table: "commonVentCapacity", rowIndex } });
  });
  const out = new Map<string, CommonVentGrid[]>();
  for (const [pair, diams] of byPair) {
    const grids: CommonVentGrid[] = [...diams].map(([diameterIn, cells]) => ({ diameterIn, heightsFt: [...cells.keys()].sort((a, b) => a - b), cells }));
    grids.sort((a, b) => a.diameterIn - b.diameterIn);
    out.set(pair, grids);
  }
  return out;
}

/**
 * Parses and indexes rulebook content once so that evaluators do no parsing per call.
 * The result is memoised per content object. Throws {@link RulebookInvalidError} when the
 * content does not match {@link rulebookContentSchema}; value problems (see
 * `validateRulebookContent`) are kept in `issues` and do not stop evaluation.
 */
export function prepareRulebook(content: unknown): PreparedRulebook {
  if (typeof content === "object" && content !== null) {
    const hit = cache.get(content);
    if (hit) return hit;
  }
  const parsed = rulebookContentSchema.safeParse(content);
  if (!parsed.success) throw new RulebookInvalidError(validateRulebookContent(content));
  const c = parsed.data;
  const issues = validateRulebookContent(c);

  const params = new Map<ParameterKey, Cited<number>>();
  c.parameters.forEach((p, i) => {
    if (!params.has(p.key)) params.set(p.key, cited("parameters", i, p.value, p.citation));
  });
  const connectorShare = new Map<ConnectorMaterial, Cited<number>>();
  c.connectorLengthShare.forEach((r, i) => connectorShare.set(r.connectorMaterial, cited("connectorLengthShare", i, r.shareOfVentHeight, r.citation)));
  const clearances = new Map<string, Cited<number>>();
  c.clearances.forEach((r, i) => clearances.set(`${r.pipeMaterial}|${r.applianceListing}`, cited("clearances", i, r.clearanceIn, r.citation)));
  const supportSpacing = new Map<string, Cited<number>>();
  c.supportSpacing.forEach((r, i) => supportSpacing.set(`${r.material}|${r.orientation}`, cited("supportSpacing", i, r.maxSpacingFt, r.citation)));
  const fasteners = new Map<ConnectorMaterial, Cited<number>>();
  c.fasteners.forEach((r, i) => fasteners.set(r.material, cited("fasteners", i, r.minPerJoint, r.citation)));
  const passages = new Map<string, IndexedRow<"prohibitedPassages">>();
  c.prohibitedPassages.forEach((row, rowIndex) => passages.set(`${row.material}|${row.passage}`, { row, ref: { table: "prohibitedPassages", rowIndex } }));
  const terminationHeights = c.terminationHeights
    .map((row: TerminationHeightRow, rowIndex) => ({ row, ref: { table: "terminationHeights" as const, rowIndex } }))
    .sort((a, b) => a.row.pitchFromPer12 - b.row.pitchFromPer12);
  const terminationDistances = c.terminationDistances.map((row, rowIndex) => ({ row, ref: { table: "terminationDistances" as const, rowIndex } }));
  const louverShares = new Map<RatedLouverType, Cited<number>>();
  c.louverShares.forEach((r, i) => louverShares.set(r.louver, cited("louverShares", i, r.freeAreaShare, r.citation)));
  const flueCoLimits = new Map<ApplianceKind, Cited<number>>();
  c.flueCoLimits.forEach((r, i) => flueCoLimits.set(r.applianceKind, cited("flueCoLimits", i, r.maxAirFreeCoPpm, r.citation)));
  const returnAirSpaces = new Map<ReturnAirSpace, IndexedRow<"returnAirSpaces">>();
  c.returnAirSpaces.forEach((row, rowIndex) => returnAirSpaces.set(row.space, { row, ref: { table: "returnAirSpaces", rowIndex } }));

  const prepared: PreparedRulebook = {
    content: c,
    issues,
    params,
    connectorShare,
    clearances,
    supportSpacing,
    fasteners,
    passages,
    terminationHeights,
    terminationDistances,
    capacity: buildGrids("capacity", c.capacity, (r) => r.lateralFt),
    ventConnectorCapacity: buildGrids("ventConnectorCapacity", c.ventConnectorCapacity, (r) => r.riseFt),
    commonVentCapacity: buildCommonVent(c.commonVentCapacity),
    louverShares,
    flueCoLimits,
    returnAirSpaces,
  };
  if (typeof content === "object" && content !== null) cache.set(content, prepared);
  return prepared;
}
