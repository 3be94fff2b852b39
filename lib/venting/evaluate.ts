import { checkAirOpeningDimension } from "./checks/air-opening-dimension";
import { checkIndoorOpenings, checkOutdoorOpenings, type OpeningSizing } from "./checks/air-openings";
import { airContext } from "./checks/air-context";
import { checkAirVolume } from "./checks/air-volume";
import { checkClearanceCombustibles } from "./checks/clearance-combustibles";
import { checkOrphanedAppliance } from "./checks/common-vent-orphaned";
import { checkConnectorDiameter } from "./checks/connector-diameter";
import { checkConnectorHorizontalLength, maxHorizontalConnectorFt } from "./checks/connector-horizontal-length";
import { checkConnectorLengthPerDiameter } from "./checks/connector-length-per-diameter";
import { checkConnectorSlope } from "./checks/connector-slope";
import { checkJointsFasteners } from "./checks/joints-fasteners";
import { checkJointsLocked } from "./checks/joints-locked";
import { checkPassageSingleWall } from "./checks/passage-single-wall";
import { checkAmbientCo } from "./checks/readings-ambient-co";
import { checkCoAirFree } from "./checks/readings-co-air-free";
import { checkDraft } from "./checks/readings-draft";
import { checkInputRate } from "./checks/readings-input-rate";
import type { ReadingsContext } from "./checks/readings-shared";
import { checkSpillage } from "./checks/readings-spillage";
import { checkReturnAirArea } from "./checks/return-air-area";
import { returnAirContext, type AirflowSource, type OutputSource } from "./checks/return-air-context";
import { checkReturnAirDraftHood } from "./checks/return-air-draft-hood";
import { checkReturnAirLocation } from "./checks/return-air-location";
import { checkReturnAirVelocity } from "./checks/return-air-velocity";
import { checkTemperatureRise } from "./checks/readings-temperature-rise";
import { applianceCategory, groupConnectors, type VentRunContext } from "./checks/shared";
import { checkSupportsSpacing } from "./checks/supports-spacing";
import { checkTerminationDistance } from "./checks/termination-distance";
import { checkTerminationHeight } from "./checks/termination-height";
import { checkVentAreaRatio } from "./checks/vent-area-ratio";
import { checkVentCapacity } from "./checks/vent-capacity";
import type { CommonVentSizing } from "./checks/common-vent-capacity";
import { checkVentCategory, reportSkippedCategoryIChecks } from "./checks/vent-category";
import { checkVentMinHeight } from "./checks/vent-min-height";
import type { ConnectorMaterial } from "./enums";
import { FINDING_STATUSES, type Finding, type FindingStatus } from "./findings";
import type { AirSpace, Appliance, CheckInput, Readings, ReturnAir, VentRun } from "./inputs";
import type { PreparedRulebook } from "./rulebook/prepare";
import type { VolumeRequirement } from "./sizing/air";
import type { CapacitySizing } from "./sizing/assess-capacity";
import { requiredRiseIn, supportsNeeded } from "./sizing/rise";

/** Sizing answers for one segment. */
export interface SegmentSizing {
  readonly segmentId: string;
  /** Rise a horizontal segment needs, in (null for vertical segments or missing length). */
  readonly requiredRiseIn: number | null;
  /** Supports the segment needs (null when length or the spacing row is missing). */
  readonly supportsNeeded: number | null;
}

/** Sizing answers for a vent run. */
export interface VentRunSizing {
  readonly segments: readonly SegmentSizing[];
  /** Longest total horizontal connector the vent height allows, ft (single appliance). */
  readonly maxHorizontalConnectorFt: number | null;
  /** Capacity answer for a single-appliance vent, with the smallest fitting diameter. */
  readonly capacity: CapacitySizing | null;
  /** Answer for a common vent: each connector and the common vent, with the smallest diameters that work. */
  readonly common: CommonVentSizing | null;
}

/** Result of {@link evaluateVentRun}. */
export interface VentRunResult {
  readonly findings: Finding[];
  readonly sizing: VentRunSizing;
}

/** Sizing answers for an air space. */
export interface AirSpaceSizing {
  readonly totalInputBtuh: number | null;
  readonly availableVolumeCuFt: number | null;
  readonly requirement: VolumeRequirement | null;
  readonly openings: readonly OpeningSizing[];
}

