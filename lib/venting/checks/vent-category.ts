import { FINDING_CODES, MESSAGES, type Finding } from "../findings";
import type { Appliance } from "../inputs";
import { applianceCategory, finding, target } from "./shared";

const CODE = FINDING_CODES.ventCategory;
const RULE = { citation: "Category I venting rules; other categories: appliance manufacturer's instructions", ref: null } as const;

function describe(a: Appliance): string {
  if (a.draft === "direct_vent") return "direct-vent (sealed combustion)";
  return `Category ${a.category ?? "?"}`;
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
