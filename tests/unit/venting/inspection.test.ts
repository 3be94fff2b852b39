import { readFileSync } from "node:fs";
import { describe, expect, test } from "vitest";
import {
  checkInputSchema,
  evaluateInspection,
  evaluateOrphanedAppliance,
  FINDING_CATALOGUE,
  FINDING_CODES,
  summarizeFindings,
  ventRunSchema,
} from "@/lib/venting";
import { RB, furnace, goodRun, only, waterHeater, withCode } from "@/tests/fixtures/venting/rulebook";

describe("common_vent.orphaned", () => {
  // IFGC 504.3.18, 501.15 (REFERENCE.md B10, found / memory): an appliance left alone on an oversized vent is re-checked against the minimum.
  const oldCommon = ventRunSchema.parse({
    applianceIds: ["furnace", "wh"],
    segments: [
      { id: "w1", applianceId: "wh", material: "type_b", diameterIn: 4, lengthFt: 5, orientation: "horizontal", riseIn: 2, turns90: 2 },
      { id: "f1", applianceId: "furnace", material: "type_b", diameterIn: 4, lengthFt: 3, orientation: "horizontal", riseIn: 1 },
    ],
    vent: { material: "type_b", diameterIn: 5, heightFt: 15, lateralFt: 0, serves: "common" },
  });

  test("a natural-draft water heater left on a 5 in vent: checked against the single-appliance maximum", () => {
    // 5 in, 15 ft, lateral 5 (the water heater's connector): nat l0 = 105,000, l10 = 90,000 → 97,500 ≥ 40,000
    const f = evaluateOrphanedAppliance(oldCommon, [furnace(), waterHeater()], ["furnace"], RB);
    expect(f.code).toBe("common_vent.orphaned");
    expect(f.status).toBe("pass");
    expect(f.required?.value).toBeCloseTo(97_500, 6);
  });

  test("a fan-assisted appliance left below the minimum fails", () => {
    // fan min at 5 in, 15 ft, lateral 5: l10 = 37,500 → 18,750; 15,000 is below
    const f = evaluateOrphanedAppliance(oldCommon, [furnace(), waterHeater({ draft: "fan_assisted", inputBtuh: 15_000 })], ["furnace"], RB);
    expect(f.status).toBe("fail");
    expect(f.message).toContain("below the 18,750 Btu/h minimum");
    expect(f.message).toContain("Resize or reline");
  });

  test("through evaluateInspection the orphan finding replaces vent.capacity", () => {
    const input = checkInputSchema.parse({ appliances: [furnace(), waterHeater()], ventRun: oldCommon, removedAppliances: [{ id: "furnace", label: "Old furnace", inputBtuh: 80_000 }] });
    const r = evaluateInspection(input, RB);
    expect(withCode(r.findings, "vent.capacity")).toHaveLength(0);
    expect(only(r.findings, "common_vent.orphaned").status).toBe("pass");
    expect(withCode(r.findings, "connector.slope").map((f) => f.target.itemId)).toEqual(["w1"]);
  });

  test("no appliance left warns", () => {
    expect(evaluateOrphanedAppliance(oldCommon, [furnace(), waterHeater()], ["furnace", "wh"], RB).status).toBe("warn");
  });
});

describe("evaluateInspection", () => {
  test("summary counts and worst status", () => {
    const input = checkInputSchema.parse({ appliances: [furnace()], ventRun: goodRun() });
    const r = evaluateInspection(input, RB);
    expect(r.summary.total).toBe(r.findings.length);
    expect(r.summary.counts.fail).toBe(0);
    expect(r.findings.every((f) => f.status === "pass")).toBe(true);
    expect(r.summary.worst).toBe("pass");
    expect(r.edition).toContain("from memory");
  });

  test("worst ranks fail over needs-info over warn", () => {
    const mk = (status: "pass" | "warn" | "needs-info" | "fail") => ({ ...only(evaluateInspection(checkInputSchema.parse({ appliances: [furnace()], ventRun: goodRun() }), RB).findings, "vent.min_height"), status });
    expect(summarizeFindings([mk("pass"), mk("warn")]).worst).toBe("warn");
    expect(summarizeFindings([mk("warn"), mk("needs-info")]).worst).toBe("needs-info");
    expect(summarizeFindings([mk("fail"), mk("needs-info")]).worst).toBe("fail");
    expect(summarizeFindings([]).worst).toBeNull();
  });

  test("an empty draft evaluates without throwing and never passes silently", () => {
    const input = checkInputSchema.parse({ appliances: [{ id: "a" }], ventRun: { segments: [{ id: "s" }] }, airSpace: { rooms: [{ id: "r" }] }, readings: [{ applianceId: "a" }] });
    const r = evaluateInspection(input, RB);
    expect(r.findings.length).toBeGreaterThan(5);
    expect(r.findings.filter((f) => f.status === "pass").map((f) => f.code)).toEqual([]);
  });

  test("every finding names a catalogued code, a unit with each number, and a target path", () => {
    const example = JSON.parse(readFileSync("docs/examples/check-request.json", "utf8"));
    const input = checkInputSchema.parse(example);
    const r = evaluateInspection(input, RB);
    const codes = new Set(Object.values(FINDING_CODES));
    for (const f of r.findings) {
      expect(codes.has(f.code)).toBe(true);
      expect(f.title).toBe(FINDING_CATALOGUE[f.code].title);
      if (f.measured) expect(f.measured.unit).not.toBe("");
      if (f.required) {
        expect(f.required.unit).not.toBe("");
        expect(f.citation).not.toBeNull();
      }
      expect(f.target.path.startsWith(f.target.section)).toBe(true);
      expect(f.message.length).toBeGreaterThan(10);
    }
  });
});

describe("docs/engine.md worked example", () => {
  test("the documented findings are exactly what the engine returns for the example request", async () => {
    const { STARTER_RULEBOOK } = await import("@/db/seeds/data/starter-rulebook");
    const { prepareRulebook } = await import("@/lib/venting");
    const doc = readFileSync("docs/engine.md", "utf8");
    const block = doc.split("<!-- example-findings:start -->")[1]!.split("<!-- example-findings:end -->")[0]!;
    const documented = block
      .split("\n")
      .filter((l) => l.startsWith("| ") && l.includes("`") && !l.startsWith("| ---"))
      .map((l) => {
        const [status, code, path, message] = l.slice(2, -2).split(" | ").map((c) => c.replace(/`/g, ""));
        return { status, code, path, message };
      });
    const input = checkInputSchema.parse(JSON.parse(readFileSync("docs/examples/check-request.json", "utf8")));
    const r = evaluateInspection(input, prepareRulebook(STARTER_RULEBOOK));
    expect(documented).toEqual(r.findings.map((f) => ({ status: f.status, code: f.code, path: f.target.path, message: f.message })));
    expect(r.summary.counts).toEqual({ pass: 22, "not-applicable": 1, warn: 0, "needs-info": 0, fail: 6 });
  });
});
