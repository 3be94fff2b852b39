"use client";

import { useRouter } from "next/navigation";
import { Fragment, Suspense, lazy, useMemo, useRef, useState } from "react";
import { apiFetch, ApiError } from "@/lib/client/api";
// Straight from the zod-free modules of the engine, so the editor's bundle carries no zod.
import type { GridLayout } from "@/lib/rulebooks/grid-layout";
import type { RulebookChoiceLabels } from "@/lib/venting/rulebook/labels";
import { PARAMETER_DEFINITIONS } from "@/lib/venting/rulebook/parameters";
import { RULEBOOK_TABLES, RULEBOOK_TABLE_KEYS, type ColumnDefinition, type RulebookTableKey } from "@/lib/venting/rulebook/table-definitions";
import type { RulebookContent } from "@/lib/venting/rulebook/tables";
import { validateRulebookTable, type RulebookIssue } from "@/lib/venting/rulebook/validate";
import type { CsvState } from "./csv-import-feedback";

type Row = Record<string, unknown>;
type Tables = Record<RulebookTableKey, Row[]>;

function cellValue(column: ColumnDefinition, raw: string): unknown {
  if (column.kind === "number") {
    if (raw.trim() === "") return null;
    const n = Number(raw.replace(",", "."));
    return Number.isFinite(n) ? n : raw;
  }
  return raw;
}

function emptyRow(table: RulebookTableKey): Row {
  const row: Row = {};
  for (const column of RULEBOOK_TABLES[table].columns) {
    row[column.key] = column.kind === "boolean" ? false : column.kind === "number" ? null : column.kind === "enum" ? (column.options?.[0] ?? "") : "";
  }
  return row;
}

/** An option as a person reads it; the parameters table's keys by their parameter name. */
function choiceLabel(labels: RulebookChoiceLabels, table: RulebookTableKey, column: ColumnDefinition, value: string): string {
  return (table === "parameters" && column.key === "key" ? labels.parameters[value] : labels.options[value]) ?? value;
}

// What an import shows (errors, the preview and its diff, the outcome) loads with the first imported
// file: the editor's first load is on a tight budget.
const loadCsvImportFeedback = () => import("./csv-import-feedback");
const CsvImportFeedback = lazy(() => loadCsvImportFeedback().then((m) => ({ default: m.CsvImportFeedback })));

/**
 * The rulebook as editable grids, one table at a time, with live validation, CSV import and
 * export, and saving as the next version.
 */
