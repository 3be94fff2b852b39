import { MESSAGES, type FindingTarget } from "../findings";
import type { Appliance, Readings, ReturnAir, ReturnAirOpening } from "../inputs";
import type { Cited, PreparedRulebook, RuleRef } from "../rulebook/prepare";
import { airflowFromRiseCfm, airflowFromTonsCfm, furnaceOutputBtuh, returnGrossAreaSqIn } from "../sizing/return-air";
import { temperatureRiseF } from "../sizing/readings";
import { known, target } from "./shared";

/** A rule a finding cites: a rulebook row, or what the installer entered. */
export interface CitedRule {
  readonly citation: string;
  readonly ref: RuleRef | null;
}

/** Why a value the return-air checks need cannot be told. */
export interface ReturnAirGap {
  readonly message: string;
  readonly target: FindingTarget;
  /** Set when the gap is a value the rulebook lacks, not the installer. */
  readonly missingRule?: string;
}

/** Where the furnace's output came from. */
export type OutputSource = "entered" | "input_efficiency";
/** Where the airflow came from. */
export type AirflowSource = "nameplate" | "cooling_tons" | "temperature_rise";

/** The furnace's output, or why it is not known. */
export type ReturnOutput =
  | { readonly ok: true; readonly outputBtuh: number; readonly source: OutputSource; readonly rule: CitedRule }
  | ({ readonly ok: false } & ReturnAirGap);

/** The blower airflow, or why it is not known. */
export type ReturnAirflow =
  | { readonly ok: true; readonly cfm: number; readonly source: AirflowSource; readonly rule: CitedRule; readonly riseF: number | null }
  | ({ readonly ok: false } & ReturnAirGap);

/** One return opening with its free area (null when it cannot be told). */
export interface ReturnOpeningInfo {
  readonly opening: ReturnAirOpening;
  readonly index: number;
  readonly label: string;
  readonly freeAreaSqIn: number | null;
  /** The field to fill in when the free area is not known. */
  readonly missingField: "widthIn" | "freeAreaShare" | null;
}

/** What the return-air checks share, computed once per evaluation. */
export interface ReturnAirContext {
  readonly ra: ReturnAir;
  readonly rb: PreparedRulebook;
  /** The furnace the return serves, when it can be told. */
  readonly appliance: Appliance | null;
  readonly output: ReturnOutput;
  readonly airflow: ReturnAirflow;
  readonly openings: readonly ReturnOpeningInfo[];
  /** Sum of the openings' free areas, in²; null when there is none or one is not known. */
  readonly totalFreeAreaSqIn: number | null;
  /** How many kinds of space the openings draw from (more than one: no opening is the sole source). */
  readonly distinctSpaces: number;
}

const M = MESSAGES.returnAir;
const ENTERED: CitedRule = { citation: M.furnaceCitation, ref: null };

/** Target of a return-air field. */
export function returnAirTarget(field: string | null): FindingTarget {
  return target("returnAir", null, field, field === null ? "returnAir" : `returnAir.${field}`);
}

/** Target of a field of one return opening. */
export function returnOpeningTarget(info: Pick<ReturnOpeningInfo, "opening" | "index">, field: string | null): FindingTarget {
  const base = `returnAir.openings.${info.index}`;
  return target("returnAir", info.opening.id, field, field === null ? base : `${base}.${field}`);
}

function cite(rules: readonly CitedRule[]): CitedRule {
  const texts: string[] = [];
  for (const r of rules) if (!texts.includes(r.citation)) texts.push(r.citation);
  return { citation: texts.join("; "), ref: rules.find((r) => r.ref !== null)?.ref ?? null };
}

function findFurnace(ra: ReturnAir, appliances: readonly Appliance[]): { appliance: Appliance | null; gap: ReturnAirGap | null } {
  if (ra.applianceId) {
    const a = appliances.find((x) => x.id === ra.applianceId);
    return a ? { appliance: a, gap: null } : { appliance: null, gap: { message: M.unknownFurnace(ra.applianceId), target: returnAirTarget("applianceId") } };
  }
  const furnaces = appliances.filter((a) => a.kind === "furnace");
  if (furnaces.length === 1) return { appliance: furnaces[0]!, gap: null };
  return { appliance: null, gap: { message: M.needsFurnace(), target: returnAirTarget("applianceId") } };
}

