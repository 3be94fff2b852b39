import { describe, expect, test } from "vitest";
import { OPTION_LABELS, PARAMETER_LABELS, humanizeValue, optionLabel, parameterLabel, rulebookChoiceLabels } from "@/lib/venting/rulebook/labels";
import { PARAMETER_KEYS } from "@/lib/venting/rulebook/parameters";
import { RULEBOOK_TABLES, RULEBOOK_TABLE_KEYS, type ColumnDefinition } from "@/lib/venting/rulebook/table-definitions";

/*
 * Every key and option a person can pick in the rulebook editor has a human name. When a table
 * or a parameter is added, these tests list exactly which names are still missing from
 * lib/venting/rulebook/labels.ts.
 */

describe("rulebook labels", () => {
  test("every parameter key has a human name", () => {
    const missing = PARAMETER_KEYS.filter((key) => !Object.hasOwn(PARAMETER_LABELS, key));
    expect(missing, "add these keys to PARAMETER_LABELS").toEqual([]);
  });

  test("every option of every enum column of every table has a human name", () => {
    const missing: string[] = [];
    for (const table of RULEBOOK_TABLE_KEYS) {
      for (const column of RULEBOOK_TABLES[table].columns as readonly ColumnDefinition[]) {
        if (column.kind !== "enum") continue;
        // The parameters table picks parameter keys: those are named by PARAMETER_LABELS.
        const names: Record<string, string> = table === "parameters" && column.key === "key" ? PARAMETER_LABELS : OPTION_LABELS;
        for (const option of column.options ?? []) {
          if (!Object.hasOwn(names, option)) missing.push(`${table}.${column.key}: ${option}`);
        }
      }
    }
    expect(missing, "add these options to OPTION_LABELS (or PARAMETER_LABELS)").toEqual([]);
  });

  test("names are short, non-empty and distinct within a column", () => {
    for (const label of Object.values(PARAMETER_LABELS)) {
      expect(label.trim()).toBe(label);
      expect(label.length).toBeGreaterThan(0);
      // Longer names are cut off in the editor's parameter picker.
      expect(label.length, label).toBeLessThanOrEqual(42);
    }
    expect(new Set(Object.values(PARAMETER_LABELS)).size).toBe(Object.keys(PARAMETER_LABELS).length);
    for (const table of RULEBOOK_TABLE_KEYS) {
      for (const column of RULEBOOK_TABLES[table].columns as readonly ColumnDefinition[]) {
        if (column.kind !== "enum" || table === "parameters") continue;
        const labels = (column.options ?? []).map(optionLabel);
        expect(new Set(labels).size, `${table}.${column.key}`).toBe(labels.length);
      }
    }
  });

  test.each([
    ["single_wall", "Single-wall"],
    ["type_b", "Type B"],
    ["masonry_lined", "Lined masonry"],
    ["fan_assisted", "Fan-assisted"],
    ["natural_draft", "Natural draft"],
    ["operable_window", "Operable window"],
  ])("optionLabel(%s) is %s", (value, label) => {
    expect(optionLabel(value)).toBe(label);
  });

  test("unknown values are made readable rather than shown raw", () => {
    expect(optionLabel("return_plenum")).toBe("Return plenum");
    expect(parameterLabel("return_opening_sqin_per_1000_btuh")).toBe("Return opening sqin per 1000 btuh");
    expect(parameterLabel("connector_min_slope_in_per_ft")).toBe("Connector minimum slope");
    expect(humanizeValue("")).toBe("");
    // Names inherited from Object.prototype are not labels.
    expect(optionLabel("toString")).toBe("ToString");
  });

  test("the editor's label set names every parameter key and every option of the tables", () => {
    const labels = rulebookChoiceLabels();
    expect(Object.keys(labels.parameters).sort()).toEqual([...PARAMETER_KEYS].sort());
    expect(labels.parameters.connector_min_slope_in_per_ft).toBe("Connector minimum slope");
    expect(labels.options).toMatchObject({ single_wall: "Single-wall", type_b: "Type B", masonry_lined: "Lined masonry", operable_window: "Operable window" });
    for (const table of RULEBOOK_TABLE_KEYS) {
      for (const column of RULEBOOK_TABLES[table].columns as readonly ColumnDefinition[]) {
        if (column.kind !== "enum" || table === "parameters") continue;
        for (const option of column.options ?? []) expect(labels.options[option], option).toBe(optionLabel(option));
      }
    }
  });
});
