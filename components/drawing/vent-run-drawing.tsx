import { buildVentRunScene, type BuildVentRunSceneInput } from "@/lib/drawing/vent-run-scene";
import type { SceneFill, ScenePrimitive, SceneRole, VentRunScene } from "@/lib/drawing/scene-types";

import { PAPER, ROLE_COLOURS, type RoleColour as RoleColours } from "@/lib/drawing/role-colours";

export { ROLE_COLOURS };

function fillOf(fill: SceneFill, c: RoleColours): string {
  switch (fill) {
    case "none":
      return "none";
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

const r2 = (v: number): number => Math.round(v * 100) / 100;
const pts = (ps: readonly { x: number; y: number }[]): string => ps.map((p) => `${r2(p.x)},${r2(p.y)}`).join(" ");

function strokeProps(p: { strokeWidth: number; dash?: readonly number[] }, c: RoleColours) {
  return {
    stroke: p.strokeWidth > 0 ? c.stroke : "none",
    strokeWidth: p.strokeWidth > 0 ? r2(p.strokeWidth) : undefined,
    strokeDasharray: p.dash ? p.dash.join(" ") : undefined,
    strokeOpacity: "opacity" in c ? c.opacity : undefined,
  };
}

function Primitive({ p }: { p: ScenePrimitive }) {
  const c: RoleColours = ROLE_COLOURS[p.role];
  const data = p.highlight ? { "data-fail": p.findingCodes?.join(" ") ?? "" } : {};
  switch (p.kind) {
    case "line":
      return <line x1={r2(p.x1)} y1={r2(p.y1)} x2={r2(p.x2)} y2={r2(p.y2)} strokeLinecap="round" {...strokeProps(p, c)} {...data} />;
    case "polyline":
      return <polyline points={pts(p.points)} fill="none" strokeLinecap="round" strokeLinejoin="round" {...strokeProps(p, c)} {...data} />;
    case "polygon":
      return <polygon points={pts(p.points)} fill={fillOf(p.fill, c)} strokeLinejoin="round" {...strokeProps(p, c)} {...data} />;
    case "rect":
      return <rect x={r2(p.x)} y={r2(p.y)} width={r2(p.width)} height={r2(p.height)} rx={p.radius} fill={fillOf(p.fill, c)} {...strokeProps(p, c)} {...data} />;
    case "circle":
      return <circle cx={r2(p.cx)} cy={r2(p.cy)} r={r2(p.r)} fill={fillOf(p.fill, c)} {...strokeProps(p, c)} {...data} />;
    case "text":
      return (
        <text x={r2(p.x)} y={r2(p.y)} textAnchor={p.anchor} fontSize={r2(p.size)} fontWeight={p.weight === "bold" ? 600 : 400} fill={c.text ?? c.stroke} {...data}>
          {p.text}
        </text>
      );
    default:
      return p satisfies never;
  }
}

/** Props of {@link VentRunSceneSvg}. */
export interface VentRunSceneSvgProps {
  readonly scene: VentRunScene;
  /** Prefix for the ids that tie the title and description to the SVG; unique on the page. */
  readonly idPrefix: string;
  readonly className?: string;
}

/** Draws a prepared scene as an accessible SVG that scales to its container's width. */
export function VentRunSceneSvg({ scene, idPrefix, className }: VentRunSceneSvgProps) {
  const titleId = `${idPrefix}-title`;
  const descId = `${idPrefix}-desc`;
  return (
    <svg
      xmlns="http://www.w3.org/2000/svg"
      viewBox={`0 0 ${scene.width} ${scene.height}`}
      width={scene.width}
      height={scene.height}
      role="img"
      aria-labelledby={titleId}
      aria-describedby={descId}
      className={["h-auto w-full", className].filter(Boolean).join(" ")}
      fontFamily="var(--font-sans), system-ui, sans-serif"
    >
      <title id={titleId}>{scene.title}</title>
      <desc id={descId}>{scene.summary}</desc>
      <rect x={0} y={0} width={scene.width} height={scene.height} fill={PAPER} />
      {scene.primitives.map((p, i) => (
        <Primitive key={i} p={p} />
      ))}
    </svg>
  );
}

/** Props of {@link VentRunDrawing}: the engine's inputs and findings, as the editor holds them. */
export interface VentRunDrawingProps extends Pick<BuildVentRunSceneInput, "ventRun" | "appliances" | "findings"> {
  /**
   * `responsive` (default) draws a phone layout below the `sm` breakpoint and a wide one above;
   * `compact` and `wide` draw one layout only.
   */
  readonly layout?: "responsive" | "compact" | "wide";
  /** Unique on the page; defaults to one derived from the vent run's id. */
  readonly idPrefix?: string;
  readonly className?: string;
}

const COMPACT_WIDTH = 343;
const WIDE_WIDTH = 700;

/**
 * Side view of a vent run with its failing parts highlighted. A pure component (no hooks): it
 * renders on the server, in the live editor, or to static markup.
 */
export function VentRunDrawing({ ventRun, appliances, findings, layout = "responsive", idPrefix, className }: VentRunDrawingProps) {
  const base = idPrefix ?? `vent-run-${String(ventRun?.id ?? "drawing").replace(/[^A-Za-z0-9_-]/g, "-")}`;
  const scene = (widthPx: number) => buildVentRunScene({ ventRun, appliances, findings, widthPx });
  if (layout !== "responsive") {
    const w = layout === "compact" ? COMPACT_WIDTH : WIDE_WIDTH;
    return (
      <figure className={className}>
        <VentRunSceneSvg scene={scene(w)} idPrefix={`${base}-${layout}`} className={layout === "compact" ? "mx-auto max-w-[480px]" : "mx-auto max-w-[700px]"} />
      </figure>
    );
  }
  return (
    <figure className={className}>
      <VentRunSceneSvg scene={scene(COMPACT_WIDTH)} idPrefix={`${base}-compact`} className="mx-auto block max-w-[480px] sm:hidden" />
      <VentRunSceneSvg scene={scene(WIDE_WIDTH)} idPrefix={`${base}-wide`} className="mx-auto hidden max-w-[700px] sm:block" />
    </figure>
  );
}
