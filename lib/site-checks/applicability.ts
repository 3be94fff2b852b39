import type { SiteCheckAppliance, SiteCheckAppliesTo } from "./types";

/** Whether an item with this applies-to concerns a job with these appliances. */
export function appliesToAppliances(appliesTo: SiteCheckAppliesTo, appliances: readonly SiteCheckAppliance[]): boolean {
  switch (appliesTo) {
    case "all":
      return true;
    case "condensing":
      return appliances.some((a) => a.condensing === true);
    // A draft hood is what makes an appliance natural draft in Category I, so both follow the draft type.
    case "draft_hood":
    case "natural_draft":
      return appliances.some((a) => a.draft === "natural");
    default:
      return appliesTo satisfies never;
  }
}

/**
 * The items that concern a job: every `all` item, condensing items when some appliance is
 * condensing, draft-hood and natural-draft items when some appliance is natural draft.
 * Order is kept.
 */
export function applicableItems<T extends { readonly appliesTo: SiteCheckAppliesTo }>(items: readonly T[], appliances: readonly SiteCheckAppliance[]): T[] {
  return items.filter((item) => appliesToAppliances(item.appliesTo, appliances));
}
