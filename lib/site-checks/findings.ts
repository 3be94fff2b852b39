import type { FindingStatus } from "@/lib/venting";
import { DEFAULT_SITE_CHECK_ITEMS } from "./defaults";
import type { SiteCheckAnswers, SiteCheckFinding, SiteCheckItemDefinition } from "./types";

export const SITE_CHECK_CITATION = "Company site-check list";
export const SITE_CHECK_COMMON_PRACTICE_CITATION = "Company site-check list; common practice";

/** Every site-check message, so that the UI, the PDF and the tests share one wording. */
export const SITE_CHECK_MESSAGES = {
  pass: (label: string) => `Confirmed on site: ${label}.`,
  notApplicable: (label: string) => `Marked not applicable on site: ${label}.`,
  fail: (label: string) => `Not confirmed on site: ${label}. Put it right before leaving the job, then answer yes.`,
  needsInfo: (label: string) => `Confirm on site: ${label}. Answer yes, no or not applicable.`,
  note: (note: string) => ` Note: ${note}`,
} as const;

// Built on first use: defaults.ts re-exports this module, so the list may not exist yet at load time.
let defaultsByKey: ReadonlyMap<string, SiteCheckItemDefinition> | null = null;
function defaultItem(key: string): SiteCheckItemDefinition | undefined {
  defaultsByKey ??= new Map(DEFAULT_SITE_CHECK_ITEMS.map((item) => [item.key, item]));
  return defaultsByKey.get(key);
}

type ItemInput = Pick<SiteCheckItemDefinition, "key" | "label"> & Partial<Pick<SiteCheckItemDefinition, "commonPractice" | "safety">>;

function plainLabel(label: string): string {
  return label.trim().replace(/[.。]+$/, "");
}

/** The finding code of an item. */
export function siteCheckCode(key: string): string {
  return `site_check.${key}`;
}

/**
 * Turns the installer's answers into one finding per item, in the items' order: yes → pass,
 * not applicable → not-applicable (shown and counted as such, never as a pass), no → fail, no
 * answer → needs-info. Pass only the items that
 * apply (see `applicableItems`) and are active. An item's basis (common practice) and caution
 * come from the item, or from the default item with the same key.
 */
export function siteCheckFindings(items: readonly ItemInput[], answers: SiteCheckAnswers): SiteCheckFinding[] {
  return items.map((item) => {
    const known = defaultItem(item.key);
    const commonPractice = item.commonPractice ?? known?.commonPractice ?? false;
    const safety = item.safety ?? known?.safety ?? null;
    const label = plainLabel(item.label);
    const entry = answers[item.key];
    const answer = entry?.answer ?? null;
    const note = entry?.note.trim() ?? "";
    let status: FindingStatus;
    let message: string;
    switch (answer) {
      case "yes":
        status = "pass";
        message = SITE_CHECK_MESSAGES.pass(label);
        break;
      case "na":
        status = "not-applicable";
        message = SITE_CHECK_MESSAGES.notApplicable(label);
        break;
      case "no":
        status = "fail";
        message = SITE_CHECK_MESSAGES.fail(label);
        break;
      case null:
        status = "needs-info";
        message = SITE_CHECK_MESSAGES.needsInfo(label);
        break;
      default:
        answer satisfies never;
        throw new Error("Unknown site-check answer");
    }
    if (note) message += SITE_CHECK_MESSAGES.note(note);
    return {
      code: siteCheckCode(item.key),
      status,
      title: label,
      message,
      citation: commonPractice ? SITE_CHECK_COMMON_PRACTICE_CITATION : SITE_CHECK_CITATION,
      ruleRef: null,
      target: { section: "siteChecks", itemId: item.key, field: "answer", path: `siteChecks.${item.key}` },
      safety: status === "pass" || status === "not-applicable" ? null : safety,
    } satisfies SiteCheckFinding;
  });
}
