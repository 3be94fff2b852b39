export { DEFAULT_SITE_CHECK_ITEMS } from "./defaults";
export type { DefaultSiteCheckKey } from "./defaults";
export { applicableItems, appliesToAppliances } from "./applicability";
export { siteCheckFindings, siteCheckCode, SITE_CHECK_CITATION, SITE_CHECK_COMMON_PRACTICE_CITATION, SITE_CHECK_MESSAGES } from "./findings";
export { SITE_CHECK_APPLIES_TO, SITE_CHECK_APPLIES_TO_LABELS, SITE_CHECK_ANSWERS } from "./types";
export type {
  SiteCheckAppliesTo,
  SiteCheckItemDefinition,
  SiteCheckAnswerValue,
  SiteCheckAnswer,
  SiteCheckAnswers,
  SiteCheckFinding,
  SiteCheckFindingTarget,
  SiteCheckAppliance,
} from "./types";
