import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { RULEBOOK_TABLES, RULEBOOK_TABLE_KEYS, rulebookContentSchema, validateRulebookContent, validateRulebookTable, type RulebookTableKey } from "@/lib/venting";
import type { ColumnDefinition } from "@/lib/venting/rulebook/table-definitions";
import { TEST_CONTENT } from "@/tests/fixtures/venting/rulebook";

/*
 * The rulebook is validated twice over: the zod row schemas type it on the server, and the
 * shape checks written against the column definitions run in the editor without zod. These
 * properties hold the two together, so a column added to one and not the other fails here.
 */

const SHAPE_MESSAGE = /must be (a number|a number or empty|text|yes or no|one of )|is not a table row|is missing/;

/** A cell value: usually right for its column, sometimes any JSON-ish value at all. */
function cellArbitrary(col: ColumnDefinition): fc.Arbitrary<unknown> {
  const right =
    col.kind === "number"
      ? col.required
        ? fc.double({ noNaN: true, noDefaultInfinity: true })
        : fc.option(fc.double({ noNaN: true, noDefaultInfinity: true }), { nil: null })
      : col.kind === "text"
        ? fc.string()
        : col.kind === "boolean"
          ? fc.boolean()
          : fc.constantFrom(...(col.options ?? []));
  const wrong = fc.oneof(
    fc.constant(undefined),
    fc.constant(null),
    fc.constant(Number.NaN),
    fc.constant(Number.POSITIVE_INFINITY),
    fc.string(),
    fc.integer(),
    fc.boolean(),
    fc.constant([]),
    fc.constant({}),
  );
  return fc.oneof({ arbitrary: right, weight: 8 }, { arbitrary: wrong, weight: 1 });
}

function rowArbitrary(table: RulebookTableKey): fc.Arbitrary<unknown> {
  const cols: readonly ColumnDefinition[] = RULEBOOK_TABLES[table].columns;
  const cells = Object.fromEntries(cols.map((c) => [c.key, cellArbitrary(c)]));
  const row = fc.record(cells).map((r) => Object.fromEntries(Object.entries(r).filter(([, v]) => v !== undefined)));
  return fc.oneof({ arbitrary: row, weight: 10 }, { arbitrary: fc.oneof(fc.string(), fc.constant(null), fc.constant([1])), weight: 1 });
}

function tableArbitrary(table: RulebookTableKey): fc.Arbitrary<unknown> {
  return fc.oneof({ arbitrary: fc.array(rowArbitrary(table), { maxLength: 4 }), weight: 12 }, { arbitrary: fc.oneof(fc.constant(undefined), fc.string(), fc.constant({})), weight: 1 });
}

describe("shape checks agree with the zod rulebook schema", () => {
  test.each(RULEBOOK_TABLE_KEYS.map((k) => [k]))("%s: rows pass the shape checks exactly when the row schema accepts them", (table) => {
    fc.assert(
      fc.property(tableArbitrary(table), (rows) => {
        const zodAccepts = rulebookContentSchema.shape[table].safeParse(rows).success;
        const shapeIssues = validateRulebookTable(table, rows).filter((i) => SHAPE_MESSAGE.test(i.message));
        expect(shapeIssues.length === 0).toBe(zodAccepts);
      }),
      { numRuns: 300 },
    );
  });

  test("whole content: the schema accepts it exactly when no shape problem is reported", () => {
    const parts: Record<string, fc.Arbitrary<unknown>> = {
      edition: fc.oneof(fc.string({ minLength: 1 }).filter((s) => s.trim() !== ""), fc.integer()),
      demoDataNote: fc.oneof(fc.constant(undefined), fc.string(), fc.integer()),
      ...Object.fromEntries(RULEBOOK_TABLE_KEYS.map((k) => [k, tableArbitrary(k)])),
    };
    // An undefined demo-data note is dropped, as JSON would drop it.
    const content = fc.record(parts).map((c) => Object.fromEntries(Object.entries(c).filter(([, v]) => v !== undefined)));
    fc.assert(
      fc.property(content, (c) => {
        const zodAccepts = rulebookContentSchema.safeParse(c).success;
        const shapeIssues = validateRulebookContent(c).filter((i) => SHAPE_MESSAGE.test(i.message) || i.column === "edition" || i.column === "demoDataNote");
        expect(shapeIssues.length === 0).toBe(zodAccepts);
      }),
      { numRuns: 200 },
    );
  });
});

describe("shape messages point at the cell", () => {
  test("a row that is not an object, a number given as text, an empty required number", () => {
    const rows = [...structuredClone(TEST_CONTENT.clearances)] as unknown[];
    rows[0] = "single_wall,listed,6";
    (rows[1] as Record<string, unknown>).clearanceIn = "6";
    expect(validateRulebookTable("clearances", rows)).toEqual([
      { table: "clearances", rowIndex: 0, column: null, message: "Row 1 is not a table row; give it one value per column.", severity: "error" },
      { table: "clearances", rowIndex: 1, column: "clearanceIn", message: "Row 2: Clearance must be a number.", severity: "error" },
    ]);
  });

  test("an optional number may be empty (null) but not missing", () => {
    const row = { ...TEST_CONTENT.terminationDistances[0]!, orAboveFt: null };
    expect(validateRulebookTable("terminationDistances", [row])).toEqual([]);
    const { orAboveFt: _dropped, ...missing } = row;
    expect(validateRulebookTable("terminationDistances", [missing])[0]?.message).toBe("Row 1: Or above by must be a number or empty.");
  });

  test("content that is not an object, and a table that is fine while another is broken", () => {
    expect(validateRulebookContent("rulebook")[0]?.message).toBe("The rulebook must be an object holding the edition and every table.");
    const c = structuredClone(TEST_CONTENT) as unknown as Record<string, unknown>;
    c.fasteners = "none";
    const supportSpacing = c.supportSpacing as Record<string, unknown>[];
    supportSpacing[0]!.maxSpacingFt = -1;
    const issues = validateRulebookContent(c);
    expect(issues).toContainEqual(expect.objectContaining({ table: "fasteners", rowIndex: null, message: expect.stringContaining("is missing") }));
    // The broken fasteners table no longer hides the value problems of the others.
    expect(issues).toContainEqual(expect.objectContaining({ table: "supportSpacing", rowIndex: 0, message: expect.stringContaining("must not be negative") }));
  });
});
