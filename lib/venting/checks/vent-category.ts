import { FINDING_CATALOGUE, FINDING_CODES, MESSAGES, type Finding, type FindingCode } from "../findings";
import type { Appliance } from "../inputs";
import { applianceCategory, finding, target } from "./shared";

const CODE = FINDING_CODES.ventCategory;
const RULE = { citation: "Category I venting rules; other categories: appliance manufacturer's instructions", ref: null } as const;

function describe(a: Appliance): string {
  if (a.draft === "direct_vent") return "direct-vent (sealed combustion)";
  return `Category ${a.category ?? "?"}`;
}

/** The Category I checks that are skipped for another category, each with the field it concerns. */
const CATEGORY_I_CHECKS: readonly { code: FindingCode; field: string; path: string; commonOnly?: true }[] = [
  { code: FINDING_CODES.connectorSlope, field: "segments", path: "ventRun.segments" },
  { code: FINDING_CODES.connectorHorizontalLength, field: "segments", path: "ventRun.segments" },
  { code: FINDING_CODES.connectorLengthPerDiameter, field: "segments", path: "ventRun.segments", commonOnly: true },
  { code: FINDING_CODES.ventCapacity, field: "diameterIn", path: "ventRun.vent.diameterIn" },
  { code: FINDING_CODES.ventMinHeight, field: "heightFt", path: "ventRun.vent.heightFt" },
  { code: FINDING_CODES.terminationHeight, field: "heightAboveRoofFt", path: "ventRun.termination.heightAboveRoofFt" },
];

/**
 * When a served appliance is not Category I, says for each Category I check that it does not
 * apply and why, instead of leaving it out silently.
 */
export function reportSkippedCategoryIChecks(served: readonly Appliance[], isCommon: boolean, out: Finding[]): void {
  const other = served.find((a) => applianceCategory(a) === "other");
  if (!other) return;
  const label = other.label || other.id;
  for (const c of CATEGORY_I_CHECKS) {
    if (c.commonOnly && !isCommon) continue;
    out.push(finding(c.code, "not-applicable", MESSAGES.ventCategory.skipped(FINDING_CATALOGUE[c.code].title, label, describe(other)), target("ventRun", null, c.field, c.path), RULE));
  }
}

/**
 * Reports served appliances the Category I checks do not cover, or whose category is unknown.
 * @returns true when the Category I checks should run
 */
export function checkVentCategory(served: readonly Appliance[], all: readonly Appliance[], out: Finding[]): boolean {
  let run = true;
  for (const a of served) {
    const c = applianceCategory(a);
    if (c === "category_i") continue;
    const idx = all.indexOf(a);
    const label = a.label || a.id;
    if (c === "other") {
      run = false;
      out.push(finding(CODE, "warn", MESSAGES.ventCategory.notCategoryI(label, describe(a)), target("appliances", a.id, "category", `appliances.${idx}.category`), RULE));
    } else {
      out.push(finding(CODE, "needs-info", MESSAGES.ventCategory.needsInfo(label), target("appliances", a.id, "category", `appliances.${idx}.category`), RULE));
    }
  }
  return run;
}