/** Result of {@link evaluateCombustionAir}. */
export interface AirSpaceResult {
  readonly findings: Finding[];
  readonly sizing: AirSpaceSizing;
}

/** Sizing answer for one return opening. */
export interface ReturnOpeningSizing {
  readonly openingId: string;
  /** Free area, in² (null when its size or share is missing). */
  readonly freeAreaSqIn: number | null;
  /** Its share of the airflow, cfm (split by free area). */
  readonly airflowCfm: number | null;
  readonly faceVelocityFpm: number | null;
  /** The face-velocity limit it was judged against, fpm (null when not known). */
  readonly velocityLimitFpm: number | null;
}

/** Sizing answers for the return-air side of a furnace. */
export interface ReturnAirSizing {
  /** The furnace served, when it can be told. */
  readonly applianceId: string | null;
  readonly outputBtuh: number | null;
  /** `entered` from the rating plate, or `input_efficiency` (rated input × efficiency). */
  readonly outputSource: OutputSource | null;
  readonly airflowCfm: number | null;
  /** `nameplate`, `cooling_tons` (tons × cfm per ton) or `temperature_rise` (output ÷ (factor × ΔT)). */
  readonly airflowSource: AirflowSource | null;
  /** Temperature rise used for the airflow, °F (only for `temperature_rise`). */
  readonly temperatureRiseF: number | null;
  /** Total free area the return needs, in². */
  readonly requiredFreeAreaSqIn: number | null;
  /** Total free area the openings give, in² (null when one is not known). */
  readonly totalFreeAreaSqIn: number | null;
  readonly openings: readonly ReturnOpeningSizing[];
}

/** Result of {@link evaluateReturnAir}. */
export interface ReturnAirResult {
  readonly findings: Finding[];
  readonly sizing: ReturnAirSizing;
}

/** Counts per status and the worst one. */
export interface FindingSummary {
  readonly total: number;
  readonly counts: Readonly<Record<FindingStatus, number>>;
  /** The worst status present (fail > needs-info > warn > pass > not-applicable); null when there are no findings. */
  readonly worst: FindingStatus | null;
}

/** Result of {@link evaluateInspection}. */
export interface InspectionResult {
  readonly findings: Finding[];
  readonly sizing: { readonly ventRun: VentRunSizing | null; readonly airSpace: AirSpaceSizing | null; readonly returnAir: ReturnAirSizing | null };
  readonly summary: FindingSummary;
  /** The rulebook edition the checks ran against. */
  readonly edition: string;
}

function servedAppliances(run: VentRun, appliances: readonly Appliance[]): Appliance[] {
  const ids = run.applianceIds;
  if (ids) return appliances.filter((a) => ids.includes(a.id));
  return appliances.filter((a) => a.draft !== "direct_vent");
}

/**
 * Checks a vent run: connector slope, horizontal length, diameter, clearances, supports,
 * joints, passages, vent height, capacity and termination. Category I rules run only when every
 * served appliance is Category I (or its category is unknown); otherwise a `vent.category`
 * caution says the manufacturer's instructions govern.
 * @param ventRun the run as entered (parsed with `ventRunSchema`)
 * @param appliances all appliances of the inspection; the run serves `ventRun.applianceIds` or every non-direct-vent one
 * @param rulebook a rulebook from `prepareRulebook`
 */
