import { FINDING_CODES, MESSAGES, type Finding } from "../findings";
import { readingTarget, type ReadingsContext } from "./readings-shared";
import { finding, known, missingRuleFinding, param } from "./shared";

const CODE = FINDING_CODES.readingsAmbientCo;

/** Ambient CO below the stop level; a caution from the marginal level. */
export function checkAmbientCo(ctx: ReadingsContext, out: Finding[]): void {
  const m = MESSAGES.readingsAmbientCo;
  const t = readingTarget(ctx, "ambientCoPpm");
  const max = param(ctx.rb, "ambient_co_max_ppm");
  const marginal = param(ctx.rb, "ambient_co_marginal_ppm");
  if (!max) {
    out.push(missingRuleFinding(CODE, "the ambient CO stop level", "parameters", t));
    return;
  }
  const ppm = ctx.r.ambientCoPpm;
  if (!known(ppm)) {
    out.push(finding(CODE, "needs-info", m.needsInfo(), t, max));
    return;
  }
  const measured = { value: ppm, unit: "ppm" };
  const required = { value: max.value, unit: "ppm", comparator: "<" as const };
  if (ppm >= max.value) {
    out.push(finding(CODE, "fail", m.fail(ppm, max.value), t, max, { measured, required, safety: "co" }));
  } else if (!marginal) {
    // Below the stop level, but whether a caution is due cannot be told without the caution level.
    out.push(missingRuleFinding(CODE, "the ambient CO caution level", "parameters", t));
  } else if (ppm >= marginal.value) {
    out.push(finding(CODE, "warn", m.warn(ppm, marginal.value, max.value), t, marginal, { measured, required: { value: marginal.value, unit: "ppm", comparator: "<" }, safety: "co" }));
  } else {
    out.push(finding(CODE, "pass", m.pass(ppm, marginal.value), t, marginal, { measured, required: { value: marginal.value, unit: "ppm", comparator: "<" } }));
  }
}
