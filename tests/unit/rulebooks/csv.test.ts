import { describe, expect, test } from "vitest";
import { STARTER_RULEBOOK } from "@/db/seeds/data/starter-rulebook";
import { csvFileName, parseCsv, parseTableCsv, rulebookToCsv, tableToCsv } from "@/lib/rulebooks/csv";
import { RULEBOOK_TABLE_KEYS } from "@/lib/venting";

describe("CSV round trip", () => {
  test.each(RULEBOOK_TABLE_KEYS)("starter table %s survives export and import unchanged", (table) => {
    const csv = tableToCsv(table, STARTER_RULEBOOK[table] as never);
    const back = parseTableCsv(table, csv);
    expect(back.ok).toBe(true);
    if (back.ok) expect(back.rows).toEqual(STARTER_RULEBOOK[table]);
  });

  test("rulebookToCsv gives one file per table", () => {
    const files = rulebookToCsv(STARTER_RULEBOOK);
    expect(Object.keys(files).sort()).toEqual([...RULEBOOK_TABLE_KEYS].sort());
    expect(files.capacity.split("\r\n")[0]).toBe("ventMaterial,connectorMaterial,heightFt,lateralFt,diameterIn,fanMinBtuh,fanMaxBtuh,naturalMaxBtuh,citation");
    expect(csvFileName("terminationHeights")).toBe("termination-heights.csv");
  });

  test("quoted fields with commas, quotes and line breaks", () => {
    const rows = [{ louver: "wood" as const, freeAreaShare: 0.25, citation: 'Sec. 304.10, "louvers",\nsecond line' }];
    const csv = tableToCsv("louverShares", rows);
    expect(csv).toContain('"Sec. 304.10, ""louvers"",\nsecond line"');
    const back = parseTableCsv("louverShares", csv);
    expect(back.ok && back.rows).toEqual(rows);
  });
});

describe("CSV import", () => {
  test("accepts labels with units as headers, in any order, and yes/no booleans", () => {
    const csv = ["Citation,Passes through,Material,Prohibited,Allowed with thimble,Note", "Sec. X,attic,single_wall,yes,no,"].join("\n");
    const r = parseTableCsv("prohibitedPassages", csv);
    expect(r).toEqual({ ok: true, warnings: [], rows: [{ citation: "Sec. X", passage: "attic", material: "single_wall", prohibited: true, allowedWithThimble: false, note: "" }] });
    const r2 = parseTableCsv("clearances", "Pipe material,Appliance listing,Clearance (in),Citation\r\ntype_b,listed,1,Sec. Y\r\n");
    expect(r2.ok && r2.rows[0]?.clearanceIn).toBe(1);
  });

  test("row-by-row error report with line numbers and columns", () => {
    const csv = [
      "pipeMaterial,applianceListing,clearanceIn,citation",
      "single_wall,listed,6,Sec. A",
      "copper,listed,6,Sec. B",
      "single_wall,unlisted,nine,Sec. C",
      "single_wall,unlisted,-9,Sec. D",
      "single_wall,listed,6,",
      "type_b,listed,1",
    ].join("\n");
    const r = parseTableCsv("clearances", csv);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.errors).toEqual([
      { line: 3, column: "pipeMaterial", message: 'Pipe material must be one of single_wall, type_b, not "copper".' },
      { line: 4, column: "clearanceIn", message: 'Clearance must be a number, not "nine".' },
      { line: 5, column: "clearanceIn", message: "Line 5: Clearance is -9; it must not be negative." },
      { line: 6, column: "citation", message: "Line 6: add the citation (code section, manual page) this value comes from." },
      { line: 6, column: null, message: "Line 6 repeats line 2 (same pipe material, appliance listing); remove one or change it." },
      { line: 7, column: null, message: "This line has 3 fields; the header has 4. Check for a missing or extra comma." },
    ]);
  });

  test("header problems: unknown, duplicate and missing columns", () => {
    const r = parseTableCsv("louverShares", "louver,share,louver\nwood,0.25,wood\n");
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.errors.map((e) => e.message)).toEqual([
      'Unknown column "share". Columns of this table: louver, freeAreaShare, citation.',
      'The column "louver" appears twice; keep one.',
      'The column "Free-area share" is missing from the header line.',
      'The column "Citation" is missing from the header line.',
    ]);
  });

  test("malformed quotes and empty files", () => {
    expect(parseTableCsv("louverShares", 'louver,freeAreaShare,citation\nwood,0.25,"open\n')).toEqual({ ok: false, errors: [{ line: 2, column: null, message: expect.stringContaining("not closed") }] });
    expect(parseTableCsv("louverShares", 'louver,freeAreaShare,citation\nwood,0.25,a"b\n')).toMatchObject({ ok: false, errors: [{ line: 2 }] });
    expect(parseTableCsv("louverShares", "\n\n")).toMatchObject({ ok: false, errors: [{ line: 1, message: expect.stringContaining("empty") }] });
  });

  test("empty optional number cells become null; warnings do not block", () => {
    const csv = [
      "ventMaterial,connectorMaterial,heightFt,lateralFt,diameterIn,fanMinBtuh,fanMaxBtuh,naturalMaxBtuh,citation",
      "type_b,type_b,10,0,4,,100000,60000,T",
      "type_b,type_b,20,10,4,30000,\"120,000\",70000,T",
    ].join("\n");
    const r = parseTableCsv("capacity", csv);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.rows[0]!.fanMinBtuh).toBeNull();
    expect(r.rows[1]!.fanMaxBtuh).toBe(120_000);
    expect(r.warnings.length).toBe(2); // grid holes: (10, 10) and (20, 0)
  });

  test("parseCsv keeps the starting line of records that span lines, and skips blank lines", () => {
    const { records, error } = parseCsv('a,b\n\n"x\ny",z\nlast,1');
    expect(error).toBeNull();
    expect(records.map((r) => r.line)).toEqual([1, 3, 5]);
    expect(records[1]!.fields).toEqual(["x\ny", "z"]);
  });
});