export function evaluateVentRun(ventRun: VentRun, appliances: readonly Appliance[], rulebook: PreparedRulebook): VentRunResult {
  const findings: Finding[] = [];
  const served = servedAppliances(ventRun, appliances);
  const byId = new Map<string, Appliance>();
  for (const a of appliances) byId.set(a.id, a);
  const isCommon = ventRun.vent.serves === "common" || served.length > 1;
  let mechanical = false;
  for (const a of served) if (a.category === "III" || a.category === "IV") mechanical = true;
  const categoryI = checkVentCategory(served, appliances, findings);
  if (!categoryI) reportSkippedCategoryIChecks(served, isCommon, findings);
  const ctx: VentRunContext = {
    run: ventRun,
    rb: rulebook,
    served,
    byId,
    allAppliances: appliances,
    isCommon,
    category: categoryI ? (served.every((a) => applianceCategory(a) === "category_i") ? "category_i" : "unknown") : "other",
    connectors: groupConnectors(ventRun, served, byId),
    ventSystem: mechanical ? "mechanical_draft" : "natural_draft",
  };
  let capacity: CapacitySizing | null = null;
  let common: CommonVentSizing | null = null;
  if (categoryI) {
    checkConnectorSlope(ctx, findings);
    checkConnectorHorizontalLength(ctx, findings);
    checkConnectorLengthPerDiameter(ctx, findings);
  }
  checkConnectorDiameter(ctx, findings);
  if (categoryI) {
    ({ single: capacity, common } = checkVentCapacity(ctx, findings));
    checkVentAreaRatio(ctx, findings);
    checkVentMinHeight(ctx, findings);
  }
  checkClearanceCombustibles(ctx, findings);
  checkSupportsSpacing(ctx, findings);
  checkJointsFasteners(ctx, findings);
  checkJointsLocked(ctx, findings);
  checkPassageSingleWall(ctx, findings);
  if (categoryI) checkTerminationHeight(ctx, findings);
  checkTerminationDistance(ctx, findings);

  const slope = rulebook.params.get("connector_min_slope_in_per_ft");
  const segments: SegmentSizing[] = ventRun.segments.map((s) => {
    const spacing = s.material && s.orientation ? rulebook.supportSpacing.get(`${s.material}|${s.orientation}`) : undefined;
    return {
      segmentId: s.id,
      requiredRiseIn: s.orientation === "horizontal" && typeof s.lengthFt === "number" && slope ? requiredRiseIn(s.lengthFt, slope.value) : null,
      supportsNeeded: typeof s.lengthFt === "number" && spacing && spacing.value > 0 ? supportsNeeded(s.lengthFt, spacing.value) : null,
    };
  });
  let maxHorizontal: number | null = null;
  if (!isCommon && typeof ventRun.vent.heightFt === "number") {
    const mats: ConnectorMaterial[] = [];
    for (const s of ventRun.segments) if (s.orientation === "horizontal" && s.material && !mats.includes(s.material)) mats.push(s.material);
    const lim = mats.length ? maxHorizontalConnectorFt(rulebook.connectorShare, mats, ventRun.vent.heightFt) : null;
    maxHorizontal = lim ? lim.maxFt : null;
  }
  return { findings, sizing: { segments, maxHorizontalConnectorFt: maxHorizontal, capacity, common } };
}

/** Options of {@link evaluateCombustionAir}. */
export interface CombustionAirOptions {
  /** Connector diameter per appliance id, in; otherwise the outlet diameter is used for the single-opening floor. */
  readonly connectorDiameterIn?: Readonly<Record<string, number>>;
}

/**
 * Checks an air space: volume by the standard or known-infiltration method, indoor openings
 * joining rooms, outdoor openings (combined with the indoor volume where the rulebook allows)
 * and the minimum opening dimension. Direct-vent appliances are left out of the input total.
 * @param airSpace the space as entered (parsed with `airSpaceSchema`)
 * @param appliances all appliances; the space holds `airSpace.applianceIds` or all of them
 * @param rulebook a rulebook from `prepareRulebook`
 */
export function evaluateCombustionAir(
  airSpace: AirSpace,
  appliances: readonly Appliance[],
  rulebook: PreparedRulebook,
  options?: CombustionAirOptions,
): AirSpaceResult {
  const findings: Finding[] = [];
  const ctx = airContext(airSpace, appliances, rulebook, options?.connectorDiameterIn);
  const openings: OpeningSizing[] = [];
  const counted = checkIndoorOpenings(ctx, findings, openings);
  const vol = checkAirVolume(ctx, counted, findings);
  if (vol) checkOutdoorOpenings(ctx, vol.availableCuFt, vol.requirement.volumeCuFt, findings, openings);
  checkAirOpeningDimension(ctx, findings);
  return {
    findings,
    sizing: {
      totalInputBtuh: ctx.inputMissing ? null : ctx.totalInputBtuh,
      availableVolumeCuFt: vol ? vol.availableCuFt : null,
      requirement: vol ? vol.requirement : null,
      openings,
    },
  };
}

/**
 * Checks one appliance's field readings: air-free flue CO, ambient CO, draft and spillage (not
 * for direct-vent; spillage only for draft-hood appliances), temperature rise (furnaces) and
 * clocked gas input.
 * @param index position of this entry in the request's readings list, used in target paths
 */
