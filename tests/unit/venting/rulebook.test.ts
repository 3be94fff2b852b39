import { z } from "zod";
import { describe, expect, expectTypeOf, test } from "vitest";
import { DEMO_MULTIPLE_APPLIANCE_CITATION } from "@/db/seeds/data/starter-multiple-appliance";
import { STARTER_RULEBOOK, STARTER_RULEBOOK_NAME, DEMO_CAPACITY_CITATION } from "@/db/seeds/data/starter-rulebook";
import {
  PARAMETER_DEFINITIONS,
  RULEBOOK_TABLES,
  RULEBOOK_TABLE_KEYS,
  RulebookInvalidError,
  prepareRulebook,
  rulebookContentSchema,
  validateRulebookContent,
  validateRulebookTable,
  type RulebookContent,
  type RulebookRow,
} from "@/lib/venting";
import { TEST_CONTENT } from "@/tests/fixtures/venting/rulebook";

const clone = (): RulebookContent => structuredClone(TEST_CONTENT);

describe("starter rulebook", () => {
  test("validates with no issues", () => {
    expect(STARTER_RULEBOOK_NAME.length).toBeGreaterThan(0);
    expect(validateRulebookContent(STARTER_RULEBOOK)).toEqual([]);
  });

  test("every code value names edition and section and says how sure it is; every capacity row says demo data", () => {
    // The confidence words follow the reference table's column: found, memory, practice.
    const SOURCED = /\(read in the published text\b|\(from memory — verify\)|\(common practice, not a code value\)/;
    const PRACTICE = "(common practice, not a code value)";
    for (const key of RULEBOOK_TABLE_KEYS) {
      for (const row of STARTER_RULEBOOK[key] as { citation: string }[]) {
        if (key === "capacity") {
          expect(row.citation).toBe(DEMO_CAPACITY_CITATION);
          continue;
        }
        if (key === "ventConnectorCapacity" || key === "commonVentCapacity") {
          expect(row.citation).toBe(DEMO_MULTIPLE_APPLIANCE_CITATION);
          continue;
        }
        expect(row.citation, `${key}: ${row.citation}`).toMatch(SOURCED);
        // A trade rule of thumb cites no code; every code value names the edition and a section number.
        if (!row.citation.includes(PRACTICE)) expect(row.citation, `${key}: ${row.citation}`).toMatch(/\b2018 (IFGC|IRC|IMC)\b[^;]*(\d{3}|\b[A-Z]\.\d)/);
      }
    }
    expect(DEMO_CAPACITY_CITATION).toBe("Demo data — invented, not from any code or manufacturer");
    expect(STARTER_RULEBOOK.demoDataNote).toContain("invented");
  });

  test("values the reference table marks as recalled say so (IFGC 304.5.3.2, Table 503.10.5, Appendix D Table D.6)", () => {
    const param = (k: string) => STARTER_RULEBOOK.parameters.find((p) => p.key === k)!.citation;
    // Reference C4: 2 in² per 1,000 Btu/h between stories, from memory.
    expect(param("opening_indoor_different_stories_sqin_per_1000_btuh")).toContain("(from memory — verify)");
    // Reference A12/A13: connector clearances, from memory.
    for (const row of STARTER_RULEBOOK.clearances) expect(row.citation).toContain("(from memory — verify)");
    // Reference D2: flue CO limits, values from memory.
    for (const row of STARTER_RULEBOOK.flueCoLimits) expect(row.citation).toContain("(from memory — verify)");
    // Reference A1: connector slope, read in IFGC 503.10.8.
    expect(param("connector_min_slope_in_per_ft")).toBe("2018 IFGC 503.10.8; 2018 IRC G2427.10.8 (read in the published text)");
  });

  test("defines every parameter once", () => {
    expect(STARTER_RULEBOOK.parameters.map((p) => p.key).sort()).toEqual(Object.keys(PARAMETER_DEFINITIONS).sort());
  });

  test("capacity covers 6–30 ft, laterals 0/5/10, diameters 3–8 for both connector materials", () => {
    const rows = STARTER_RULEBOOK.capacity;
    expect(new Set(rows.map((r) => r.heightFt))).toEqual(new Set([6, 8, 10, 15, 20, 30]));
    expect(new Set(rows.map((r) => r.lateralFt))).toEqual(new Set([0, 5, 10]));
    expect(new Set(rows.map((r) => r.diameterIn))).toEqual(new Set([3, 4, 5, 6, 7, 8]));
    expect(new Set(rows.map((r) => r.connectorMaterial))).toEqual(new Set(["single_wall", "type_b"]));
  });
});

describe("RULEBOOK_TABLES metadata", () => {
  test("columns match each row schema exactly and include a citation", () => {
    for (const key of RULEBOOK_TABLE_KEYS) {
      const def = RULEBOOK_TABLES[key];
      const field = rulebookContentSchema.shape[key];
      // Tables added later carry a default (older stored versions read as empty): unwrap it.
      const array = field instanceof z.ZodDefault ? field.unwrap() : field;
      const shapeKeys = Object.keys(array.element.shape).sort();
      expect(def.columns.map((c) => c.key).sort()).toEqual(shapeKeys);
      expect(def.columns.some((c) => c.key === "citation" && c.required)).toBe(true);
      for (const u of def.uniqueBy) expect(shapeKeys).toContain(u);
    }
  });

  test("type-level: row types follow the schemas", () => {
    expectTypeOf<RulebookRow<"clearances">>().toEqualTypeOf<{ pipeMaterial: "single_wall" | "type_b"; applianceListing: "listed" | "unlisted"; clearanceIn: number; citation: string }>();
    expectTypeOf<RulebookRow<"capacity">["fanMaxBtuh"]>().toEqualTypeOf<number | null>();
  });
});

describe("validateRulebookContent", () => {
  test("missing citation", () => {
    const c = clone();
    c.clearances[1]!.citation = "  ";
    expect(validateRulebookContent(c)).toEqual([
      { table: "clearances", rowIndex: 1, column: "citation", message: "Row 2: add the citation (code section, manual page) this value comes from.", severity: "error" },
    ]);
  });

  test("negative length, share outside 0–1, whole numbers", () => {
    const c = clone();
    c.supportSpacing[0]!.maxSpacingFt = -5;
    c.connectorLengthShare[0]!.shareOfVentHeight = 75;
    c.fasteners[0]!.minPerJoint = 2.5;
    const issues = validateRulebookContent(c);
    expect(issues).toContainEqual(expect.objectContaining({ table: "supportSpacing", rowIndex: 0, column: "maxSpacingFt", message: expect.stringContaining("must not be negative") }));
    expect(issues).toContainEqual(expect.objectContaining({ table: "connectorLengthShare", column: "shareOfVentHeight", message: expect.stringContaining("75 % is 0.75") }));
    expect(issues).toContainEqual(expect.objectContaining({ table: "fasteners", column: "minPerJoint", message: expect.stringContaining("whole number") }));
  });

  test("duplicated row", () => {
    const c = clone();
    c.louverShares.push({ ...c.louverShares[0]! });
    expect(validateRulebookContent(c)).toContainEqual(expect.objectContaining({ table: "louverShares", rowIndex: 2, message: "Row 3 repeats row 1 (same louver); remove one or change it." }));
  });

  test("roof pitches out of order, with gaps, or reversed", () => {
    const c = clone();
    const rows = c.terminationHeights;
    [rows[1], rows[2]] = [rows[2]!, rows[1]!];
    const issues = validateRulebookContent(c).filter((i) => i.table === "terminationHeights");
    expect(issues.some((i) => i.message.includes("sort the roof pitches"))).toBe(true);
    const c2 = clone();
    c2.terminationHeights[3]!.pitchFromPer12 = 8.5;
    expect(validateRulebookContent(c2).some((i) => i.message.includes("make each row start where the previous one ends"))).toBe(true);
    const c3 = clone();
    c3.terminationHeights[0]!.pitchToPer12 = 0;
    expect(validateRulebookContent(c3).some((i) => i.message.includes("must be above pitch from"))).toBe(true);
  });

  test("max below min in the capacity table, and holes in the grid", () => {
    const c = clone();
    c.capacity[3]!.fanMinBtuh = 90_000; // fan max is 60,000
    c.capacity.splice(0, 1);
    const issues = validateRulebookContent(c);
    expect(issues).toContainEqual(expect.objectContaining({ table: "capacity", column: "fanMinBtuh", severity: "error", message: expect.stringContaining("above the fan-assisted max") }));
    expect(issues).toContainEqual(expect.objectContaining({ table: "capacity", severity: "warning", message: expect.stringContaining("no row for height 10 ft with lateral 0 ft") }));
  });

  test("parameter in the wrong unit or a flag that is not 0/1", () => {
    const c = clone();
    c.parameters[0]!.unit = "mm/m";
    c.parameters.find((p) => p.key === "capacity_interpolation_allowed")!.value = 2;
    const msgs = validateRulebookContent(c).map((i) => i.message);
    expect(msgs.some((m) => m.includes('measured in "in/ft", not "mm/m"'))).toBe(true);
    expect(msgs.some((m) => m.includes("enter 1 for yes or 0 for no"))).toBe(true);
  });

  test("structural errors are mapped to table, row and column", () => {
    const c = clone() as unknown as Record<string, unknown[]>;
    (c.clearances![0] as Record<string, unknown>).clearanceIn = "six";
    (c.clearances![1] as Record<string, unknown>).pipeMaterial = "copper";
    const issues = validateRulebookContent(c);
    expect(issues).toContainEqual(expect.objectContaining({ table: "clearances", rowIndex: 0, column: "clearanceIn", message: "Row 1: Clearance must be a number." }));
    expect(issues).toContainEqual(expect.objectContaining({ table: "clearances", rowIndex: 1, column: "pipeMaterial", message: "Row 2: Pipe material must be one of single_wall, type_b." }));
    delete (c as Record<string, unknown>).louverShares;
    expect(validateRulebookContent(c)).toContainEqual(expect.objectContaining({ table: "louverShares", rowIndex: null }));
  });

  test("validateRulebookTable checks one table", () => {
    expect(validateRulebookTable("louverShares", [{ louver: "wood", freeAreaShare: 1.5, citation: "x" }])[0]?.message).toContain("a share is a number from 0 to 1");
    expect(validateRulebookTable("louverShares", STARTER_RULEBOOK.louverShares)).toEqual([]);
  });
});

describe("prepareRulebook", () => {
  test("memoises per content object", () => {
    const c = clone();
    expect(prepareRulebook(c)).toBe(prepareRulebook(c));
  });
  test("throws a typed error with issues on structurally invalid content", () => {
    expect(() => prepareRulebook({ edition: "x" })).toThrow(RulebookInvalidError);
    try {
      prepareRulebook({ edition: "x" });
    } catch (e) {
      expect((e as RulebookInvalidError).issues.length).toBeGreaterThan(0);
    }
  });
  test("schema parse keeps content unchanged", () => {
    expect(rulebookContentSchema.parse(STARTER_RULEBOOK)).toEqual(STARTER_RULEBOOK);
  });
});
