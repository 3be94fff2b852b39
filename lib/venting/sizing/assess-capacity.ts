import type { ConnectorMaterial } from "../enums";
import { MESSAGES, type FindingStatus, type FindingTarget, type Quantity, type Requirement } from "../findings";
import type { Appliance, VentRun } from "../inputs";
import type { PreparedRulebook, RuleRef } from "../rulebook/prepare";
import { deratePct, fits, limitsFor, lookupCapacity, smallestFittingDiameter, type DerateRule } from "./capacity";

/** Sizing answer for one appliance on a single-appliance vent. */
export interface CapacitySizing {
  readonly diameterIn: number;
  readonly heightFt: number;
  readonly lateralFt: number;
  readonly minBtuh: number | null;
  /** Maximum after derating; null when the table gives none. */
  readonly maxBtuh: number | null;
  readonly deratePct: number;
  readonly interpolated: boolean;
  readonly conservative: boolean;
  /** Smallest table diameter, not below the outlet, that fits the input; null if none. */
  readonly smallestDiameterIn: number | null;
}

/** Outcome of a capacity assessment, before it is turned into a finding. */
export interface CapacityAssessment {
  readonly status: FindingStatus;
  readonly message: string;
  readonly measured?: Quantity;
  readonly required?: Requirement;
  readonly rule: { readonly citation: string; readonly ref: RuleRef | null } | null;
  readonly target: FindingTarget;
  readonly sizing: CapacitySizing | null;
}

const VENT_TARGET = (field: string): FindingTarget => ({ section: "ventRun", itemId: null, field, path: `ventRun.vent.${field}` });

/**
 * Checks one Category I appliance alone on a vent against the single-appliance capacity table:
 * input between the (fan-assisted) minimum and the maximum derated for extra turns, looked up at
 * the vent's height and the run's total lateral (horizontal connector plus vent offsets).
 * Turn counts left empty are counted as none.
 */
