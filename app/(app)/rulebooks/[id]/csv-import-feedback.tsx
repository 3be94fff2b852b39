"use client";

import { useEffect, useMemo, useRef } from "react";
import type { CsvRowError } from "@/lib/rulebooks/csv";
import { diffTableRows, formatCell, isEmptyDiff } from "@/lib/rulebooks/csv-diff";
import { RULEBOOK_TABLES, type ColumnDefinition, type RulebookTableKey } from "@/lib/venting/rulebook/table-definitions";

type Row = Readonly<Record<string, unknown>>;

/** Where a CSV import stands: refused with errors, waiting for confirmation, applied, or cancelled. */
export type CsvState =
  | { kind: "errors"; errors: readonly CsvRowError[] }
  | { kind: "preview"; fileName: string; rows: Record<string, unknown>[]; warnings: readonly CsvRowError[] }
  | { kind: "applied"; warnings: readonly CsvRowError[] }
  | { kind: "cancelled" };

/** Everything an import shows above the grid, for each stage of {@link CsvState}. */
export function CsvImportFeedback({
  state,
  table,
  currentRows,
  onApply,
  onCancel,
}: {
  state: CsvState;
  table: RulebookTableKey;
  currentRows: readonly Row[];
  onApply: () => void;
  onCancel: () => void;
}) {
  return (
    <>
      {state.kind === "errors" ? (
        <div role="alert" className="rounded-md border border-fail/30 bg-fail-soft px-3 py-2 text-sm">
          <p className="font-semibold text-fail">The CSV file was not imported. Fix these lines and import it again:</p>
          <ul className="mt-1 list-disc space-y-0.5 pl-5 text-ink-800" data-testid="csv-errors">
            {state.errors.map((e, i) => (
              <li key={i}>
                Line {e.line}
                {e.column ? `, column ${e.column}` : ""}: {e.message}
              </li>
            ))}
          </ul>
        </div>
      ) : null}
      {state.kind === "preview" ? (
        <CsvImportPreview table={table} fileName={state.fileName} currentRows={currentRows} importedRows={state.rows} warnings={state.warnings} onApply={onApply} onCancel={onCancel} />
      ) : null}
      {state.kind === "applied" ? (
        <div role="status" className="rounded-md bg-pass-soft px-3 py-2 text-sm text-pass">
          <p>CSV applied to the table below. Review it, then save a new version: nothing is saved until you do.</p>
          {state.warnings.length > 0 ? (
            <ul className="mt-1 list-disc space-y-0.5 pl-5 text-warn">
              {state.warnings.map((w, i) => (
                <li key={i}>
                  Line {w.line}: {w.message}
                </li>
              ))}
            </ul>
          ) : null}
        </div>
      ) : null}
      {state.kind === "cancelled" ? (
        <p role="status" className="rounded-md bg-ink-100 px-3 py-2 text-sm text-ink-700">
          Import cancelled. The table is unchanged.
        </p>
      ) : null}
    </>
  );
}

/** Rows listed per kind of change; the counts above the lists are always complete. */
const LIST_LIMIT = 25;

function plural(n: number, one: string, many = `${one}s`): string {
  return `${n.toLocaleString("en-US")} ${n === 1 ? one : many}`;
}

function More({ shown, total }: { shown: number; total: number }) {
  return total > shown ? <li className="list-none text-ink-500">…and {plural(total - shown, "more row")}</li> : null;
}

/**
 * What a CSV file would change in one table — rows added, changed (cell by cell, old → new)
 * and removed — with Apply and Cancel. Nothing reaches the table before Apply.
 */
