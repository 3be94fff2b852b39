// The zod-free parts of the engine only: this module runs in the rulebook editor's bundle.
import { optionLabel, parameterLabel } from "../venting/rulebook/labels";
import { RULEBOOK_TABLES, type ColumnDefinition, type RulebookTableKey } from "../venting/rulebook/table-definitions";

/**
 * What importing a CSV file would change in one rulebook table, worked out before anything is
 * applied, so the person importing sees every added, changed and removed row first. Rows are
 * matched by the table's `uniqueBy` columns (the same columns that make two rows duplicates).
 */

type Row = Readonly<Record<string, unknown>>;

/** One cell whose value the import changes. */
export interface CellChange {
  readonly column: string;
  readonly before: unknown;
  readonly after: unknown;
}

/** A row present only in the imported file. */
export interface AddedRow {
  readonly key: string;
  /** 0-based position among the imported rows. */
  readonly afterIndex: number;
  readonly row: Row;
}

/** A row present only in the current table. */
export interface RemovedRow {
  readonly key: string;
  /** 0-based position in the current table. */
  readonly beforeIndex: number;
  readonly row: Row;
}

/** A row in both, with at least one cell changed. */
export interface ChangedRow {
  readonly key: string;
  readonly beforeIndex: number;
  readonly afterIndex: number;
  readonly changes: readonly CellChange[];
}

/** A key held by more than one row on one side; its rows are paired in order. */
export interface DuplicateKey {
  readonly side: "current" | "imported";
  readonly key: string;
  readonly count: number;
}

/** A text cell of an imported row that a spreadsheet would read as a formula. */
export interface FormulaLikeCell {
  readonly afterIndex: number;
  readonly column: string;
  readonly value: string;
}

/** Result of {@link diffTableRows}. */
export interface TableDiff {
  readonly added: readonly AddedRow[];
  readonly changed: readonly ChangedRow[];
  readonly removed: readonly RemovedRow[];
  readonly unchangedCount: number;
  /** True when rows found on both sides come in a different order. */
  readonly orderChanged: boolean;
  readonly duplicateKeys: readonly DuplicateKey[];
  readonly formulaLikeCells: readonly FormulaLikeCell[];
}

// A cell starting with one of these is run as a formula if the file is opened in a spreadsheet.
const FORMULA_START = /^[=+\-@\t\r]/;

/** Brings a cell to the form an import produces, so "6" typed in the grid equals 6 from a file. */
function normaliseCell(column: ColumnDefinition, value: unknown): unknown {
  if (value === undefined || value === null) return column.kind === "text" ? "" : null;
  if (column.kind === "number" && typeof value === "string") {
    if (value.trim() === "") return null;
    const n = Number(value.replace(",", "."));
    return Number.isFinite(n) ? n : value;
  }
  if (column.kind === "boolean" && typeof value !== "boolean") return Boolean(value);
  return value;
}

function sameCell(column: ColumnDefinition, a: unknown, b: unknown): boolean {
  return Object.is(normaliseCell(column, a), normaliseCell(column, b));
}

/** Identity of a row: its `uniqueBy` cells, normalised. */
function rowIdentity(columns: readonly ColumnDefinition[], uniqueBy: readonly string[], row: Row): string {
  return JSON.stringify(uniqueBy.map((key) => {
    const column = columns.find((c) => c.key === key);
    return column ? normaliseCell(column, row[key]) : row[key] ?? null;
  }));
}

/**
 * A cell as a person reads it: options by their human name, numbers with their unit, yes/no
 * for flags, and "(empty)" rather than nothing.
 */
export function formatCell(table: RulebookTableKey, columnKey: string, value: unknown): string {
  const column = (RULEBOOK_TABLES[table].columns as readonly ColumnDefinition[]).find((c) => c.key === columnKey);
  if (value === null || value === undefined || value === "") return "(empty)";
  if (!column) return String(value);
  switch (column.kind) {
    case "boolean":
      return value ? "Yes" : "No";
    case "enum":
      return table === "parameters" && column.key === "key" ? parameterLabel(String(value)) : optionLabel(String(value));
    case "number":
      return typeof value === "number" ? `${value.toLocaleString("en-US", { maximumFractionDigits: 6 })}${column.unit ? ` ${column.unit}` : ""}` : String(value);
    case "text":
      return String(value);
    default:
      column.kind satisfies never;
      return String(value);
  }
}

