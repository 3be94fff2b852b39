import { PARAMETER_DEFINITIONS, type ParameterDefinition } from "./parameters";
import { RULEBOOK_TABLES, RULEBOOK_TABLE_KEYS, type ColumnDefinition, type RulebookTableKey } from "./table-definitions";
import type { RulebookContent } from "./tables";

/*
 * Validation is written against the column definitions rather than the zod row schemas, so the
 * rulebook editor can run it in the browser without shipping zod. A unit test holds the two
 * together: content passes these shape checks exactly when `rulebookContentSchema` accepts it.
 */

/** One problem found in a rulebook, pointing at the table cell to fix. */
export interface RulebookIssue {
  /** Table key, or null for a top-level field such as `edition`. */
  readonly table: RulebookTableKey | null;
  /** Zero-based row index, or null for a table-level or top-level problem. */
  readonly rowIndex: number | null;
  /** Column key, or null when the whole row is concerned. */
  readonly column: string | null;
  /** Plain sentence saying what is wrong and how to fix it. */
  readonly message: string;
  /** Errors make the rulebook unusable for checks; warnings are worth a look. */
  readonly severity: "error" | "warning";
}

/** Message templates for rulebook validation. */
export const RULEBOOK_MESSAGES = {
  missingCitation: (row: number) =>
    `Row ${row}: add the citation (code section, manual page) this value comes from.`,
  negative: (row: number, label: string, value: number) =>
    `Row ${row}: ${label} is ${value}; it must not be negative.`,
  belowMin: (row: number, label: string, value: number, min: number) =>
    `Row ${row}: ${label} is ${value}; it must be at least ${min}.`,
  aboveMax: (row: number, label: string, value: number, max: number) =>
    `Row ${row}: ${label} is ${value}; it must be at most ${max}.`,
  shareOutOfRange: (row: number, label: string, value: number) =>
    `Row ${row}: ${label} is ${value}; a share is a number from 0 to 1 (75 % is 0.75).`,
  notWhole: (row: number, label: string, value: number) =>
    `Row ${row}: ${label} is ${value}; enter a whole number.`,
  duplicate: (row: number, firstRow: number, columns: string) =>
    `Row ${row} repeats row ${firstRow} (same ${columns}); remove one or change it.`,
  unitMismatch: (row: number, key: string, unit: string, expected: string) =>
    `Row ${row}: ${key} is measured in "${expected}", not "${unit}"; convert the value and set the unit to "${expected}".`,
  flagNotBinary: (row: number, key: string, value: number) =>
    `Row ${row}: ${key} is a yes/no flag; enter 1 for yes or 0 for no (found ${value}).`,
  pitchRange: (row: number, from: number, to: number) =>
    `Row ${row}: pitch to (${to}/12) must be above pitch from (${from}/12).`,
  pitchOrder: (row: number, prevRow: number) =>
    `Row ${row} starts below row ${prevRow}; sort the roof pitches from flat to steep.`,
  pitchGap: (row: number, from: number, prevRow: number, prevTo: number) =>
    `Row ${row} starts at ${from}/12 but row ${prevRow} ends at ${prevTo}/12; make each row start where the previous one ends.`,
  pitchHeightFalls: (row: number, prevRow: number) =>
    `Row ${row} asks for less height than row ${prevRow} on a steeper roof; check the values.`,
  firstPitchNotFlat: (from: number) =>
    `The first row starts at ${from}/12; start it at 0 so flat roofs are covered.`,
  capacityMinAboveMax: (row: number, min: number, max: number) =>
    `Row ${row}: fan-assisted min (${min} Btu/h) is above the fan-assisted max (${max} Btu/h); swap or correct them.`,
  capacityEmpty: (row: number) =>
    `Row ${row} has no capacity value at all; fill in at least one, or remove the row.`,
  capacityGridHole: (ventMaterial: string, connectorMaterial: string, diameterIn: number, heightFt: number, lateralFt: number) =>
    `The ${ventMaterial} vent / ${connectorMaterial} connector table at ${diameterIn} in has no row for height ${heightFt} ft with lateral ${lateralFt} ft; add it so values between rows can be interpolated.`,
  wrongType: (row: number, label: string, expected: string) =>
    `Row ${row}: ${label} must be ${expected}.`,
  badOption: (row: number, label: string, options: readonly string[]) =>
    `Row ${row}: ${label} must be one of ${options.join(", ")}.`,
  missingTable: (title: string) => `The table "${title}" is missing; add it (it may be empty).`,
  edition: () => "State the edition (code and year, or the company's own revision) this rulebook follows.",
  notARow: (row: number) => `Row ${row} is not a table row; give it one value per column.`,
} as const;

