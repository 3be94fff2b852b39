import { atLeast } from "../compare";
import { FINDING_CODES, MESSAGES, type Finding } from "../findings";
import { returnOpeningTarget, type ReturnAirContext } from "./return-air-context";
import { fuelApplianceInSpace } from "./return-air-location";
import { finding, known, missingRuleFinding, param } from "./shared";

const CODE = FINDING_CODES.returnAirDraftHood;
const M = MESSAGES.returnAir;

/**
 * Each opening in a space with a fuel-burning appliance is at least the rulebook's distance from
 * its draft hood or open combustion chamber; with none in the space the rule does not apply,
 * and the finding says so.
 */
export function checkReturnAirDraftHood(ctx: ReturnAirContext, out: Finding[]): void {
  if (ctx.openings.length === 0) return;
  const min = param(ctx.rb, "return_air_draft_hood_min_distance_ft");
  for (const info of ctx.openings) {
    const fuel = fuelApplianceInSpace(info);
    if (fuel === false) {
      out.push(finding(CODE, "not-applicable", M.noFuelAppliance(info.label), returnOpeningTarget(info, "fuelApplianceInSpace"), null));
      continue;
    }
    if (!min) {
      out.push(missingRuleFinding(CODE, "the smallest distance of a return opening from a draft hood", "parameters", returnOpeningTarget(info, "distanceToDraftHoodFt")));
      continue;
    }
    if (fuel === null) {
      out.push(finding(CODE, "needs-info", M.fuelApplianceNeedsInfo(info.label), returnOpeningTarget(info, "fuelApplianceInSpace"), min));
      continue;
    }
    const d = info.opening.distanceToDraftHoodFt;
    const t = returnOpeningTarget(info, "distanceToDraftHoodFt");
    if (!known(d)) {
      out.push(finding(CODE, "needs-info", M.distanceNeedsInfo(info.label), t, min));
      continue;
    }
    const ok = atLeast(d, min.value);
    out.push(
      finding(CODE, ok ? "pass" : "fail", ok ? M.distancePass(info.label, d, min.value) : M.distanceFail(info.label, d, min.value), t, min, {
        measured: { value: d, unit: "ft" },
        required: { value: min.value, unit: "ft", comparator: "≥" },
      }),
    );
  }
}
