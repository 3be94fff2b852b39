import type { PDFPage } from "pdf-lib";
import type { Point, SceneFill, ScenePrimitive, VentRunScene } from "@/lib/drawing";
import { num, paint, rect } from "./draw";
import type { DocumentFonts } from "./fonts";
import { PAPER, ROLE_COLOURS, type RoleColour } from "@/lib/drawing/role-colours";
import { drawLine, textWidth } from "./text";
import { hex } from "./theme";

function fillColour(fill: SceneFill, c: RoleColour): string | null {
  switch (fill) {
    case "none":
      return null;
    case "paper":
      return PAPER;
    case "tint":
      return c.tint;
    case "solid":
      return c.stroke;
    default:
      return fill satisfies never;
  }
}

/** Bézier handle length for a quarter circle. */
const KAPPA = 0.5522847498;

/**
 * Paths in scene units with the y axis pointing down, as the scene gives them; `paint` maps
 * them onto the page with a transform that flips y, so nothing here converts coordinates.
 */
const p = (x: number, y: number): string => `${num(x)} ${num(y)}`;
const poly = (ps: readonly Point[], close: boolean): string => ps.map((q, i) => `${p(q.x, q.y)} ${i === 0 ? "m" : "l"}`).join(" ") + (close ? " h" : "");

function roundedRect(x: number, y: number, w: number, h: number, radius: number): string {
  const k = Math.min(radius, w / 2, h / 2);
  if (k <= 0) return `${p(x, y)} ${num(w)} ${num(h)} re`;
  const c = k * (1 - KAPPA);
  return [
    `${p(x + k, y)} m`,
    `${p(x + w - k, y)} l`,
    `${p(x + w - c, y)} ${p(x + w, y + c)} ${p(x + w, y + k)} c`,
    `${p(x + w, y + h - k)} l`,
    `${p(x + w, y + h - c)} ${p(x + w - c, y + h)} ${p(x + w - k, y + h)} c`,
    `${p(x + k, y + h)} l`,
    `${p(x + c, y + h)} ${p(x, y + h - c)} ${p(x, y + h - k)} c`,
    `${p(x, y + k)} l`,
    `${p(x, y + c)} ${p(x + c, y)} ${p(x + k, y)} c h`,
  ].join(" ");
}

function circle(cx: number, cy: number, r: number): string {
  const k = r * KAPPA;
  return [
    `${p(cx + r, cy)} m`,
    `${p(cx + r, cy + k)} ${p(cx + k, cy + r)} ${p(cx, cy + r)} c`,
    `${p(cx - k, cy + r)} ${p(cx - r, cy + k)} ${p(cx - r, cy)} c`,
    `${p(cx - r, cy - k)} ${p(cx - k, cy - r)} ${p(cx, cy - r)} c`,
    `${p(cx + k, cy - r)} ${p(cx + r, cy - k)} ${p(cx + r, cy)} c h`,
  ].join(" ");
}

function pathOf(q: Exclude<ScenePrimitive, { kind: "text" }>): { d: string; fill: SceneFill } {
  switch (q.kind) {
    case "line":
      return { d: `${p(q.x1, q.y1)} m ${p(q.x2, q.y2)} l`, fill: "none" };
    case "polyline":
      return { d: poly(q.points, false), fill: "none" };
    case "polygon":
      return { d: poly(q.points, true), fill: q.fill };
    case "rect":
      return { d: roundedRect(q.x, q.y, q.width, q.height, q.radius ?? 0), fill: q.fill };
    case "circle":
      return { d: circle(q.cx, q.cy, q.r), fill: q.fill };
    default:
      return q satisfies never;
  }
}

/**
 * Draws a vent-run scene as vector graphics with its top-left corner at (x, top), `scale` points
 * per scene unit. The scene's y axis points down: shapes are drawn through a transform that
 * flips it, and text positions are flipped here. Line widths and dashes are in scene units and
 * scale with the drawing.
 */
export function drawScene(page: PDFPage, fonts: DocumentFonts, scene: VentRunScene, x: number, top: number, scale: number): void {
  rect(page, x, top - scene.height * scale, scene.width * scale, scene.height * scale, { fill: hex(PAPER) });
  const flip = [scale, 0, 0, -scale, x, top] as const;
  for (const q of scene.primitives) {
    const c: RoleColour = ROLE_COLOURS[q.role];
    if (q.kind === "text") {
      const size = q.size * scale;
      const style = { weight: q.weight === "bold" ? "bold" : "regular", size, color: hex(c.text ?? c.stroke) } as const;
      const w = textWidth(fonts, q.text, style);
      const left = x + q.x * scale - (q.anchor === "middle" ? w / 2 : q.anchor === "end" ? w : 0);
      drawLine(page, fonts, q.text, left, top - q.y * scale, style);
      continue;
    }
    const { d, fill } = pathOf(q);
    const fc = fillColour(fill, c);
    const stroked = q.strokeWidth > 0;
    paint(
      page,
      d,
      { fill: fc ? hex(fc) : undefined, stroke: stroked ? hex(c.stroke) : undefined, lineWidth: q.strokeWidth, dash: q.dash, round: true, opacity: c.opacity },
      flip,
    );
  }
}
