import { FINDING_CODES, MESSAGES, type Finding } from "../findings";
import { finding, missingRuleFinding, segmentTarget, type VentRunContext } from "./shared";

const CODE = FINDING_CODES.passageSingleWall;

/** No segment passes where the rulebook prohibits its material; walls need a thimble where so ruled. */
export function checkPassageSingleWall(ctx: VentRunContext, out: Finding[]): void {
  const segs = ctx.run.segments;
  const m = MESSAGES.passage;
  for (let i = 0; i < segs.length; i++) {
    const seg = segs[i]!;
    const t = segmentTarget(i, seg, "passesThrough");
    const passage = seg.passesThrough;
    if (passage == null || seg.material == null) {
      out.push(finding(CODE, "needs-info", m.needsInfo(), passage == null ? t : segmentTarget(i, seg, "material"), null));
      continue;
    }
    if (passage === "none") {
      out.push(finding(CODE, "pass", m.pass(seg.material, passage), t, null));
      continue;
    }
    const entry = ctx.rb.passages.get(`${seg.material}|${passage}`);
    if (!entry) {
      // No row is no answer: whether this pipe may go there is not something to assume.
      const where = passage.replace("_", " ");
      out.push(missingRuleFinding(CODE, `whether ${seg.material.replace("_", "-")} pipe may pass through ${/^[aeiou]/.test(where) ? "an" : "a"} ${where}`, "prohibitedPassages", t));
      continue;
    }
    if (!entry.row.prohibited) {
      out.push(finding(CODE, "pass", m.pass(seg.material, passage), t, { citation: entry.row.citation, ref: entry.ref }));
      continue;
    }
    const rule = { citation: entry.row.citation, ref: entry.ref };
    const safety = seg.material === "single_wall" ? ("concealed_single_wall" as const) : null;
    if (entry.row.allowedWithThimble) {
      if (seg.thimble == null) out.push(finding(CODE, "needs-info", m.thimbleNeedsInfo(), segmentTarget(i, seg, "thimble"), rule));
      else if (seg.thimble) out.push(finding(CODE, "pass", m.thimbleOk(seg.material), segmentTarget(i, seg, "thimble"), rule));
      else out.push(finding(CODE, "fail", m.thimble(seg.material), segmentTarget(i, seg, "thimble"), rule, { safety }));
      continue;
    }
    out.push(finding(CODE, "fail", m.fail(seg.material, passage, entry.row.note), t, rule, { safety }));
  }
}
