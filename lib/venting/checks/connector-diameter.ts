import { FINDING_CODES, MESSAGES, type Finding } from "../findings";
import { finding, known, param, segmentTarget, target, type VentRunContext } from "./shared";

const CODE = FINDING_CODES.connectorDiameter;
/** The requirement here is the appliance's own outlet, not a rulebook number. */
const OUTLET_RULE = { citation: MESSAGES.connectorDiameter.outletCitation, ref: null } as const;

/** Whether a vent one size below the outlet may be considered (the reduction conditions). */
export function ventReductionConsidered(ventIn: number, outletIn: number, heightFt: number, minHeightFt: number, natural: boolean): boolean {
  if (heightFt < minHeightFt) return false;
  if (outletIn > 12 || outletIn - ventIn > 1) return false;
  // never a 3 in vent on a 4 in draft hood
  if (natural && ventIn <= 3 && outletIn >= 4) return false;
  return true;
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
  if (minH && known(heightFt) && ventReductionConsidered(vent.diameterIn, a.outletDiameterIn, heightFt, minH.value, a.draft !== "fan_assisted")) {
    out.push(finding(CODE, "warn", m.ventReduced(vent.diameterIn, a.outletDiameterIn, heightFt), vt, minH, { measured, required }));
  } else {
    out.push(finding(CODE, "fail", m.ventFail(vent.diameterIn, a.outletDiameterIn, minH ? minH.value : null), vt, minH ?? OUTLET_RULE, { measured, required }));
  }
}
