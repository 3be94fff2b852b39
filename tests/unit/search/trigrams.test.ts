import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { MAX_QUERY_TRIGRAMS, foldLikeSqlite, queryTrigrams, trigramsOf } from "@/lib/search/trigrams";

describe("trigrams for the job search", () => {
  test("folds only A–Z, as SQLite's LIKE does (SQLite docs, 'The LIKE, GLOB, REGEXP, MATCH, and extract operators': case-insensitive for ASCII only)", () => {
    expect(foldLikeSqlite("Brook LANE 12")).toBe("brook lane 12");
    expect(foldLikeSqlite("ÖSTERBY Æble")).toBe("Österby Æble");
  });

  test("every distinct trigram of each text, none spanning two texts", () => {
    expect(trigramsOf(["Brook", "Ash"]).sort()).toEqual(["ash", "bro", "ook", "roo"]);
    expect(trigramsOf(["aaaa"])).toEqual(["aaa"]);
    expect(trigramsOf(["ab", ""])).toEqual([]);
    // Characters, not UTF-16 units: an astral character is one character.
    expect(trigramsOf(["a😀b"])).toEqual(["a😀b"]);
  });

  test("a query shorter than three characters has no trigrams (the search scans instead)", () => {
    expect(queryTrigrams("br")).toEqual([]);
    expect(queryTrigrams("bro")).toEqual(["bro"]);
  });

  test("a long query keeps at most a handful, the first and the last among them", () => {
    const grams = queryTrigrams("Fernhollow Cormorant Rise");
    expect(grams.length).toBeLessThanOrEqual(MAX_QUERY_TRIGRAMS);
    expect(grams).toContain("fer");
    expect(grams).toContain("ise");
  });

  test("property: whatever a text contains (as LIKE sees it), its trigrams hold the query's", () => {
    fc.assert(
      fc.property(fc.string({ unit: "grapheme-composite" }), fc.nat(), fc.nat(), (text, a, b) => {
        const chars = Array.from(text);
        const from = chars.length ? a % chars.length : 0;
        const query = chars.slice(from, from + (b % 12)).join("");
        // Change the case of the query's ASCII letters at random: LIKE still matches.
        const shouted = query.replace(/[a-z]/g, (c, i: number) => ((a + i) % 2 ? c.toUpperCase() : c));
        const held = new Set(trigramsOf(["x", text, "y"]));
        expect(queryTrigrams(shouted).every((g) => held.has(g))).toBe(true);
      }),
      { numRuns: 500 },
    );
  });
});
