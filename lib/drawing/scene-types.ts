import type { FindingCode } from "@/lib/venting";

/**
 * A renderer-neutral drawing: plain primitives in one coordinate system (viewBox units, origin
 * top left, y down). The SVG component and the PDF renderer both draw exactly this list, in
 * order, choosing colours from `role`; nothing here is SVG- or CSS-specific.
 */

/** A point in scene units (y down). */
export interface Point {
  readonly x: number;
  readonly y: number;
}

/** What a primitive depicts; each renderer maps roles to its own colours. */
export type SceneRole =
  | "appliance"
  | "appliance-fail"
  | "draft-hood"
  | "floor"
  | "connector"
  | "connector-fail"
  | "halo"
  | "joint"
  | "support"
  | "turn"
  | "vent"
  | "vent-fail"
  | "roof"
  | "termination"
  | "termination-fail"
  | "combustible"
  | "clearance"
  | "clearance-fail"
  | "passage"
  | "passage-fail"
  | "dimension"
  | "dimension-fail"
  | "break"
  | "label"
  | "label-fail"
  | "label-muted"
  | "note"
  | "note-pass"
  | "legend";

/** How a closed shape is filled: nothing, the paper colour, a light tint or the role colour. */
export type SceneFill = "none" | "paper" | "tint" | "solid";

/** Fields every primitive carries. */
export interface PrimitiveBase {
  readonly role: SceneRole;
  /**
   * Segment id, `vent`, `termination`, `appliance` (`appliance:<id>` and the tee `junction:<id>`
   * on a common vent) or `legend`; lets tests and renderers group parts.
   */
  readonly partId?: string;
  /** True on parts that a failing finding targets. */
  readonly highlight?: boolean;
  /** Codes of the failing findings that target this part. */
  readonly findingCodes?: readonly FindingCode[];
}

/** Stroke of an open or closed shape. */
export interface Stroke {
  readonly strokeWidth: number;
  /** Dash pattern in scene units (on, off, ...); absent for a solid line. */
  readonly dash?: readonly number[];
}

export interface LinePrimitive extends PrimitiveBase, Stroke {
  readonly kind: "line";
  readonly x1: number;
  readonly y1: number;
  readonly x2: number;
  readonly y2: number;
}

export interface PolylinePrimitive extends PrimitiveBase, Stroke {
  readonly kind: "polyline";
  readonly points: readonly Point[];
}

export interface RectPrimitive extends PrimitiveBase, Stroke {
  readonly kind: "rect";
  readonly x: number;
  readonly y: number;
  readonly width: number;
  readonly height: number;
  readonly fill: SceneFill;
  /** Corner radius. */
  readonly radius?: number;
}

export interface PolygonPrimitive extends PrimitiveBase, Stroke {
  readonly kind: "polygon";
  readonly points: readonly Point[];
  readonly fill: SceneFill;
}

export interface CirclePrimitive extends PrimitiveBase, Stroke {
  readonly kind: "circle";
  readonly cx: number;
  readonly cy: number;
  readonly r: number;
  readonly fill: SceneFill;
}

/** Text anchored at (x, y); `y` is the alphabetic baseline. */
export interface TextPrimitive extends PrimitiveBase {
  readonly kind: "text";
  readonly x: number;
  readonly y: number;
  readonly text: string;
  readonly anchor: "start" | "middle" | "end";
  /** Font size in scene units. */
  readonly size: number;
  readonly weight: "normal" | "bold";
}

export type ScenePrimitive = LinePrimitive | PolylinePrimitive | RectPrimitive | PolygonPrimitive | CirclePrimitive | TextPrimitive;

/** What a legend entry shows. */
export type LegendKey = "single-wall" | "type-b" | "support" | "combustible" | "passage" | "fail";

export interface LegendEntry {
  readonly key: LegendKey;
  readonly label: string;
}

/** Where and how one connector segment was drawn, with the true values behind it. */
export interface SceneSegmentInfo {
  readonly id: string;
  readonly index: number;
  readonly orientation: "horizontal" | "vertical";
  readonly material: "single_wall" | "type_b" | null;
  /** As entered; null when missing. */
  readonly lengthFt: number | null;
  readonly riseIn: number | null;
  /** Drawn at a nominal length because the length is missing. */
  readonly nominalLength: boolean;
  /** Drawn shorter than to scale, with break marks, to keep a very long run readable. */
  readonly shortened: boolean;
  /** True slope of a horizontal segment: riseIn / (12 · lengthFt); null when unknown or vertical. */
  readonly trueSlope: number | null;
  /** Slope as drawn, rise over run with up positive (0 for an unknown rise, not used for vertical). */
  readonly drawnSlope: number;
  /** Centre line in scene units. */
  readonly start: Point;
  readonly end: Point;
  /** Supports drawn (as installed; 0 when not entered). */
  readonly supports: number;
  /** Whether the segment got its length label. */
  readonly labelled: boolean;
  readonly highlight: boolean;
  readonly findingCodes: readonly FindingCode[];
  readonly findingTitles: readonly string[];
}

/** One appliance as drawn, with where its connector meets the vent. */
export interface SceneApplianceInfo {
  readonly id: string;
  /** `appliance` when the run is drawn with one appliance, `appliance:<id>` on a common vent. */
  readonly partId: string;
  readonly label: string;
  /** Top of its draft hood or flue collar, where its connector starts. */
  readonly collar: Point;
  /** Where its connector joins the vent (a tee on a common vent); null without a connector. */
  readonly junction: Point | null;
  /** Its connector segments, in order. */
  readonly segmentIds: readonly string[];
  /** On the run but no connector segment assigned to it. */
  readonly noConnector: boolean;
  readonly highlight: boolean;
  readonly findingCodes: readonly FindingCode[];
}

/** A part with failing findings, for summaries and lists beside the drawing. */
export interface FailingPart {
  readonly partId: string;
  readonly kind: "appliance" | "segment" | "vent" | "termination" | "run";
  /** E.g. "Segment 2", "Vent", "Termination". */
  readonly label: string;
  readonly findingCodes: readonly FindingCode[];
  readonly titles: readonly string[];
}

/** The drawing of a vent run, ready for any renderer. */
export interface VentRunScene {
  /** viewBox is `0 0 width height`. */
  readonly width: number;
  readonly height: number;
  /** Short accessible name. */
  readonly title: string;
  /** One-sentence description for screen readers and the PDF's alternative text. */
  readonly summary: string;
  /** Drawn in order: later primitives on top. */
  readonly primitives: readonly ScenePrimitive[];
  readonly legend: readonly LegendEntry[];
  readonly segments: readonly SceneSegmentInfo[];
  /** The appliances drawn: one, or every appliance on a common vent, each with its own connector. */
  readonly appliances: readonly SceneApplianceInfo[];
  readonly failingParts: readonly FailingPart[];
  /** Factor by which horizontal connector slopes are steepened so that a small rise is visible. */
  readonly slopeExaggeration: number;
  /** The roof as drawn; null when no termination was entered. */
  readonly roof: { readonly pitchPer12: number; readonly nominal: boolean; readonly angleRad: number; readonly start: Point; readonly end: Point } | null;
  /** Scene units per foot along the pipe (the appliance, fittings and offsets are not to scale). */
  readonly unitsPerFt: number;
}
