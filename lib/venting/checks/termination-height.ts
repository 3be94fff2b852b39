import { atLeast } from "../compare";
import { FINDING_CODES, MESSAGES, type Finding } from "../findings";
import { fmt } from "../format";
import type { IndexedRow, PreparedRulebook } from "../rulebook/prepare";
import { finding, known, missingRuleFinding, param, target, type VentRunContext } from "./shared";

const CODE = FINDING_CODES.terminationHeight;

/**
 * The termination-height row for a roof pitch: a row covers pitches above its `from` up to and
 * including its `to`; the first row also includes its `from` (flat roofs).
 */
export function terminationHeightRow(rb: PreparedRulebook, pitchPer12: number): IndexedRow<"terminationHeights"> | null {
  const rows = rb.terminationHeights;
  for (let i = 0; i < rows.length; i++) {
    const r = rows[i]!;
    const lowOk = i === 0 ? pitchPer12 >= r.row.pitchFromPer12 : pitchPer12 > r.row.pitchFromPer12;
    if (lowOk && pitchPer12 <= r.row.pitchToPer12) return r;
  }
  return null;
}

/** The vent ends high enough above the roof: by pitch for small listed caps away from walls, otherwise the fixed height. */
export function checkTerminationHeight(ctx: VentRunContext, out: Finding[]): void {
  const term = ctx.run.termination;
  const m = MESSAGES.terminationHeight;
  const t = target("ventRun", null, "heightAboveRoofFt", "ventRun.termination.heightAboveRoofFt");
  if (!term) {
    out.push(finding(CODE, "needs-info", m.needsInfo(), target("ventRun", null, "termination", "ventRun.termination"), null));
    return;
  }
  const capMax = param(ctx.rb, "termination_listed_cap_max_in");
  const wallMin = param(ctx.rb, "termination_wall_distance_min_ft");
  const fixed = param(ctx.rb, "termination_height_otherwise_ft");
  if (!capMax || !wallMin || !fixed) {
    out.push(missingRuleFinding(CODE, "the termination cap size, wall distance and fixed height", "parameters", t));
    return;
  }
  const h = term.heightAboveRoofFt;
  if (!known(h) || term.listedCap == null || (term.listedCap && !known(term.capSizeIn)) || !known(term.distanceToVerticalWallFt)) {
    const field = !known(h) ? "heightAboveRoofFt" : term.listedCap == null || term.listedCap ? "capSizeIn" : "distanceToVerticalWallFt";
    out.push(finding(CODE, "needs-info", m.needsInfo(), target("ventRun", null, field, `ventRun.termination.${field}`), null));
    return;
  }
  const tableApplies = term.listedCap && term.capSizeIn! <= capMax.value && atLeast(term.distanceToVerticalWallFt, wallMin.value);
  if (tableApplies) {
    const pitch = term.roofPitchPer12;
    if (!known(pitch)) {
      out.push(finding(CODE, "needs-info", m.needsInfo(), target("ventRun", null, "roofPitchPer12", "ventRun.termination.roofPitchPer12"), null));
      return;
    }
    const row = terminationHeightRow(ctx.rb, pitch);
    if (!row) {
      const last = ctx.rb.terminationHeights[ctx.rb.terminationHeights.length - 1];
      if (!last) out.push(missingRuleFinding(CODE, "termination heights by roof pitch", "terminationHeights", t));
      else out.push(finding(CODE, "needs-info", m.outsidePitch(pitch, last.row.pitchToPer12), target("ventRun", null, "roofPitchPer12", "ventRun.termination.roofPitchPer12"), { citation: last.row.citation, ref: last.ref }));
      return;
    }
    const min = row.row.minHeightFt;
    const ok = atLeast(h, min);
    const rule = { citation: row.row.citation, ref: row.ref };
    out.push(
      finding(CODE, ok ? "pass" : "fail", (ok ? m.pass : m.fail)(h, min, m.pitchRow(pitch)), t, rule, {
        measured: { value: h, unit: "ft" },
        required: { value: min, unit: "ft", comparator: "≥" },
      }),
    );
    return;
  }
  const reason = !term.listedCap ? "without a listed cap" : term.capSizeIn! > capMax.value ? `with a cap over ${fmt(capMax.value)} in` : `closer than ${fmt(wallMin.value)} ft to a wall`;
  const ok = atLeast(h, fixed.value);
  out.push(
    finding(CODE, ok ? "pass" : "fail", (ok ? m.pass : m.fail)(h, fixed.value, m.fixed(reason)), t, fixed, {
      measured: { value: h, unit: "ft" },
      required: { value: fixed.value, unit: "ft", comparator: "≥" },
    }),
  );
  const nearby = term.heightAboveNearbyStructureFt;
  const nt = target("ventRun", null, "heightAboveNearbyStructureFt", "ventRun.termination.heightAboveNearbyStructureFt");
  if (!known(nearby)) out.push(finding(CODE, "needs-info", m.needsNearby(), nt, fixed));
  else if (!atLeast(nearby, fixed.value)) {
    out.push(finding(CODE, "fail", m.nearbyFail(nearby, fixed.value), nt, fixed, { measured: { value: nearby, unit: "ft" }, required: { value: fixed.value, unit: "ft", comparator: "≥" } }));
  }
}