function columnOf(table: RulebookTableKey, key: string): ColumnDefinition | undefined {
  const cols: readonly ColumnDefinition[] = RULEBOOK_TABLES[table].columns;
  return cols.find((c) => c.key === key);
}

export function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === "object" && value !== null && !Array.isArray(value);
}

/** What a cell of this column must hold, or null when `value` fits. */
function cellProblem(col: ColumnDefinition, value: unknown, row: number): string | null {
  switch (col.kind) {
    case "number":
      if (typeof value === "number" && Number.isFinite(value)) return null;
      if (value === null && !col.required) return null;
      return RULEBOOK_MESSAGES.wrongType(row, col.label, col.required ? "a number" : "a number or empty");
    case "text":
      return typeof value === "string" ? null : RULEBOOK_MESSAGES.wrongType(row, col.label, "text");
    case "boolean":
      return typeof value === "boolean" ? null : RULEBOOK_MESSAGES.wrongType(row, col.label, "yes or no");
    case "enum":
      return typeof value === "string" && (col.options ?? []).includes(value) ? null : RULEBOOK_MESSAGES.badOption(row, col.label, col.options ?? []);
  }
}

/**
 * Tables a stored rulebook may lack because they were added after it was saved; such a version
 * reads them as empty (the schema's `.default([])`).
 */
const TABLES_ADDED_LATER: ReadonlySet<RulebookTableKey> = new Set<RulebookTableKey>(["returnAirSpaces"]);

/** Problems of type and shape: a missing table, a row that is not a row, a word where a number belongs. */
function checkShape(table: RulebookTableKey, rows: unknown): RulebookIssue[] {
  if (rows === undefined && TABLES_ADDED_LATER.has(table)) return [];
  if (!Array.isArray(rows)) {
    return [{ table, rowIndex: null, column: null, message: RULEBOOK_MESSAGES.missingTable(RULEBOOK_TABLES[table].title), severity: "error" }];
  }
  const cols: readonly ColumnDefinition[] = RULEBOOK_TABLES[table].columns;
  const out: RulebookIssue[] = [];
  rows.forEach((r: unknown, i) => {
    if (!isRecord(r)) {
      out.push({ table, rowIndex: i, column: null, message: RULEBOOK_MESSAGES.notARow(i + 1), severity: "error" });
      return;
    }
    for (const col of cols) {
      const message = cellProblem(col, r[col.key], i + 1);
      if (message) out.push({ table, rowIndex: i, column: col.key, message, severity: "error" });
    }
  });
  return out;
}

function rowKey(row: Record<string, unknown>, cols: readonly string[]): string {
  let k = "";
  for (const c of cols) k += `${String(row[c])}\u0000`;
  return k;
}