export function evaluateReadings(readings: Readings, appliance: Appliance, rulebook: PreparedRulebook, index = 0): Finding[] {
  const out: Finding[] = [];
  const ctx: ReadingsContext = { r: readings, appliance, rb: rulebook, index };
  checkAmbientCo(ctx, out);
  checkCoAirFree(ctx, out);
  checkDraft(ctx, out);
  checkSpillage(ctx, out);
  checkTemperatureRise(ctx, out);
  checkInputRate(ctx, out);
  return out;
}

/**
 * An appliance left alone on a vent that was common (another appliance was removed): re-checks
 * it against the single-appliance capacity table, minimum and maximum. The run should describe
 * the vent as it is now; appliances listed in `removedApplianceIds` are left out of it.
 */
export function evaluateOrphanedAppliance(
  ventRun: VentRun,
  appliances: readonly Appliance[],
  removedApplianceIds: readonly string[],
  rulebook: PreparedRulebook,
): Finding {
  const remaining = servedAppliances(ventRun, appliances).filter((a) => !removedApplianceIds.includes(a.id));
  const segments = ventRun.segments.filter((s) => !s.applianceId || !removedApplianceIds.includes(s.applianceId));
  const current: VentRun = { ...ventRun, segments, applianceIds: remaining.map((a) => a.id) };
  // Two or more left: the vent is still common, re-checked against the multiple-appliance tables.
  const stillCommon = remaining.length > 1 ? evaluateVentRun({ ...current, vent: { ...current.vent, serves: "common" } }, appliances, rulebook).findings.find((f) => f.code === "vent.capacity") ?? null : null;
  return checkOrphanedAppliance(current, remaining, appliances, rulebook, stillCommon);
}

/**
 * Checks the return-air side of a furnace: the openings' total free area against the furnace's
 * output, each grille's face velocity from the airflow, where the return draws from, and its
 * distance from draft hoods in the same space.
 * @param returnAir the return as entered (parsed with `returnAirSchema`)
 * @param appliances all appliances; the return serves `returnAir.applianceId` or the only furnace
 * @param readings the readings entries; the furnace's supply and return temperatures give the rise when none is entered
 * @param rulebook a rulebook from `prepareRulebook`
 */
export function evaluateReturnAir(returnAir: ReturnAir, appliances: readonly Appliance[], readings: readonly Readings[], rulebook: PreparedRulebook): ReturnAirResult {
  const findings: Finding[] = [];
  const ctx = returnAirContext(returnAir, appliances, readings, rulebook);
  const requiredFreeAreaSqIn = checkReturnAirArea(ctx, findings);
  const velocities = checkReturnAirVelocity(ctx, findings);
  checkReturnAirLocation(ctx, findings);
  checkReturnAirDraftHood(ctx, findings);
  const byId = new Map(velocities.map((v) => [v.openingId, v]));
  return {
    findings,
    sizing: {
      applianceId: ctx.appliance?.id ?? null,
      outputBtuh: ctx.output.ok ? ctx.output.outputBtuh : null,
      outputSource: ctx.output.ok ? ctx.output.source : null,
      airflowCfm: ctx.airflow.ok ? ctx.airflow.cfm : null,
      airflowSource: ctx.airflow.ok ? ctx.airflow.source : null,
      temperatureRiseF: ctx.airflow.ok ? ctx.airflow.riseF : null,
      requiredFreeAreaSqIn,
      totalFreeAreaSqIn: ctx.totalFreeAreaSqIn,
      openings: ctx.openings.map((o) => {
        const v = byId.get(o.opening.id);
        return {
          openingId: o.opening.id,
          freeAreaSqIn: o.freeAreaSqIn,
          airflowCfm: v ? v.airflowCfm : null,
          faceVelocityFpm: v ? v.faceVelocityFpm : null,
          velocityLimitFpm: v ? v.limitFpm : null,
        };
      }),
    },
  };
}

/** Whether a return-air entry concerns this inspection: it names a furnace, or a furnace is among the appliances. */
function returnAirApplies(returnAir: ReturnAir, appliances: readonly Appliance[]): boolean {
  return Boolean(returnAir.applianceId) || appliances.some((a) => a.kind === "furnace");
}

/**
 * Counts findings per status and finds the worst. A not-applicable finding says nothing about
 * the work, so it is the worst only when every finding is not applicable.
 */
