import type { FindingTarget } from "../findings";
import type { Appliance, Readings } from "../inputs";
import type { PreparedRulebook } from "../rulebook/prepare";

/** What each readings check receives. */
export interface ReadingsContext {
  readonly r: Readings;
  readonly appliance: Appliance;
  readonly rb: PreparedRulebook;
  /** Index of this entry in the request's readings list, for target paths. */
  readonly index: number;
}

/** Target of a readings field. */
export function readingTarget(ctx: ReadingsContext, field: keyof Readings): FindingTarget {
  return { section: "readings", itemId: ctx.r.applianceId, field, path: `readings.${ctx.index}.${field}` };
}
