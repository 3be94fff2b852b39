import type { RGB } from "pdf-lib";
import { formatNumber, type FindingStatus, type Quantity, type Requirement } from "@/lib/venting";
import { COLOURS } from "./theme";

/** Status words printed in the record: the meaning never rests on colour alone. */
export const STATUS_WORDS = { pass: "PASS", "not-applicable": "NOT APPLICABLE", fail: "FAIL", warn: "WARNING", "needs-info": "NEEDS INFO" } as const satisfies Record<FindingStatus, string>;

export const STATUS_COLOURS: Record<FindingStatus, RGB> = {
  pass: COLOURS.pass,
  "not-applicable": COLOURS.notApplicable,
  fail: COLOURS.fail,
  warn: COLOURS.warn,
  "needs-info": COLOURS.needsInfo,
};

/** Status words as a homeowner reads them in the summary. */
export const STATUS_EXPLAINED = {
  pass: "meets the table",
  "not-applicable": "does not apply to this job",
  warn: "needs attention",
  "needs-info": "value not recorded",
  fail: "does not meet the table",
} as const satisfies Record<FindingStatus, string>;

export const DASH = "—";

/** A number with its unit, e.g. "1.5 in"; units never go missing. */
const SINGULAR: Record<string, string> = { supports: "support", fasteners: "fastener" };

export function withUnit(value: number | null | undefined, unit: string, digits = 2): string {
  if (typeof value !== "number" || !Number.isFinite(value)) return "not entered";
  const u = value === 1 ? (SINGULAR[unit] ?? unit) : unit;
  return u ? `${formatNumber(value, digits)} ${u}` : formatNumber(value, digits);
}

/** Decimals worth printing for a unit: whole Btu/h and ppm, hundredths otherwise. */
export function digitsFor(unit: string): number {
  return unit === "Btu/h" || unit.startsWith("ppm") || unit === "ft³" ? 0 : unit === "in. w.c." ? 3 : 2;
}

export function quantity(q: Quantity | undefined): string {
  return q ? withUnit(q.value, q.unit, digitsFor(q.unit)) : DASH;
}

/** The required value without its comparator, for sentences that say it in words. */
export function requiredValue(r: Requirement): string {
  const d = digitsFor(r.unit);
  if (r.comparator === "between") return `${formatNumber(r.value, d)}–${typeof r.upperValue === "number" ? formatNumber(r.upperValue, d) : "?"} ${r.unit}`;
  return withUnit(r.value, r.unit, d);
}

export function requirement(r: Requirement | undefined): string {
  if (!r) return DASH;
  if (r.comparator === "between") return requiredValue(r);
  return `${r.comparator} ${requiredValue(r)}`;
}

export function yesNo(v: boolean | null | undefined): string {
  return v === true ? "Yes" : v === false ? "No" : "not entered";
}

const MONTHS = ["Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"] as const;
const pad = (n: number): string => String(n).padStart(2, "0");

/** "14 Mar 2026, 09:05 UTC", independent of the server's locale and zone. */
export function utcDateTime(iso: string): string {
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return iso || "not recorded";
  return `${utcDate(iso)}, ${pad(d.getUTCHours())}:${pad(d.getUTCMinutes())} UTC`;
}

/** "14 Mar 2026". */
export function utcDate(iso: string): string {
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return iso || "not recorded";
  return `${d.getUTCDate()} ${MONTHS[d.getUTCMonth()]} ${d.getUTCFullYear()}`;
}

/** Plain words for a snake_case value without a label. */
export function words(value: string | null | undefined): string {
  if (!value) return "not entered";
  return value.replace(/_/g, " ");
}

/** A label from a label map, or the value in plain words. */
export function label<K extends string>(map: Readonly<Record<K, string>>, value: K | null | undefined): string {
  if (value === null || value === undefined) return "not entered";
  return map[value] ?? words(value);
}
