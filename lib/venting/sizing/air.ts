/**
 * Combustion-air sizing: required volume and opening free areas. Inputs are totals of the
 * appliances that draw room air (direct-vent appliances are left out by the caller).
 */

/** Factors of the standard and known-infiltration methods. */
export interface VolumeFactors {
  /** Standard method, ft³ per 1,000 Btu/h. */
  readonly perKbtuhCuFt: number;
  /** Known-infiltration constant for appliances other than fan-assisted. */
  readonly otherConstant: number;
  /** Known-infiltration constant for fan-assisted appliances. */
  readonly fanConstant: number;
  /** Below this ACH the standard method may not be used. */
  readonly achThreshold: number;
  /** ACH above this value is not used. */
  readonly achMax: number;
}

/** Result of {@link requiredVolumeCuFt}. */
export interface VolumeRequirement {
  readonly volumeCuFt: number;
  readonly method: "standard" | "known_infiltration";
  /** The air-change rate used (after clamping), or null for the standard method. */
  readonly achUsed: number | null;
}

/**
 * Required indoor volume. Without a known ACH: the standard method. With a known ACH below the
 * threshold: the known-infiltration method, V = A/ACH × I_other/1000 + B/ACH × I_fan/1000, with
 * ACH clamped to the maximum. At or above the threshold either method is permitted and the
 * smaller volume is returned.
 */
export function requiredVolumeCuFt(otherInputBtuh: number, fanInputBtuh: number, ach: number | null, f: VolumeFactors): VolumeRequirement {
  const standard = (f.perKbtuhCuFt * (otherInputBtuh + fanInputBtuh)) / 1000;
  if (ach === null || !(ach > 0)) return { volumeCuFt: standard, method: "standard", achUsed: null };
  const achUsed = Math.min(ach, f.achMax);
  const infiltration = ((f.otherConstant / achUsed) * otherInputBtuh) / 1000 + ((f.fanConstant / achUsed) * fanInputBtuh) / 1000;
  if (ach < f.achThreshold || infiltration < standard) return { volumeCuFt: infiltration, method: "known_infiltration", achUsed };
  return { volumeCuFt: standard, method: "standard", achUsed: null };
}

/** Each of two same-story indoor openings: area per 1,000 Btu/h, not below the minimum. */
export function indoorSameStoryAreaSqIn(inputBtuh: number, perKbtuhSqIn: number, minSqIn: number): number {
  return Math.max(minSqIn, (perKbtuhSqIn * inputBtuh) / 1000);
}

/** Total area of openings between stories: area per 1,000 Btu/h. */
export function indoorDifferentStoriesAreaSqIn(inputBtuh: number, perKbtuhSqIn: number): number {
  return (perKbtuhSqIn * inputBtuh) / 1000;
}

/** Each outdoor opening (two-opening methods): input ÷ Btu/h served per in². */
export function outdoorOpeningAreaSqIn(inputBtuh: number, btuhPerSqIn: number): number {
  return inputBtuh / btuhPerSqIn;
}

/** The single high outdoor opening: input ÷ Btu/h per in², and not less than the connectors' total area. */
export function singleOpeningAreaSqIn(inputBtuh: number, btuhPerSqIn: number, connectorAreaSumSqIn: number): number {
  return Math.max(inputBtuh / btuhPerSqIn, connectorAreaSumSqIn);
}

/** Gross opening a louver of the given free-area share needs to give a free area. */
export function grossAreaSqIn(freeAreaSqIn: number, freeAreaShare: number): number {
  return freeAreaSqIn / freeAreaShare;
}

/** Combination of indoor and outdoor air: share of the full outdoor opening still needed. */
export function combinationFactor(availableCuFt: number, requiredCuFt: number): number {
  if (requiredCuFt <= 0) return 0;
  return Math.min(1, Math.max(0, 1 - availableCuFt / requiredCuFt));
}
