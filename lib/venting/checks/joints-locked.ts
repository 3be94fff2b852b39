import { FINDING_CODES, MESSAGES, type Finding } from "../findings";
import { finding, segmentTarget, type VentRunContext } from "./shared";

const CODE = FINDING_CODES.jointsLocked;

/** Every section of each segment is locked; the citation is the material's fastening row. */
export function checkJointsLocked(ctx: VentRunContext, out: Finding[]): void {
  const segs = ctx.run.segments;
  for (let i = 0; i < segs.length; i++) {
    const seg = segs[i]!;
    const rule = seg.material ? (ctx.rb.fasteners.get(seg.material) ?? null) : null;
    const t = segmentTarget(i, seg, "sectionsLocked");
    const locked = seg.sectionsLocked;
    if (locked == null) out.push(finding(CODE, "needs-info", MESSAGES.locked.needsInfo(), t, rule));
    else out.push(finding(CODE, locked ? "pass" : "fail", locked ? MESSAGES.locked.pass() : MESSAGES.locked.fail(), t, rule));
  }
}
