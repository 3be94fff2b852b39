import { atMost } from "../compare";
import { FINDING_CODES, MESSAGES, type Finding } from "../findings";
import { faceVelocityFpm, openingAirflowCfm } from "../sizing/return-air";
import { combineRules, returnOpeningTarget, type ReturnAirContext } from "./return-air-context";
import { finding, missingRuleFinding, param } from "./shared";

const CODE = FINDING_CODES.returnAirVelocity;
const M = MESSAGES.returnAir;

/** Face velocity of one opening, for the sizing answer. */
export interface ReturnOpeningVelocity {
  readonly openingId: string;
  readonly airflowCfm: number;
  readonly faceVelocityFpm: number;
  /** The limit it was judged against, fpm (null when the rulebook lacks it). */
  readonly limitFpm: number | null;
}

/**
 * Each opening's face velocity: its share of the airflow (split by free area) over its free area.
 * A filter grille is held to the filter-grille maximum, any other to the quiet-return target.
 * Both values are trade practice rather than code, so exceeding them is a warning: noise and
 * pressure drop, not a hazard. A grille whose velocity lies between the two limits needs to be
 * told whether it holds a filter.
 */
export function checkReturnAirVelocity(ctx: ReturnAirContext, out: Finding[]): ReturnOpeningVelocity[] {
  const sizing: ReturnOpeningVelocity[] = [];
  if (ctx.openings.length === 0) return sizing;
  const first = ctx.openings[0]!;
  if (!ctx.airflow.ok) {
    const t = ctx.airflow.target;
    out.push(ctx.airflow.missingRule ? missingRuleFinding(CODE, ctx.airflow.missingRule, "parameters", t) : finding(CODE, "needs-info", ctx.airflow.message, t, null));
    return sizing;
  }
  const total = ctx.totalFreeAreaSqIn;
  if (total === null || !(total > 0)) {
    const o = ctx.openings.find((x) => x.freeAreaSqIn === null) ?? first;
    out.push(finding(CODE, "needs-info", M.needsAllOpenings(), returnOpeningTarget(o, o.missingField ?? "widthIn"), ctx.airflow.rule));
    return sizing;
  }
  const quiet = param(ctx.rb, "return_air_grille_velocity_max_fpm");
  const filter = param(ctx.rb, "return_air_filter_grille_velocity_max_fpm");
  const cfmTotal = ctx.airflow.cfm;
  for (const o of ctx.openings) {
    const free = o.freeAreaSqIn!;
    const cfm = openingAirflowCfm(cfmTotal, free, total);
    const fpm = faceVelocityFpm(cfm, free);
    const t = returnOpeningTarget(o, "widthIn");
    if (fpm === null) {
      out.push(finding(CODE, "needs-info", M.needsOpening(o.label), t, ctx.airflow.rule));
      continue;
    }
    const isFilter = o.opening.filterGrille;
    const limit = isFilter === true ? filter : isFilter === false ? quiet : undefined;
    if (isFilter === true && !filter) {
      out.push(missingRuleFinding(CODE, "the filter-grille face velocity maximum", "parameters", t));
      continue;
    }
    if (isFilter === false && !quiet) {
      out.push(missingRuleFinding(CODE, "the quiet return-grille face velocity", "parameters", t));
      continue;
    }
    const extras = (max: number) => ({ measured: { value: fpm, unit: "fpm" }, required: { value: max, unit: "fpm", comparator: "≤" as const } });
    if (limit) {
      const ok = atMost(fpm, limit.value);
      const what = isFilter ? M.filterMax : M.quietTarget;
      sizing.push({ openingId: o.opening.id, airflowCfm: cfm, faceVelocityFpm: fpm, limitFpm: limit.value });
      out.push(
        finding(
          CODE,
          ok ? "pass" : "warn",
          ok ? M.velocityPass(o.label, fpm, limit.value, cfm, what) : M.velocityHigh(o.label, fpm, limit.value, cfm, what),
          t,
          combineRules([limit, ctx.airflow.rule]),
          extras(limit.value),
        ),
      );
      continue;
    }
    // Whether the grille holds a filter is not known: judge it where both limits agree.
    if (!quiet || !filter) {
      out.push(missingRuleFinding(CODE, "the return-grille face velocity limits", "parameters", t));
      continue;
    }
    const lower = filter.value <= quiet.value ? filter : quiet;
    const upper = lower === filter ? quiet : filter;
    sizing.push({ openingId: o.opening.id, airflowCfm: cfm, faceVelocityFpm: fpm, limitFpm: null });
    if (atMost(fpm, lower.value)) {
      out.push(finding(CODE, "pass", M.velocityPass(o.label, fpm, lower.value, cfm, lower === filter ? M.filterMax : M.quietTarget), t, combineRules([lower, ctx.airflow.rule]), extras(lower.value)));
    } else if (!atMost(fpm, upper.value)) {
      out.push(finding(CODE, "warn", M.velocityHigh(o.label, fpm, upper.value, cfm, upper === filter ? M.filterMax : M.quietTarget), t, combineRules([upper, ctx.airflow.rule]), extras(upper.value)));
    } else {
      out.push(finding(CODE, "needs-info", M.needsFilterAnswer(o.label, fpm, filter.value), returnOpeningTarget(o, "filterGrille"), combineRules([filter, ctx.airflow.rule])));
    }
  }
  return sizing;
}
