import { RULEBOOK_TABLE_KEYS } from "./table-definitions";
import { RULEBOOK_MESSAGES, isRecord, validateRulebookTable, type RulebookIssue } from "./validate";

/*
 * Whole-rulebook validation, for the server and the engine. The per-table rules it applies live
 * in ./validate, which the rulebook editor runs in the browser on its own.
 */

const CONTENT_MESSAGES = {
  notAnObject: "The rulebook must be an object holding the edition and every table.",
  demoNoteNotText: "The demo-data note must be text.",
} as const;

/**
 * Checks rulebook content and lists every problem with the table, row and column to fix.
 * Shape problems (a missing table, a word where a number belongs) come first; a table with none
 * is then checked for its values: citations present, no negative lengths, shares within 0–1,
 * no duplicated rows, parameters in their fixed units, roof pitches in order and contiguous,
 * capacity minimums not above maximums. An empty list means the rulebook can be used.
 */
export function validateRulebookContent(content: unknown): RulebookIssue[] {
  if (!isRecord(content)) return [{ table: null, rowIndex: null, column: null, message: CONTENT_MESSAGES.notAnObject, severity: "error" }];
  const out: RulebookIssue[] = [];
  if (typeof content.edition !== "string" || content.edition.trim() === "") {
    out.push({ table: null, rowIndex: null, column: "edition", message: RULEBOOK_MESSAGES.edition(), severity: "error" });
  }
  if (content.demoDataNote !== undefined && typeof content.demoDataNote !== "string") {
    out.push({ table: null, rowIndex: null, column: "demoDataNote", message: CONTENT_MESSAGES.demoNoteNotText, severity: "error" });
  }
  for (const table of RULEBOOK_TABLE_KEYS) out.push(...validateRulebookTable(table, content[table]));
  return out;
}

