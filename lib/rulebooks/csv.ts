// The zod-free parts of the engine only: this module runs in the rulebook editor's bundle.
import { RULEBOOK_TABLES, RULEBOOK_TABLE_KEYS, type ColumnDefinition, type RulebookTableKey } from "../venting/rulebook/table-definitions";
import type { RulebookContent, RulebookRow } from "../venting/rulebook/tables";
import { validateRulebookTable } from "../venting/rulebook/validate";

/**
 * CSV import and export of one rulebook table at a time, driven by the table's column
 * metadata. Export writes RFC 4180 CSV (CRLF, fields quoted when needed) with the column keys
 * as the header. Import accepts the keys or the column labels as headers, in any order, and
 * reports every problem with its line number and column.
 */

/** One problem in an imported CSV file. */
export interface CsvRowError {
  /** 1-based line number in the file where the record starts. */
  readonly line: number;
  /** Column key, or null when the whole line or the header is concerned. */
  readonly column: string | null;
  readonly message: string;
}

/** Result of {@link parseTableCsv}. */
export type CsvImportResult<K extends RulebookTableKey> =
  | { readonly ok: true; readonly rows: RulebookRow<K>[]; readonly warnings: readonly CsvRowError[] }
  | { readonly ok: false; readonly errors: readonly CsvRowError[] };

/** A parsed CSV record with the line it starts on. */
export interface CsvRecord {
  readonly line: number;
  readonly fields: string[];
}

/** Messages of the CSV importer. */
export const CSV_MESSAGES = {
  unterminatedQuote: "A quoted field is not closed; add the closing double quote.",
  badQuote: "A double quote inside a field must be written twice (\"\") and the field quoted.",
  empty: "The file is empty; the first line must name the columns.",
  unknownColumn: (name: string, known: string) => `Unknown column "${name}". Columns of this table: ${known}.`,
  duplicateColumn: (name: string) => `The column "${name}" appears twice; keep one.`,
  missingColumn: (label: string) => `The column "${label}" is missing from the header line.`,
  fieldCount: (found: number, expected: number) => `This line has ${found} fields; the header has ${expected}. Check for a missing or extra comma.`,
  required: (label: string) => `${label} is required.`,
  notNumber: (label: string, raw: string) => `${label} must be a number, not "${raw}".`,
  notBoolean: (label: string, raw: string) => `${label} must be yes or no (true/false), not "${raw}".`,
  badOption: (label: string, raw: string, options: readonly string[]) => `${label} must be one of ${options.join(", ")}, not "${raw}".`,
} as const;

/**
 * Splits CSV text into records (RFC 4180: quoted fields may hold commas, quotes written twice
 * and line breaks). Blank lines are skipped. Throws nothing: a malformed quote is reported.
 */
export function parseCsv(text: string): { records: CsvRecord[]; error: CsvRowError | null } {
  const records: CsvRecord[] = [];
  let line = 1;
  let i = 0;
  const n = text.length;
  if (text.charCodeAt(0) === 0xfeff) i = 1; // byte-order mark from spreadsheet exports
  while (i < n) {
    const startLine = line;
    const fields: string[] = [];
    let field = "";
    let atFieldStart = true;
    let quoted = false;
    let endOfRecord = false;
    while (i < n && !endOfRecord) {
      const ch = text[i]!;
      if (quoted) {
        if (ch === '"') {
          if (text[i + 1] === '"') {
            field += '"';
            i += 2;
            continue;
          }
          quoted = false;
          i++;
          const next = text[i];
          if (next !== undefined && next !== "," && next !== "\n" && next !== "\r") {
            return { records, error: { line, column: null, message: CSV_MESSAGES.badQuote } };
          }
          continue;
        }
        if (ch === "\n") line++;
        field += ch;
        i++;
        continue;
      }
      if (ch === '"' && atFieldStart) {
        quoted = true;
        atFieldStart = false;
        i++;
        continue;
      }
      if (ch === '"') return { records, error: { line, column: null, message: CSV_MESSAGES.badQuote } };
      if (ch === ",") {
        fields.push(field);
        field = "";
        atFieldStart = true;
        i++;
        continue;
      }
      if (ch === "\r" || ch === "\n") {
        if (ch === "\r" && text[i + 1] === "\n") i++;
        i++;
        line++;
        endOfRecord = true;
        continue;
      }
      field += ch;
      atFieldStart = false;
      i++;
    }
    if (quoted) return { records, error: { line: startLine, column: null, message: CSV_MESSAGES.unterminatedQuote } };
    fields.push(field);
    if (!(fields.length === 1 && fields[0]!.trim() === "")) records.push({ line: startLine, fields });
  }
  return { records, error: null };
}

