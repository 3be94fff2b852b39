import type { Point } from "./scene-types";

/** Small vector helpers for the scene builder (scene units, y down). */

export const pt = (x: number, y: number): Point => ({ x, y });
export const add = (a: Point, b: Point): Point => ({ x: a.x + b.x, y: a.y + b.y });
export const sub = (a: Point, b: Point): Point => ({ x: a.x - b.x, y: a.y - b.y });
export const mul = (a: Point, k: number): Point => ({ x: a.x * k, y: a.y * k });
export const len = (a: Point): number => Math.hypot(a.x, a.y);
export const lerpPt = (a: Point, b: Point, t: number): Point => ({ x: a.x + (b.x - a.x) * t, y: a.y + (b.y - a.y) * t });

/** Unit vector; a zero vector becomes "up" so that callers never divide by zero. */
export function unit(a: Point): Point {
  const l = len(a);
  return l > 1e-9 ? { x: a.x / l, y: a.y / l } : { x: 0, y: -1 };
}

/** The normal on the left of a direction when walking along it on screen (y down). */
export const leftNormal = (d: Point): Point => ({ x: d.y, y: -d.x });

/** Points of an arc around `c` from angle a0 to a1 (radians, screen angles), inclusive. */
export function arcPoints(c: Point, r: number, a0: number, a1: number, steps = 8): Point[] {
  const out: Point[] = [];
  for (let i = 0; i <= steps; i++) {
    const a = a0 + ((a1 - a0) * i) / steps;
    out.push({ x: c.x + r * Math.cos(a), y: c.y + r * Math.sin(a) });
  }
  return out;
}

/** Corners of a rectangle centred on `c`, with half-extent `hu` along unit `u` and `hv` across it. */
export function orientedRect(c: Point, u: Point, hu: number, hv: number): Point[] {
  const v = leftNormal(u);
  return [
    add(add(c, mul(u, -hu)), mul(v, -hv)),
    add(add(c, mul(u, hu)), mul(v, -hv)),
    add(add(c, mul(u, hu)), mul(v, hv)),
    add(add(c, mul(u, -hu)), mul(v, hv)),
  ];
}

/**
 * 45° hatch lines filling an oriented rectangle (as for `orientedRect`), clipped to it. Hatching
 * is explicit geometry because not every renderer has pattern fills.
 */
export function hatchLines(c: Point, u: Point, hu: number, hv: number, spacing: number): [Point, Point][] {
  const v = leftNormal(u);
  const toScene = (a: number, b: number): Point => add(add(c, mul(u, a)), mul(v, b));
  const out: [Point, Point][] = [];
  // Lines a - b = k for k across [-(hu + hv), hu + hv], clipped to |a| ≤ hu, |b| ≤ hv.
  const span = hu + hv;
  const n = Math.max(1, Math.min(200, Math.floor((2 * span) / spacing)));
  for (let i = 1; i < n; i++) {
    const k = -span + (2 * span * i) / n;
    const aLo = Math.max(-hu, k - hv);
    const aHi = Math.min(hu, k + hv);
    if (aHi - aLo < 0.5) continue;
    out.push([toScene(aLo, aLo - k), toScene(aHi, aHi - k)]);
  }
  return out;
}

/** An axis-aligned box. */
export interface Box {
  x0: number;
  y0: number;
  x1: number;
  y1: number;
}

export const boxesOverlap = (a: Box, b: Box, pad = 0): boolean =>
  a.x0 < b.x1 + pad && b.x0 < a.x1 + pad && a.y0 < b.y1 + pad && b.y0 < a.y1 + pad;

/** Rough advance width of text in a sans-serif face: good enough to keep labels apart. */
export function textWidth(text: string, size: number, bold = false): number {
  let w = 0;
  for (const ch of text) {
    if (ch === " " || ch === "." || ch === "," || ch === ":" || ch === "·" || ch === "/" || ch === "'" || ch === "i" || ch === "l" || ch === "1") w += 0.3;
    else if (ch === "m" || ch === "w" || ch === "M" || ch === "W" || ch === "×") w += 0.82;
    else if (ch >= "A" && ch <= "Z") w += 0.64;
    else w += 0.54;
  }
  // A little wide on purpose: labels that touch read worse than labels a bit apart.
  return w * size * 1.08 * (bold ? 1.06 : 1);
}

/** Box of a text primitive laid out from its anchor and baseline. */
export function textBox(x: number, y: number, text: string, size: number, anchor: "start" | "middle" | "end", bold = false): Box {
  const w = textWidth(text, size, bold);
  const x0 = anchor === "start" ? x : anchor === "middle" ? x - w / 2 : x - w;
  return { x0, y0: y - size * 0.78, x1: x0 + w, y1: y + size * 0.24 };
}

/** Finite number or null: drawing inputs may be half typed. */
export function num(v: unknown): number | null {
  return typeof v === "number" && Number.isFinite(v) ? v : null;
}

export const clamp = (v: number, lo: number, hi: number): number => Math.min(hi, Math.max(lo, v));

/** A number for a label: at most `digits` decimals, trailing zeros dropped, thousands grouped. */
export function fmtNum(v: number, digits = 2): string {
  if (!Number.isFinite(v)) return "?";
  const r = Math.round(v * 10 ** digits) / 10 ** digits;
  const [int, frac] = Math.abs(r).toFixed(digits).split(".") as [string, string?];
  const grouped = int.replace(/\B(?=(\d{3})+(?!\d))/g, ",");
  const f = frac ? frac.replace(/0+$/, "") : "";
  return `${r < 0 ? "−" : ""}${grouped}${f ? `.${f}` : ""}`;
}