export function summarizeFindings(findings: readonly Finding[]): FindingSummary {
  const counts: Record<FindingStatus, number> = { pass: 0, "not-applicable": 0, warn: 0, "needs-info": 0, fail: 0 };
  for (const f of findings) counts[f.status]++;
  let worst: FindingStatus | null = null;
  for (const s of FINDING_STATUSES) if (s !== "not-applicable" && counts[s] > 0) worst = s;
  if (worst === null && counts["not-applicable"] > 0) worst = "not-applicable";
  return { total: findings.length, counts, worst };
}

/**
 * Reads a summary stored by an older version (before a status existed, its count is missing):
 * every status gets a count, missing ones 0, and `total` and `worst` are kept. Null for
 * anything that is not a summary.
 */
export function readFindingSummary(value: unknown): FindingSummary | null {
  if (!value || typeof value !== "object" || !("counts" in value)) return null;
  const raw = value as { total?: unknown; counts?: unknown; worst?: unknown };
  if (!raw.counts || typeof raw.counts !== "object") return null;
  const stored = raw.counts as Record<string, unknown>;
  const counts = {} as Record<FindingStatus, number>;
  let sum = 0;
  for (const s of FINDING_STATUSES) {
    const n = stored[s];
    counts[s] = typeof n === "number" && Number.isFinite(n) && n >= 0 ? n : 0;
    sum += counts[s];
  }
  const worst = typeof raw.worst === "string" && (FINDING_STATUSES as readonly string[]).includes(raw.worst) ? (raw.worst as FindingStatus) : null;
  return { total: typeof raw.total === "number" && Number.isFinite(raw.total) ? raw.total : sum, counts, worst };
}

/**
 * Runs every check of a check request: the vent run, the air space, each appliance's readings,
 * when appliances were removed from a common vent, the appliance left on it, and the return air
 * when there is a furnace.
 * @param input a request parsed with `checkInputSchema`
 * @param rulebook a rulebook from `prepareRulebook`
 */
export function evaluateInspection(input: CheckInput, rulebook: PreparedRulebook): InspectionResult {
  const findings: Finding[] = [];
  const { appliances } = input;
  let ventSizing: VentRunSizing | null = null;
  let airSizing: AirSpaceSizing | null = null;
  const removedIds = (input.removedAppliances ?? []).map((r) => r.id);
  if (input.ventRun) {
    if (removedIds.length > 0) {
      const run = input.ventRun;
      const current: VentRun = {
        ...run,
        applianceIds: run.applianceIds ? run.applianceIds.filter((id) => !removedIds.includes(id)) : run.applianceIds,
        segments: run.segments.filter((s) => !s.applianceId || !removedIds.includes(s.applianceId)),
        vent: { ...run.vent, serves: "single" },
      };
      const r = evaluateVentRun(current, appliances.filter((a) => !removedIds.includes(a.id)), rulebook);
      // The orphan finding replaces the plain capacity finding: it is the same table, read for the one left behind.
      for (const f of r.findings) if (f.code !== "vent.capacity") findings.push(f);
      findings.push(evaluateOrphanedAppliance(run, appliances, removedIds, rulebook));
      ventSizing = r.sizing;
    } else {
      const r = evaluateVentRun(input.ventRun, appliances, rulebook);
      findings.push(...r.findings);
      ventSizing = r.sizing;
    }
  }
  if (input.airSpace) {
    const diam: Record<string, number> = {};
    for (const s of input.ventRun?.segments ?? []) {
      const id = s.applianceId ?? (appliances.length === 1 ? appliances[0]!.id : null);
      if (id && typeof s.diameterIn === "number") diam[id] = Math.max(diam[id] ?? 0, s.diameterIn);
    }
    const r = evaluateCombustionAir(input.airSpace, appliances, rulebook, { connectorDiameterIn: diam });
    findings.push(...r.findings);
    airSizing = r.sizing;
  }
  const readings = input.readings ?? [];
  for (let i = 0; i < readings.length; i++) {
    const r = readings[i]!;
    const a = appliances.find((x) => x.id === r.applianceId);
    if (a) findings.push(...evaluateReadings(r, a, rulebook, i));
  }
  let returnSizing: ReturnAirSizing | null = null;
  if (input.returnAir && returnAirApplies(input.returnAir, appliances)) {
    const r = evaluateReturnAir(input.returnAir, appliances, readings, rulebook);
    findings.push(...r.findings);
    returnSizing = r.sizing;
  }
  return { findings, sizing: { ventRun: ventSizing, airSpace: airSizing, returnAir: returnSizing }, summary: summarizeFindings(findings), edition: rulebook.content.edition };
}
