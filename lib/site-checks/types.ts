import type { Finding, SafetyFlag } from "@/lib/venting";

/** Which appliances a site-check item concerns. */
export const SITE_CHECK_APPLIES_TO = ["all", "condensing", "draft_hood", "natural_draft"] as const;
export type SiteCheckAppliesTo = (typeof SITE_CHECK_APPLIES_TO)[number];

/** Labels for the applies-to choices, as the admin screen and the inspection show them. */
export const SITE_CHECK_APPLIES_TO_LABELS = {
  all: "Every job",
  condensing: "Condensing appliances",
  draft_hood: "Draft-hood appliances",
  natural_draft: "Natural-draft appliances",
} as const satisfies Record<SiteCheckAppliesTo, string>;

/** One item of a company's site-check list. */
export interface SiteCheckItemDefinition {
  /** Stable snake_case key; answers, photos and finding codes refer to it. */
  readonly key: string;
  readonly label: string;
  readonly help: string;
  readonly appliesTo: SiteCheckAppliesTo;
  /** The item rests on common trade practice rather than a code section. */
  readonly commonPractice?: boolean;
  /** The caution a UI must make prominent while the item is not confirmed. */
  readonly safety?: SafetyFlag | null;
}

/** The installer's answer to one item. */
export const SITE_CHECK_ANSWERS = ["yes", "no", "na"] as const;
export type SiteCheckAnswerValue = (typeof SITE_CHECK_ANSWERS)[number];

export interface SiteCheckAnswer {
  readonly answer: SiteCheckAnswerValue | null;
  readonly note: string;
}

/** Answers keyed by item key; a missing key is an unanswered item. */
export type SiteCheckAnswers = Readonly<Record<string, SiteCheckAnswer | undefined>>;

/** Where a site-check finding points: the answer of one item. */
export interface SiteCheckFindingTarget {
  readonly section: "siteChecks";
  readonly itemId: string;
  readonly field: "answer";
  /** `siteChecks.<key>` */
  readonly path: string;
}

/** A finding in the engine's shape, with a free-form code `site_check.<key>`. */
export interface SiteCheckFinding extends Omit<Finding, "code" | "target"> {
  readonly code: string;
  readonly target: SiteCheckFindingTarget;
}

/** What applicability needs to know about an appliance (a subset of the engine's appliance input). */
export interface SiteCheckAppliance {
  readonly condensing?: boolean | null;
  readonly draft?: "natural" | "fan_assisted" | "direct_vent" | null;
}
