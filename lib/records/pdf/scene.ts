import { LineCapStyle, type PDFPage } from "pdf-lib";
import type { Point, SceneFill, ScenePrimitive, VentRunScene } from "@/lib/drawing";
import type { DocumentFonts } from "./fonts";
import { PAPER, PDF_ROLE_COLOURS, type RoleColour } from "./role-colours";
import { drawLine, textWidth } from "./text";
import { hex } from "./theme";

const r = (v: number): string => String(Math.round(v * 100) / 100);

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

const poly = (ps: readonly Point[], close: boolean): string => ps.map((p, i) => `${i === 0 ? "M" : "L"}${r(p.x)} ${r(p.y)}`).join(" ") + (close ? " Z" : "");

function rectPath(x: number, y: number, w: number, h: number, radius: number): string {
  const k = Math.min(radius, w / 2, h / 2);
  if (k <= 0) return `M${r(x)} ${r(y)} H${r(x + w)} V${r(y + h)} H${r(x)} Z`;
  return `M${r(x + k)} ${r(y)} H${r(x + w - k)} A${r(k)} ${r(k)} 0 0 1 ${r(x + w)} ${r(y + k)} V${r(y + h - k)} A${r(k)} ${r(k)} 0 0 1 ${r(x + w - k)} ${r(y + h)} H${r(x + k)} A${r(k)} ${r(k)} 0 0 1 ${r(x)} ${r(y + h - k)} V${r(y + k)} A${r(k)} ${r(k)} 0 0 1 ${r(x + k)} ${r(y)} Z`;
}

function circlePath(cx: number, cy: number, rad: number): string {
  return `M${r(cx - rad)} ${r(cy)} A${r(rad)} ${r(rad)} 0 1 0 ${r(cx + rad)} ${r(cy)} A${r(rad)} ${r(rad)} 0 1 0 ${r(cx - rad)} ${r(cy)} Z`;
}

function pathOf(p: Exclude<ScenePrimitive, { kind: "text" }>): { d: string; fill: SceneFill } {
  switch (p.kind) {
    case "line":
      return { d: `M${r(p.x1)} ${r(p.y1)} L${r(p.x2)} ${r(p.y2)}`, fill: "none" };
    case "polyline":
      return { d: poly(p.points, false), fill: "none" };
    case "polygon":
      return { d: poly(p.points, true), fill: p.fill };
    case "rect":
      return { d: rectPath(p.x, p.y, p.width, p.height, p.radius ?? 0), fill: p.fill };
    case "circle":
      return { d: circlePath(p.cx, p.cy, p.r), fill: p.fill };
    default:
      return p satisfies never;
  }
}

/**
 * Draws a vent-run scene as vector graphics with its top-left corner at (x, top), `scale` points
 * per scene unit. The scene's y axis points down; `drawSvgPath` flips it, and text positions are
 * flipped here. Line widths and dashes are given in scene units and scale with the drawing.
 */
export function drawScene(page: PDFPage, fonts: DocumentFonts, scene: VentRunScene, x: number, top: number, scale: number): void {
  page.drawRectangle({ x, y: top - scene.height * scale, width: scene.width * scale, height: scene.height * scale, color: hex(PAPER) });
  for (const p of scene.primitives) {
    const c: RoleColour = PDF_ROLE_COLOURS[p.role];
    if (p.kind === "text") {
      const size = p.size * scale;
      const style = { weight: p.weight === "bold" ? "bold" : "regular", size, color: hex(c.text ?? c.stroke) } as const;
      const w = textWidth(fonts, p.text, style);
      const left = x + p.x * scale - (p.anchor === "middle" ? w / 2 : p.anchor === "end" ? w : 0);
      drawLine(page, fonts, p.text, left, top - p.y * scale, style);
      continue;
    }
    const { d, fill } = pathOf(p);
    const fc = fillColour(fill, c);
    const stroked = p.strokeWidth > 0;
    if (!fc && !stroked) continue;
    page.drawSvgPath(d, {
      x,
      y: top,
      scale,
      color: fc ? hex(fc) : undefined,
      borderColor: stroked ? hex(c.stroke) : undefined,
      borderWidth: stroked ? p.strokeWidth : undefined,
      borderDashArray: p.dash ? [...p.dash] : undefined,
      borderLineCap: LineCapStyle.Round,
      opacity: c.opacity,
      borderOpacity: c.opacity,
    });
  }
}
