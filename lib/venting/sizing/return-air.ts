import { circleAreaSqIn } from "../units";

/**
 * Return-air sizing: the furnace's output and airflow, the return area it needs and the face
 * velocity through each grille. Plain arithmetic; the factors come from the rulebook.
 */

/** Square inches in a square foot. */
export const SQIN_PER_SQFT = 144;

/** Heating output from the rated input and the efficiency, Btu/h = input × efficiency ÷ 100. */
export function furnaceOutputBtuh(inputBtuh: number, efficiencyPct: number): number {
  return (inputBtuh * efficiencyPct) / 100;
}

/** Nominal airflow from the cooling size, cfm = tons × cfm per ton. */
export function airflowFromTonsCfm(coolingTons: number, cfmPerTon: number): number {
  return coolingTons * cfmPerTon;
}

/**
 * Airflow from the sensible-heat relation, cfm = output ÷ (factor × ΔT). Null when the rise or
 * the factor is not positive, since no airflow follows from them.
 */
export function airflowFromRiseCfm(outputBtuh: number, riseF: number, sensibleFactor: number): number | null {
  if (!(riseF > 0) || !(sensibleFactor > 0)) return null;
  return outputBtuh / (sensibleFactor * riseF);
}

/** Smallest total free area of the return openings, in² = area per 1,000 Btu/h × output ÷ 1,000. */
export function requiredReturnAreaSqIn(outputBtuh: number, perKbtuhSqIn: number): number {
  return (perKbtuhSqIn * outputBtuh) / 1000;
}

/** The share of the total airflow that passes one opening, split by free area. */
export function openingAirflowCfm(totalCfm: number, freeAreaSqIn: number, totalFreeAreaSqIn: number): number {
  if (!(totalFreeAreaSqIn > 0)) return 0;
  return (totalCfm * freeAreaSqIn) / totalFreeAreaSqIn;
}

/**
 * Face velocity through a free area, fpm = cfm ÷ (free area in² ÷ 144). Null for a free area
 * that is not positive (no velocity can be told, and none may be infinite).
 */
export function faceVelocityFpm(cfm: number, freeAreaSqIn: number): number | null {
  if (!(freeAreaSqIn > 0)) return null;
  return cfm / (freeAreaSqIn / SQIN_PER_SQFT);
}

/** Gross area of a rectangular or round opening, in², or null when its size is missing. */
export function returnGrossAreaSqIn(widthIn: number | null | undefined, heightIn: number | null | undefined, diameterIn: number | null | undefined): number | null {
  if (typeof widthIn === "number" && typeof heightIn === "number") return widthIn * heightIn;
  if (typeof diameterIn === "number") return circleAreaSqIn(diameterIn);
  return null;
}
