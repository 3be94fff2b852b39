import { FINDING_CODES, type Finding } from "../findings";
import { assessSingleCapacity, type CapacitySizing } from "../sizing/assess-capacity";
import { checkCommonVentCapacity, type CommonVentSizing } from "./common-vent-capacity";
import { finding, type VentRunContext } from "./shared";

const CODE = FINDING_CODES.ventCapacity;

/**
 * Vent capacity: one appliance against the single-appliance table; two or more against the
 * multiple-appliance connector and common-vent tables. Returns the sizing answer of whichever ran.
 */
export function checkVentCapacity(ctx: VentRunContext, out: Finding[]): { single: CapacitySizing | null; common: CommonVentSizing | null } {
  if (ctx.isCommon) return { single: null, common: checkCommonVentCapacity(ctx, out) };
  const a = ctx.served[0];
  if (!a) return { single: null, common: null };
  const idx = ctx.allAppliances.findIndex((x) => x.id === a.id);
  const r = assessSingleCapacity(ctx.run, a, idx, ctx.rb);
  const extras: { measured?: typeof r.measured; required?: typeof r.required; smallest?: { value: number; unit: string } } = {};
  if (r.measured) extras.measured = r.measured;
  if (r.required) extras.required = r.required;
  if (r.sizing?.smallestDiameterIn != null) extras.smallest = { value: r.sizing.smallestDiameterIn, unit: "in" };
  out.push(finding(CODE, r.status, r.message, r.target, r.rule, extras));
  return { single: r.sizing, common: null };
}
