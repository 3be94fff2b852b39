import { atMost } from "../compare";
import type { ConnectorMaterial, VentMaterial } from "../enums";
import { FINDING_CODES, MESSAGES, type Finding, type FindingTarget } from "../findings";
import type { Appliance } from "../inputs";
import type { Cited, PreparedRulebook } from "../rulebook/prepare";
import { fits } from "../sizing/capacity";
import {
  commonConnectorMaterial,
  commonVentColumn,
  commonVentLimit,
  commonVentTurns,
  connectorLimits,
  smallestCommonVentDiameter,
  smallestConnectorDiameter,
  tableDraft,
  type CommonVentColumn,
  type ConnectorProfile,
  type ConnectorRules,
  type TableMiss,
} from "../sizing/common-capacity";
import { finding, known, missingRuleFinding, param, segmentTarget, target, type ConnectorGroup, type VentRunContext } from "./shared";

const m = MESSAGES.commonVent;
const VENT = (field: string): FindingTarget => target("ventRun", null, field, `ventRun.vent.${field}`);

/** Sizing answer for one connector into a common vent. */
export interface CommonConnectorSizing {
  readonly applianceId: string;
  readonly diameterIn: number;
  readonly riseFt: number;
  readonly horizontalFt: number;
  readonly minBtuh: number | null;
  readonly maxBtuh: number | null;
  readonly deratePct: number;
  /** Smallest connector diameter the tables allow (not below the outlet); null when none fits. */
  readonly smallestDiameterIn: number | null;
}

/** Sizing answer for a common vent and its connectors. */
export interface CommonVentSizing {
  readonly connectors: readonly CommonConnectorSizing[];
  readonly column: CommonVentColumn | null;
  readonly diameterIn: number | null;
  readonly heightFt: number | null;
  readonly totalInputBtuh: number | null;
  readonly maxBtuh: number | null;
  readonly deratePct: number;
  /** Smallest common-vent diameter the tables allow (not below the largest connector); null when none fits. */
  readonly smallestDiameterIn: number | null;
}

type Profiled = { ok: true; profile: ConnectorProfile } | { ok: false; target: FindingTarget };

/** Measures one appliance's connector as the tables need it; the first missing value otherwise. */
function profileOf(ctx: VentRunContext, group: ConnectorGroup): Profiled {
  const segs = ctx.run.segments;
  let material: ConnectorMaterial | null = null;
  let diameterIn = Number.POSITIVE_INFINITY;
  let riseFt = 0;
  let horizontalFt = 0;
  let turns45 = 0;
  let turns90 = 0;
  for (const i of group.segmentIndexes) {
    const s = segs[i]!;
    if (s.material == null) return { ok: false, target: segmentTarget(i, s, "material") };
    if (!known(s.diameterIn)) return { ok: false, target: segmentTarget(i, s, "diameterIn") };
    if (s.orientation == null) return { ok: false, target: segmentTarget(i, s, "orientation") };
    if (!known(s.lengthFt)) return { ok: false, target: segmentTarget(i, s, "lengthFt") };
    material = material === "single_wall" || s.material === "single_wall" ? "single_wall" : "type_b";
    if (s.diameterIn < diameterIn) diameterIn = s.diameterIn;
    if (s.orientation === "vertical") riseFt += s.lengthFt;
    else {
      if (!known(s.riseIn)) return { ok: false, target: segmentTarget(i, s, "riseIn") };
      horizontalFt += s.lengthFt;
      riseFt += Math.max(0, s.riseIn) / 12;
    }
    turns45 += s.turns45 ?? 0;
    turns90 += s.turns90 ?? 0;
  }
  if (material === null) return { ok: false, target: target("ventRun", null, "segments", "ventRun.segments") };
  return { ok: true, profile: { material, diameterIn, riseFt, horizontalFt, turns45, turns90 } };
}

function missText(miss: TableMiss, what: "connector" | "common"): string {
  switch (miss.reason) {
    case "no_table":
      return what === "connector" ? m.noConnectorTable() : m.noCommonTable();
    case "height_outside":
      return m.heightOutside(miss.minFt, miss.maxFt);
    case "second_outside":
      return m.riseOutside(miss.minFt, miss.maxFt);
    case "missing_row":
      return m.missingRow(miss.heightFt, miss.secondFt);
    case "min_outside_single_table":
      return m.minOutsideSingle();
    default:
      miss satisfies never;
      return "";
  }
}

function labelOf(a: Appliance): string {
  return a.label || a.id;
}

