import { describe, expect, test } from "vitest";
import { STARTER_RULEBOOK } from "@/db/seeds/data/starter-rulebook";
import { parseTableCsv, tableToCsv } from "@/lib/rulebooks/csv";
import { describeRowKey, diffTableRows, formatCell, isEmptyDiff } from "@/lib/rulebooks/csv-diff";
import { RULEBOOK_TABLE_KEYS } from "@/lib/venting";

/*
 * The rows here are hand-made; the values in them are only there to be compared, not checked
 * against any code.
 */

const clearances = [
  { pipeMaterial: "single_wall", applianceListing: "listed", clearanceIn: 6, citation: "Sec. A" },
  { pipeMaterial: "single_wall", applianceListing: "unlisted", clearanceIn: 9, citation: "Sec. B" },
  { pipeMaterial: "type_b", applianceListing: "listed", clearanceIn: 1, citation: "Sec. C" },
];
const HEADER = "pipeMaterial,applianceListing,clearanceIn,citation";

function importCsv(lines: string[]) {
  const result = parseTableCsv("clearances", [HEADER, ...lines].join("\r\n"));
  if (!result.ok) throw new Error(result.errors.map((e) => e.message).join("; "));
  return result.rows;
}

describe("diffTableRows", () => {
  test.each(RULEBOOK_TABLE_KEYS)("a starter table %s exported and imported again changes nothing", (table) => {
    const rows = STARTER_RULEBOOK[table] as Record<string, unknown>[];
    const back = parseTableCsv(table, tableToCsv(table, rows as never));
    expect(back.ok).toBe(true);
    if (!back.ok) return;
    const diff = diffTableRows(table, rows, back.rows as Record<string, unknown>[]);
    expect(diff.unchangedCount).toBe(rows.length);
    expect(isEmptyDiff(diff)).toBe(true);
  });

  test("added, changed, removed and unchanged rows, matched by the table's unique columns", () => {
    const imported = importCsv([
      "single_wall,listed,7,Sec. A as amended", // changed: clearance and citation
      "type_b,listed,1,Sec. C", // unchanged
      "type_b,unlisted,2,Sec. D", // added
      // single_wall/unlisted is left out: removed
    ]);
    const diff = diffTableRows("clearances", clearances, imported);
    expect(diff.unchangedCount).toBe(1);
    expect(diff.added).toEqual([{ key: "Type B · Unlisted", afterIndex: 2, row: imported[2] }]);
    expect(diff.removed).toEqual([{ key: "Single-wall · Unlisted", beforeIndex: 1, row: clearances[1] }]);
    expect(diff.changed).toEqual([
      {
        key: "Single-wall · Listed",
        beforeIndex: 0,
        afterIndex: 0,
        changes: [
          { column: "clearanceIn", before: 6, after: 7 },
          { column: "citation", before: "Sec. A", after: "Sec. A as amended" },
        ],
      },
    ]);
    expect(diff.orderChanged).toBe(false);
    expect(isEmptyDiff(diff)).toBe(false);
  });

  test("a changed key column is a removal and an addition, not a change", () => {
    const imported = importCsv(["single_wall,listed,6,Sec. A", "single_wall,unlisted,9,Sec. B", "type_b,unlisted,1,Sec. C"]);
    const diff = diffTableRows("clearances", clearances, imported);
    expect(diff.changed).toEqual([]);
    expect(diff.added.map((a) => a.key)).toEqual(["Type B · Unlisted"]);
    expect(diff.removed.map((r) => r.key)).toEqual(["Type B · Listed"]);
  });

  test("the same rows in another order: nothing changed but the order", () => {
    const diff = diffTableRows("clearances", clearances, [clearances[2]!, clearances[0]!, clearances[1]!]);
    expect(diff.unchangedCount).toBe(3);
    expect(diff.orderChanged).toBe(true);
    expect(isEmptyDiff(diff)).toBe(false);
  });

  test("a number still typed as text in the grid equals the same number from a file", () => {
    const grid = [{ ...clearances[0]!, clearanceIn: "6" }];
    const diff = diffTableRows("clearances", grid, [clearances[0]!]);
    expect(diff.unchangedCount).toBe(1);
    expect(diff.changed).toEqual([]);
  });

  test("an empty optional cell equals a missing one", () => {
    const row = { ventSystem: "mechanical_draft", opening: "door", minDistanceFt: 4, orAboveFt: null, citation: "Sec. E" };
    const diff = diffTableRows("terminationDistances", [{ ...row, orAboveFt: undefined }], [row]);
    expect(diff.unchangedCount).toBe(1);
  });

  test("duplicate keys on either side are reported and paired in order", () => {
    const duplicated = [clearances[0]!, { ...clearances[0]!, clearanceIn: 8 }];
    const fromGrid = diffTableRows("clearances", duplicated, [clearances[0]!]);
    expect(fromGrid.duplicateKeys).toEqual([{ side: "current", key: "Single-wall · Listed", count: 2 }]);
    expect(fromGrid.unchangedCount).toBe(1);
    expect(fromGrid.removed).toEqual([{ key: "Single-wall · Listed", beforeIndex: 1, row: duplicated[1] }]);

    const fromFile = diffTableRows("clearances", [clearances[0]!], duplicated);
    expect(fromFile.duplicateKeys).toEqual([{ side: "imported", key: "Single-wall · Listed", count: 2 }]);
    expect(fromFile.unchangedCount).toBe(1);
    expect(fromFile.added).toEqual([{ key: "Single-wall · Listed", afterIndex: 1, row: duplicated[1] }]);
  });

  test("a CSV cell that looks like a formula stays literal text and is pointed out", () => {
    const imported = importCsv(['single_wall,listed,6,"=HYPERLINK(""http://example.invalid"",""Sec. A"")"', "single_wall,unlisted,9,Sec. B", "type_b,listed,1,Sec. C"]);
    const diff = diffTableRows("clearances", clearances, imported);
    expect(diff.changed).toEqual([
      { key: "Single-wall · Listed", beforeIndex: 0, afterIndex: 0, changes: [{ column: "citation", before: "Sec. A", after: '=HYPERLINK("http://example.invalid","Sec. A")' }] },
    ]);
    expect(diff.formulaLikeCells).toEqual([{ afterIndex: 0, column: "citation", value: '=HYPERLINK("http://example.invalid","Sec. A")' }]);

    // In a number column a formula is not a number: the import stops there, before any preview.
    const bad = parseTableCsv("clearances", [HEADER, "single_wall,listed,=2+4,Sec. A"].join("\r\n"));
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.errors[0]).toMatchObject({ line: 2, column: "clearanceIn" });
  });

  test("an import that empties the table removes every row", () => {
    const diff = diffTableRows("clearances", clearances, []);
    expect(diff.removed).toHaveLength(3);
    expect(diff.added).toEqual([]);
  });
});

describe("formatCell and describeRowKey", () => {
  test("options by human name, numbers with unit, flags as yes/no, empties named", () => {
    expect(formatCell("clearances", "pipeMaterial", "single_wall")).toBe("Single-wall");
    expect(formatCell("clearances", "clearanceIn", 6)).toBe("6 in");
    expect(formatCell("capacity", "fanMaxBtuh", 423000)).toBe("423,000 Btu/h");
    expect(formatCell("capacity", "fanMinBtuh", null)).toBe("(empty)");
    expect(formatCell("prohibitedPassages", "allowedWithThimble", true)).toBe("Yes");
    expect(formatCell("parameters", "key", "connector_min_slope_in_per_ft")).toBe("Connector minimum slope");
    expect(describeRowKey("capacity", { ventMaterial: "type_b", connectorMaterial: "single_wall", heightFt: 10, lateralFt: 5, diameterIn: 4 })).toBe("Type B · Single-wall · 10 ft · 5 ft · 4 in");
  });
});
