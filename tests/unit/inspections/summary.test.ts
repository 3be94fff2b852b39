import { describe, expect, test } from "vitest";
import { emptyInspectionData, parseStoredInspectionData } from "@/lib/inspections/data";
import { evaluateInspectionData, submissionBlockers, type InspectionFinding } from "@/lib/inspections/evaluate";
import { DEFAULT_SITE_CHECK_ITEMS } from "@/lib/site-checks";
import { prepareRulebook, readFindingSummary, summarizeFindings, type Finding, type FindingStatus } from "@/lib/venting";
import { STARTER_RULEBOOK } from "@/db/seeds/data/starter-rulebook";
import { furnace } from "@/tests/fixtures/venting/rulebook";

const f = (status: FindingStatus): Finding =>
  ({ code: "joints.locked", status, title: "t", message: "m", citation: null, ruleRef: null, target: { section: "ventRun", itemId: null, field: null, path: "p" }, safety: null }) as Finding;

describe("summaries count not applicable on its own", () => {
  test("counts every status; not applicable is the worst only when nothing else is there", () => {
    expect(summarizeFindings([f("pass"), f("not-applicable"), f("not-applicable")])).toEqual({
      total: 3,
      counts: { pass: 1, "not-applicable": 2, warn: 0, "needs-info": 0, fail: 0 },
      worst: "pass",
    });
    expect(summarizeFindings([f("not-applicable")]).worst).toBe("not-applicable");
    expect(summarizeFindings([f("not-applicable"), f("warn")]).worst).toBe("warn");
    expect(summarizeFindings([f("fail"), f("needs-info"), f("not-applicable")]).worst).toBe("fail");
    expect(summarizeFindings([]).worst).toBeNull();
  });

  test("a summary stored before the status existed still reads, its missing count as 0", () => {
    const old = { total: 27, counts: { pass: 21, warn: 0, "needs-info": 0, fail: 6 }, worst: "fail" };
    expect(readFindingSummary(old)).toEqual({ total: 27, counts: { pass: 21, "not-applicable": 0, warn: 0, "needs-info": 0, fail: 6 }, worst: "fail" });
    expect(readFindingSummary(JSON.parse(JSON.stringify(summarizeFindings([f("not-applicable")]))))?.counts["not-applicable"]).toBe(1);
    expect(readFindingSummary(null)).toBeNull();
    expect(readFindingSummary({})).toBeNull();
    expect(readFindingSummary({ counts: { pass: "x" } })).toEqual({ total: 0, counts: { pass: 0, "not-applicable": 0, warn: 0, "needs-info": 0, fail: 0 }, worst: null });
  });
});

describe("the inspection's findings: site checks answered not applicable", () => {
  const rb = prepareRulebook(STARTER_RULEBOOK);
  const items = DEFAULT_SITE_CHECK_ITEMS.filter((i) => i.appliesTo === "all");

  test("are counted as not applicable, not as passes, and never block a submission", () => {
    const data = emptyInspectionData([furnace()]);
    data.siteChecks = Object.fromEntries(items.map((i) => [i.key, { answer: "na" as const, note: "" }]));
    const e = evaluateInspectionData(data, rb, items);
    const site = e.findings.filter((x) => x.code.startsWith("site_check."));
    expect(site).toHaveLength(items.length);
    expect(site.every((x) => x.status === "not-applicable")).toBe(true);
    const engine = e.findings.filter((x) => !x.code.startsWith("site_check."));
    expect(e.summary.counts["not-applicable"]).toBe(items.length + engine.filter((x) => x.status === "not-applicable").length);
    expect(e.summary.counts.pass).toBe(engine.filter((x) => x.status === "pass").length);
    expect(submissionBlockers(site as InspectionFinding[], {})).toEqual([]);
  });

  test("engine findings that do not apply never block a submission either; needs-info still does", () => {
    const data = emptyInspectionData([furnace()]);
    const e = evaluateInspectionData(data, rb, []);
    const spillage = e.findings.find((x) => x.code === "readings.spillage")!;
    expect(spillage.status).toBe("not-applicable"); // a fan-assisted furnace has no draft hood
    const blockers = submissionBlockers(e.findings, {});
    expect(blockers.some((x) => x.status === "not-applicable")).toBe(false);
    expect(blockers.some((x) => x.status === "needs-info")).toBe(true);
  });
});

describe("inspections stored before the input ranges", () => {
  test("a value now out of range is cleared (asked for again), the rest of the draft is kept", () => {
    const stored = { appliances: [{ id: "a", label: "Furnace", inputBtuh: 80_000 }], readings: [{ applianceId: "a", flueO2Pct: 25, flueCoPpm: 40 }], notes: "kept" };
    const data = parseStoredInspectionData(stored);
    expect(data?.readings[0]).toMatchObject({ applianceId: "a", flueO2Pct: null, flueCoPpm: 40 });
    expect(data?.appliances[0]?.inputBtuh).toBe(80_000);
    expect(data?.notes).toBe("kept");
    expect(stored.readings[0]!.flueO2Pct).toBe(25); // the stored object itself is not changed
  });

  test("something that is not an inspection at all still reads as nothing", () => {
    expect(parseStoredInspectionData({ appliances: "x" })).toBeNull();
  });
});
