import { RULEBOOK_TABLES, RULEBOOK_TABLE_KEYS, type ColumnDefinition, type RulebookTableKey } from "../venting/rulebook/table-definitions";

/**
 * Column widths of the rulebook editor's grids, worked out from the column definitions on the
 * server and handed to the grid as data. The goal: every usual table fits a 1280 px screen
 * without scrolling sideways, with its citations readable.
 */

/** Text columns that hold sentences: they get the room that is left, or a line of their own. */
const WIDE_TEXT_COLUMNS = new Set(["citation", "note"]);
/** Narrowest a sentence column may get beside the others before it moves under its row. */
export const WIDE_TEXT_MIN_REM = 15;
/**
 * Room for a grid on a 1280 px screen beside the navigation: 1280 px less the 240 px sidebar and
 * the page's padding leaves 992 px, 62 rem, less the card's border and some slack.
 */
export const GRID_ROOM_REM = 60;
const INDEX_COLUMN_REM = 2.5;
const ACTIONS_COLUMN_REM = 7.5;

/** How one table's grid is laid out. */
export interface GridLayout {
  /** Width of the row-number column. */
  readonly indexRem: number;
  /** Width of the row-actions column, 0 when rows cannot be edited. */
  readonly actionsRem: number;
  /** Fixed widths of the short columns; sentence columns are not listed. */
  readonly widthsRem: Readonly<Record<string, number>>;
  /** Sentence columns (citation, note), in column order. */
  readonly wide: readonly string[];
  /** True when the sentence columns go on a line of their own under each row. */
  readonly stacked: boolean;
  /** Width below which the grid scrolls inside its box (phones) rather than squeezing. */
  readonly minWidthRem: number;
}

function isWideText(column: ColumnDefinition): boolean {
  return column.kind === "text" && WIDE_TEXT_COLUMNS.has(column.key);
}

function columnWidthRem(table: RulebookTableKey, column: ColumnDefinition): number {
  // Parameter names are the longest choices of any picker.
  if (table === "parameters" && column.key === "key") return 20;
  switch (column.kind) {
    case "enum":
      return 8.5;
    case "number":
      return 5.5;
    case "boolean":
      return 5.5;
    case "text":
      return 8.5;
    default:
      column.kind satisfies never;
      return 8;
  }
}

/** The layout of one table's grid, with or without the row-actions column. */
export function rulebookGridLayout(table: RulebookTableKey, withActions: boolean): GridLayout {
  const columns: readonly ColumnDefinition[] = RULEBOOK_TABLES[table].columns;
  const widthsRem: Record<string, number> = {};
  const wide: string[] = [];
  for (const column of columns) {
    if (isWideText(column)) wide.push(column.key);
    else widthsRem[column.key] = columnWidthRem(table, column);
  }
  const actionsRem = withActions ? ACTIONS_COLUMN_REM : 0;
  const fixedRem = INDEX_COLUMN_REM + actionsRem + Object.values(widthsRem).reduce((sum, w) => sum + w, 0);
  const stacked = wide.length > 0 && fixedRem + wide.length * WIDE_TEXT_MIN_REM > GRID_ROOM_REM;
  return { indexRem: INDEX_COLUMN_REM, actionsRem, widthsRem, wide, stacked, minWidthRem: stacked ? fixedRem : fixedRem + wide.length * WIDE_TEXT_MIN_REM };
}

/** Layouts of every table, for the editor. */
export function rulebookGridLayouts(withActions: boolean): Record<RulebookTableKey, GridLayout> {
  const out = {} as Record<RulebookTableKey, GridLayout>;
  for (const table of RULEBOOK_TABLE_KEYS) out[table] = rulebookGridLayout(table, withActions);
  return out;
}