function CsvImportPreview({
  table,
  fileName,
  currentRows,
  importedRows,
  warnings,
  onApply,
  onCancel,
}: {
  table: RulebookTableKey;
  fileName: string;
  currentRows: readonly Row[];
  importedRows: readonly Row[];
  warnings: readonly CsvRowError[];
  onApply: () => void;
  onCancel: () => void;
}) {
  const heading = useRef<HTMLHeadingElement>(null);
  useEffect(() => heading.current?.focus(), []);
  // Against the grid as it is now, so edits made while the preview is open count.
  const diff = useMemo(() => diffTableRows(table, currentRows, importedRows), [table, currentRows, importedRows]);
  const columns: readonly ColumnDefinition[] = RULEBOOK_TABLES[table].columns;
  const labelOf = (key: string) => columns.find((c) => c.key === key)?.label ?? key;
  const uniqueBy: readonly string[] = RULEBOOK_TABLES[table].uniqueBy;
  const nothingChanges = isEmptyDiff(diff);
  const otherCells = (row: Row) =>
    columns
      .filter((c) => !uniqueBy.includes(c.key))
      .map((c) => `${c.label}: ${formatCell(table, c.key, row[c.key])}`)
      .join("; ");

  return (
    <section aria-labelledby="csv-preview-title" className="card space-y-3 border-info/40 p-4 text-sm" data-testid="csv-preview">
      <div>
        <h2 id="csv-preview-title" ref={heading} tabIndex={-1} className="text-base font-bold focus:outline-none">
          Check the import before applying it
        </h2>
        <p className="break-words text-ink-700">
          <span className="font-medium">{fileName}</span> into {RULEBOOK_TABLES[table].title}:{" "}
          <span data-testid="csv-preview-summary">
            {plural(diff.added.length, "row")} added, {diff.changed.length.toLocaleString("en-US")} changed, {diff.removed.length.toLocaleString("en-US")} removed,{" "}
            {diff.unchangedCount.toLocaleString("en-US")} unchanged
            {diff.orderChanged ? "; the row order changes" : ""}.
          </span>
        </p>
      </div>

      {nothingChanges ? <p className="text-ink-700">The file holds exactly what the table holds now: applying it changes nothing.</p> : null}

      {diff.changed.length > 0 ? (
        <div>
          <h3 className="font-semibold">Changed ({diff.changed.length.toLocaleString("en-US")})</h3>
          <ul className="mt-1 space-y-1.5" data-testid="csv-preview-changed">
            {diff.changed.slice(0, LIST_LIMIT).map((row) => (
              <li key={`${row.beforeIndex}-${row.afterIndex}`} className="break-words">
                <span className="font-medium">{row.key}</span> <span className="text-xs text-ink-500">(table row {row.beforeIndex + 1})</span>
                <ul className="ml-4 list-disc pl-3 text-ink-700">
                  {row.changes.map((change) => (
                    <li key={change.column}>
                      {labelOf(change.column)}: <del className="text-ink-600 decoration-fail/70">{formatCell(table, change.column, change.before)}</del> → <ins className="font-medium text-pass no-underline">{formatCell(table, change.column, change.after)}</ins>
                    </li>
                  ))}
                </ul>
              </li>
            ))}
            <More shown={LIST_LIMIT} total={diff.changed.length} />
          </ul>
        </div>
      ) : null}

      {diff.added.length > 0 ? (
        <div>
          <h3 className="font-semibold">Added ({diff.added.length.toLocaleString("en-US")})</h3>
          <ul className="mt-1 list-disc space-y-1 pl-5 text-ink-700" data-testid="csv-preview-added">
            {diff.added.slice(0, LIST_LIMIT).map((row) => (
              <li key={row.afterIndex} className="break-words">
                <span className="font-medium text-ink-900">{row.key}</span> — {otherCells(row.row)}
              </li>
            ))}
            <More shown={LIST_LIMIT} total={diff.added.length} />
          </ul>
        </div>
      ) : null}

      {diff.removed.length > 0 ? (
        <div>
          <h3 className="font-semibold text-fail">Removed ({diff.removed.length.toLocaleString("en-US")})</h3>
          <ul className="mt-1 list-disc space-y-1 pl-5 text-ink-700" data-testid="csv-preview-removed">
            {diff.removed.slice(0, LIST_LIMIT).map((row) => (
              <li key={row.beforeIndex} className="break-words">
                <span className="font-medium text-ink-900">{row.key}</span> <span className="text-xs text-ink-500">(table row {row.beforeIndex + 1})</span>
              </li>
            ))}
            <More shown={LIST_LIMIT} total={diff.removed.length} />
          </ul>
        </div>
      ) : null}

      {diff.duplicateKeys.length > 0 || diff.formulaLikeCells.length > 0 || warnings.length > 0 ? (
        <div className="rounded-md bg-warn-soft px-3 py-2">
          <h3 className="font-semibold text-warn">Worth a look</h3>
          <ul className="mt-1 list-disc space-y-0.5 pl-5 text-ink-800">
            {diff.duplicateKeys.map((d) => (
              <li key={`${d.side}-${d.key}`}>
                {d.key} appears {d.count} times in {d.side === "current" ? "the table now" : "the file"}; its rows were compared in order.
              </li>
            ))}
            {diff.formulaLikeCells.slice(0, LIST_LIMIT).map((cell) => (
              <li key={`${cell.afterIndex}-${cell.column}`} className="break-words">
                Row {cell.afterIndex + 1} of the file, {labelOf(cell.column)}, starts with “{cell.value.charAt(0)}”: it is kept as plain text, but a spreadsheet may run it as a formula.
              </li>
            ))}
            {warnings.map((w, i) => (
              <li key={`w-${i}`}>
                Line {w.line}: {w.message}
              </li>
            ))}
          </ul>
        </div>
      ) : null}

      <p className="text-ink-600">Nothing has changed yet. Applying puts these rows in the table below; the rulebook is saved only when you save a new version.</p>
      <div className="flex flex-wrap gap-2">
        <button type="button" className="btn-primary" onClick={onApply} disabled={nothingChanges}>
          Apply to the table
        </button>
        <button type="button" className="btn-secondary" onClick={onCancel}>
          Cancel import
        </button>
      </div>
    </section>
  );
}