/** Reads the rulebook values a connector needs; a needs-info finding when one is missing. */
function connectorRules(rb: PreparedRulebook, anyTurns: boolean, at: FindingTarget): ConnectorRules | Finding {
  const perIn = param(rb, "connector_max_length_ft_per_in_diameter");
  if (!perIn) return missingRuleFinding(FINDING_CODES.connectorCapacity, "the connector length per inch of diameter", "parameters", at);
  const lengthLoss = param(rb, "connector_capacity_loss_per_extra_length_multiple_pct");
  if (!lengthLoss) return missingRuleFinding(FINDING_CODES.connectorCapacity, "the capacity loss per extra connector length", "parameters", at);
  const assumed = param(rb, "common_connector_assumed_90_turns");
  const l45 = param(rb, "capacity_loss_per_extra_45_turn_pct");
  const l90 = param(rb, "capacity_loss_per_extra_90_turn_pct");
  if (anyTurns && (!assumed || !l45 || !l90)) return missingRuleFinding(FINDING_CODES.connectorCapacity, "the turns a connector table assumes and the loss per extra turn", "parameters", at);
  return {
    interpolate: param(rb, "capacity_interpolation_allowed")?.value === 1,
    assumed90: assumed?.value ?? 0,
    lossPer45Pct: l45?.value ?? 0,
    lossPer90Pct: l90?.value ?? 0,
    lengthFtPerIn: perIn.value,
    lengthLossPct: lengthLoss.value,
  };
}

/**
 * Two or more appliances on one vent: every served appliance has a connector; each connector is
 * sized from the company's connector table at the vent height and its rise (maximum reduced for
 * extra turns and for a horizontal length beyond the tables' assumption, fan-assisted minimum from
 * the single-appliance table when longer); the common vent from the common-vent table in the
 * column the draft types choose, reduced for its turns and a manifold; offsets and manifolds kept
 * within their length per inch of diameter. Each finding names the smallest diameter that works.
 */
