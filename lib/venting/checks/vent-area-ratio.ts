import { atMost } from "../compare";
import { FINDING_CODES, MESSAGES, type Finding } from "../findings";
import { circleAreaSqIn } from "../units";
import { finding, known, missingRuleFinding, param, target, type VentRunContext } from "./shared";

const CODE = FINDING_CODES.ventAreaRatio;
const m = MESSAGES.ventAreaRatio;

/**
 * A vent much larger than the outlets it serves stays cold: its flow area must not exceed the
 * rulebook's multiple of the smallest draft-hood outlet or flue collar area on it (the tables'
 * notes set 7 times). Round vents only; a lined masonry chimney is left to the installer.
 */
export function checkVentAreaRatio(ctx: VentRunContext, out: Finding[]): void {
  const vent = ctx.run.vent;
  const vt = target("ventRun", null, "diameterIn", "ventRun.vent.diameterIn");
  if (ctx.served.length === 0) return;
  if (vent.material === "masonry_lined") {
    out.push(finding(CODE, "needs-info", m.masonry(), vt, null));
    return;
  }
  const ratio = param(ctx.rb, "vent_max_area_ratio_to_outlet");
  if (!ratio) {
    out.push(missingRuleFinding(CODE, "the largest vent area as a multiple of the outlet area", "parameters", vt));
    return;
  }
  let smallestOutletIn = Number.POSITIVE_INFINITY;
  for (const a of ctx.served) {
    if (!known(a.outletDiameterIn)) {
      const idx = ctx.allAppliances.findIndex((x) => x.id === a.id);
      out.push(finding(CODE, "needs-info", m.needsInfo(), target("appliances", a.id, "outletDiameterIn", `appliances.${idx}.outletDiameterIn`), ratio));
      return;
    }
    if (a.outletDiameterIn < smallestOutletIn) smallestOutletIn = a.outletDiameterIn;
  }
  if (!known(vent.diameterIn)) {
    out.push(finding(CODE, "needs-info", m.needsInfo(), vt, ratio));
    return;
  }
  const actual = circleAreaSqIn(vent.diameterIn) / circleAreaSqIn(smallestOutletIn);
  const ok = atMost(actual, ratio.value);
  out.push(
    finding(CODE, ok ? "pass" : "fail", (ok ? m.pass : m.fail)(vent.diameterIn, smallestOutletIn, actual, ratio.value), vt, ratio, {
      measured: { value: actual, unit: "× outlet area" },
      required: { value: ratio.value, unit: "× outlet area", comparator: "≤" },
    }),
  );
}
