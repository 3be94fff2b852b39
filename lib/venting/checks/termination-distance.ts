import { atLeast } from "../compare";
import { FINDING_CODES, MESSAGES, type Finding } from "../findings";
import { finding, known, missingRuleFinding, target, type VentRunContext } from "./shared";

const CODE = FINDING_CODES.terminationDistance;
const OPENING_NAMES = {
  door: "door",
  operable_window: "operable window",
  gravity_inlet: "gravity air inlet",
  mechanical_inlet: "mechanical air inlet",
} as const;

/**
 * The termination is at least the minimum distance from each listed opening, or high enough
 * above it. An opening whose rows are all for another vent system is not applicable; one with no
 * row at all is not checked.
 */
export function checkTerminationDistance(ctx: VentRunContext, out: Finding[]): void {
  const term = ctx.run.termination;
  if (!term) return;
  const m = MESSAGES.terminationDistance;
  const openings = term.nearbyOpenings;
  for (let i = 0; i < openings.length; i++) {
    const o = openings[i]!;
    const what = OPENING_NAMES[o.kind];
    const base = `ventRun.termination.nearbyOpenings.${i}`;
    let entry = null;
    const otherSystems: string[] = [];
    for (const r of ctx.rb.terminationDistances) {
      if (r.row.opening !== o.kind) continue;
      if (r.row.ventSystem === "any" || r.row.ventSystem === ctx.ventSystem) {
        entry = r;
        break;
      }
      if (!otherSystems.includes(r.row.ventSystem)) otherSystems.push(r.row.ventSystem);
    }
    if (!entry) {
      const t = target("ventRun", o.id, "distanceFt", `${base}.distanceFt`);
      // Rows for this opening that are all for another vent system: the rule exists and does not apply here.
      if (otherSystems.length > 0) out.push(finding(CODE, "not-applicable", m.otherSystem(what, otherSystems, ctx.ventSystem), t, null));
      else out.push(missingRuleFinding(CODE, `the distance from a termination to ${/^[aeiou]/.test(what) ? "an" : "a"} ${what}`, "terminationDistances", t));
      continue;
    }
    const rule = { citation: entry.row.citation, ref: entry.ref };
    const min = entry.row.minDistanceFt;
    const above = entry.row.orAboveFt;
    if (known(o.distanceFt) && atLeast(o.distanceFt, min)) {
      out.push(finding(CODE, "pass", m.pass(what, o.distanceFt, min), target("ventRun", o.id, "distanceFt", `${base}.distanceFt`), rule, {
        measured: { value: o.distanceFt, unit: "ft" },
        required: { value: min, unit: "ft", comparator: "≥" },
      }));
      continue;
    }
    if (above !== null && known(o.ventAboveFt) && atLeast(o.ventAboveFt, above)) {
      out.push(finding(CODE, "pass", m.passAbove(what, o.ventAboveFt, above), target("ventRun", o.id, "ventAboveFt", `${base}.ventAboveFt`), rule, {
        measured: { value: o.ventAboveFt, unit: "ft" },
        required: { value: above, unit: "ft", comparator: "≥" },
      }));
      continue;
    }
    if (!known(o.distanceFt) || (above !== null && !known(o.ventAboveFt))) {
      const field = !known(o.distanceFt) ? "distanceFt" : "ventAboveFt";
      out.push(finding(CODE, "needs-info", m.needsInfo(what), target("ventRun", o.id, field, `${base}.${field}`), rule));
      continue;
    }
    out.push(finding(CODE, "fail", m.fail(what, o.distanceFt, min, above), target("ventRun", o.id, "distanceFt", `${base}.distanceFt`), rule, {
      measured: { value: o.distanceFt, unit: "ft" },
      required: { value: min, unit: "ft", comparator: "≥" },
    }));
  }
}