function checkColumns(table: RulebookTableKey, rows: readonly Record<string, unknown>[], out: RulebookIssue[]): void {
  const def = RULEBOOK_TABLES[table];
  const cols: readonly ColumnDefinition[] = def.columns;
  const seen = new Map<string, number>();
  rows.forEach((r, i) => {
    const row = i + 1;
    for (const col of cols) {
      const v = r[col.key];
      if (col.key === "citation") {
        if (typeof v !== "string" || v.trim() === "") {
          out.push({ table, rowIndex: i, column: "citation", message: RULEBOOK_MESSAGES.missingCitation(row), severity: "error" });
        }
        continue;
      }
      if (col.kind !== "number" || typeof v !== "number") continue;
      const isShare = col.min === 0 && col.max === 1;
      if (isShare && (v < 0 || v > 1)) {
        out.push({ table, rowIndex: i, column: col.key, message: RULEBOOK_MESSAGES.shareOutOfRange(row, col.label, v), severity: "error" });
        continue;
      }
      if (col.min === 0 && v < 0) {
        out.push({ table, rowIndex: i, column: col.key, message: RULEBOOK_MESSAGES.negative(row, col.label, v), severity: "error" });
      } else if (col.min !== undefined && v < col.min) {
        out.push({ table, rowIndex: i, column: col.key, message: RULEBOOK_MESSAGES.belowMin(row, col.label, v, col.min), severity: "error" });
      } else if (col.max !== undefined && v > col.max) {
        out.push({ table, rowIndex: i, column: col.key, message: RULEBOOK_MESSAGES.aboveMax(row, col.label, v, col.max), severity: "error" });
      }
      if (col.integer && !Number.isInteger(v)) {
        out.push({ table, rowIndex: i, column: col.key, message: RULEBOOK_MESSAGES.notWhole(row, col.label, v), severity: "error" });
      }
    }
    const key = rowKey(r, def.uniqueBy);
    const first = seen.get(key);
    if (first === undefined) seen.set(key, i);
    else {
      const names = def.uniqueBy.map((k) => columnOf(table, k)?.label.toLowerCase() ?? k).join(", ");
      out.push({ table, rowIndex: i, column: null, message: RULEBOOK_MESSAGES.duplicate(row, first + 1, names), severity: "error" });
    }
  });
}

function checkParameters(rows: RulebookContent["parameters"], out: RulebookIssue[]): void {
  rows.forEach((p, i) => {
    const def: ParameterDefinition = PARAMETER_DEFINITIONS[p.key];
    const row = i + 1;
    if (p.unit.trim() !== def.unit) {
      out.push({ table: "parameters", rowIndex: i, column: "unit", message: RULEBOOK_MESSAGES.unitMismatch(row, p.key, p.unit, def.unit), severity: "error" });
    }
    if (def.flag && p.value !== 0 && p.value !== 1) {
      out.push({ table: "parameters", rowIndex: i, column: "value", message: RULEBOOK_MESSAGES.flagNotBinary(row, p.key, p.value), severity: "error" });
    } else if (def.min === 0 && p.value < 0) {
      out.push({ table: "parameters", rowIndex: i, column: "value", message: RULEBOOK_MESSAGES.negative(row, p.key, p.value), severity: "error" });
    } else if (def.max !== undefined && p.value > def.max) {
      out.push({ table: "parameters", rowIndex: i, column: "value", message: RULEBOOK_MESSAGES.aboveMax(row, p.key, p.value, def.max), severity: "error" });
    }
  });
}

