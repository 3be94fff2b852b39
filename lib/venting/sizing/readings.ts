/** Oxygen share of dry air, %, used to correct flue CO to air-free. */
export const AMBIENT_O2_PCT = 20.9;
/** Sensible-heat factor for standard air, Btu/h per cfm per °F. */
export const SENSIBLE_HEAT_FACTOR = 1.08;

/**
 * Air-free CO: the measured CO corrected for the excess air diluting the sample,
 * CO × 20.9 / (20.9 − O2). Null when O2 is at or above ambient (the probe is not in the flue).
 */
export function airFreeCoPpm(coPpm: number, o2Pct: number): number | null {
  if (o2Pct >= AMBIENT_O2_PCT) return null;
  return (coPpm * AMBIENT_O2_PCT) / (AMBIENT_O2_PCT - o2Pct);
}

/** Gas flow from meter clocking, ft³/h: 3,600 × dial size ÷ seconds per revolution. */
export function clockedFlowCuFtPerH(dialCuFt: number, secondsPerRev: number): number {
  return (3600 * dialCuFt) / secondsPerRev;
}

/** Gas input from meter clocking, Btu/h: flow × heating value. */
export function clockedInputBtuh(dialCuFt: number, secondsPerRev: number, heatingValueBtuPerCuFt: number): number {
  return clockedFlowCuFtPerH(dialCuFt, secondsPerRev) * heatingValueBtuPerCuFt;
}

/** Temperature rise across a furnace, °F. */
export function temperatureRiseF(supplyTempF: number, returnTempF: number): number {
  return supplyTempF - returnTempF;
}

/** Airflow from output and temperature rise, cfm = output ÷ (1.08 × ΔT); null for a rise of zero or less. */
export function airflowCfm(outputBtuh: number, riseF: number): number | null {
  // No rise means no measurable airflow from this relation, not an infinite one.
  if (!(riseF > 0) || !Number.isFinite(outputBtuh)) return null;
  return outputBtuh / (SENSIBLE_HEAT_FACTOR * riseF);
}