export function checkCommonVentCapacity(ctx: VentRunContext, out: Finding[]): CommonVentSizing {
  const run = ctx.run;
  const vent = run.vent;
  const rb = ctx.rb;
  const connectors: CommonConnectorSizing[] = [];
  const empty = (over: Partial<CommonVentSizing> = {}): CommonVentSizing => ({
    connectors,
    column: null,
    diameterIn: known(vent.diameterIn) ? vent.diameterIn : null,
    heightFt: known(vent.heightFt) ? vent.heightFt : null,
    totalInputBtuh: null,
    maxBtuh: null,
    deratePct: 0,
    smallestDiameterIn: null,
    ...over,
  });

  // Every appliance on the vent needs a connector of its own, and every segment an owner.
  const withConnector = new Set<string>();
  for (const g of ctx.connectors) {
    if (g.appliance) withConnector.add(g.appliance.id);
    else {
      const i = g.segmentIndexes[0]!;
      out.push(finding(FINDING_CODES.commonVentNoConnector, "needs-info", m.segmentWithoutAppliance(), segmentTarget(i, run.segments[i]!, "applianceId"), null));
    }
  }
  for (const a of ctx.served) {
    if (withConnector.has(a.id)) continue;
    const idx = ctx.allAppliances.findIndex((x) => x.id === a.id);
    out.push(finding(FINDING_CODES.commonVentNoConnector, "needs-info", m.noConnector(labelOf(a)), target("appliances", a.id, null, `appliances.${idx}`), null));
  }

  const ventMaterial: VentMaterial | null = vent.material ?? null;
  const heightFt = vent.heightFt;
  if (ventMaterial === null || !known(heightFt)) {
    out.push(finding(FINDING_CODES.ventCapacity, "needs-info", m.needsVent(), VENT(ventMaterial === null ? "material" : "heightFt"), null));
    return empty();
  }

  // Connectors.
  const materials: ConnectorMaterial[] = [];
  let largestConnectorIn = 0;
  let allInputs = true;
  let total = 0;
  for (const g of ctx.connectors) {
    const a = g.appliance;
    if (!a || !ctx.served.includes(a)) continue;
    const first = g.segmentIndexes[0]!;
    const at = segmentTarget(first, run.segments[first]!, "diameterIn");
    const label = labelOf(a);
    const draft = tableDraft(a);
    const idx = ctx.allAppliances.findIndex((x) => x.id === a.id);
    const prof = profileOf(ctx, g);
    if (!prof.ok) {
      out.push(finding(FINDING_CODES.connectorCapacity, "needs-info", m.connectorNeedsInfo(label), prof.target, null));
      continue;
    }
    const p = prof.profile;
    materials.push(p.material);
    if (p.diameterIn > largestConnectorIn) largestConnectorIn = p.diameterIn;
    if (!known(a.inputBtuh) || draft === null) {
      out.push(finding(FINDING_CODES.connectorCapacity, "needs-info", m.connectorNeedsInfo(label), target("appliances", a.id, known(a.inputBtuh) ? "draft" : "inputBtuh", `appliances.${idx}.${known(a.inputBtuh) ? "draft" : "inputBtuh"}`), null));
      continue;
    }
    const rules = connectorRules(rb, p.turns45 + p.turns90 > 0, at);
    if ("code" in rules) {
      out.push(rules);
      continue;
    }
    const fan = draft === "fan_assisted";
    const r = connectorLimits(rb, ventMaterial, p, heightFt, fan, rules);
    const smallest = smallestConnectorDiameter(rb, ventMaterial, p, heightFt, a.inputBtuh, fan, rules, a.outletDiameterIn ?? 0);
    const fix = smallest === null ? m.connectorFixNone() : m.connectorFixSmallest(smallest);
    if (!r.ok) {
      out.push(finding(FINDING_CODES.connectorCapacity, "needs-info", m.outsideTable(label, missText(r, "connector")), r.reason === "height_outside" ? VENT("heightFt") : at, null));
      connectors.push({ applianceId: a.id, diameterIn: p.diameterIn, riseFt: p.riseFt, horizontalFt: p.horizontalFt, minBtuh: null, maxBtuh: null, deratePct: 0, smallestDiameterIn: smallest });
      continue;
    }
    connectors.push({ applianceId: a.id, diameterIn: p.diameterIn, riseFt: p.riseFt, horizontalFt: p.horizontalFt, minBtuh: r.minBtuh, maxBtuh: r.maxBtuh, deratePct: r.deratePct, smallestDiameterIn: smallest });
    const where = m.connectorWhere(p.diameterIn, p.material, p.riseFt, heightFt);
    const notes = m.connectorNotes(r.turnsLossPct, r.lengthLossPct, r.assumedLengthFt, p.horizontalFt, r.minFromSingleTable, r.interpolated, r.conservative);
    const rule = { citation: r.citation, ref: r.ref };
    const measured = { value: a.inputBtuh, unit: "Btu/h" } as const;
    const extras = smallest === null ? {} : { smallest: { value: smallest, unit: "in" } };
    if (r.maxBtuh === null) {
      out.push(finding(FINDING_CODES.connectorCapacity, "fail", m.connectorNotListed(label, fan, where, fix), at, rule, { measured, ...extras }));
      continue;
    }
    const required =
      r.minBtuh === null ? ({ value: r.maxBtuh, unit: "Btu/h", comparator: "≤" } as const) : ({ value: r.minBtuh, upperValue: r.maxBtuh, unit: "Btu/h", comparator: "between" } as const);
    if (fits(a.inputBtuh, r)) {
      out.push(finding(FINDING_CODES.connectorCapacity, "pass", m.connectorPass(label, a.inputBtuh, r.minBtuh, r.maxBtuh, where, notes, smallest), at, rule, { measured, required, ...extras }));
    } else if (r.minBtuh !== null && a.inputBtuh < r.minBtuh) {
      out.push(finding(FINDING_CODES.connectorCapacity, "fail", m.connectorUnderMin(label, a.inputBtuh, r.minBtuh, where, notes, fix), at, rule, { measured, required, ...extras }));
    } else {
      out.push(finding(FINDING_CODES.connectorCapacity, "fail", m.connectorOverMax(label, a.inputBtuh, r.maxBtuh, where, notes, fix), at, rule, { measured, required, ...extras }));
    }
  }
  for (const a of ctx.served) {
    if (known(a.inputBtuh)) total += a.inputBtuh;
    else allInputs = false;
  }

  // The common vent.
  const drafts = ctx.served.map(tableDraft);
  if (!allInputs || drafts.some((d) => d === null) || !known(vent.diameterIn)) {
    out.push(finding(FINDING_CODES.ventCapacity, "needs-info", m.commonNeedsInfo(), known(vent.diameterIn) ? VENT("heightFt") : VENT("diameterIn"), null));
    return empty();
  }
  const column = commonVentColumn(drafts as ("natural" | "fan_assisted")[]);
  const connectorMaterial = commonConnectorMaterial(materials.length ? materials : ["type_b"]);
  const turns = commonVentTurns(run);
  const reductions: { pct: number; rule: Cited<number> }[] = [];
  const l45 = param(rb, "common_vent_loss_per_45_turn_pct");
  const l90 = param(rb, "common_vent_loss_per_90_turn_pct");
  if (turns.turns45 + turns.turns90 > 0) {
    if (!l45 || !l90) {
      out.push(missingRuleFinding(FINDING_CODES.ventCapacity, "the common vent's capacity loss per turn", "parameters", VENT("turns90")));
      return empty({ column, totalInputBtuh: total });
    }
    reductions.push({ pct: turns.turns45 * l45.value + turns.turns90 * l90.value, rule: turns.turns90 > 0 ? l90 : l45 });
  }
  const manifoldFt = vent.manifoldLengthFt ?? 0;
  if (manifoldFt > 0) {
    const ml = param(rb, "common_vent_manifold_loss_pct");
    if (!ml) {
      out.push(missingRuleFinding(FINDING_CODES.ventCapacity, "the common vent's capacity loss for a manifold", "parameters", VENT("manifoldLengthFt")));
      return empty({ column, totalInputBtuh: total });
    }
    reductions.push({ pct: ml.value, rule: ml });
  }
  const derate = Math.min(100, reductions.reduce((s, r) => s + r.pct, 0));
  const interpolate = param(rb, "capacity_interpolation_allowed")?.value === 1;
  const look = commonVentLimit(rb, ventMaterial, connectorMaterial, vent.diameterIn, heightFt, column, interpolate, derate);
  const smallest = smallestCommonVentDiameter(rb, ventMaterial, connectorMaterial, heightFt, column, interpolate, derate, total, largestConnectorIn);
  const fix = smallest === null ? m.commonFixNone() : m.commonFixSmallest(smallest);
  checkHorizontalLengths(ctx, out);
  const vt = VENT("diameterIn");
  if (!look.ok) {
    out.push(finding(FINDING_CODES.ventCapacity, "needs-info", m.commonOutsideTable(missText(look, "common")), look.reason === "height_outside" ? VENT("heightFt") : vt, null));
    return empty({ column, totalInputBtuh: total, deratePct: derate, smallestDiameterIn: smallest });
  }
  let citation = look.citation;
  for (const r of reductions) if (!citation.includes(r.rule.citation)) citation += `; ${r.rule.citation}`;
  const rule = { citation, ref: look.ref };
  const sizing = empty({ column, totalInputBtuh: total, maxBtuh: look.maxBtuh, deratePct: derate, smallestDiameterIn: smallest });
  const measured = { value: total, unit: "Btu/h" } as const;
  const extras = smallest === null ? {} : { smallest: { value: smallest, unit: "in" } };
  const where = m.commonWhere(vent.diameterIn, heightFt, column);
  const notes = m.commonNotes(derate, look.interpolated, look.conservative);
  if (look.maxBtuh === null) {
    out.push(finding(FINDING_CODES.ventCapacity, "fail", m.commonNotListed(where, fix), vt, rule, { measured, ...extras }));
    return sizing;
  }
  const required = { value: look.maxBtuh, unit: "Btu/h", comparator: "≤" } as const;
  if (atMost(total, look.maxBtuh)) {
    out.push(finding(FINDING_CODES.ventCapacity, "pass", m.commonPass(total, look.maxBtuh, where, notes, smallest), vt, rule, { measured, required, ...extras }));
  } else {
    out.push(finding(FINDING_CODES.ventCapacity, "fail", m.commonOverMax(total, look.maxBtuh, where, notes, fix), vt, rule, { measured, required, ...extras }));
  }
  return sizing;
}