function checkTerminationHeights(rows: RulebookContent["terminationHeights"], out: RulebookIssue[]): void {
  const first = rows[0];
  if (first && first.pitchFromPer12 !== 0) {
    out.push({ table: "terminationHeights", rowIndex: 0, column: "pitchFromPer12", message: RULEBOOK_MESSAGES.firstPitchNotFlat(first.pitchFromPer12), severity: "warning" });
  }
  rows.forEach((r, i) => {
    if (r.pitchToPer12 <= r.pitchFromPer12) {
      out.push({ table: "terminationHeights", rowIndex: i, column: "pitchToPer12", message: RULEBOOK_MESSAGES.pitchRange(i + 1, r.pitchFromPer12, r.pitchToPer12), severity: "error" });
    }
    const prev = i > 0 ? rows[i - 1] : undefined;
    if (!prev) return;
    if (r.pitchFromPer12 < prev.pitchFromPer12) {
      out.push({ table: "terminationHeights", rowIndex: i, column: "pitchFromPer12", message: RULEBOOK_MESSAGES.pitchOrder(i + 1, i), severity: "error" });
    } else if (r.pitchFromPer12 !== prev.pitchToPer12) {
      out.push({ table: "terminationHeights", rowIndex: i, column: "pitchFromPer12", message: RULEBOOK_MESSAGES.pitchGap(i + 1, r.pitchFromPer12, i, prev.pitchToPer12), severity: "error" });
    }
    if (r.minHeightFt < prev.minHeightFt) {
      out.push({ table: "terminationHeights", rowIndex: i, column: "minHeightFt", message: RULEBOOK_MESSAGES.pitchHeightFalls(i + 1, i), severity: "warning" });
    }
  });
}

function checkCapacity(rows: RulebookContent["capacity"], out: RulebookIssue[]): void {
  const groups = new Map<string, { heights: Set<number>; laterals: Set<number>; cells: Set<string>; sample: RulebookContent["capacity"][number] }>();
  rows.forEach((r, i) => {
    if (r.fanMinBtuh !== null && r.fanMaxBtuh !== null && r.fanMinBtuh > r.fanMaxBtuh) {
      out.push({ table: "capacity", rowIndex: i, column: "fanMinBtuh", message: RULEBOOK_MESSAGES.capacityMinAboveMax(i + 1, r.fanMinBtuh, r.fanMaxBtuh), severity: "error" });
    }
    if (r.fanMinBtuh === null && r.fanMaxBtuh === null && r.naturalMaxBtuh === null) {
      out.push({ table: "capacity", rowIndex: i, column: null, message: RULEBOOK_MESSAGES.capacityEmpty(i + 1), severity: "warning" });
    }
    const g = `${r.ventMaterial}|${r.connectorMaterial}|${r.diameterIn}`;
    let grp = groups.get(g);
    if (!grp) {
      grp = { heights: new Set(), laterals: new Set(), cells: new Set(), sample: r };
      groups.set(g, grp);
    }
    grp.heights.add(r.heightFt);
    grp.laterals.add(r.lateralFt);
    grp.cells.add(`${r.heightFt}|${r.lateralFt}`);
  });
  for (const grp of groups.values()) {
    for (const h of [...grp.heights].sort((a, b) => a - b)) {
      for (const l of [...grp.laterals].sort((a, b) => a - b)) {
        if (!grp.cells.has(`${h}|${l}`)) {
          out.push({
            table: "capacity",
            rowIndex: null,
            column: null,
            message: RULEBOOK_MESSAGES.capacityGridHole(grp.sample.ventMaterial, grp.sample.connectorMaterial, grp.sample.diameterIn, h, l),
            severity: "warning",
          });
        }
      }
    }
  }
}

function validateParsedTable<K extends RulebookTableKey>(table: K, rows: RulebookContent[K]): RulebookIssue[] {
  const out: RulebookIssue[] = [];
  checkColumns(table, rows as readonly Record<string, unknown>[], out);
  if (table === "parameters") checkParameters(rows as RulebookContent["parameters"], out);
  else if (table === "terminationHeights") checkTerminationHeights(rows as RulebookContent["terminationHeights"], out);
  else if (table === "capacity") checkCapacity(rows as RulebookContent["capacity"], out);
  return out;
}

/**
 * Checks the rows of one table (for an editor grid or a CSV import) with the same rules as
 * {@link validateRulebookContent}. Value rules run only once the table's shape is right.
 */
export function validateRulebookTable<K extends RulebookTableKey>(table: K, rows: unknown): RulebookIssue[] {
  const shape = checkShape(table, rows);
  if (shape.length > 0) return shape;
  return validateParsedTable(table, (rows ?? []) as RulebookContent[K]);
}
