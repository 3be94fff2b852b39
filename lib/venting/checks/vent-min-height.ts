import { atLeast } from "../compare";
import { FINDING_CODES, MESSAGES, type Finding } from "../findings";
import { finding, known, missingRuleFinding, param, target, type VentRunContext } from "./shared";

const CODE = FINDING_CODES.ventMinHeight;

/** The vent reaches the minimum height above the highest collar or draft hood. */
export function checkVentMinHeight(ctx: VentRunContext, out: Finding[]): void {
  const t = target("ventRun", null, "heightFt", "ventRun.vent.heightFt");
  const min = param(ctx.rb, "vent_min_height_above_collar_ft");
  if (!min) {
    out.push(missingRuleFinding(CODE, "the minimum vent height above the collar", "parameters", t));
    return;
  }
  const h = ctx.run.vent.heightFt;
  if (!known(h)) {
    out.push(finding(CODE, "needs-info", MESSAGES.ventMinHeight.needsInfo(), t, min));
    return;
  }
  const ok = atLeast(h, min.value);
  out.push(
    finding(CODE, ok ? "pass" : "fail", (ok ? MESSAGES.ventMinHeight.pass : MESSAGES.ventMinHeight.fail)(h, min.value), t, min, {
      measured: { value: h, unit: "ft" },
      required: { value: min.value, unit: "ft", comparator: "≥" },
    }),
  );
}
