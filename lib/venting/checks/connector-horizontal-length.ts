import { atMost } from "../compare";
import type { ConnectorMaterial } from "../enums";
import { FINDING_CODES, MESSAGES, type Finding } from "../findings";
import type { Cited } from "../rulebook/prepare";
import { finding, known, missingRuleFinding, segmentTarget, target, type VentRunContext } from "./shared";

const CODE = FINDING_CODES.connectorHorizontalLength;

/**
 * Longest horizontal connector length for a run: the smallest share of vent height among the
 * materials of its horizontal segments, times the vent height. Null when a value is missing.
 */
export function maxHorizontalConnectorFt(
  shares: ReadonlyMap<ConnectorMaterial, Cited<number>>,
  materials: readonly ConnectorMaterial[],
  ventHeightFt: number,
): { maxFt: number; share: Cited<number>; material: ConnectorMaterial } | null {
  let best: { maxFt: number; share: Cited<number>; material: ConnectorMaterial } | null = null;
  for (const m of materials) {
    const s = shares.get(m);
    if (!s) return null;
    if (!best || s.value < best.share.value) best = { maxFt: s.value * ventHeightFt, share: s, material: m };
  }
  return best;
}

/** Total horizontal connector length of each appliance within the share of vent height its material allows. */
export function checkConnectorHorizontalLength(ctx: VentRunContext, out: Finding[]): void {
  const segs = ctx.run.segments;
  const heightFt = ctx.run.vent.heightFt;
  for (const group of ctx.connectors) {
    let totalFt = 0;
    let missing: number | null = null;
    let longest: number | null = null;
    const materials: ConnectorMaterial[] = [];
    for (const i of group.segmentIndexes) {
      const seg = segs[i]!;
      if (seg.orientation === "vertical") continue;
      if (seg.orientation == null || !known(seg.lengthFt) || seg.material == null) {
        missing ??= i;
        continue;
      }
      totalFt += seg.lengthFt;
      if (!materials.includes(seg.material)) materials.push(seg.material);
      if (longest === null || seg.lengthFt > segs[longest]!.lengthFt!) longest = i;
    }
    if (missing !== null) {
      out.push(finding(CODE, "needs-info", MESSAGES.connectorHorizontalLength.needsInfo(), segmentTarget(missing, segs[missing]!, "lengthFt"), null));
      continue;
    }
    if (!known(heightFt)) {
      out.push(finding(CODE, "needs-info", MESSAGES.connectorHorizontalLength.needsInfo(), target("ventRun", null, "heightFt", "ventRun.vent.heightFt"), null));
      continue;
    }
    if (materials.length === 0) continue; // no horizontal run at all: nothing to limit
    const limit = maxHorizontalConnectorFt(ctx.rb.connectorShare, materials, heightFt);
    const t = segmentTarget(longest!, segs[longest!]!, "lengthFt");
    if (!limit) {
      out.push(missingRuleFinding(CODE, "the horizontal-length share of every connector material used", "connectorLengthShare", t));
      continue;
    }
    const ok = atMost(totalFt, limit.maxFt);
    const m = MESSAGES.connectorHorizontalLength;
    out.push(
      finding(CODE, ok ? "pass" : "fail", (ok ? m.pass : m.fail)(totalFt, limit.maxFt, limit.share.value, heightFt, limit.material), t, limit.share, {
        measured: { value: totalFt, unit: "ft" },
        required: { value: limit.maxFt, unit: "ft", comparator: "≤" },
      }),
    );
  }
}
