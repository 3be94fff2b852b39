import { atLeast } from "../compare";
import { FINDING_CODES, MESSAGES, type Finding } from "../findings";
import { requiredReturnAreaSqIn } from "../sizing/return-air";
import { combineRules, returnAirTarget, returnOpeningTarget, type ReturnAirContext } from "./return-air-context";
import { finding, missingRuleFinding, param } from "./shared";

const CODE = FINDING_CODES.returnAirArea;
const M = MESSAGES.returnAir;

/**
 * The return openings' total free area is at least the rulebook's area per 1,000 Btu/h of the
 * furnace's output.
 * @returns the free area needed, in², or null when it cannot be told
 */
export function checkReturnAirArea(ctx: ReturnAirContext, out: Finding[]): number | null {
  const perKbtuh = param(ctx.rb, "return_air_area_sqin_per_1000_btuh_output");
  if (!perKbtuh) {
    out.push(missingRuleFinding(CODE, "the return-air area per 1,000 Btu/h of output", "parameters", returnAirTarget("openings")));
    return null;
  }
  if (!ctx.output.ok) {
    out.push(finding(CODE, "needs-info", ctx.output.message, ctx.output.target, perKbtuh));
    return null;
  }
  const required = requiredReturnAreaSqIn(ctx.output.outputBtuh, perKbtuh.value);
  if (ctx.openings.length === 0) {
    out.push(finding(CODE, "needs-info", M.noOpenings(), returnAirTarget("openings"), perKbtuh));
    return required;
  }
  const missing = ctx.openings.find((o) => o.freeAreaSqIn === null);
  if (missing || ctx.totalFreeAreaSqIn === null) {
    const o = missing ?? ctx.openings[0]!;
    out.push(finding(CODE, "needs-info", M.needsOpening(o.label), returnOpeningTarget(o, o.missingField ?? "widthIn"), perKbtuh));
    return required;
  }
  const total = ctx.totalFreeAreaSqIn;
  const ok = atLeast(total, required);
  out.push(
    finding(
      CODE,
      ok ? "pass" : "fail",
      ok ? M.pass(total, required, ctx.output.outputBtuh, perKbtuh.value) : M.fail(total, required, ctx.output.outputBtuh, perKbtuh.value),
      returnAirTarget("openings"),
      combineRules([perKbtuh, ctx.output.rule]),
      { measured: { value: total, unit: "in²" }, required: { value: required, unit: "in²", comparator: "≥" } },
    ),
  );
  return required;
}
