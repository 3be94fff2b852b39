/** What {@link fmt} prints for a value that is not a finite number. */
export const NOT_A_NUMBER = "—";

/**
 * Formats a number for a message: at most `digits` decimals, trailing zeros dropped, thousands
 * separated by commas, a true minus sign. Hand-rolled because Intl formatting costs more than a
 * whole check.
 */
export function fmt(value: number, digits = 2): string {
  // Never "NaN" or "Infinity" in front of a user: the checks guard against them, this is the last line.
  if (!Number.isFinite(value)) return NOT_A_NUMBER;
  const p = digits === 2 ? 100 : 10 ** digits;
  // Beyond 1e15 there are no decimals left to round, and value × p could overflow to Infinity.
  const rounded = Math.abs(value) < 1e15 ? Math.round(value * p) / p : Math.round(value);
  const neg = rounded < 0;
  const abs = neg ? -rounded : rounded;
  // String() of a value rounded to k/10^d gives its shortest form, without trailing zeros.
  let s = String(abs);
  if (s.includes("e")) {
    // Huge values print whole (toFixed itself turns exponential from 1e21); tiny ones to `digits`.
    s = abs >= 1 ? BigInt(Math.round(abs)).toString() : abs.toFixed(digits).replace(/\.?0+$/, "");
  }
  if (abs >= 1000) {
    const dot = s.indexOf(".");
    const intPart = dot === -1 ? s : s.slice(0, dot);
    let grouped = "";
    for (let i = intPart.length; i > 0; i -= 3) grouped = (i > 3 ? "," : "") + intPart.slice(Math.max(0, i - 3), i) + grouped;
    s = dot === -1 ? grouped : grouped + s.slice(dot);
  }
  return neg ? `−${s}` : s;
}