/** A row's `uniqueBy` cells as a person reads them, e.g. "Single-wall · Listed". */
export function describeRowKey(table: RulebookTableKey, row: Row): string {
  return RULEBOOK_TABLES[table].uniqueBy.map((key) => formatCell(table, key, row[key])).join(" · ");
}

/**
 * Compares the rows of one table now (`current`) with the rows an import would put in their
 * place (`imported`). Rows are matched by the table's `uniqueBy` columns; when a key appears
 * more than once on a side, its rows are paired in order and the duplicate is reported.
 */
export function diffTableRows(table: RulebookTableKey, current: readonly Row[], imported: readonly Row[]): TableDiff {
  const definition = RULEBOOK_TABLES[table];
  const columns: readonly ColumnDefinition[] = definition.columns;
  const uniqueBy: readonly string[] = definition.uniqueBy;

  const currentByKey = new Map<string, number[]>();
  current.forEach((row, index) => {
    const id = rowIdentity(columns, uniqueBy, row);
    currentByKey.set(id, [...(currentByKey.get(id) ?? []), index]);
  });
  const importedCount = new Map<string, number>();
  const matchedCurrent = new Set<number>();

  const added: AddedRow[] = [];
  const changed: ChangedRow[] = [];
  const pairs: { beforeIndex: number; afterIndex: number }[] = [];
  let unchangedCount = 0;

  imported.forEach((row, afterIndex) => {
    const id = rowIdentity(columns, uniqueBy, row);
    const occurrence = importedCount.get(id) ?? 0;
    importedCount.set(id, occurrence + 1);
    const beforeIndex = currentByKey.get(id)?.[occurrence];
    const key = describeRowKey(table, row);
    if (beforeIndex === undefined) {
      added.push({ key, afterIndex, row });
      return;
    }
    matchedCurrent.add(beforeIndex);
    pairs.push({ beforeIndex, afterIndex });
    const before = current[beforeIndex]!;
    const changes = columns
      .filter((column) => !sameCell(column, before[column.key], row[column.key]))
      .map((column) => ({ column: column.key, before: normaliseCell(column, before[column.key]), after: normaliseCell(column, row[column.key]) }));
    if (changes.length === 0) unchangedCount++;
    else changed.push({ key, beforeIndex, afterIndex, changes });
  });

  const removed: RemovedRow[] = current
    .map((row, beforeIndex) => ({ row, beforeIndex }))
    .filter(({ beforeIndex }) => !matchedCurrent.has(beforeIndex))
    .map(({ row, beforeIndex }) => ({ key: describeRowKey(table, row), beforeIndex, row }));

  // Pairs are in imported order; the order changed when their current positions do not rise.
  const orderChanged = pairs.some((pair, i) => i > 0 && pair.beforeIndex < pairs[i - 1]!.beforeIndex);

  const duplicateKeys: DuplicateKey[] = [];
  const describeId = (side: "current" | "imported", rows: readonly Row[], counts: Map<string, number>) => {
    for (const [id, count] of counts) {
      if (count < 2) continue;
      const example = rows.find((r) => rowIdentity(columns, uniqueBy, r) === id)!;
      duplicateKeys.push({ side, key: describeRowKey(table, example), count });
    }
  };
  describeId("current", current, new Map([...currentByKey].map(([id, list]) => [id, list.length])));
  describeId("imported", imported, importedCount);

  const formulaLikeCells: FormulaLikeCell[] = [];
  imported.forEach((row, afterIndex) => {
    for (const column of columns) {
      const value = row[column.key];
      if (column.kind === "text" && typeof value === "string" && FORMULA_START.test(value)) formulaLikeCells.push({ afterIndex, column: column.key, value });
    }
  });

  return { added, changed, removed, unchangedCount, orderChanged, duplicateKeys, formulaLikeCells };
}

/** True when applying the import would change nothing at all, order included. */
export function isEmptyDiff(diff: TableDiff): boolean {
  return diff.added.length === 0 && diff.changed.length === 0 && diff.removed.length === 0 && !diff.orderChanged;
}