export function RulebookEditor({
  rulebookId,
  versionNumber,
  content,
  canEdit,
  labels,
  layouts,
}: {
  rulebookId: number;
  versionNumber: number;
  content: RulebookContent;
  canEdit: boolean;
  /** Human names of parameter keys and options (lib/venting/rulebook/labels.ts), from the server. */
  labels: RulebookChoiceLabels;
  /** Column widths of every table (lib/rulebooks/grid-layout.ts), from the server. */
  layouts: Record<RulebookTableKey, GridLayout>;
}) {
  const router = useRouter();
  const [tables, setTables] = useState<Tables>(() => {
    const t = {} as Tables;
    for (const key of RULEBOOK_TABLE_KEYS) t[key] = (content[key] as Row[]).map((r) => ({ ...r }));
    return t;
  });
  const [active, setActive] = useState<RulebookTableKey>("parameters");
  const [dirty, setDirty] = useState(false);
  const [changeNote, setChangeNote] = useState("");
  const [saveState, setSaveState] = useState<{ kind: "idle" | "saving" | "error" | "saved"; message?: string; fields?: Record<string, string> }>({ kind: "idle" });
  const [csv, setCsv] = useState<CsvState | null>(null);
  const fileInput = useRef<HTMLInputElement>(null);

  const definition = RULEBOOK_TABLES[active] as { title: string; description: string; columns: readonly ColumnDefinition[] };
  const rows = tables[active];
  const issues = useMemo(() => validateRulebookTable(active, rows), [active, rows]);
  const issuesByRow = useMemo(() => {
    const map = new Map<number | null, RulebookIssue[]>();
    for (const issue of issues) map.set(issue.rowIndex, [...(map.get(issue.rowIndex) ?? []), issue]);
    return map;
  }, [issues]);
  const errorCounts = useMemo(() => {
    const counts = {} as Record<RulebookTableKey, number>;
    for (const key of RULEBOOK_TABLE_KEYS) counts[key] = validateRulebookTable(key, tables[key]).filter((i) => i.severity === "error").length;
    return counts;
  }, [tables]);
  const totalErrors = Object.values(errorCounts).reduce((a, b) => a + b, 0);
  const layout = layouts[active];
  const isWideText = (column: ColumnDefinition) => layout.wide.includes(column.key);
  const wideColumns = definition.columns.filter(isWideText);
  const shortCount = definition.columns.length - wideColumns.length;

  const update = (next: Row[]) => {
    setTables((t) => ({ ...t, [active]: next }));
    setDirty(true);
    setSaveState({ kind: "idle" });
  };
  const setCell = (rowIndex: number, column: ColumnDefinition, value: unknown) => update(rows.map((r, i) => (i === rowIndex ? { ...r, [column.key]: value } : r)));
  const move = (from: number, to: number) => {
    if (to < 0 || to >= rows.length) return;
    const next = [...rows];
    const [item] = next.splice(from, 1);
    next.splice(to, 0, item!);
    update(next);
  };

  const importCsv = async (file: File) => {
    setCsv(null);
    // The CSV reader loads only when someone imports a file; most visits just read the tables.
    const [text, { parseTableCsv }] = await Promise.all([file.text(), import("@/lib/rulebooks/csv"), loadCsvImportFeedback()]);
    const result = parseTableCsv(active, text);
    if (!result.ok) {
      setCsv({ kind: "errors", errors: result.errors });
      return;
    }
    // Nothing changes until the person has seen what the file would change and confirmed it.
    setCsv({ kind: "preview", fileName: file.name, rows: result.rows as Row[], warnings: result.warnings });
  };
  const applyImport = () => {
    if (csv?.kind !== "preview") return;
    update(csv.rows.map((r) => ({ ...r })));
    setCsv({ kind: "applied", warnings: csv.warnings });
  };

  const save = async () => {
    setSaveState({ kind: "saving" });
    try {
      const body = { baseVersionNumber: versionNumber, changeNote, content: { edition: content.edition, demoDataNote: content.demoDataNote, ...tables } };
      const result = await apiFetch<{ version: { versionNumber: number } }>(`/api/rulebooks/${rulebookId}/versions`, { method: "POST", body });
      setDirty(false);
      setChangeNote("");
      setSaveState({ kind: "saved", message: `Saved as version ${result.version.versionNumber}.` });
      router.push(`/rulebooks/${rulebookId}?version=${result.version.versionNumber}`);
      router.refresh();
    } catch (error) {
      if (error instanceof ApiError) setSaveState({ kind: "error", message: error.message, fields: error.fields });
      else setSaveState({ kind: "error", message: "The rulebook could not be saved. Try again." });
    }
  };

  return (
    <div className="min-w-0 space-y-3">
      <div className="flex flex-wrap items-end gap-3">
        <div className="min-w-[14rem] flex-1">
          <label htmlFor="rulebook-table" className="label">
            Table
          </label>
          <select id="rulebook-table" className="input" value={active} onChange={(e) => { setActive(e.target.value as RulebookTableKey); setCsv(null); }}>
            {RULEBOOK_TABLE_KEYS.map((key) => (
              <option key={key} value={key}>
                {RULEBOOK_TABLES[key].title} ({tables[key].length} rows{errorCounts[key] ? `, ${errorCounts[key]} to fix` : ""})
              </option>
            ))}
          </select>
        </div>
        <a className="btn-secondary" href={`/api/rulebooks/${rulebookId}/versions/${versionNumber}/csv/${active}`} download>
          {/* The file name comes from the export's Content-Disposition. */}
          Export CSV
        </a>
        {canEdit ? (
          <>
            <button type="button" className="btn-secondary" onClick={() => fileInput.current?.click()}>
              Import CSV
            </button>
            <input
              ref={fileInput}
              type="file"
              accept=".csv,text/csv"
              className="sr-only"
              aria-label="CSV file to import into this table"
              onChange={(e) => {
                const file = e.target.files?.[0];
                if (file) void importCsv(file);
                e.target.value = "";
              }}
            />
          </>
        ) : null}
      </div>
      <p className="text-sm text-ink-600">{definition.description}</p>

      {csv ? (
        <Suspense fallback={<p role="status" className="text-sm text-ink-600">Reading the file…</p>}>
          <CsvImportFeedback state={csv} table={active} currentRows={rows} onApply={applyImport} onCancel={() => setCsv({ kind: "cancelled" })} />
        </Suspense>
      ) : null}

      {issuesByRow.get(null)?.map((issue, i) => (
        <p key={i} className={`text-sm ${issue.severity === "error" ? "text-fail" : "text-warn"}`}>
          {issue.message}
        </p>
      ))}

      {/* relative: keeps visually hidden labels inside the scrolling box, so the page itself never scrolls sideways. */}
      <div className="card relative overflow-x-auto" role="region" aria-label={`${definition.title} table`} tabIndex={0}>
        <table className="w-full table-fixed text-left text-sm" style={{ minWidth: `${layout.minWidthRem}rem` }}>
          <colgroup>
            <col style={{ width: `${layout.indexRem}rem` }} />
            {definition.columns.map((c) =>
              layout.stacked && isWideText(c) ? null : <col key={c.key} style={isWideText(c) ? undefined : { width: `${layout.widthsRem[c.key]}rem` }} />,
            )}
            {canEdit ? <col style={{ width: `${layout.actionsRem}rem` }} /> : null}
          </colgroup>
          <thead className="border-b border-ink-200 bg-ink-50 text-xs uppercase tracking-wide text-ink-500">
            <tr>
              <th className="px-1.5 py-2">#</th>
              {definition.columns.map((c) =>
                layout.stacked && isWideText(c) ? null : (
                  <th key={c.key} className="break-words px-1.5 py-2 align-bottom">
                    {c.label}
                    {c.unit ? <span className="block normal-case text-ink-400">{c.unit}</span> : null}
                  </th>
                ),
              )}
              {canEdit ? (
                <th className="px-1.5 py-2">
                  <span className="sr-only">Row actions</span>
                </th>
              ) : null}
            </tr>
          </thead>
          <tbody>
            {rows.map((row, rowIndex) => {
              const rowIssues = issuesByRow.get(rowIndex) ?? [];
              const rowTone = rowIssues.some((i) => i.severity === "error") ? "bg-fail-soft/40" : "";
              const renderCell = (column: ColumnDefinition) => {
                const cellIssue = rowIssues.find((i) => i.column === column.key);
                const id = `cell-${active}-${rowIndex}-${column.key}`;
                const value = row[column.key];
                const label = `${column.label}, row ${rowIndex + 1}`;
                const isParameterKey = active === "parameters" && column.key === "key";
                let control;
                if (!canEdit) {
                  if (column.kind === "boolean") control = <span>{value ? "Yes" : "No"}</span>;
                  else if (column.kind === "enum") control = <span className={isParameterKey ? "font-medium" : ""}>{value === null || value === undefined || value === "" ? "—" : choiceLabel(labels, active, column, String(value))}</span>;
                  else control = <span className={`break-words ${isWideText(column) ? "text-xs text-ink-700" : ""}`}>{value === null || value === undefined || value === "" ? "—" : String(value)}</span>;
                } else if (column.kind === "boolean") {
                  control = <input id={id} type="checkbox" aria-label={label} className="h-5 w-5 accent-copper-600" checked={Boolean(value)} onChange={(e) => setCell(rowIndex, column, e.target.checked)} />;
                } else if (column.kind === "enum") {
                  control = (
                    <select id={id} aria-label={label} className="input px-2 py-1 text-sm" value={String(value ?? "")} onChange={(e) => setCell(rowIndex, column, e.target.value)}>
                      {(column.options ?? []).map((o) => (
                        <option key={o} value={o}>
                          {choiceLabel(labels, active, column, o)}
                        </option>
                      ))}
                    </select>
                  );
                } else if (isWideText(column)) {
                  control = (
                    <textarea
                      id={id}
                      aria-label={label}
                      aria-invalid={cellIssue ? true : undefined}
                      rows={layout.stacked ? 1 : 3}
                      className="input px-2 py-1 text-xs leading-snug [field-sizing:content]"
                      value={value === null || value === undefined ? "" : String(value)}
                      onChange={(e) => setCell(rowIndex, column, e.target.value)}
                    />
                  );
                } else {
                  control = (
                    <input
                      id={id}
                      aria-label={label}
                      aria-invalid={cellIssue ? true : undefined}
                      className="input px-2 py-1 text-sm"
                      inputMode={column.kind === "number" ? "decimal" : undefined}
                      value={value === null || value === undefined ? "" : String(value)}
                      onChange={(e) => setCell(rowIndex, column, cellValue(column, e.target.value))}
                    />
                  );
                }
                const parameter = isParameterKey ? PARAMETER_DEFINITIONS[String(value) as keyof typeof PARAMETER_DEFINITIONS] : undefined;
                return (
                  <>
                    {control}
                    {isParameterKey ? (
                      <span className="mt-1 block text-xs text-ink-500">
                        {/* The stored key stays visible, small: CSV files and the API use it. */}
                        <code className="break-all text-[11px] text-ink-400">{String(value ?? "")}</code>
                        {parameter ? ` · in ${parameter.unit}` : ""}
                        {parameter ? <span className="block">{parameter.description}</span> : null}
                      </span>
                    ) : null}
                    {cellIssue ? <span className={`mt-1 block text-xs font-medium ${cellIssue.severity === "error" ? "text-fail" : "text-warn"}`}>{cellIssue.message}</span> : null}
                  </>
                );
              };
              return (
                <Fragment key={rowIndex}>
                  <tr className={`align-top ${layout.stacked ? "" : "border-b border-ink-100"} ${rowTone}`}>
                    <td className="px-1.5 py-2 text-xs text-ink-400">{rowIndex + 1}</td>
                    {definition.columns.map((column) =>
                      layout.stacked && isWideText(column) ? null : (
                        <td key={column.key} className="min-w-0 px-1.5 py-2">
                          {renderCell(column)}
                        </td>
                      ),
                    )}
                    {canEdit ? (
                      <td className="whitespace-nowrap px-1 py-2">
                        <button type="button" className="btn-ghost min-h-0 px-1.5 py-1" aria-label={`Move row ${rowIndex + 1} up`} title="Move up" onClick={() => move(rowIndex, rowIndex - 1)}>
                          ↑
                        </button>
                        <button type="button" className="btn-ghost min-h-0 px-1.5 py-1" aria-label={`Move row ${rowIndex + 1} down`} title="Move down" onClick={() => move(rowIndex, rowIndex + 1)}>
                          ↓
                        </button>
                        <button type="button" className="btn-ghost min-h-0 px-1.5 py-1 text-xs text-fail" aria-label={`Remove row ${rowIndex + 1}`} onClick={() => update(rows.filter((_, i) => i !== rowIndex))}>
                          Remove
                        </button>
                      </td>
                    ) : null}
                  </tr>
                  {layout.stacked ? (
                    <tr className={`border-b border-ink-100 ${rowTone}`}>
                      <td />
                      <td colSpan={shortCount + (canEdit ? 1 : 0)} className="px-1.5 pb-2">
                        <div className={`grid gap-2 ${wideColumns.length > 1 ? "sm:grid-cols-2" : ""}`}>
                          {wideColumns.map((column) => (
                            <div key={column.key} className="min-w-0">
                              <span className="mb-0.5 block text-[11px] font-semibold uppercase tracking-wide text-ink-500" aria-hidden="true">
                                {column.label}
                              </span>
                              {renderCell(column)}
                            </div>
                          ))}
                        </div>
                      </td>
                    </tr>
                  ) : null}
                </Fragment>
              );
            })}
            {rows.length > 0 ? null : (
              <tr>
                <td colSpan={definition.columns.length + 2} className="px-3 py-6 text-center text-ink-500">
                  This table is empty.
                </td>
              </tr>
            )}
            {[...issuesByRow.entries()]
              .filter(([rowIndex, list]) => rowIndex !== null && list.some((i) => i.column === null))
              .map(([rowIndex, list]) => (
                <tr key={`row-issue-${rowIndex}`}>
                  <td colSpan={definition.columns.length + 2} className="px-2 py-1 text-xs text-fail">
                    {list.filter((i) => i.column === null).map((i) => i.message).join(" ")}
                  </td>
                </tr>
              ))}
          </tbody>
        </table>
      </div>
      {canEdit ? (
        <div className="space-y-3">
          <button type="button" className="btn-secondary" onClick={() => update([...rows, emptyRow(active)])}>
            Add row
          </button>
          <div className="card space-y-3 p-4">
            <label htmlFor="change-note" className="label">
              What changed, and why
            </label>
            <input
              id="change-note"
              className="input"
              maxLength={500}
              placeholder="e.g. Single-wall clearance per our adopted edition, section 503.10.5"
              value={changeNote}
              onChange={(e) => setChangeNote(e.target.value)}
            />
            <div aria-live="polite" className="space-y-1 text-sm">
              {totalErrors > 0 ? (
                <p className="text-fail">
                  {totalErrors} problem{totalErrors === 1 ? "" : "s"} to fix before saving (
                  {RULEBOOK_TABLE_KEYS.filter((k) => errorCounts[k]).map((k) => RULEBOOK_TABLES[k].title).join(", ")}).
                </p>
              ) : null}
              {saveState.kind === "error" ? (
                <div role="alert" className="rounded-md bg-fail-soft px-3 py-2 text-fail">
                  <p className="font-semibold">{saveState.message}</p>
                  {saveState.fields ? (
                    <ul className="mt-1 list-disc pl-5 text-ink-800">
                      {Object.entries(saveState.fields).slice(0, 10).map(([k, m]) => (
                        <li key={k}>{m}</li>
                      ))}
                    </ul>
                  ) : null}
                </div>
              ) : null}
              {saveState.kind === "saved" ? <p className="text-pass">{saveState.message}</p> : null}
            </div>
            <button type="button" className="btn-primary" disabled={!dirty || totalErrors > 0 || saveState.kind === "saving" || changeNote.trim() === ""} onClick={save}>
              {saveState.kind === "saving" ? "Saving…" : `Save as version ${versionNumber + 1}`}
            </button>
            {dirty ? <p className="text-xs text-ink-500">Unsaved changes. Saving creates a new version; this version stays as it is.</p> : null}
          </div>
        </div>
      ) : null}
    </div>
  );
}
