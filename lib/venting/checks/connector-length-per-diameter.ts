import { atMost } from "../compare";
import { FINDING_CODES, MESSAGES, type Finding } from "../findings";
import { finding, known, missingRuleFinding, param, segmentTarget, type VentRunContext } from "./shared";

const CODE = FINDING_CODES.connectorLengthPerDiameter;

/**
 * Capacity loss for a connector longer than the assumed length: one loss step for each started
 * multiple of the assumed length beyond the first.
 * @returns loss in percent (0 when within the assumed length)
 */
export function connectorLengthLossPct(lengthFt: number, assumedFt: number, lossPerMultiplePct: number): number {
  if (assumedFt <= 0 || atMost(lengthFt, assumedFt)) return 0;
  const extraMultiples = Math.ceil(lengthFt / assumedFt - 1e-9) - 1;
  return Math.min(100, extraMultiples * lossPerMultiplePct);
}

/**
 * For a common vent: each appliance's connector keeps within the horizontal length per inch of
 * diameter the multiple-appliance tables assume (measured, as the code measures it, on the
 * horizontal run). Longer is allowed with the connector's own maximum reduced, which the connector
 * capacity check applies; this finding says by how much.
 */
export function checkConnectorLengthPerDiameter(ctx: VentRunContext, out: Finding[]): void {
  if (!ctx.isCommon) return;
  const perIn = param(ctx.rb, "connector_max_length_ft_per_in_diameter");
  const loss = param(ctx.rb, "connector_capacity_loss_per_extra_length_multiple_pct");
  const segs = ctx.run.segments;
  for (const group of ctx.connectors) {
    const first = group.segmentIndexes[0];
    if (first === undefined) continue;
    const label = group.appliance ? group.appliance.label || group.appliance.id : "an unassigned connector";
    if (!perIn) {
      out.push(missingRuleFinding(CODE, "the connector length per inch of diameter", "parameters", segmentTarget(first, segs[first]!, "lengthFt")));
      continue;
    }
    let lengthFt = 0;
    let diameterIn = Number.POSITIVE_INFINITY;
    let missing: number | null = null;
    for (const i of group.segmentIndexes) {
      const s = segs[i]!;
      if (!known(s.diameterIn) || s.orientation == null || (s.orientation === "horizontal" && !known(s.lengthFt))) {
        missing ??= i;
        continue;
      }
      if (s.orientation === "horizontal") lengthFt += s.lengthFt ?? 0;
      if (s.diameterIn < diameterIn) diameterIn = s.diameterIn;
    }
    if (missing !== null) {
      const s = segs[missing]!;
      const field = !known(s.diameterIn) ? "diameterIn" : s.orientation == null ? "orientation" : "lengthFt";
      out.push(finding(CODE, "needs-info", MESSAGES.connectorLengthPerDiameter.needsInfo(label), segmentTarget(missing, s, field), perIn));
      continue;
    }
    const maxFt = perIn.value * diameterIn;
    const ok = atMost(lengthFt, maxFt);
    if (!ok && !loss) {
      out.push(missingRuleFinding(CODE, "the capacity loss per extra multiple of connector length", "parameters", segmentTarget(first, segs[first]!, "lengthFt")));
      continue;
    }
    const lossPct = ok || !loss ? 0 : connectorLengthLossPct(lengthFt, maxFt, loss.value);
    const m = MESSAGES.connectorLengthPerDiameter;
    out.push(
      finding(
        CODE,
        ok ? "pass" : "warn",
        ok ? m.pass(label, lengthFt, maxFt, diameterIn) : m.warn(label, lengthFt, maxFt, diameterIn, lossPct),
        segmentTarget(first, segs[first]!, "lengthFt"),
        ok || !loss ? perIn : { citation: `${perIn.citation}; ${loss.citation}`, ref: perIn.ref },
        { measured: { value: lengthFt, unit: "ft" }, required: { value: maxFt, unit: "ft", comparator: "≤" } },
      ),
    );
  }
}
