import { FINDING_CODES, MESSAGES, type Finding } from "../findings";
import { combineRules, returnOpeningTarget, type ReturnAirContext, type ReturnOpeningInfo } from "./return-air-context";
import { finding, missingRuleFinding, param } from "./shared";

const CODE = FINDING_CODES.returnAirLocation;
const M = MESSAGES.returnAir;

/**
 * Whether the space an opening draws from holds a fuel-burning appliance: the installer's answer,
 * else yes for the appliance room or where a draft-hood distance was measured, else unknown.
 */
export function fuelApplianceInSpace(info: ReturnOpeningInfo): boolean | null {
  const o = info.opening;
  if (typeof o.fuelApplianceInSpace === "boolean") return o.fuelApplianceInSpace;
  if (o.space === "appliance_room" || typeof o.distanceToDraftHoodFt === "number") return true;
  return null;
}

/**
 * Where each opening draws from: not a space the `returnAirSpaces` table prohibits (unless the
 * installer confirms the row's exception), and not a space holding a fuel-burning appliance as
 * the only return source (unless the exception noted for that space applies). A confirmed
 * exception is a warning, so it stays visible to the reviewer.
 */
export function checkReturnAirLocation(ctx: ReturnAirContext, out: Finding[]): void {
  for (const info of ctx.openings) {
    const o = info.opening;
    const t = returnOpeningTarget(info, "space");
    if (!o.space) {
      out.push(finding(CODE, "needs-info", M.needsSpace(info.label), t, null));
      continue;
    }
    const entry = ctx.rb.returnAirSpaces.get(o.space);
    if (!entry) {
      out.push(o.space === "other" ? finding(CODE, "needs-info", M.otherSpace(info.label), t, null) : missingRuleFinding(CODE, `return air drawn from a ${o.space.replace(/_/g, " ")}`, "returnAirSpaces", t));
      continue;
    }
    const row = entry.row;
    const rule = { citation: row.citation, ref: entry.ref };
    const note = row.exceptionNote.trim();
    if (row.prohibited) {
      if (note && o.exceptionApplies === true) out.push(finding(CODE, "warn", M.exceptionConfirmed(info.label, o.space, note), returnOpeningTarget(info, "exceptionApplies"), rule));
      else out.push(finding(CODE, "fail", M.spaceProhibited(info.label, o.space, note), t, rule));
      continue;
    }
    const fuel = fuelApplianceInSpace(info);
    // Openings drawing from different kinds of space cannot each be the only source.
    const sole = o.soleReturnSource ?? (ctx.distinctSpaces > 1 ? false : null);
    if (fuel === false || sole === false) {
      out.push(finding(CODE, "pass", fuel === true ? M.soleSourceOk(info.label, o.space) : M.spaceAllowed(info.label, o.space), t, rule));
      continue;
    }
    const flag = param(ctx.rb, "return_air_sole_source_fuel_space_prohibited");
    if (!flag) {
      out.push(missingRuleFinding(CODE, "whether a space with a fuel-burning appliance may be the only return source", "parameters", returnOpeningTarget(info, "soleReturnSource")));
      continue;
    }
    if (flag.value !== 1) {
      out.push(finding(CODE, "pass", M.spaceAllowed(info.label, o.space), t, combineRules([rule, flag])));
      continue;
    }
    if (fuel === null) {
      out.push(finding(CODE, "needs-info", M.fuelApplianceNeedsInfo(info.label), returnOpeningTarget(info, "fuelApplianceInSpace"), flag));
      continue;
    }
    if (sole === null) {
      out.push(finding(CODE, "needs-info", M.soleSourceNeedsInfo(info.label, o.space), returnOpeningTarget(info, "soleReturnSource"), flag));
      continue;
    }
    const rules = combineRules([flag, rule]);
    if (note && o.exceptionApplies === true) out.push(finding(CODE, "warn", M.exceptionConfirmed(info.label, o.space, note), returnOpeningTarget(info, "exceptionApplies"), rules));
    else out.push(finding(CODE, "fail", M.soleSourceFail(info.label, o.space, note), returnOpeningTarget(info, "soleReturnSource"), rules));
  }
}
