import { FINDING_CODES, MESSAGES, type Finding } from "../findings";
import { atLeast } from "../compare";
import { requiredRiseIn } from "../sizing/rise";
import { finding, known, missingRuleFinding, param, segmentTarget, type VentRunContext } from "./shared";

const CODE = FINDING_CODES.connectorSlope;

/** Each horizontal segment rises at least the minimum slope per foot toward the vent. */
export function checkConnectorSlope(ctx: VentRunContext, out: Finding[]): void {
  const slope = param(ctx.rb, "connector_min_slope_in_per_ft");
  const segs = ctx.run.segments;
  for (let i = 0; i < segs.length; i++) {
    const seg = segs[i]!;
    if (seg.orientation !== "horizontal") continue;
    if (!slope) {
      out.push(missingRuleFinding(CODE, "the minimum connector slope", "parameters", segmentTarget(i, seg, "riseIn")));
      continue;
    }
    if (!known(seg.lengthFt) || !known(seg.riseIn)) {
      out.push(finding(CODE, "needs-info", MESSAGES.connectorSlope.needsInfo(), segmentTarget(i, seg, known(seg.lengthFt) ? "riseIn" : "lengthFt"), slope));
      continue;
    }
    const req = requiredRiseIn(seg.lengthFt, slope.value);
    const ok = atLeast(seg.riseIn, req);
    out.push(
      finding(
        CODE,
        ok ? "pass" : "fail",
        ok ? MESSAGES.connectorSlope.pass(seg.riseIn, seg.lengthFt, req) : MESSAGES.connectorSlope.fail(seg.riseIn, seg.lengthFt, req, slope.value),
        segmentTarget(i, seg, "riseIn"),
        slope,
        { measured: { value: seg.riseIn, unit: "in" }, required: { value: req, unit: "in", comparator: "≥" } },
      ),
    );
  }
}
