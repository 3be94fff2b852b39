import { describe, expect, it } from "vitest";
import {
  DEFAULT_SITE_CHECK_ITEMS,
  SITE_CHECK_APPLIES_TO,
  SITE_CHECK_CITATION,
  SITE_CHECK_COMMON_PRACTICE_CITATION,
  applicableItems,
  siteCheckFindings,
  type SiteCheckAppliance,
  type SiteCheckAppliesTo,
} from "@/lib/site-checks";
import * as defaultsModule from "@/lib/site-checks/defaults";
import { summarizeFindings, type Finding } from "@/lib/venting";

const item = (key: string, appliesTo: SiteCheckAppliesTo = "all") => ({ key, label: `Item ${key}`, help: "", appliesTo });

describe("default site-check items", () => {
  it("has 12–14 items with unique snake_case keys and a known applies-to", () => {
    expect(DEFAULT_SITE_CHECK_ITEMS.length).toBeGreaterThanOrEqual(12);
    expect(DEFAULT_SITE_CHECK_ITEMS.length).toBeLessThanOrEqual(14);
    const keys = DEFAULT_SITE_CHECK_ITEMS.map((i) => i.key);
    expect(new Set(keys).size).toBe(keys.length);
    for (const i of DEFAULT_SITE_CHECK_ITEMS) {
      expect(i.key).toMatch(/^[a-z0-9_]+$/);
      expect(SITE_CHECK_APPLIES_TO).toContain(i.appliesTo);
      expect(i.label.length).toBeGreaterThan(3);
      expect(i.help.length).toBeGreaterThan(3);
    }
  });

  it("is also importable from defaults.ts with its companions", () => {
    expect(defaultsModule.siteCheckFindings).toBe(siteCheckFindings);
    expect(defaultsModule.applicableItems).toBe(applicableItems);
  });
});

describe("siteCheckFindings", () => {
  it.each([
    ["yes", "pass", /^Confirmed on site/],
    ["na", "not-applicable", /not applicable/],
    ["no", "fail", /before leaving the job/],
    [null, "needs-info", /^Confirm on site/],
  ] as const)("answer %s → %s", (answer, status, message) => {
    const [finding] = siteCheckFindings([item("vent_cap_clear")], { vent_cap_clear: { answer, note: "" } });
    expect(finding).toMatchObject({
      code: "site_check.vent_cap_clear",
      status,
      ruleRef: null,
      target: { section: "siteChecks", itemId: "vent_cap_clear", field: "answer", path: "siteChecks.vent_cap_clear" },
    });
    expect(finding!.message).toMatch(message);
  });

  it("counts a not-applicable answer as not applicable, never as a pass, and raises no caution", () => {
    const co = DEFAULT_SITE_CHECK_ITEMS.find((i) => i.key === "co_alarm_working")!;
    const findings = siteCheckFindings([item("a"), co], { a: { answer: "yes", note: "" }, co_alarm_working: { answer: "na", note: "no sleeping rooms" } });
    expect(findings.map((f) => f.status)).toEqual(["pass", "not-applicable"]);
    expect(findings[1]!.safety).toBeNull();
    expect(findings[1]!.message).toContain("Note: no sleeping rooms");
    const summary = summarizeFindings(findings as unknown as Finding[]);
    expect(summary.counts).toEqual({ pass: 1, "not-applicable": 1, warn: 0, "needs-info": 0, fail: 0 });
    expect(summary.worst).toBe("pass");
  });

  it("treats a missing answer as needs-info, never as a pass", () => {
    const findings = siteCheckFindings([item("a"), item("b")], { a: { answer: "yes", note: "" } });
    expect(findings.map((f) => f.status)).toEqual(["pass", "needs-info"]);
  });

  it("keeps the items' order and adds the installer's note", () => {
    const findings = siteCheckFindings([item("b"), item("a")], { a: { answer: "no", note: "  tape on the collar joint " } });
    expect(findings.map((f) => f.code)).toEqual(["site_check.b", "site_check.a"]);
    expect(findings[1]!.message).toContain("Note: tape on the collar joint");
  });

  it("cites the company list, and common practice where the item rests on it", () => {
    const byKey = (key: string) => DEFAULT_SITE_CHECK_ITEMS.find((i) => i.key === key)!;
    const [fastened, tape] = siteCheckFindings([byKey("connector_joints_fastened"), byKey("no_tape_on_vent")], {});
    expect(fastened!.citation).toBe(SITE_CHECK_COMMON_PRACTICE_CITATION);
    expect(tape!.citation).toBe(SITE_CHECK_CITATION);
    // A stored item carries only its key: the basis comes from the default with that key.
    const [stored] = siteCheckFindings([{ key: "connector_joints_fastened", label: "Joints fastened" }], {});
    expect(stored!.citation).toBe(SITE_CHECK_COMMON_PRACTICE_CITATION);
  });

  it("raises the caution of a safety item only while it is not confirmed", () => {
    const co = DEFAULT_SITE_CHECK_ITEMS.find((i) => i.key === "co_alarm_working")!;
    expect(siteCheckFindings([co], { co_alarm_working: { answer: "no", note: "" } })[0]!.safety).toBe("co");
    expect(siteCheckFindings([co], {})[0]!.safety).toBe("co");
    expect(siteCheckFindings([co], { co_alarm_working: { answer: "yes", note: "" } })[0]!.safety).toBeNull();
  });

  it("strips a trailing full stop from the label in the message", () => {
    const [f] = siteCheckFindings([{ key: "x", label: "Cap fitted." }], { x: { answer: "yes", note: "" } });
    expect(f!.message).toBe("Confirmed on site: Cap fitted.");
    expect(f!.title).toBe("Cap fitted");
  });
});

describe("applicableItems", () => {
  const items = [item("all"), item("cond", "condensing"), item("hood", "draft_hood"), item("nat", "natural_draft")];
  const keys = (appliances: SiteCheckAppliance[]) => applicableItems(items, appliances).map((i) => i.key);

  it.each<[string, SiteCheckAppliance[], string[]]>([
    ["no appliances", [], ["all"]],
    ["a fan-assisted furnace", [{ draft: "fan_assisted", condensing: false }], ["all"]],
    ["a condensing direct-vent furnace", [{ draft: "direct_vent", condensing: true }], ["all", "cond"]],
    ["a natural-draft water heater", [{ draft: "natural" }], ["all", "hood", "nat"]],
    ["a condensing furnace and a natural-draft water heater", [{ draft: "direct_vent", condensing: true }, { draft: "natural", condensing: false }], ["all", "cond", "hood", "nat"]],
    ["an appliance whose draft is not entered yet", [{ draft: null, condensing: null }], ["all"]],
  ])("%s", (_name, appliances, expected) => {
    expect(keys(appliances)).toEqual(expected);
  });

  it("keeps the defaults for a fan-assisted, non-condensing job free of condensing and draft-hood items", () => {
    const applied = applicableItems(DEFAULT_SITE_CHECK_ITEMS, [{ draft: "fan_assisted", condensing: false }]);
    expect(applied.every((i) => i.appliesTo === "all")).toBe(true);
    expect(applied.length).toBeLessThan(DEFAULT_SITE_CHECK_ITEMS.length);
  });
});
