import { FINDING_CODES, MESSAGES, type Finding } from "../findings";
import { finding, known, missingRuleFinding, segmentTarget, type VentRunContext } from "./shared";

const CODE = FINDING_CODES.jointsFasteners;

/** Each joint has at least the rulebook's fasteners for the material. */
export function checkJointsFasteners(ctx: VentRunContext, out: Finding[]): void {
  const segs = ctx.run.segments;
  for (let i = 0; i < segs.length; i++) {
    const seg = segs[i]!;
    if (seg.joints === 0) continue; // a single piece has no joint to fasten
    const t = segmentTarget(i, seg, "fastenersPerJoint");
    if (seg.material == null) {
      out.push(finding(CODE, "needs-info", MESSAGES.fasteners.needsInfo(), segmentTarget(i, seg, "material"), null));
      continue;
    }
    const row = ctx.rb.fasteners.get(seg.material);
    if (!row) {
      out.push(missingRuleFinding(CODE, `the fasteners per joint of ${seg.material.replace("_", "-")} pipe`, "fasteners", t));
      continue;
    }
    if (!known(seg.fastenersPerJoint)) {
      out.push(finding(CODE, "needs-info", MESSAGES.fasteners.needsInfo(), t, row));
      continue;
    }
    const ok = seg.fastenersPerJoint >= row.value;
    out.push(
      finding(CODE, ok ? "pass" : "fail", (ok ? MESSAGES.fasteners.pass : MESSAGES.fasteners.fail)(seg.fastenersPerJoint, row.value), t, row, {
        measured: { value: seg.fastenersPerJoint, unit: "fasteners" },
        required: { value: row.value, unit: "fasteners", comparator: "≥" },
      }),
    );
  }
}
