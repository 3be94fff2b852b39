import { FINDING_CODES, MESSAGES, type Finding } from "../findings";
import { finding, known, missingRuleFinding, param, segmentTarget, target, type VentRunContext } from "./shared";

const CODE = FINDING_CODES.connectorDiameter;
/** The requirement here is the appliance's own outlet, not a rulebook number. */
const OUTLET_RULE = { citation: MESSAGES.connectorDiameter.outletCitation, ref: null } as const;

/** Why a vent smaller than the outlet may not be considered; null when it may. */
export type VentReductionRefusal = "too_short" | "more_than_one_size" | "outlet_over_12" | "three_on_four";

/**
 * The reduction conditions for a vent smaller than the outlet (IFGC 504.2.2): at least the
 * rulebook's height, outlets of 12 in or less, one table size at most, and never a 3 in vent on a
 * 4 in draft hood. Returns the first condition that fails, so the message names that rule.
 * @param oneSizeDownIn the next table diameter below the outlet
 */
export function ventReductionRefusal(
  ventIn: number,
  outletIn: number,
  heightFt: number,
  minHeightFt: number,
  natural: boolean,
  oneSizeDownIn: number,
): VentReductionRefusal | null {
  if (natural && ventIn <= 3 && outletIn >= 4) return "three_on_four";
  if (outletIn > 12) return "outlet_over_12";
  if (ventIn < oneSizeDownIn - 1e-9) return "more_than_one_size";
  if (heightFt < minHeightFt) return "too_short";
  return null;
}

/** Whether a vent one size below the outlet may be considered (every reduction condition holds). */
export function ventReductionConsidered(ventIn: number, outletIn: number, heightFt: number, minHeightFt: number, natural: boolean): boolean {
  return ventReductionRefusal(ventIn, outletIn, heightFt, minHeightFt, natural, outletIn - 1) === null;
}

/** The next diameter below the outlet among the capacity table's sizes for this vent (1 in less without a table). */
function oneSizeDown(ctx: VentRunContext, outletIn: number): number {
  let best: number | null = null;
  for (const [pair, grids] of ctx.rb.capacity) {
    if (ctx.run.vent.material && !pair.startsWith(`${ctx.run.vent.material}|`)) continue;
    for (const g of grids) if (g.diameterIn < outletIn - 1e-9 && (best === null || g.diameterIn > best)) best = g.diameterIn;
  }
  return best ?? outletIn - 1;
}