function quote(value: string): string {
  return /[",\r\n]|^\s|\s$/.test(value) ? `"${value.replace(/"/g, '""')}"` : value;
}

function cellText(v: unknown): string {
  if (v === null || v === undefined) return "";
  if (typeof v === "boolean") return v ? "true" : "false";
  return String(v);
}

/** Writes one table's rows as CSV, header first (column keys), CRLF line ends. */
export function tableToCsv<K extends RulebookTableKey>(table: K, rows: readonly RulebookRow<K>[]): string {
  const cols: readonly ColumnDefinition[] = RULEBOOK_TABLES[table].columns;
  const lines = [cols.map((c) => quote(c.key)).join(",")];
  for (const row of rows) {
    const r = row as Record<string, unknown>;
    lines.push(cols.map((c) => quote(cellText(r[c.key]))).join(","));
  }
  return `${lines.join("\r\n")}\r\n`;
}

/** Every table of a rulebook as CSV text, keyed by table. */
export function rulebookToCsv(content: RulebookContent): Record<RulebookTableKey, string> {
  const out = {} as Record<RulebookTableKey, string>;
  for (const key of RULEBOOK_TABLE_KEYS) out[key] = tableToCsv(key, content[key] as RulebookRow<typeof key>[]);
  return out;
}

/** File name for a table's CSV export. */
export function csvFileName(table: RulebookTableKey): string {
  return `${table.replace(/[A-Z]/g, (c) => `-${c.toLowerCase()}`)}.csv`;
}

const TRUE = new Set(["true", "yes", "y", "1"]);
const FALSE = new Set(["false", "no", "n", "0"]);

function normalise(h: string): string {
  return h.trim().toLowerCase().replace(/\s*\(.*\)\s*$/, "");
}

function convert(col: ColumnDefinition, raw: string): { ok: true; value: unknown } | { ok: false; message: string } {
  const v = raw.trim();
  if (v === "") {
    if (col.required && col.kind !== "text") return { ok: false, message: CSV_MESSAGES.required(col.label) };
    if (col.required && col.key === "citation") return { ok: true, value: "" }; // reported by validation with a fix-it message
    if (col.required) return { ok: false, message: CSV_MESSAGES.required(col.label) };
    return { ok: true, value: col.kind === "text" ? "" : null };
  }
  switch (col.kind) {
    case "number": {
      const num = Number(v.replace(/,/g, ""));
      if (!Number.isFinite(num)) return { ok: false, message: CSV_MESSAGES.notNumber(col.label, v) };
      return { ok: true, value: num };
    }
    case "boolean": {
      const l = v.toLowerCase();
      if (TRUE.has(l)) return { ok: true, value: true };
      if (FALSE.has(l)) return { ok: true, value: false };
      return { ok: false, message: CSV_MESSAGES.notBoolean(col.label, v) };
    }
    case "enum": {
      const opts = col.options ?? [];
      const hit = opts.find((o) => o.toLowerCase() === v.toLowerCase());
      if (hit === undefined) return { ok: false, message: CSV_MESSAGES.badOption(col.label, v, opts) };
      return { ok: true, value: hit };
    }
    case "text":
      return { ok: true, value: raw };
    default:
      col.kind satisfies never;
      return { ok: false, message: "" };
  }
}

/**
 * Reads one table from CSV. Every problem is reported with its line and column: unknown or
 * missing columns, cells of the wrong kind, and the rulebook's own rules (missing citation,
 * negative values, duplicates, rows out of order). Warnings (such as a hole in a capacity grid)
 * do not stop the import.
 */
export function parseTableCsv<K extends RulebookTableKey>(table: K, text: string): CsvImportResult<K> {
  const cols: readonly ColumnDefinition[] = RULEBOOK_TABLES[table].columns;
  const { records, error } = parseCsv(text);
  if (error) return { ok: false, errors: [error] };
  const header = records[0];
  if (!header) return { ok: false, errors: [{ line: 1, column: null, message: CSV_MESSAGES.empty }] };
  const errors: CsvRowError[] = [];
  const colAt: (ColumnDefinition | null)[] = [];
  const seen = new Set<string>();
  for (const h of header.fields) {
    const key = normalise(h);
    const col = cols.find((c) => c.key.toLowerCase() === key || c.label.toLowerCase() === key) ?? null;
    if (!col) {
      errors.push({ line: header.line, column: null, message: CSV_MESSAGES.unknownColumn(h.trim(), cols.map((c) => c.key).join(", ")) });
    } else if (seen.has(col.key)) {
      errors.push({ line: header.line, column: col.key, message: CSV_MESSAGES.duplicateColumn(h.trim()) });
    } else seen.add(col.key);
    colAt.push(col);
  }
  for (const c of cols) {
    if (!seen.has(c.key) && c.required) errors.push({ line: header.line, column: c.key, message: CSV_MESSAGES.missingColumn(c.label) });
  }
  if (errors.length > 0) return { ok: false, errors };

  const rows: Record<string, unknown>[] = [];
  const lines: number[] = [];
  for (let r = 1; r < records.length; r++) {
    const rec = records[r]!;
    if (rec.fields.length !== colAt.length) {
      errors.push({ line: rec.line, column: null, message: CSV_MESSAGES.fieldCount(rec.fields.length, colAt.length) });
      continue;
    }
    const row: Record<string, unknown> = {};
    let rowOk = true;
    for (const c of cols) if (!seen.has(c.key)) row[c.key] = c.kind === "text" ? "" : null;
    rec.fields.forEach((raw, i) => {
      const col = colAt[i]!;
      const cv = convert(col, raw);
      if (cv.ok) row[col.key] = cv.value;
      else {
        rowOk = false;
        errors.push({ line: rec.line, column: col.key, message: cv.message });
      }
    });
    if (rowOk) {
      rows.push(row);
      lines.push(rec.line);
    }
  }
  // Rows that converted are still checked against the rulebook's rules, so one pass reports everything.
  const issues = validateRulebookTable(table, rows);
  const warnings: CsvRowError[] = [];
  for (const iss of issues) {
    const line = iss.rowIndex === null ? header.line : (lines[iss.rowIndex] ?? header.line);
    // The validator counts rows from 1; in a file the line number is what the user sees.
    const message = iss.rowIndex === null ? iss.message : iss.message.replace(/\b[Rr]ow (\d+)/g, (_m, d: string) => `line ${lines[Number(d) - 1] ?? d}`).replace(/^line/, "Line");
    (iss.severity === "error" ? errors : warnings).push({ line, column: iss.column, message });
  }
  if (errors.length > 0) return { ok: false, errors: errors.sort((a, b) => a.line - b.line) };
  return { ok: true, rows: rows as RulebookRow<K>[], warnings };
}