function resolveOutput(ra: ReturnAir, appliances: readonly Appliance[], furnace: { appliance: Appliance | null; gap: ReturnAirGap | null }): ReturnOutput {
  if (known(ra.outputBtuh)) return { ok: true, outputBtuh: ra.outputBtuh, source: "entered", rule: ENTERED };
  if (!known(ra.efficiencyPct)) return { ok: false, message: M.needsOutput(), target: returnAirTarget("outputBtuh") };
  const a = furnace.appliance;
  if (!a) return { ok: false, ...furnace.gap! };
  if (!known(a.inputBtuh)) {
    const i = appliances.indexOf(a);
    return { ok: false, message: M.needsInput(a.label || "the furnace"), target: target("appliances", a.id, "inputBtuh", `appliances.${i}.inputBtuh`) };
  }
  return { ok: true, outputBtuh: furnaceOutputBtuh(a.inputBtuh, ra.efficiencyPct), source: "input_efficiency", rule: ENTERED };
}

function measuredRise(ra: ReturnAir, appliance: Appliance | null, readings: readonly Readings[]): { riseF: number; rule: CitedRule } | null {
  if (known(ra.temperatureRiseF)) return { riseF: ra.temperatureRiseF, rule: { citation: "Temperature rise as entered", ref: null } };
  if (!appliance) return null;
  const r = readings.find((x) => x.applianceId === appliance.id);
  if (!r || !known(r.supplyTempF) || !known(r.returnTempF)) return null;
  return { riseF: temperatureRiseF(r.supplyTempF, r.returnTempF), rule: { citation: "Supply and return temperatures in the readings", ref: null } };
}

/**
 * The airflow from the first source entered, in this order: the rating plate's airflow, the
 * cooling size in tons, then the temperature-rise relation (entered rise, or the readings).
 */
function resolveAirflow(ra: ReturnAir, rb: PreparedRulebook, appliance: Appliance | null, readings: readonly Readings[], output: ReturnOutput): ReturnAirflow {
  if (known(ra.airflowCfm)) return { ok: true, cfm: ra.airflowCfm, source: "nameplate", rule: ENTERED, riseF: null };
  if (known(ra.coolingTons)) {
    const perTon: Cited<number> | undefined = rb.params.get("return_air_cfm_per_ton");
    if (!perTon) return { ok: false, message: "", target: returnAirTarget("coolingTons"), missingRule: "the airflow per ton of cooling" };
    return { ok: true, cfm: airflowFromTonsCfm(ra.coolingTons, perTon.value), source: "cooling_tons", rule: perTon, riseF: null };
  }
  const rise = measuredRise(ra, appliance, readings);
  if (!rise) return { ok: false, message: M.needsAirflow(), target: returnAirTarget("airflowCfm") };
  if (!output.ok) return { ok: false, message: output.message, target: output.target };
  const factor = rb.params.get("return_air_sensible_heat_btuh_per_cfm_f");
  if (!factor) return { ok: false, message: "", target: returnAirTarget("temperatureRiseF"), missingRule: "the sensible-heat factor" };
  const cfm = airflowFromRiseCfm(output.outputBtuh, rise.riseF, factor.value);
  if (cfm === null) return { ok: false, message: M.badRise(rise.riseF), target: returnAirTarget("temperatureRiseF") };
  return { ok: true, cfm, source: "temperature_rise", rule: cite([factor, rise.rule, output.rule]), riseF: rise.riseF };
}

function openingInfo(o: ReturnAirOpening, index: number): ReturnOpeningInfo {
  const label = o.label.trim() || `Return opening ${index + 1}`;
  if (known(o.freeAreaSqIn)) return { opening: o, index, label, freeAreaSqIn: o.freeAreaSqIn, missingField: null };
  const gross = returnGrossAreaSqIn(o.widthIn, o.heightIn, o.diameterIn);
  if (gross === null) return { opening: o, index, label, freeAreaSqIn: null, missingField: "widthIn" };
  if (!known(o.freeAreaShare)) return { opening: o, index, label, freeAreaSqIn: null, missingField: "freeAreaShare" };
  return { opening: o, index, label, freeAreaSqIn: gross * o.freeAreaShare, missingField: null };
}

/** Builds the context the return-air checks share. */
export function returnAirContext(ra: ReturnAir, appliances: readonly Appliance[], readings: readonly Readings[], rb: PreparedRulebook): ReturnAirContext {
  const furnace = findFurnace(ra, appliances);
  const output = resolveOutput(ra, appliances, furnace);
  const airflow = resolveAirflow(ra, rb, furnace.appliance, readings, output);
  const openings = ra.openings.map(openingInfo);
  let total: number | null = openings.length > 0 ? 0 : null;
  for (const o of openings) total = total === null || o.freeAreaSqIn === null ? null : total + o.freeAreaSqIn;
  const spaces = new Set<string>();
  for (const o of ra.openings) if (o.space) spaces.add(o.space);
  return { ra, rb, appliance: furnace.appliance, output, airflow, openings, totalFreeAreaSqIn: total, distinctSpaces: spaces.size };
}

/** Joins citations of several rules into one, keeping the first rulebook reference. */
export const combineRules = cite;