/** A common vent's offset and a connector manifold stay within their length per inch of common-vent diameter. */
function checkHorizontalLengths(ctx: VentRunContext, out: Finding[]): void {
  const vent = ctx.run.vent;
  if (!known(vent.diameterIn)) return;
  const items: { lengthFt: number | null | undefined; key: "common_vent_offset_max_in_per_in_diameter" | "common_vent_manifold_max_in_per_in_diameter"; field: string; what: "offset" | "manifold" }[] = [
    { lengthFt: vent.lateralFt, key: "common_vent_offset_max_in_per_in_diameter", field: "lateralFt", what: "offset" },
    { lengthFt: vent.manifoldLengthFt, key: "common_vent_manifold_max_in_per_in_diameter", field: "manifoldLengthFt", what: "manifold" },
  ];
  for (const it of items) {
    if (!known(it.lengthFt) || it.lengthFt <= 0) continue;
    const p = param(ctx.rb, it.key);
    if (!p) {
      out.push(missingRuleFinding(FINDING_CODES.commonVentHorizontalLength, `the longest common-vent ${it.what} per inch of diameter`, "parameters", VENT(it.field)));
      continue;
    }
    const maxFt = (p.value * vent.diameterIn) / 12;
    const ok = atMost(it.lengthFt, maxFt);
    out.push(
      finding(FINDING_CODES.commonVentHorizontalLength, ok ? "pass" : "fail", (ok ? m.horizontalPass : m.horizontalFail)(it.what, it.lengthFt, maxFt, p.value, vent.diameterIn), VENT(it.field), p, {
        measured: { value: it.lengthFt, unit: "ft" },
        required: { value: maxFt, unit: "ft", comparator: "≤" },
      }),
    );
  }
}
