import { atLeast } from "../compare";
import { FINDING_CODES, MESSAGES, type Finding } from "../findings";
import type { RuleRef } from "../rulebook/prepare";
import { finding, known, missingRuleFinding, segmentAppliance, segmentTarget, type VentRunContext } from "./shared";

const CODE = FINDING_CODES.clearanceCombustibles;
const MANUAL_CITATION = "Appliance installation instructions (clearance entered by the installer)";

/** Each segment's measured clearance meets the manual's value, or the rulebook table's. */
export function checkClearanceCombustibles(ctx: VentRunContext, out: Finding[]): void {
  const segs = ctx.run.segments;
  const m = MESSAGES.clearance;
  for (let i = 0; i < segs.length; i++) {
    const seg = segs[i]!;
    const a = segmentAppliance(ctx, seg);
    let required: { value: number; citation: string; ref: RuleRef | null } | null = null;
    if (a && known(a.manualClearanceIn)) {
      required = { value: a.manualClearanceIn, citation: MANUAL_CITATION, ref: null };
    } else {
      if (seg.material == null || !a || a.listed == null) {
        out.push(finding(CODE, "needs-info", m.needsMaterial(), segmentTarget(i, seg, seg.material == null ? "material" : "clearanceIn"), null));
        continue;
      }
      const row = ctx.rb.clearances.get(`${seg.material}|${a.listed ? "listed" : "unlisted"}`);
      if (!row) {
        out.push(missingRuleFinding(CODE, `the clearance of ${seg.material.replace("_", "-")} pipe on ${a.listed ? "listed" : "unlisted"} appliances`, "clearances", segmentTarget(i, seg, "clearanceIn")));
        continue;
      }
      required = row;
    }
    const t = segmentTarget(i, seg, "clearanceIn");
    if (!known(seg.clearanceIn)) {
      out.push(finding(CODE, "needs-info", m.needsInfo(), t, required));
      continue;
    }
    const ok = atLeast(seg.clearanceIn, required.value);
    out.push(
      finding(CODE, ok ? "pass" : "fail", (ok ? m.pass : m.fail)(seg.clearanceIn, required.value), t, required, {
        measured: { value: seg.clearanceIn, unit: "in" },
        required: { value: required.value, unit: "in", comparator: "≥" },
      }),
    );
  }
}
