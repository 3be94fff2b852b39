/**
 * Formats a number for a message: at most `digits` decimals, trailing zeros dropped, thousands
 * separated by commas, a true minus sign. Hand-rolled because Intl formatting costs more than a
 * whole check.
 */
export function fmt(value: number, digits = 2): string {
  if (!Number.isFinite(value)) return String(value);
  const p = digits === 2 ? 100 : 10 ** digits;
  const rounded = Math.round(value * p) / p;
  const neg = rounded < 0;
  const abs = neg ? -rounded : rounded;
  // String() of a value rounded to k/10^d gives its shortest form, without trailing zeros.
  let s = String(abs);
  if (s.includes("e")) s = abs.toFixed(digits).replace(/\.?0+$/, "");
  if (abs >= 1000) {
    const dot = s.indexOf(".");
    const intPart = dot === -1 ? s : s.slice(0, dot);
    let grouped = "";
    for (let i = intPart.length; i > 0; i -= 3) grouped = (i > 3 ? "," : "") + intPart.slice(Math.max(0, i - 3), i) + grouped;
    s = dot === -1 ? grouped : grouped + s.slice(dot);
  }
  return neg ? `−${s}` : s;
}
