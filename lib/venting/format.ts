/**
 * Formats a number for a message: at most `digits` decimals, trailing zeros dropped, thousands
 * separated by commas. Hand-rolled because Intl formatting costs more than a whole check.
 */
export function fmt(value: number, digits = 2): string {
  if (!Number.isFinite(value)) return String(value);
  const p = 10 ** digits;
  const rounded = Math.round(value * p) / p;
  const neg = rounded < 0;
  const abs = Math.abs(rounded);
  let s = abs.toFixed(digits);
  if (digits > 0) s = s.replace(/\.?0+$/, "");
  const dot = s.indexOf(".");
  const intPart = dot === -1 ? s : s.slice(0, dot);
  const frac = dot === -1 ? "" : s.slice(dot);
  const grouped = intPart.length > 3 ? intPart.replace(/\B(?=(\d{3})+(?!\d))/g, ",") : intPart;
  return `${neg ? "−" : ""}${grouped}${frac}`;
}
