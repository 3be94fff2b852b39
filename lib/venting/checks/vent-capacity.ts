import { FINDING_CODES, MESSAGES, type Finding } from "../findings";
import { assessSingleCapacity, type CapacitySizing } from "../sizing/assess-capacity";
import { finding, target, type VentRunContext } from "./shared";

const CODE = FINDING_CODES.ventCapacity;

/**
 * Single-appliance vent: the input within the capacity table's limits. A common vent is
 * reported as needing the multiple-appliance tables. Returns the sizing answer when there is one.
 */
export function checkVentCapacity(ctx: VentRunContext, out: Finding[], appliancesInput: readonly { id: string }[]): CapacitySizing | null {
  if (ctx.isCommon) {
    out.push(finding(CODE, "needs-info", MESSAGES.ventCapacity.common(), target("ventRun", null, "serves", "ventRun.vent.serves"), null));
    return null;
  }
  const a = ctx.served[0];
  if (!a) return null;
  const idx = appliancesInput.findIndex((x) => x.id === a.id);
  const r = assessSingleCapacity(ctx.run, a, idx, ctx.rb);
  const extras: { measured?: typeof r.measured; required?: typeof r.required } = {};
  if (r.measured) extras.measured = r.measured;
  if (r.required) extras.required = r.required;
  out.push(finding(CODE, r.status, r.message, r.target, r.rule, extras));
  return r.sizing;
}
