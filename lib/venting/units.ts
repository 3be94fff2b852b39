/**
 * Unit conversions used by the engine and by forms that accept metric input.
 * Exact factors: 1 in = 25.4 mm (international inch), 1 Btu/h = 0.29307107 W (IT Btu),
 * 1 in w.c. = 249.0889 Pa (water column at 4 °C, the usual instrument convention).
 */

/** Millimetres in one inch (exact by definition). */
export const MM_PER_IN = 25.4;
/** Metres in one foot (exact by definition). */
export const M_PER_FT = 0.3048;
/** Cubic metres in one cubic foot. */
export const CUM_PER_CUFT = M_PER_FT ** 3;
/** Square centimetres in one square inch. */
export const SQCM_PER_SQIN = 2.54 ** 2;
/** Watts in one Btu/h (International Table Btu). */
export const W_PER_BTUH = 0.29307107;
/** Pascals in one inch of water column (4 °C). */
export const PA_PER_INWC = 249.0889;

/** Inches → millimetres. */
export const inToMm = (lengthIn: number): number => lengthIn * MM_PER_IN;
/** Millimetres → inches. */
export const mmToIn = (lengthMm: number): number => lengthMm / MM_PER_IN;
/** Feet → metres. */
export const ftToM = (lengthFt: number): number => lengthFt * M_PER_FT;
/** Metres → feet. */
export const mToFt = (lengthM: number): number => lengthM / M_PER_FT;
/** Cubic feet → cubic metres. */
export const cuFtToCuM = (volumeCuFt: number): number => volumeCuFt * CUM_PER_CUFT;
/** Cubic metres → cubic feet. */
export const cuMToCuFt = (volumeCuM: number): number => volumeCuM / CUM_PER_CUFT;
/** Square inches → square centimetres. */
export const sqInToSqCm = (areaSqIn: number): number => areaSqIn * SQCM_PER_SQIN;
/** Square centimetres → square inches. */
export const sqCmToSqIn = (areaSqCm: number): number => areaSqCm / SQCM_PER_SQIN;
/** Btu per hour → kilowatts. */
export const btuhToKw = (inputBtuh: number): number => (inputBtuh * W_PER_BTUH) / 1000;
/** Kilowatts → Btu per hour. */
export const kwToBtuh = (powerKw: number): number => (powerKw * 1000) / W_PER_BTUH;
/** Degrees Fahrenheit → degrees Celsius (absolute temperature). */
export const fToC = (tempF: number): number => ((tempF - 32) * 5) / 9;
/** Degrees Celsius → degrees Fahrenheit (absolute temperature). */
export const cToF = (tempC: number): number => (tempC * 9) / 5 + 32;
/** Pascals → inches of water column. */
export const paToInWc = (pressurePa: number): number => pressurePa / PA_PER_INWC;
/** Inches of water column → pascals. */
export const inWcToPa = (pressureInWc: number): number => pressureInWc * PA_PER_INWC;

/** Area in square inches of a circle of the given diameter in inches. */
export const circleAreaSqIn = (diameterIn: number): number => (Math.PI * diameterIn * diameterIn) / 4;

/** Volume in cubic feet of a rectangular room. */
export const roomVolumeCuFt = (lengthFt: number, widthFt: number, heightFt: number): number =>
  lengthFt * widthFt * heightFt;

/** A length unit that {@link parseLength} understands. */
export type LengthUnit = "ft" | "in" | "m" | "mm" | "cm";

/** Result of {@link parseLength}. */
export type ParseLengthResult = { ok: true; valueFt: number } | { ok: false; error: string };

const TO_FT: Record<LengthUnit, number> = {
  ft: 1,
  in: 1 / 12,
  m: 1 / M_PER_FT,
  cm: 1 / (M_PER_FT * 100),
  mm: 1 / (M_PER_FT * 1000),
};

const UNIT_ALIASES: Record<string, LengthUnit> = {
  "'": "ft",
  "’": "ft",
  ft: "ft",
  foot: "ft",
  feet: "ft",
  '"': "in",
  "”": "in",
  "''": "in",
  in: "in",
  inch: "in",
  inches: "in",
  m: "m",
  meter: "m",
  meters: "m",
  metre: "m",
  metres: "m",
  cm: "cm",
  mm: "mm",
};

/** Message returned by {@link parseLength} when the text cannot be read. */
export const PARSE_LENGTH_ERROR =
  "Enter a length such as 6' 4\", 6 ft 4 in, 76 in, 1.93 m or 1930 mm.";

const PART = /\s*(\d+(?:[.,]\d+)?|\.\d+)\s*('{1,2}|’|"|”|[a-zA-Z]+)?/y;

/**
 * Reads a length typed by a user and returns it in feet.
 * Accepts feet-and-inches (`6' 4"`, `6ft 4in`, `6 feet 4 inches`), a single value with a unit
 * (`76 in`, `1.93 m`, `1930 mm`, `193 cm`) or a plain number in `defaultUnit`.
 * A decimal comma is read as a decimal point. Negative lengths are refused.
 */
export function parseLength(text: string, defaultUnit: LengthUnit = "ft"): ParseLengthResult {
  const src = text.trim();
  if (src === "") return { ok: false, error: PARSE_LENGTH_ERROR };
  let pos = 0;
  let totalFt = 0;
  const units: LengthUnit[] = [];
  while (pos < src.length) {
    PART.lastIndex = pos;
    const m = PART.exec(src);
    if (!m || m[0].length === 0) return { ok: false, error: PARSE_LENGTH_ERROR };
    pos = PART.lastIndex;
    const num = Number((m[1] ?? "").replace(",", "."));
    const rawUnit = m[2];
    let unit: LengthUnit;
    if (rawUnit === undefined) {
      // A bare number after feet means inches (6' 4); alone it is the default unit.
      unit = units.length === 1 && units[0] === "ft" ? "in" : defaultUnit;
    } else {
      const u = UNIT_ALIASES[rawUnit.toLowerCase()];
      if (u === undefined) return { ok: false, error: PARSE_LENGTH_ERROR };
      unit = u;
    }
    units.push(unit);
    totalFt += num * TO_FT[unit];
    // skip whitespace between parts
    while (pos < src.length && /\s/.test(src.charAt(pos))) pos++;
  }
  if (units.length > 2 || (units.length === 2 && !(units[0] === "ft" && units[1] === "in"))) {
    return { ok: false, error: PARSE_LENGTH_ERROR };
  }
  if (!Number.isFinite(totalFt)) return { ok: false, error: PARSE_LENGTH_ERROR };
  return { ok: true, valueFt: totalFt };
}
