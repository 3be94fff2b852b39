import { FINDING_CODES, MESSAGES, type Finding } from "../findings";
import { supportsNeeded } from "../sizing/rise";
import { finding, known, missingRuleFinding, segmentTarget, type VentRunContext } from "./shared";

const CODE = FINDING_CODES.supportsSpacing;

/** Each segment has at least length ÷ maximum spacing supports. */
export function checkSupportsSpacing(ctx: VentRunContext, out: Finding[]): void {
  const segs = ctx.run.segments;
  for (let i = 0; i < segs.length; i++) {
    const seg = segs[i]!;
    const t = segmentTarget(i, seg, "supportsInstalled");
    if (seg.material == null || seg.orientation == null) {
      out.push(finding(CODE, "needs-info", MESSAGES.supports.needsInfo(), segmentTarget(i, seg, seg.material == null ? "material" : "orientation"), null));
      continue;
    }
    const row = ctx.rb.supportSpacing.get(`${seg.material}|${seg.orientation}`);
    if (!row || !(row.value > 0)) {
      // A spacing of zero would ask for endless supports: it is no usable value.
      out.push(missingRuleFinding(CODE, `the support spacing of ${seg.orientation} ${seg.material.replace("_", "-")} pipe`, "supportSpacing", t));
      continue;
    }
    if (!known(seg.lengthFt) || !known(seg.supportsInstalled)) {
      out.push(finding(CODE, "needs-info", MESSAGES.supports.needsInfo(), known(seg.lengthFt) ? t : segmentTarget(i, seg, "lengthFt"), row));
      continue;
    }
    const needed = supportsNeeded(seg.lengthFt, row.value);
    const ok = seg.supportsInstalled >= needed;
    out.push(
      finding(CODE, ok ? "pass" : "fail", (ok ? MESSAGES.supports.pass : MESSAGES.supports.fail)(seg.supportsInstalled, needed, seg.lengthFt, row.value), t, row, {
        measured: { value: seg.supportsInstalled, unit: "supports" },
        required: { value: needed, unit: "supports", comparator: "≥" },
      }),
    );
  }
}