export function assessSingleCapacity(run: VentRun, appliance: Appliance, applianceIndex: number, rb: PreparedRulebook): CapacityAssessment {
  const m = MESSAGES.ventCapacity;
  const vent = run.vent;
  const input = appliance.inputBtuh;
  const needs = (t: FindingTarget): CapacityAssessment => ({ status: "needs-info", message: m.needsInfo(), rule: null, target: t, sizing: null });
  if (typeof input !== "number") return needs({ section: "appliances", itemId: appliance.id, field: "inputBtuh", path: `appliances.${applianceIndex}.inputBtuh` });
  if (appliance.draft !== "natural" && appliance.draft !== "fan_assisted") {
    return needs({ section: "appliances", itemId: appliance.id, field: "draft", path: `appliances.${applianceIndex}.draft` });
  }
  if (vent.material == null) return needs(VENT_TARGET("material"));
  if (typeof vent.diameterIn !== "number") return needs(VENT_TARGET("diameterIn"));
  if (typeof vent.heightFt !== "number") return needs(VENT_TARGET("heightFt"));
  if (typeof vent.lateralFt !== "number") return needs(VENT_TARGET("lateralFt"));

  let connectorMaterial: ConnectorMaterial | null = null;
  let lateralFt = vent.lateralFt;
  let turns45 = vent.turns45 ?? 0;
  let turns90 = vent.turns90 ?? 0;
  const segs = run.segments;
  for (let i = 0; i < segs.length; i++) {
    const s = segs[i]!;
    if (s.applianceId && s.applianceId !== appliance.id) continue;
    const segTarget: FindingTarget = { section: "ventRun", itemId: s.id, field: "material", path: `ventRun.segments.${i}.material` };
    if (s.material == null) return needs(segTarget);
    connectorMaterial = connectorMaterial === "single_wall" || s.material === "single_wall" ? "single_wall" : "type_b";
    if (s.orientation == null) return needs({ ...segTarget, field: "orientation", path: `ventRun.segments.${i}.orientation` });
    if (s.orientation === "horizontal") {
      if (typeof s.lengthFt !== "number") return needs({ ...segTarget, field: "lengthFt", path: `ventRun.segments.${i}.lengthFt` });
      lateralFt += s.lengthFt;
    }
    turns45 += s.turns45 ?? 0;
    turns90 += s.turns90 ?? 0;
  }
  if (connectorMaterial === null) return needs({ section: "ventRun", itemId: null, field: "segments", path: "ventRun.segments" });

  const interpParam = rb.params.get("capacity_interpolation_allowed");
  const interpolate = interpParam?.value === 1;
  const hasLateral = lateralFt > 0;
  const assumed = rb.params.get("capacity_assumed_90_turns_with_lateral");
  const l45 = rb.params.get("capacity_loss_per_extra_45_turn_pct");
  const l90 = rb.params.get("capacity_loss_per_extra_90_turn_pct");
  const anyTurns = turns45 + turns90 > 0;
  if (anyTurns && (!l45 || !l90 || (hasLateral && !assumed))) {
    return {
      status: "needs-info",
      message: MESSAGES.missingRule("the capacity loss per extra turn", "Parameters"),
      rule: null,
      target: VENT_TARGET("turns90"),
      sizing: null,
    };
  }
  const rule: DerateRule = { assumed90WithLateral: assumed?.value ?? 0, lossPer45Pct: l45?.value ?? 0, lossPer90Pct: l90?.value ?? 0 };
  const turnsDerate = deratePct({ turns45, turns90, hasLateral }, rule);
  const fan = appliance.draft === "fan_assisted";
  // A fan-assisted appliance on a vent one size smaller than its outlet: the table maximum is
  // reduced (IFGC 504.2.2 states 10 %), in the numbers, not only in words.
  let reducedVentPct = 0;
  let reducedVentRule: { citation: string } | null = null;
  if (fan && typeof appliance.outletDiameterIn === "number" && vent.diameterIn < appliance.outletDiameterIn) {
    const red = rb.params.get("vent_reduction_fan_max_loss_pct");
    if (!red) {
      return { status: "needs-info", message: MESSAGES.missingRule("the fan-assisted maximum's reduction on a vent smaller than the outlet", "Parameters"), rule: null, target: VENT_TARGET("diameterIn"), sizing: null };
    }
    reducedVentPct = red.value;
    reducedVentRule = red;
  }
  const derate = Math.min(100, turnsDerate + reducedVentPct);
  const q = { ventMaterial: vent.material, connectorMaterial, diameterIn: vent.diameterIn, heightFt: vent.heightFt, lateralFt };
  const look = lookupCapacity(rb, q, interpolate);
  const dTarget = VENT_TARGET("diameterIn");
  if (!look.ok) {
    let what: string;
    switch (look.reason) {
      case "no_table":
        return { status: "needs-info", message: m.noTable(vent.material, connectorMaterial, vent.diameterIn), rule: null, target: dTarget, sizing: null };
      case "height_outside":
        what = `The table covers vent heights of ${look.minFt}–${look.maxFt} ft; this vent is ${vent.heightFt} ft.`;
        break;
      case "second_outside":
        what = `The table covers laterals of ${look.minFt}–${look.maxFt} ft; this run has ${Math.round(lateralFt * 100) / 100} ft.`;
        break;
      case "missing_row":
        what = `The table has no row for ${look.heightFt} ft height with ${look.secondFt} ft lateral at ${vent.diameterIn} in.`;
        break;
      default:
        look satisfies never;
        what = "";
    }
    return { status: "needs-info", message: m.outsideTable(what), rule: null, target: look.reason === "second_outside" ? VENT_TARGET("lateralFt") : VENT_TARGET("heightFt"), sizing: null };
  }
  const limits = limitsFor(look, fan, derate);
  // Diameters not below the outlet carry no reduced-vent loss.
  const smallest = smallestFittingDiameter(rb, q, input, fan, turnsDerate, interpolate, appliance.outletDiameterIn ?? 0);
  const sizing: CapacitySizing = {
    diameterIn: vent.diameterIn,
    heightFt: vent.heightFt,
    lateralFt,
    minBtuh: limits.minBtuh,
    maxBtuh: limits.maxBtuh,
    deratePct: derate,
    interpolated: look.interpolated,
    conservative: look.conservative,
    smallestDiameterIn: smallest ? smallest.diameterIn : null,
  };
  const note = `${look.interpolated ? m.interpolated() : look.conservative ? m.conservative() : ""}${turnsDerate > 0 ? m.derated(turnsDerate) : ""}${reducedVentPct > 0 ? m.reducedVent(reducedVentPct) : ""}`;
  const fix = smallest ? m.fixSmallest(smallest.diameterIn) : m.fixNone();
  const rule2 = { citation: reducedVentRule && !look.citation.includes(reducedVentRule.citation) ? `${look.citation}; ${reducedVentRule.citation}` : look.citation, ref: look.ref };
  const measured = { value: input, unit: "Btu/h" } as const;
  if (limits.maxBtuh === null) {
    return { status: "fail", message: m.notListed(vent.diameterIn, vent.heightFt, lateralFt, fan ? "fan-assisted" : "natural-draft", fix), measured, rule: rule2, target: dTarget, sizing };
  }
  const required: Requirement =
    limits.minBtuh === null
      ? { value: limits.maxBtuh, unit: "Btu/h", comparator: "≤" }
      : { value: limits.minBtuh, upperValue: limits.maxBtuh, unit: "Btu/h", comparator: "between" };
  if (fits(input, limits)) {
    return { status: "pass", message: m.pass(input, limits.minBtuh, limits.maxBtuh, vent.diameterIn, vent.heightFt, lateralFt, note), measured, required, rule: rule2, target: dTarget, sizing };
  }
  if (limits.minBtuh !== null && input < limits.minBtuh) {
    return { status: "fail", message: m.underMin(input, limits.minBtuh, vent.diameterIn, vent.heightFt, lateralFt, fix), measured, required, rule: rule2, target: dTarget, sizing };
  }
  return { status: "fail", message: m.overMax(input, limits.maxBtuh, vent.diameterIn, vent.heightFt, lateralFt, note, fix), measured, required, rule: rule2, target: dTarget, sizing };
}
