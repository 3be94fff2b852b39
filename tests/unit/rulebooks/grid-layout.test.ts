import { describe, expect, test } from "vitest";
import { GRID_ROOM_REM, WIDE_TEXT_MIN_REM, rulebookGridLayout, rulebookGridLayouts } from "@/lib/rulebooks/grid-layout";
import { RULEBOOK_TABLES, RULEBOOK_TABLE_KEYS, type ColumnDefinition } from "@/lib/venting/rulebook/table-definitions";

/*
 * The editor's grid must fit a 1280 px screen (62 rem of room beside the navigation) without
 * scrolling sideways, with citations at least WIDE_TEXT_MIN_REM wide or on a line of their own.
 */

describe("rulebook grid layout", () => {
  test.each(RULEBOOK_TABLE_KEYS.flatMap((table) => [[table, true] as const, [table, false] as const]))("%s (editable: %s) fits the room of a 1280 px screen", (table, editable) => {
    const layout = rulebookGridLayout(table, editable);
    expect(layout.minWidthRem).toBeLessThanOrEqual(GRID_ROOM_REM);
    const fixed = layout.indexRem + layout.actionsRem + Object.values(layout.widthsRem).reduce((a, b) => a + b, 0);
    if (!layout.stacked) expect(layout.minWidthRem).toBe(fixed + layout.wide.length * WIDE_TEXT_MIN_REM);
    else expect(fixed + layout.wide.length * WIDE_TEXT_MIN_REM).toBeGreaterThan(GRID_ROOM_REM);
  });

  test("every column is either given a width or is a sentence column, never both", () => {
    for (const table of RULEBOOK_TABLE_KEYS) {
      const layout = rulebookGridLayout(table, true);
      const columns = (RULEBOOK_TABLES[table].columns as readonly ColumnDefinition[]).map((c) => c.key);
      expect([...Object.keys(layout.widthsRem), ...layout.wide].sort()).toEqual([...columns].sort());
      expect(layout.wide).toContain("citation");
    }
  });

  test("the wide capacity table puts its citation under each row; the parameters keep it beside", () => {
    expect(rulebookGridLayout("capacity", true).stacked).toBe(true);
    expect(rulebookGridLayout("parameters", true).stacked).toBe(false);
    expect(rulebookGridLayout("parameters", false).actionsRem).toBe(0);
    expect(Object.keys(rulebookGridLayouts(true)).sort()).toEqual([...RULEBOOK_TABLE_KEYS].sort());
  });
});