/** Connectors not smaller than the outlet; the vent not smaller than the outlet or the largest connector. */
export function checkConnectorDiameter(ctx: VentRunContext, out: Finding[]): void {
  const segs = ctx.run.segments;
  const m = MESSAGES.connectorDiameter;
  let largestConnectorIn = 0;
  for (const group of ctx.connectors) {
    const a = group.appliance;
    let smallest: number | null = null;
    let missing: number | null = null;
    for (const i of group.segmentIndexes) {
      const d = segs[i]!.diameterIn;
      if (!known(d)) {
        missing ??= i;
        continue;
      }
      if (d > largestConnectorIn) largestConnectorIn = d;
      if (smallest === null || d < segs[smallest]!.diameterIn!) smallest = i;
    }
    const label = a ? a.label || a.id : "this connector";
    if (missing !== null || smallest === null || !a || !known(a.outletDiameterIn)) {
      const at = missing ?? smallest ?? group.segmentIndexes[0]!;
      out.push(finding(CODE, "needs-info", m.needsInfo(label), missing !== null || !a ? segmentTarget(at, segs[at]!, "diameterIn") : target("appliances", a.id, "outletDiameterIn", `appliances.${ctx.served.indexOf(a)}.outletDiameterIn`), OUTLET_RULE));
      continue;
    }
    const d = segs[smallest]!.diameterIn!;
    const ok = d >= a.outletDiameterIn;
    out.push(
      finding(CODE, ok ? "pass" : "fail", (ok ? m.pass : m.fail)(d, a.outletDiameterIn, label), segmentTarget(smallest, segs[smallest]!, "diameterIn"), OUTLET_RULE, {
        measured: { value: d, unit: "in" },
        required: { value: a.outletDiameterIn, unit: "in", comparator: "≥" },
      }),
    );
  }

  const vent = ctx.run.vent;
  const vt = target("ventRun", null, "diameterIn", "ventRun.vent.diameterIn");
  if (ctx.isCommon) {
    if (!known(vent.diameterIn) || largestConnectorIn === 0) {
      out.push(finding(CODE, "needs-info", m.ventNeedsInfo(), vt, OUTLET_RULE));
      return;
    }
    const ok = vent.diameterIn >= largestConnectorIn;
    out.push(
      finding(CODE, ok ? "pass" : "fail", (ok ? m.commonPass : m.commonFail)(vent.diameterIn, largestConnectorIn), vt, OUTLET_RULE, {
        measured: { value: vent.diameterIn, unit: "in" },
        required: { value: largestConnectorIn, unit: "in", comparator: "≥" },
      }),
    );
    return;
  }
  const a = ctx.served[0];
  if (!a) return;
  if (!known(vent.diameterIn) || !known(a.outletDiameterIn)) {
    out.push(finding(CODE, "needs-info", m.ventNeedsInfo(), vt, OUTLET_RULE));
    return;
  }
  const measured = { value: vent.diameterIn, unit: "in" } as const;
  const required = { value: a.outletDiameterIn, unit: "in", comparator: "≥" } as const;
  if (vent.diameterIn >= a.outletDiameterIn) {
    out.push(finding(CODE, "pass", m.ventPass(vent.diameterIn, a.outletDiameterIn), vt, OUTLET_RULE, { measured, required }));
    return;
  }
  const minH = param(ctx.rb, "vent_reduction_min_height_ft");
  const heightFt = vent.heightFt;
  const oneDown = oneSizeDown(ctx, a.outletDiameterIn);
  // Rules that do not depend on the height are checked first, so a refusal names the rule that fails.
  const refusal = ventReductionRefusal(vent.diameterIn, a.outletDiameterIn, known(heightFt) ? heightFt : Number.POSITIVE_INFINITY, minH ? minH.value : 0, a.draft !== "fan_assisted", oneDown);
  let reason: string | null = null;
  switch (refusal) {
    case "three_on_four":
      reason = m.reasonThreeOnFour();
      break;
    case "outlet_over_12":
      reason = m.reasonOutletOver12(a.outletDiameterIn);
      break;
    case "more_than_one_size":
      reason = m.reasonMoreThanOneSize(vent.diameterIn, a.outletDiameterIn, oneDown);
      break;
    case "too_short":
      reason = m.reasonTooShort(heightFt ?? 0, minH ? minH.value : 0);
      break;
    case null:
      break;
    default:
      refusal satisfies never;
  }
  if (reason === null && !minH) {
    // Every other condition holds; only the rulebook's height is missing: not checked, never a verdict.
    out.push(missingRuleFinding(CODE, "the vent height at which a smaller vent may be considered", "parameters", vt));
    return;
  }
  if (reason !== null) {
    out.push(finding(CODE, "fail", m.ventFail(vent.diameterIn, a.outletDiameterIn, reason), vt, minH ?? OUTLET_RULE, { measured, required }));
  } else if (!known(heightFt)) {
    out.push(finding(CODE, "needs-info", m.ventFail(vent.diameterIn, a.outletDiameterIn, m.reasonNeedsHeight()), target("ventRun", null, "heightFt", "ventRun.vent.heightFt"), minH ?? OUTLET_RULE));
  } else {
    out.push(finding(CODE, "warn", m.ventReduced(vent.diameterIn, a.outletDiameterIn, heightFt), vt, minH ?? OUTLET_RULE, { measured, required }));
  }
}
