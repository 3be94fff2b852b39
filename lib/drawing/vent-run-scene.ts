import type { Appliance, ConnectorSegment, Finding, FindingCode, Termination, Vent } from "@/lib/venting";
import { failuresByPart, type PartFailures } from "./finding-targets";
import {
  add,
  arcPoints,
  clamp,
  fmtNum,
  hatchLines,
  leftNormal,
  lerpPt,
  mul,
  num,
  orientedRect,
  pt,
  sub,
  textBox,
  textWidth,
  unit,
  len,
  type Box,
} from "./geometry";
import { servedApplianceIds } from "./served-appliances";
import { LabelPlacer, type LabelCandidate, type LabelLine } from "./label-placer";
import type {
  FailingPart,
  LegendEntry,
  LegendKey,
  Point,
  ScenePrimitive,
  SceneRole,
  SceneApplianceInfo,
  SceneSegmentInfo,
  TextPrimitive,
  VentRunScene,
} from "./scene-types";

/** A vent run as the editor holds it: any field may still be missing. */
export interface DrawingVentRun {
  readonly id?: string | null;
  readonly applianceIds?: readonly string[] | null;
  readonly segments?: readonly Partial<ConnectorSegment>[] | null;
  readonly vent?: Partial<Vent> | null;
  readonly termination?: Partial<Termination> | null;
}

/** Input of {@link buildVentRunScene}. */
export interface BuildVentRunSceneInput {
  readonly ventRun: DrawingVentRun | null | undefined;
  readonly appliances?: readonly Partial<Appliance>[] | null;
  /** Findings of the same input; only `fail` findings change the drawing. */
  readonly findings?: readonly Finding[] | null;
  /** Width of the scene in units; draw it at this many CSS pixels for 1:1 text. Default 700. */
  readonly widthPx?: number;
  /** Height of the scene in units. Default: 460 when wide, taller than wide below 500. */
  readonly heightPx?: number;
}

/** Finding code of an appliance on a common vent with no connector segment assigned. */
const NO_CONNECTOR_CODE = "common_vent.no_connector";

/** Horizontal connector slopes are drawn this many times steeper than true. */
export const SLOPE_EXAGGERATION = 5;
/** Steepest drawn slope of a horizontal segment (rise over run), however steep the entry. */
export const MAX_DRAWN_SLOPE = 0.5;
/** Largest length, ft, that the drawing uses for any one run (entries beyond are still labelled). */
const MAX_DRAW_FT = 2000;

const PASSAGE_WORDS: Record<string, string> = {
  attic: "attic",
  concealed_space: "concealed space",
  floor: "floor",
  ceiling: "ceiling",
  wall: "wall",
  crawl_space: "crawl space",
};
const KIND_WORDS: Record<string, string> = { furnace: "Furnace", boiler: "Boiler", water_heater: "Water heater", other: "Appliance" };
const MATERIAL_WORDS: Record<string, string> = { single_wall: "single-wall", type_b: "Type B", masonry_lined: "lined masonry" };

/** Sizes of the drawing's fixed-size parts, per layout. */
function metrics(width: number) {
  const compact = width < 500;
  return {
    compact,
    font: compact ? 11 : 12,
    small: compact ? 10 : 10.5,
    hw: compact ? 3.5 : 4,
    appW: compact ? 54 : 66,
    appH: compact ? 56 : 66,
    hoodH: 12,
    roofHalf: compact ? 58 : 88,
    roofT: 7,
    pad: 8,
    marginRight: compact ? 96 : 136,
    maxSegLabels: compact ? 5 : 9,
    maxFailLabels: compact ? 4 : 7,
    unitsPerFtMax: compact ? 34 : 44,
  };
}

type M = ReturnType<typeof metrics>;

/** One appliance of the run as drawn: where it stands and where its connector meets the vent. */
interface ChainPlace {
  readonly appId: string;
  readonly app: Partial<Appliance> | undefined;
  /** `appliance` for a run drawn with one appliance, `appliance:<id>` on a common vent. */
  readonly partId: string;
  /** Left (-1) or right (1) of the vent. */
  readonly side: -1 | 1;
  /** Its connector segments, in order (indices into the run's segments). */
  readonly segIdx: number[];
  collar: Point;
  connectorEnd: Point | null;
  /** The tee on the vent; null without a connector. */
  junction: Point | null;
  readonly fail: PartFailures | undefined;
}

interface SegModel {
  readonly index: number;
  readonly id: string;
  readonly orientation: "horizontal" | "vertical";
  readonly material: "single_wall" | "type_b" | null;
  readonly lengthFt: number | null;
  readonly riseIn: number | null;
  readonly nominal: boolean;
  /** Length used for the drawing before shortening, ft. */
  readonly baseFt: number;
  drawFt: number;
  shortened: boolean;
  readonly trueSlope: number | null;
  readonly drawnSlope: number;
  readonly supports: number;
  readonly turns90: number;
  readonly turns45: number;
  readonly clearanceIn: number | null;
  readonly passage: string | null;
  readonly thimble: boolean;
  readonly fail: PartFailures | undefined;
}

/**
 * Reduces the longest of `lengths` to a common cap so that their sum drops by `reduceBy`, never
 * capping below `minCap`. Returns the cap (Infinity when nothing needs to change).
 */
export function waterLevelCap(lengths: readonly number[], reduceBy: number, minCap: number): number {
  if (!(reduceBy > 0) || lengths.length === 0) return Infinity;
  const sorted = [...lengths].sort((a, b) => b - a);
  let sum = 0;
  for (let k = 0; k < sorted.length; k++) {
    sum += sorted[k]!;
    const cap = (sum - reduceBy) / (k + 1);
    const next = sorted[k + 1] ?? 0;
    if (cap >= next) return Math.max(cap, minCap);
  }
  return minCap;
}

/** "segments 1–3", "segment 4" or "segments 1, 3, 6": the editor's numbering. */
function segmentList(indices: readonly number[]): string {
  const ns = indices.map((i) => i + 1);
  if (ns.length === 1) return `segment ${ns[0]}`;
  const contiguous = ns.every((n, k) => k === 0 || n === ns[k - 1]! + 1);
  if (contiguous) return `segments ${ns[0]}–${ns.at(-1)}`;
  return `segments ${ns.slice(0, 4).join(", ")}${ns.length > 4 ? ` +${ns.length - 4}` : ""}`;
}

function median(xs: readonly number[]): number | null {
  if (xs.length === 0) return null;
  const s = [...xs].sort((a, b) => a - b);
  const mid = Math.floor(s.length / 2);
  return s.length % 2 ? s[mid]! : (s[mid - 1]! + s[mid]!) / 2;
}

const count = (v: unknown): number => {
  const n = num(v);
  return n === null || n < 0 ? 0 : Math.min(Math.floor(n), 500);
};

const plural = (n: number, one: string, many = `${one}s`): string => `${n} ${n === 1 ? one : many}`;

function turnText(t90: number, t45: number): string {
  return [t90 > 0 ? `${t90}×90°` : "", t45 > 0 ? `${t45}×45°` : ""].filter(Boolean).join(" ");
}

/**
 * Builds the side view of a vent run: the appliance at the bottom left, each connector segment
 * at its slope and (scaled) length, turns, supports, passages and clearance marks, the vent
 * rising through the roof at its pitch with the termination height, and the failing parts
 * highlighted and labelled with their finding titles. Pure and total: half-typed input draws
 * nominal, dashed parts labelled with a question mark instead of failing.
 */
export function buildVentRunScene(input: BuildVentRunSceneInput): VentRunScene {
  const W = clamp(Math.round(num(input.widthPx) ?? 700), 240, 4000);
  const m = metrics(W);
  const run = input.ventRun ?? {};
  const rawSegs = (Array.isArray(run.segments) ? run.segments : []).map((s) => s ?? {});
  const emptyRun = rawSegs.length === 0 && num(run.vent?.heightFt) === null && !run.vent?.material && !run.termination;
  const defaultH = emptyRun ? 240 : m.compact ? Math.round(W * 1.32) : 480;
  const H = clamp(Math.round(num(input.heightPx) ?? defaultH), 200, 4000);
  const appliances = (Array.isArray(input.appliances) ? input.appliances : []).map((a) => a ?? {});
  const findings = Array.isArray(input.findings) ? input.findings : [];
  const vent = run.vent ?? {};
  const term = run.termination ?? null;

  const segIds = rawSegs.map((s, i) => (typeof s.id === "string" && s.id ? s.id : `segment-${i + 1}`));
  const appIds = appliances.map((a, i) => (typeof a.id === "string" && a.id ? a.id : `appliance-${i + 1}`));
  const fails = failuresByPart(findings, segIds, appIds);

  // Several appliances on the run: each gets its own connector joining a common vent.
  const served = servedApplianceIds(run, appliances);
  const multi = served.length > 1;

  // The appliance drawn alone: the one the first segment names, else the first the run serves.
  const firstAppId = rawSegs.find((s) => typeof s.applianceId === "string")?.applianceId ?? run.applianceIds?.[0] ?? appIds[0];
  const appIndex = Math.max(0, appIds.indexOf(firstAppId ?? ""));
  const app = appliances[appIndex];
  const appId = appIds[appIndex] ?? "appliance";
  const otherApps = new Set<string>();
  for (const s of rawSegs) if (typeof s.applianceId === "string" && s.applianceId !== appId) otherApps.add(s.applianceId);
  for (const id of run.applianceIds ?? []) if (id !== appId) otherApps.add(id);
  if (multi) otherApps.clear();

  // ---- Model, in feet, y up ------------------------------------------------------------------
  const knownLengths = rawSegs.map((s) => num(s.lengthFt)).filter((v): v is number => v !== null && v > 0);
  const nominalFt = clamp(median(knownLengths) ?? 3, 1.5, 10);
  const segs: SegModel[] = rawSegs.map((s, i) => {
    const lengthFt = num(s.lengthFt);
    const riseIn = num(s.riseIn);
    const orientation = s.orientation === "vertical" ? "vertical" : "horizontal";
    const nominal = lengthFt === null || lengthFt <= 0;
    const baseFt = nominal ? nominalFt : Math.min(lengthFt, MAX_DRAW_FT);
    const trueSlope = orientation === "horizontal" && !nominal && riseIn !== null ? riseIn / (12 * lengthFt) : null;
    const drawnSlope = trueSlope === null ? 0 : clamp(trueSlope * SLOPE_EXAGGERATION, -MAX_DRAWN_SLOPE, MAX_DRAWN_SLOPE);
    const material = s.material === "single_wall" || s.material === "type_b" ? s.material : null;
    const clearanceIn = num(s.clearanceIn);
    const passage = typeof s.passesThrough === "string" && s.passesThrough !== "none" ? s.passesThrough : null;
    return {
      index: i,
      id: segIds[i]!,
      orientation,
      material,
      lengthFt,
      riseIn,
      nominal,
      baseFt,
      drawFt: baseFt,
      shortened: false,
      trueSlope,
      drawnSlope,
      supports: count(s.supportsInstalled),
      turns90: count(s.turns90),
      turns45: count(s.turns45),
      clearanceIn: clearanceIn !== null && clearanceIn >= 0 ? clearanceIn : null,
      passage,
      thimble: s.thimble === true,
      fail: fails.segments.get(i),
    };
  });

  const ventHeightFt = num(vent.heightFt);
  const ventMaterial = typeof vent.material === "string" ? vent.material : null;
  const hasVent = segs.length > 0 || ventHeightFt !== null || ventMaterial !== null || term !== null;
  const trueRiseFt = segs.reduce((acc, s) => acc + (s.orientation === "vertical" ? s.baseFt : (s.riseIn ?? 0) / 12), 0);
  const ventNominal = ventHeightFt === null || ventHeightFt <= 0;
  let ventPipeFt = ventNominal ? Math.max(6, nominalFt * 2) : clamp(ventHeightFt - trueRiseFt, 1, MAX_DRAW_FT);
  const lateralRaw = num(vent.lateralFt);
  const lateralFt = lateralRaw !== null && lateralRaw > 0 ? Math.min(lateralRaw, MAX_DRAW_FT) : 0;
  const pitchRaw = term ? num(term.roofPitchPer12) : null;
  const pitchNominal = term !== null && (pitchRaw === null || pitchRaw < 0);
  const pitch = pitchRaw !== null && pitchRaw >= 0 ? Math.min(pitchRaw, 1e6) : 6;
  const habRaw = term ? num(term.heightAboveRoofFt) : null;
  const habNominal = term !== null && (habRaw === null || habRaw < 0);
  const habFt = habRaw !== null && habRaw >= 0 ? Math.min(habRaw, MAX_DRAW_FT) : 2;
  if (term && ventPipeFt < habFt + 1) ventPipeFt = habFt + 1;

  // ---- Keep a very long run readable: shorten the longest runs, with break marks -------------
  const legendRows = legendLayout(legendEntries(segs, ventMaterial, fails, findings), W, m);
  const noteLines = topNotes(segs, fails, otherApps, appliances, appIds, term, hasVent, m.maxFailLabels);
  const mTop = m.pad + noteLines.length * (m.small * 1.3) + 26;
  const legendH = legendRows.rows.length * 17 + 20;
  // Below the floor: the appliance label (and on a common vent, its connector and a failure).
  const mBottom = m.hoodH + m.appH + 10 + 2 * m.font * 1.25 + 8 + legendH + (multi ? 2 * m.small * 1.25 : 0);
  const mLeft = m.appW / 2 + m.pad + 6;
  const plotW = Math.max(40, W - mLeft - m.marginRight);
  const plotH = Math.max(40, H - mTop - mBottom);

  const extent = () => {
    const w = segs.reduce((a, s) => a + (s.orientation === "horizontal" ? s.drawFt : 0), 0) + lateralFt;
    const h =
      segs.reduce((a, s) => a + (s.orientation === "vertical" ? s.drawFt : Math.abs(s.drawnSlope) * s.drawFt), 0) + (hasVent ? ventPipeFt : 0);
    return { w, h };
  };
  // A vent much taller than the connector is drawn shorter, with break marks, so that the
  // connector (where most problems are) gets the room.
  let ventShortened = false;
  if (!multi) {
    const e = extent();
    const connector = Math.max(e.w, e.h - (hasVent ? ventPipeFt : 0));
    const cap = Math.max(1.5 * connector, 8, (term ? habFt : 0) + 5);
    if (hasVent && segs.length > 0 && ventPipeFt > cap * 1.25) ((ventPipeFt = cap), (ventShortened = true));
  }
  // A very long horizontal run squashes everything vertical: shorten the longest horizontals.
  if (!multi) {
    const e = extent();
    if (e.w > 0 && e.h > 0) {
      const s0 = Math.min(plotW / e.w, plotH / e.h);
      if (e.h * s0 < 0.6 * plotH) {
        const targetW = (e.h * plotW) / (0.6 * plotH);
        const hor = segs.filter((sg) => sg.orientation === "horizontal");
        const cap = waterLevelCap(hor.map((sg) => sg.drawFt), e.w - targetW, Math.max(4, 0.5 * e.h));
        for (const sg of hor) if (sg.drawFt > cap * 1.2) ((sg.drawFt = cap), (sg.shortened = true));
      } else if (e.w * s0 < 0.2 * plotW) {
        // A very tall vertical connector: shorten the tallest vertical segments.
        const targetH = (e.w * plotH) / (0.2 * plotW);
        const ver = segs.filter((sg) => sg.orientation === "vertical");
        const cap = waterLevelCap(ver.map((sg) => sg.drawFt), e.h - targetH, Math.max(6, 2 * e.w));
        for (const sg of ver) if (sg.drawFt > cap * 1.2) ((sg.drawFt = cap), (sg.shortened = true));
      }
    }
  }

  // World points (ft, y up) of the connector and the vent.
  const wpts: Point[] = [pt(0, 0)];
  for (const s of segs) {
    const p = wpts[wpts.length - 1]!;
    wpts.push(s.orientation === "vertical" ? pt(p.x, p.y + s.drawFt) : pt(p.x + s.drawFt, p.y + s.drawnSlope * s.drawFt));
  }
  const wEnd = wpts[wpts.length - 1]!;
  const ventW: Point[] = [];
  if (hasVent) {
    ventW.push(wEnd);
    if (lateralFt > 0) {
      const jogDy = Math.min(lateralFt, ventPipeFt * 0.4);
      const a = (ventPipeFt - jogDy) * 0.35;
      const p1 = pt(wEnd.x, wEnd.y + a);
      const p2 = pt(p1.x + lateralFt, p1.y + jogDy);
      ventW.push(p1, p2, pt(p2.x, wEnd.y + ventPipeFt));
    } else ventW.push(pt(wEnd.x, wEnd.y + ventPipeFt));
  }
  const all = [...wpts, ...ventW];
  const minX = Math.min(...all.map((p) => p.x));
  const maxX = Math.max(...all.map((p) => p.x));
  const minY = Math.min(...all.map((p) => p.y));
  const maxY = Math.max(...all.map((p) => p.y));
  const spanX = Math.max(maxX - minX, 1e-6);
  const spanY = Math.max(maxY - minY, 1e-6);
  let s = Math.max(1e-6, Math.min(plotW / spanX, plotH / spanY, m.unitsPerFtMax));
  const offX = mLeft + Math.max(0, (plotW - s * spanX) / 2) * 0.6;
  const baseY = H - mBottom;
  const P = (w: Point): Point => pt(offX + s * (w.x - minX), baseY - s * (w.y - minY));
  const spts = wpts.map(P);
  let vpts = ventW.map(P);
  // Where each segment is drawn, and the start of the one before it on the same connector.
  let segA = segs.map((_, i) => spts[i]!);
  let segB = segs.map((_, i) => spts[i + 1]!);
  let segPrev: (Point | null)[] = segs.map((_, i) => (i > 0 ? spts[i - 1]! : null));
  let chains: ChainPlace[] = [
    { appId, app, partId: "appliance", side: -1, segIdx: segs.map((_, i) => i), collar: spts[0]!, connectorEnd: segs.length > 0 ? spts[segs.length]! : null, junction: segs.length > 0 && vpts.length > 0 ? vpts[0]! : null, fail: fails.appliances.get(appId) },
  ];
  const unassigned = new Set<number>();
  if (multi) {
    const laid = layoutCommonVent();
    s = laid.s;
    vpts = laid.vpts;
    segA = laid.segA;
    segB = laid.segB;
    segPrev = laid.segPrev;
    chains = laid.chains;
  }
  /** Direction the flow takes after segment i: along the next segment of its connector, else into the vent. */
  const nextDir = (i: number, fallback: Point): Point => {
    const ch = chains.find((c) => c.segIdx.includes(i));
    const k = ch ? ch.segIdx.indexOf(i) : -1;
    const nxt = ch && k >= 0 ? ch.segIdx[k + 1] : undefined;
    if (nxt !== undefined) return unit(sub(segB[nxt]!, segA[nxt]!));
    if (multi) return ch && ch.junction && ch.connectorEnd ? unit(sub(ch.junction, ch.connectorEnd)) : fallback;
    return vpts.length >= 2 ? unit(sub(vpts[1]!, vpts[0]!)) : fallback;
  };

  /**
   * Lays out several appliances side by side on the floor, alternately left and right of the
   * common vent, each connector drawn to scale from its collar to a tee on the vent. A tee's
   * branch (a fitting, not to scale) is lengthened where needed so that the appliances do not
   * overlap.
   */
  function layoutCommonVent() {
    const places: ChainPlace[] = served.map((id, k) => ({
      appId: id,
      app: appliances[appIds.indexOf(id)],
      partId: `appliance:${id}`,
      side: k % 2 === 0 ? -1 : 1,
      segIdx: [],
      collar: pt(0, 0),
      connectorEnd: null,
      junction: null,
      fail: fails.appliances.get(id),
    }));
    // A segment without an appliance (or naming one not on this run) continues the connector before it.
    let last = 0;
    rawSegs.forEach((sg, i) => {
      const k = typeof sg.applianceId === "string" ? served.indexOf(sg.applianceId) : -1;
      if (k < 0) unassigned.add(i);
      const c = k >= 0 ? k : last;
      places[c]!.segIdx.push(i);
      last = c;
    });
    // World points of each connector from its own collar, x toward the vent, y up (ft).
    const local = () =>
      places.map((c) => {
        const out: Point[] = [pt(0, 0)];
        for (const i of c.segIdx) {
          const sg = segs[i]!;
          const p = out[out.length - 1]!;
          out.push(sg.orientation === "vertical" ? pt(p.x, p.y + sg.drawFt) : pt(p.x + sg.drawFt, p.y + sg.drawnSlope * sg.drawFt));
        }
        return out;
      });
    const trueRise = (c: ChainPlace) =>
      c.segIdx.reduce((acc, i) => acc + (segs[i]!.orientation === "vertical" ? segs[i]!.baseFt : (segs[i]!.riseIn ?? 0) / 12), 0);
    const connected = places.filter((c) => c.segIdx.length > 0);
    // The vent is measured from the highest outlet; draw it from the highest tee.
    let pts = local();
    const riseOf = (c: ChainPlace) => pts[places.indexOf(c)]!.at(-1)!.y;
    const highest = () => connected.reduce<ChainPlace | null>((b, c) => (b === null || riseOf(c) > riseOf(b) ? c : b), null);
    const hi0 = highest();
    let pipeFt = ventNominal ? Math.max(6, nominalFt * 2) : clamp((ventHeightFt ?? 0) - (hi0 ? trueRise(hi0) : 0), 1, MAX_DRAW_FT);
    if (term && pipeFt < habFt + 1) pipeFt = habFt + 1;
    const sideWidth = (side: number) => Math.max(0, ...places.filter((c) => c.side === side).map((c) => pts[places.indexOf(c)]!.at(-1)!.x));
    const extentM = () => {
      const w = sideWidth(-1) + sideWidth(1) + lateralFt;
      const ys = pts.flat().map((p) => p.y);
      const h = Math.max(0, ...ys) - Math.min(0, ...ys) + pipeFt;
      return { w, h };
    };
    {
      const e = extentM();
      const connector = Math.max(e.w, e.h - pipeFt);
      // Tighter than for one connector: two side by side need the room more.
      const cap = Math.max(connector, 8, (term ? habFt : 0) + 5);
      if (connected.length > 0 && pipeFt > cap * 1.25) ((pipeFt = cap), (ventShortened = true));
    }
    const fixedW = m.appW + 2 * (m.hw + 8) + 2 * m.pad + 12;
    const plotWm = Math.max(40, W - fixedW - (places.some((c) => c.side === 1 && c.segIdx.length > 0) ? 0 : m.marginRight));
    {
      const e = extentM();
      if (e.w > 0 && e.h > 0) {
        const s0 = Math.min(plotWm / e.w, plotH / e.h);
        if (e.h * s0 < 0.6 * plotH) {
          const targetW = (e.h * plotWm) / (0.6 * plotH);
          const hor = segs.filter((sg) => sg.orientation === "horizontal");
          const cap = waterLevelCap(hor.map((sg) => sg.drawFt), e.w - targetW, Math.max(4, 0.5 * e.h));
          for (const sg of hor) if (sg.drawFt > cap * 1.2) ((sg.drawFt = cap), (sg.shortened = true));
          pts = local();
        }
      }
    }
    const hi = highest();
    const ys = pts.flat().map((p) => p.y);
    const minYw = Math.min(0, ...ys);
    const topW = (hi ? riseOf(hi) : 0) + pipeFt;
    const spanYm = Math.max(topW - minYw, 1e-6);
    const wFt = sideWidth(-1) + sideWidth(1) + lateralFt;
    const sm = Math.max(1e-6, Math.min(plotH / spanYm, wFt > 0 ? plotWm / wFt : Infinity, m.unitsPerFtMax));
    const baseYm = H - mBottom;
    const yOf = (y: number) => baseYm - sm * (y - minYw);

    // Distance of each collar from the vent, inner appliances first on each side.
    const minStub = m.hw + 8;
    const gap = m.compact ? 12 : 18;
    const dist = new Map<ChainPlace, number>();
    for (const side of [-1, 1]) {
      let prev: number | null = null;
      for (const c of places.filter((q) => q.side === side)) {
        const dx = sm * pts[places.indexOf(c)]!.at(-1)!.x;
        let st = c.segIdx.length > 0 ? minStub : Math.max(minStub, m.appW / 2 + gap);
        if (prev !== null) st = Math.max(st, prev + m.appW + gap - dx);
        dist.set(c, dx + st);
        prev = dx + st;
      }
    }
    // The innermost appliances on either side must not overlap each other.
    const inL = places.find((c) => c.side === -1);
    const inR = places.find((c) => c.side === 1);
    if (inL && inR) {
      const short = m.appW + gap - (dist.get(inL)! + dist.get(inR)!);
      if (short > 0)
        for (const c of places) {
          dist.set(c, dist.get(c)! + short / 2);
        }
    }
    const leftNeed = Math.max(0, ...places.filter((c) => c.side === -1).map((c) => dist.get(c)!)) + m.appW / 2 + m.pad + 6;
    const rightNeed = Math.max(sm * lateralFt + m.marginRight, ...places.filter((c) => c.side === 1).map((c) => dist.get(c)! + m.appW / 2 + m.pad + 6));
    // Spare width goes first where a vertical connector's label needs room beyond its appliance.
    const labelRoom = (side: number) =>
      Math.max(
        0,
        ...places
          .filter((c) => c.side === side)
          .flatMap((c) => c.segIdx.filter((i) => segs[i]!.orientation === "vertical"))
          .map((i) => textWidth(`${i + 1}: ${fmtNum(segs[i]!.lengthFt ?? 0)} ft up`, m.font, true) + m.hw + 10 - m.appW / 2),
      );
    const slack = Math.max(0, W - leftNeed - rightNeed);
    const wantL = labelRoom(-1);
    const wantR = labelRoom(1);
    const xv = leftNeed + (wantL + wantR > slack ? (wantL + wantR > 0 ? (slack * wantL) / (wantL + wantR) : slack / 2) : wantL + (slack - wantL - wantR) / 2);

    const segAm: Point[] = segs.map(() => pt(0, 0));
    const segBm: Point[] = segs.map(() => pt(0, 0));
    const segPrevm: (Point | null)[] = segs.map(() => null);
    places.forEach((c, k) => {
      const collar = pt(xv + c.side * dist.get(c)!, yOf(0));
      const px = pts[k]!.map((w) => pt(collar.x - c.side * sm * w.x, yOf(w.y)));
      c.segIdx.forEach((i, j) => {
        segAm[i] = px[j]!;
        segBm[i] = px[j + 1]!;
        segPrevm[i] = j > 0 ? px[j - 1]! : null;
      });
      c.collar = collar;
      if (c.segIdx.length > 0) {
        c.connectorEnd = px.at(-1)!;
        c.junction = pt(xv, c.connectorEnd.y);
      }
    });

    // The vent: from the bottom of the lowest tee up past the highest, with its offset, to the top.
    const vp: Point[] = [];
    if (hasVent) {
      const tees = places.filter((c) => c.junction).map((c) => c.junction!.y);
      const hiY = tees.length > 0 ? Math.min(...tees) : yOf(0) - 20;
      const loY = tees.length > 0 ? Math.max(...tees) + m.hw + 5 : yOf(0) - 20;
      vp.push(pt(xv, loY));
      if (lateralFt > 0) {
        const jogDy = Math.min(lateralFt, pipeFt * 0.4);
        const a = (pipeFt - jogDy) * 0.35;
        const p1 = pt(xv, hiY - sm * a);
        const p2 = pt(xv + sm * lateralFt, p1.y - sm * jogDy);
        vp.push(p1, p2, pt(p2.x, hiY - sm * pipeFt));
      } else vp.push(pt(xv, hiY - sm * pipeFt));
    }
    return { s: sm, vpts: vp, segA: segAm, segB: segBm, segPrev: segPrevm, chains: places };
  }

  // ---- Primitives -----------------------------------------------------------------------------
  const back: ScenePrimitive[] = []; // structure behind the pipes
  const pipes: ScenePrimitive[] = [];
  const front: ScenePrimitive[] = []; // supports, marks, dimensions
  const placer = new LabelPlacer({ x0: 3, y0: 3, x1: W - 3, y1: H - 3 });
  const labels: TextPrimitive[] = [];
  const hw = m.hw;
  const drawnKeys = new Set<LegendKey>();

  // Appliances, standing on one floor.
  const floorY = chains[0]!.collar.y + m.hoodH + m.appH;
  back.push({ kind: "line", role: "floor", x1: m.pad, y1: floorY, x2: W - m.pad, y2: floorY, strokeWidth: 1.2 });
  for (let x = m.pad + 4; x < W - m.pad - 4; x += 9) back.push({ kind: "line", role: "floor", x1: x, y1: floorY + 1, x2: x - 5, y2: floorY + 6, strokeWidth: 0.7 });
  const drawn = chains.map((ch) => {
    const collar = ch.collar;
    const appFail = ch.fail;
    const appRole: SceneRole = appFail ? "appliance-fail" : "appliance";
    const appMeta = { partId: ch.partId, ...(appFail ? { highlight: true, findingCodes: appFail.codes } : {}) };
    const natural = ch.app?.draft === "natural";
    const boxTop = collar.y + m.hoodH;
    const boxL = collar.x - m.appW / 2;
    pipes.push({ kind: "rect", role: appRole, ...appMeta, x: boxL, y: boxTop, width: m.appW, height: m.appH, fill: "tint", strokeWidth: 1.6, radius: 3 });
    pipes.push({ kind: "line", role: appRole, ...appMeta, x1: boxL + 6, y1: boxTop + m.appH * 0.56, x2: boxL + m.appW - 6, y2: boxTop + m.appH * 0.56, strokeWidth: 0.8 });
    pipes.push({ kind: "rect", role: appRole, ...appMeta, x: collar.x - 9, y: boxTop + m.appH * 0.68, width: 18, height: 8, fill: "paper", strokeWidth: 0.9, radius: 1.5 });
    if (natural) {
      // Draft hood: a skirt wider than the pipe with an open relief gap above the cabinet.
      pipes.push({
        kind: "polygon",
        role: "draft-hood",
        ...appMeta,
        points: [pt(collar.x - hw - 1, collar.y), pt(collar.x + hw + 1, collar.y), pt(collar.x + hw + 10, boxTop - 4), pt(collar.x - hw - 10, boxTop - 4)],
        fill: "paper",
        strokeWidth: 1.3,
      });
    } else {
      pipes.push({ kind: "rect", role: "draft-hood", ...appMeta, x: collar.x - hw - 2, y: collar.y + 2, width: 2 * hw + 4, height: m.hoodH - 2, fill: "paper", strokeWidth: 1.3 });
    }
    placer.avoid({ x0: boxL, y0: collar.y, x1: boxL + m.appW, y1: floorY + 7 });
    const kindWord = KIND_WORDS[ch.app?.kind ?? "other"] ?? "Appliance";
    const kindText: TextPrimitive = { kind: "text", role: "label-muted", ...appMeta, x: collar.x, y: boxTop + m.appH * 0.4, text: kindWord, anchor: "middle", size: m.small - (textWidth(kindWord, m.small) > m.appW - 8 ? 1.5 : 0), weight: "normal" };
    labels.push(kindText);
    const label = (typeof ch.app?.label === "string" && ch.app.label.trim()) || kindWord;
    return { ch, collar, appFail, appMeta, natural, boxTop, boxL, kindWord, label };
  });
  const { collar, appFail, appMeta, natural, boxTop, boxL, kindWord } = drawn[0]!;
  const anyAppFail = chains.some((c) => c.fail);

  // Top-left notes (run-level failures, missing parts).
  noteLines.forEach((n, k) => {
    const y = m.pad + m.small * 0.8 + k * m.small * 1.3;
    const t: TextPrimitive = { kind: "text", role: n.role, x: m.pad, y, text: n.text, anchor: "start", size: m.small, weight: n.role === "label-fail" ? "bold" : "normal" };
    labels.push(t);
    placer.reserve(textBox(t.x, t.y, t.text, t.size, "start", t.weight === "bold"));
  });

  // Pipe obstacles for the labels.
  const avoidPath = (a: Point, b: Point, r: number) => {
    const n = Math.max(1, Math.ceil(len(sub(b, a)) / 8));
    for (let i = 0; i <= n; i++) {
      const p = lerpPt(a, b, i / n);
      placer.avoid({ x0: p.x - r, y0: p.y - r, x1: p.x + r, y1: p.y + r });
    }
  };
  segs.forEach((sg, i) => avoidPath(segA[i]!, segB[i]!, hw + 1));
  for (const ch of chains) if (multi && ch.connectorEnd && ch.junction) avoidPath(ch.connectorEnd, ch.junction, hw + 1);
  /** An appliance on the run with no connector assigned: a dashed stub ending in a cross above the outlet. */
  function markNoConnector(d: (typeof drawn)[number]): void {
    const { ch, collar: c, appFail: f, appMeta: meta } = d;
    const away = ch.side < 0 ? "end" : "start";
    const missing = (f?.codes as readonly string[] | undefined)?.includes(NO_CONNECTOR_CODE) ?? false;
    const role: SceneRole = missing ? "connector-fail" : "connector";
    const top = pt(c.x, c.y - 22);
    front.push({ kind: "line", role, ...meta, x1: c.x, y1: c.y, x2: top.x, y2: top.y, strokeWidth: 1.6, dash: [3, 3] });
    for (const k of [-1, 1]) front.push({ kind: "line", role, ...meta, x1: top.x - 5, y1: top.y - 5 * k, x2: top.x + 5, y2: top.y + 5 * k, strokeWidth: 2 });
    placer.avoid({ x0: top.x - 6, y0: top.y - 6, x1: top.x + 6, y1: c.y });
    const np = placer.place(
      [{ text: "no connector", role: missing ? "label-fail" : "note", size: m.small, weight: "bold" }],
      [
        { x: c.x, y: top.y - 8, anchor: "middle", v: "bottom" },
        { x: c.x - ch.side * 10, y: top.y, anchor: ch.side < 0 ? "start" : "end", v: "middle" },
        { x: c.x + ch.side * 10, y: top.y, anchor: away === "end" ? "end" : "start", v: "middle" },
      ],
      meta,
      true,
    );
    if (np) labels.push(...np);
  }

  for (let i = 0; i + 1 < vpts.length; i++) avoidPath(vpts[i]!, vpts[i + 1]!, hw + 1);
  if (multi) for (const d of drawn) if (d.ch.segIdx.length === 0) markNoConnector(d);

  // Vent, roof and termination.
  const ventFail = fails.vent.codes.length > 0;
  const termFail = fails.termination.codes.length > 0;
  let roofInfo: VentRunScene["roof"] = null;
  const top = vpts[vpts.length - 1];
  const lastStart = vpts[vpts.length - 2];
  let crossing: Point | null = null;
  if (top && lastStart && term) {
    const theta = Math.atan(pitch / 12);
    const u = pt(Math.cos(theta), Math.sin(theta));
    const lastLen = lastStart.y - top.y;
    const habPx = Math.min(habFt * s, Math.max(0, lastLen - Math.min(6, lastLen * 0.3)));
    crossing = pt(top.x, top.y + habPx);
    const leftRoom = Math.sin(theta) > 1e-6 ? (crossing.y - mTop + 6) / Math.sin(theta) : m.roofHalf;
    const rl = clamp(leftRoom, 10, m.roofHalf);
    const rr = Math.min(m.roofHalf, Math.max(10, (W - m.pad - crossing.x) / Math.max(u.x, 1e-6)));
    const a = add(crossing, mul(u, -rl));
    const b = add(crossing, mul(u, rr));
    const nrm = pt(-u.y, u.x);
    const band = [a, b, add(b, mul(nrm, m.roofT)), add(a, mul(nrm, m.roofT))];
    const dash = pitchNominal ? [6, 4] : undefined;
    back.push({ kind: "polygon", role: "roof", partId: "roof", points: band, fill: "tint", strokeWidth: 0.8, ...(dash ? { dash } : {}) });
    const mid = lerpPt(add(a, mul(nrm, m.roofT / 2)), add(b, mul(nrm, m.roofT / 2)), 0.5);
    for (const [p, q] of hatchLines(mid, u, (rl + rr) / 2, m.roofT / 2, 6)) back.push({ kind: "line", role: "roof", partId: "roof", x1: p.x, y1: p.y, x2: q.x, y2: q.y, strokeWidth: 0.6 });
    back.push({ kind: "line", role: "roof", partId: "roof", x1: a.x, y1: a.y, x2: b.x, y2: b.y, strokeWidth: 1.8, ...(dash ? { dash } : {}) });
    roofInfo = { pitchPer12: pitch, nominal: pitchNominal, angleRad: theta, start: a, end: b };
    avoidPath(a, b, 2);
    avoidPath(add(a, mul(nrm, m.roofT)), add(b, mul(nrm, m.roofT)), 2);
  }

  const ventSingle = ventMaterial === "single_wall";
  const ventMasonry = ventMaterial === "masonry_lined";
  const ventRole: SceneRole = ventFail ? "vent-fail" : "vent";
  const ventMeta = { partId: "vent", ...(ventFail ? { highlight: true, findingCodes: fails.vent.codes } : {}) };
  if (vpts.length >= 2) {
    drawnKeys.add(ventSingle ? "single-wall" : "type-b");
    if (ventFail) drawnKeys.add("fail");
    if (ventFail) pipes.push({ kind: "polyline", role: "halo", partId: "vent", highlight: true, findingCodes: fails.vent.codes, points: vpts, strokeWidth: 2 * hw + 9 });
    // On a common vent each connector enters through the side branch of its own tee.
    const tees = multi ? chains.filter((c) => c.connectorEnd && c.junction) : [];
    for (const ch of tees) drawPipe(pipes, ch.connectorEnd!, ch.junction!, ventSingle ? "single_wall" : "type_b", ventRole, { ...ventMeta, partId: `junction:${ch.appId}` }, hw, ventNominal);
    for (let i = 0; i + 1 < vpts.length; i++) {
      drawPipe(pipes, vpts[i]!, vpts[i + 1]!, ventSingle ? "single_wall" : "type_b", ventRole, ventMeta, hw * (ventMasonry ? 1.7 : 1), ventNominal);
    }
    for (let i = segs.length > 0 && !multi ? 0 : 1; i + 1 < vpts.length; i++) pipes.push(knuckle(vpts[i]!, hw, ventRole, ventMeta));
    for (const ch of tees) {
      const tMeta = { ...ventMeta, partId: `junction:${ch.appId}` };
      const vw = hw * (ventMasonry ? 1.7 : 1);
      pipes.push({ kind: "polygon", role: ventRole, ...tMeta, points: orientedRect(ch.junction!, pt(0, -1), vw + 5, vw + 1.8), fill: "paper", strokeWidth: 1.4 });
      const stubEnd = add(ch.junction!, pt(-ch.side * (vw + 1.8), 0));
      pipes.push({ kind: "line", role: ventRole, ...tMeta, x1: stubEnd.x, y1: ch.junction!.y - hw - 0.8, x2: stubEnd.x, y2: ch.junction!.y + hw + 0.8, strokeWidth: 1.4 });
    }
    if (multi && tees.length > 0) {
      // The tee at the bottom of the vent is capped.
      const b0 = vpts[0]!;
      pipes.push({ kind: "line", role: ventRole, ...ventMeta, x1: b0.x - hw - 2.5, y1: b0.y, x2: b0.x + hw + 2.5, y2: b0.y, strokeWidth: 2.2 });
    }
    if (ventShortened && vpts.length >= 2) {
      const a = vpts[vpts.length - 2]!;
      const b = crossing ?? vpts[vpts.length - 1]!;
      breakMark(front, lerpPt(a, b, 0.45), unit(sub(b, a)), hw, "vent");
    }
  }
  if (top) {
    const tRole: SceneRole = termFail ? "termination-fail" : "termination";
    const tMeta = { partId: "termination", ...(termFail ? { highlight: true, findingCodes: fails.termination.codes } : {}) };
    const cw = hw * (ventMasonry ? 1.7 : 1) + 8;
    front.push({ kind: "line", role: tRole, ...tMeta, x1: top.x - hw + 1, y1: top.y, x2: top.x - hw + 1, y2: top.y - 5, strokeWidth: 1.1 });
    front.push({ kind: "line", role: tRole, ...tMeta, x1: top.x + hw - 1, y1: top.y, x2: top.x + hw - 1, y2: top.y - 5, strokeWidth: 1.1 });
    front.push({
      kind: "polygon",
      role: tRole,
      ...tMeta,
      points: [pt(top.x - cw, top.y - 5), pt(top.x + cw, top.y - 5), pt(top.x + cw - 2, top.y - 8), pt(top.x, top.y - 14), pt(top.x - cw + 2, top.y - 8)],
      fill: "tint",
      strokeWidth: 1.3,
    });
    placer.avoid({ x0: top.x - cw, y0: top.y - 15, x1: top.x + cw, y1: top.y });
    if (crossing && roofInfo) {
      const th = roofInfo.angleRad;
      const yAt = (x: number) => crossing!.y + (x - crossing!.x) * Math.tan(th);
      const cl = crossing.x - hw - 5;
      const cr = crossing.x + hw + 5;
      front.push({ kind: "polygon", role: tRole, ...tMeta, points: [pt(cl, yAt(cl)), pt(cr, yAt(cr)), pt(crossing.x + hw + 1, crossing.y - 6), pt(crossing.x - hw - 1, crossing.y - 6)], fill: "tint", strokeWidth: 1 });
      // Termination height: a dimension from the roof at the vent to the top of the vent.
      const dRole: SceneRole = termFail ? "dimension-fail" : "dimension";
      const xd = crossing.x + hw + (m.compact ? 14 : 18);
      const dash = habNominal ? [4, 3] : undefined;
      front.push({ kind: "line", role: dRole, ...tMeta, x1: crossing.x + hw + 6, y1: crossing.y, x2: xd + 4, y2: crossing.y, strokeWidth: 0.8 });
      front.push({ kind: "line", role: dRole, ...tMeta, x1: top.x + cw + 2, y1: top.y, x2: xd + 4, y2: top.y, strokeWidth: 0.8 });
      front.push({ kind: "line", role: dRole, ...tMeta, x1: xd, y1: crossing.y, x2: xd, y2: top.y, strokeWidth: 1, ...(dash ? { dash } : {}) });
      for (const y of [crossing.y, top.y]) front.push({ kind: "line", role: dRole, ...tMeta, x1: xd - 3, y1: y + 3, x2: xd + 3, y2: y - 3, strokeWidth: 1.3 });
      placer.avoid({ x0: xd - 3, y0: top.y - 3, x1: xd + 4, y1: crossing.y + 3 });
      const dimLines: LabelLine[] = [
        { text: habNominal ? "height?" : `${fmtNum(habFt)} ft`, role: termFail ? "label-fail" : "label", size: m.font, weight: "bold" },
        { text: "above roof", role: termFail ? "label-fail" : "label-muted", size: m.small },
        ...failLines(fails.termination, m),
      ];
      const midY = (crossing.y + top.y) / 2;
      const placed = placer.place(
        dimLines,
        [
          { x: xd + 6, y: midY, anchor: "start", v: "middle" },
          { x: xd + 6, y: top.y - 6, anchor: "start", v: "bottom" },
          { x: top.x - cw - 6, y: top.y - 4, anchor: "end", v: "bottom" },
          { x: top.x - hw - 8, y: midY, anchor: "end", v: "middle" },
        ],
        tMeta,
        true,
        [[dimLines[0]!, ...failLines(fails.termination, m, 1)], [dimLines[0]!]],
      );
      if (placed) labels.push(...placed);
      const roofLine: LabelLine[] = [{ text: pitchNominal ? "roof pitch?" : `roof ${fmtNum(pitch)}/12`, role: pitchNominal ? "label-muted" : "label", size: m.small }];
      const b = roofInfo.end;
      const a = roofInfo.start;
      const rp = placer.place(roofLine, [
        { x: b.x, y: b.y + m.roofT + 3, anchor: "end", v: "top" },
        { x: a.x, y: a.y - 3, anchor: "start", v: "bottom" },
        { x: a.x, y: a.y + m.roofT + 3, anchor: "start", v: "top" },
        { x: b.x - 24, y: b.y + m.roofT + 3, anchor: "start", v: "top" },
      ], { partId: "roof" }, true);
      if (rp) labels.push(...rp);
    }
  }

  // Connector segments.
  const every = Math.max(1, Math.ceil(segs.length / m.maxSegLabels));
  let failLabelled = 0;
  const labelled = new Set<number>();
  const segLabelJobs: { sg: SegModel; a: Point; b: Point; essential: boolean }[] = [];
  segs.forEach((sg, i) => {
    const a = segA[i]!;
    const b = segB[i]!;
    const u = unit(sub(b, a));
    // Up for a horizontal run (on either side of a common vent), left for a vertical one.
    const v = sg.orientation === "horizontal" && leftNormal(u).y > 0 ? mul(leftNormal(u), -1) : leftNormal(u);
    const failing = !!sg.fail;
    const role: SceneRole = failing ? "connector-fail" : "connector";
    const meta = { partId: sg.id, ...(failing ? { highlight: true, findingCodes: sg.fail!.codes } : {}) };
    const pxLen = len(sub(b, a));
    drawnKeys.add(sg.material === "type_b" ? "type-b" : "single-wall");
    if (failing) drawnKeys.add("fail");
    if (failing) pipes.unshift({ kind: "polyline", role: "halo", ...meta, points: [a, b], strokeWidth: 2 * hw + 9 });

    // Passage through a floor, ceiling, wall or attic: a hatched band across the pipe.
    if (sg.passage) {
      const passFail = sg.fail?.codes.includes("passage.single_wall") ?? false;
      const pRole: SceneRole = passFail ? "passage-fail" : "passage";
      const c = lerpPt(a, b, 0.5);
      const hu = 4.5;
      const hv = hw + 12;
      drawnKeys.add("passage");
      back.push({ kind: "polygon", role: pRole, ...meta, points: orientedRect(c, u, hu, hv), fill: "tint", strokeWidth: 1 });
      for (const [p, q] of hatchLines(c, u, hu, hv, 4)) back.push({ kind: "line", role: pRole, ...meta, x1: p.x, y1: p.y, x2: q.x, y2: q.y, strokeWidth: 0.6 });
      placer.avoid(boxOf(orientedRect(c, u, hu, hv)));
    }
    // Combustible material and the measured clearance to it.
    const clrFail = sg.fail?.codes.includes("clearance.combustibles") ?? false;
    if (sg.clearanceIn !== null && pxLen >= 14 && (pxLen >= 40 || clrFail)) {
      const off = hw + 15;
      const c0 = add(lerpPt(a, b, 0.06), mul(v, off));
      const c1 = add(lerpPt(a, b, 0.94), mul(v, off));
      drawnKeys.add("combustible");
      back.push({ kind: "line", role: "combustible", partId: sg.id, x1: c0.x, y1: c0.y, x2: c1.x, y2: c1.y, strokeWidth: 1.1, dash: [5, 2] });
      const ticks = Math.max(1, Math.floor(len(sub(c1, c0)) / 7));
      for (let k = 0; k <= ticks; k++) {
        const p = lerpPt(c0, c1, k / ticks);
        const q = add(add(p, mul(v, 4)), mul(u, 3));
        back.push({ kind: "line", role: "combustible", partId: sg.id, x1: p.x, y1: p.y, x2: q.x, y2: q.y, strokeWidth: 0.6 });
      }
      avoidPath(c0, c1, 2);
      const dRole: SceneRole = clrFail ? "clearance-fail" : "clearance";
      const supportTs = Array.from({ length: sg.supports }, (_, k) => (k + 0.5) / sg.supports);
      const dimT = [0.7, 0.82, 0.3, 0.6, 0.4, 0.9].find((t) => supportTs.every((q) => Math.abs(q - t) * pxLen >= 12)) ?? 0.7;
      const dp = lerpPt(a, b, dimT);
      const d0 = add(dp, mul(v, hw + 1));
      const d1 = add(dp, mul(v, off - 0.5));
      front.push({ kind: "line", role: dRole, ...meta, x1: d0.x, y1: d0.y, x2: d1.x, y2: d1.y, strokeWidth: 1 });
      for (const e of [d0, d1]) front.push({ kind: "line", role: dRole, ...meta, x1: e.x - u.x * 2.5, y1: e.y - u.y * 2.5, x2: e.x + u.x * 2.5, y2: e.y + u.y * 2.5, strokeWidth: 1 });
      const text = `${fmtNum(sg.clearanceIn)} in`;
      const lbl: LabelLine[] = [{ text, role: clrFail ? "label-fail" : "label", size: m.small - 0.5, weight: clrFail ? "bold" : "normal" }];
      const midGap = lerpPt(d0, d1, 0.5);
      const cands: LabelCandidate[] =
        sg.orientation === "vertical"
          ? [{ x: d1.x - 4, y: midGap.y, anchor: "end", v: "middle" }, { x: midGap.x, y: d1.y - 6, anchor: "middle", v: "bottom" }]
          : [
              { x: midGap.x + 4, y: midGap.y, anchor: "start", v: "middle" },
              { x: midGap.x - 4, y: midGap.y, anchor: "end", v: "middle" },
              { x: d1.x, y: d1.y - 6, anchor: "middle", v: "bottom" },
            ];
      const placed = placer.place(lbl, cands, { partId: sg.id }, clrFail);
      if (placed) labels.push(...placed);
    }

    drawPipe(pipes, a, b, sg.material, role, meta, hw, sg.nominal);
    // Joint collars only where they can be told apart; in a dense run they would be beads.
    const prev = segPrev[i];
    if (prev && pxLen >= 6 * hw && len(sub(a, prev)) >= 6 * hw) pipes.push(knuckle(a, hw, role, meta));
    if (sg.shortened) breakMark(front, lerpPt(a, b, 0.38), u, hw, sg.id);

    // Supports, evenly spread: hangers above a horizontal run, wall brackets beside a vertical one.
    if (sg.supports > 0) drawnKeys.add("support");
    for (let k = 0; k < sg.supports; k++) {
      const c = lerpPt(a, b, (k + 0.5) / sg.supports);
      const reach = 11;
      const pts =
        sg.orientation === "vertical"
          ? [pt(c.x - hw, c.y), pt(c.x - hw - reach, c.y), pt(c.x - hw - reach, c.y - 4), pt(c.x - hw - reach, c.y + 4)]
          : [pt(c.x, c.y - hw), pt(c.x, c.y - hw - reach), pt(c.x - 4, c.y - hw - reach), pt(c.x + 4, c.y - hw - reach)];
      front.push({ kind: "polyline", role: "support", partId: sg.id, points: pts, strokeWidth: 1.4 });
    }
    if (sg.supports > 0) {
      if (sg.orientation === "vertical") placer.avoid({ x0: Math.min(a.x, b.x) - hw - 15, y0: Math.min(a.y, b.y), x1: Math.min(a.x, b.x) - hw, y1: Math.max(a.y, b.y) });
      else placer.avoid({ x0: Math.min(a.x, b.x), y0: Math.min(a.y, b.y) - hw - 15, x1: Math.max(a.x, b.x), y1: Math.min(a.y, b.y) - hw });
    }

    // Turns at the far end of the segment, where its elbow sits.
    if (sg.turns90 + sg.turns45 > 0) {
      const next = nextDir(i, u);
      let outward = sub(u, next);
      if (len(outward) < 1e-6) outward = v;
      const o = unit(outward);
      const ang = Math.atan2(o.y, o.x);
      const r = hw + 6;
      front.push({ kind: "polyline", role: "turn", partId: sg.id, points: arcPoints(b, r, ang - Math.PI / 4, ang + Math.PI / 4, 8), strokeWidth: 1.6 });
      const tip = add(b, mul(o, r));
      front.push({ kind: "circle", role: "turn", partId: sg.id, cx: tip.x, cy: tip.y, r: 1.8, fill: "solid", strokeWidth: 0 });
    }

    const show = failing ? failLabelled < m.maxFailLabels : i % every === 0 || (i === segs.length - 1 && segs.length <= m.maxSegLabels);
    if (failing && show) failLabelled++;
    if (show) segLabelJobs.push({ sg, a, b, essential: failing });
  });

  const deferredTurns: (() => void)[] = [];
  // Segment labels: failing ones first so they get the best places.
  segLabelJobs.sort((x, y) => Number(y.essential) - Number(x.essential));
  for (const job of segLabelJobs) {
    const { sg, a, b } = job;
    const c = lerpPt(a, b, 0.5);
    const n = sg.index + 1;
    const main =
      sg.orientation === "vertical"
        ? `${n}: ${sg.nominal ? "length?" : `${fmtNum(sg.lengthFt ?? 0)} ft`} up`
        : `${n}: ${sg.riseIn === null ? "rise?" : `${fmtNum(sg.riseIn)} in`} / ${sg.nominal ? "length?" : `${fmtNum(sg.lengthFt ?? 0)} ft`}`;
    const extra: string[] = [];
    if (sg.passage) extra.push(`through ${PASSAGE_WORDS[sg.passage] ?? sg.passage}${sg.thimble ? ", thimble" : ""}`);
    if (unassigned.has(sg.index)) extra.push("appliance not chosen");
    const t = turnText(sg.turns90, sg.turns45);
    const lines: LabelLine[] = [
      { text: main, role: sg.fail ? "label-fail" : "label", size: m.font, weight: "bold" },
      ...extra.map((e) => ({ text: e, role: "label-muted" as const, size: m.small })),
      ...failLines(sg.fail, m),
    ];
    const meta = { partId: sg.id, ...(sg.fail ? { highlight: true, findingCodes: sg.fail.codes } : {}) };
    const cands: LabelCandidate[] =
      sg.orientation === "vertical"
        ? [
            { x: c.x + hw + 8, y: c.y, anchor: "start", v: "middle" },
            { x: c.x - hw - (sg.clearanceIn !== null ? 34 : 18), y: c.y, anchor: "end", v: "middle" },
            { x: c.x + hw + 8, y: a.y, anchor: "start", v: "bottom" },
            { x: c.x + hw + 8, y: b.y, anchor: "start", v: "top" },
          ]
        : [
            { x: c.x, y: Math.max(a.y, b.y) + hw + 5, anchor: "middle", v: "top" },
            { x: c.x, y: Math.max(a.y, b.y) + hw + 22, anchor: "middle", v: "top" },
            { x: c.x, y: Math.min(a.y, b.y) - hw - (sg.clearanceIn !== null ? 24 : 17), anchor: "middle", v: "bottom" },
            { x: a.x, y: Math.max(a.y, b.y) + hw + 5, anchor: "start", v: "top" },
            { x: b.x, y: Math.max(a.y, b.y) + hw + 5, anchor: "end", v: "top" },
          ];
    if (multi) {
      // Several connectors crowd the middle: a vertical run on the left of the vent is labelled
      // on its outer side, and any label may move a little to find room.
      const ch = chains.find((q) => q.segIdx.includes(sg.index));
      if (sg.orientation === "vertical" && ch?.side === -1) cands.unshift(cands.splice(1, 1)[0]!);
      if (sg.orientation === "vertical")
        cands.push({ x: c.x - hw - 8, y: a.y, anchor: "end", v: "bottom" }, { x: c.x - hw - 8, y: b.y, anchor: "end", v: "top" });
      // A horizontal label wider than its run keeps to its own side of the vent.
      if (sg.orientation === "horizontal" && ch && textWidth(main, m.font, true) > Math.abs(b.x - a.x)) {
        const y = Math.max(a.y, b.y) + hw + 5;
        const above = Math.min(a.y, b.y) - hw - (sg.clearanceIn !== null ? 34 : 20);
        const x = ch.side < 0 ? Math.max(a.x, b.x) : Math.min(a.x, b.x);
        const anchor = ch.side < 0 ? "end" : "start";
        // Beyond the run's outer end, where the connector turns down to its appliance.
        const outer = ch.side < 0 ? (a.x < b.x ? a : b) : a.x > b.x ? a : b;
        const beyond: LabelCandidate = { x: outer.x + ch.side * (hw + 12), y: outer.y - hw - 4, anchor, v: "bottom" };
        cands.unshift({ x, y, anchor, v: "top" }, beyond, { x, y: above, anchor, v: "bottom" });
      }
      const near: LabelCandidate[] = [];
      const dys = sg.orientation === "vertical" ? [14, -14, 28, -28] : [12, 24];
      for (const dy of dys) for (const dx of [0, 30, -30]) for (const q of cands.slice(0, 3)) near.push({ ...q, x: q.x + dx, y: q.y + dy });
      cands.push(...near);
    }
    const head = lines[0]!;
    const shortFail = failLines(sg.fail, m, 1);
    const placed = placer.place(lines, cands, meta, job.essential, [[head, ...shortFail], [head]]);
    if (placed) {
      labels.push(...placed);
      labelled.add(sg.index);
    }
    if (t && multi) deferredTurns.push(() => placeTurn(sg, a, b, t));
    else if (t) placeTurn(sg, a, b, t);
  }
  // On a common vent the connector labels come first; the turn counts take the room left.
  for (const place of deferredTurns) place();

  function placeTurn(sg: SegModel, a: Point, b: Point, t: string): void {
    const next = nextDir(sg.index, unit(sub(b, a)));
    let o = sub(unit(sub(b, a)), next);
    if (len(o) < 1e-6) o = leftNormal(unit(sub(b, a)));
    const d = unit(o);
    const tip = add(b, mul(d, hw + 11));
    const anchor = d.x < -0.3 ? "end" : d.x > 0.3 ? "start" : "middle";
    const tl = placer.place([{ text: t, role: "label-muted", size: m.small }], [
      { x: tip.x, y: tip.y, anchor, v: d.y < -0.3 ? "bottom" : d.y > 0.3 ? "top" : "middle" },
      { x: b.x + hw + 6, y: b.y + hw + 4, anchor: "start", v: "top" },
      { x: b.x - hw - 6, y: b.y - hw - 4, anchor: "end", v: "bottom" },
    ], { partId: sg.id });
    if (tl) labels.push(...tl);
  }

  // Vent label.
  if (vpts.length >= 2) {
    const a = vpts[vpts.length - 2]!;
    const b = crossing ?? vpts[vpts.length - 1]!;
    const c = lerpPt(a, b, 0.5);
    const matWord = ventMaterial ? MATERIAL_WORDS[ventMaterial] ?? ventMaterial : "material?";
    const dia = num(vent.diameterIn);
    const lines: LabelLine[] = [
      { text: `${multi ? "Common vent" : "Vent"}: ${matWord}${dia !== null ? ` ${fmtNum(dia)} in` : ""}`, role: ventFail ? "label-fail" : "label", size: m.font, weight: "bold" },
      { text: ventNominal ? "height?" : `${fmtNum(ventHeightFt ?? 0)} ft above ${multi ? "top outlet" : "collar"}`, role: ventFail ? "label-fail" : "label-muted", size: m.small },
      ...(lateralFt > 0 ? [{ text: `${fmtNum(lateralFt)} ft lateral`, role: "label-muted" as const, size: m.small }] : []),
      ...failLines(fails.vent, m),
    ];
    const x = Math.max(a.x, b.x);
    const placed = placer.place(
      lines,
      [
        { x: x + hw + 9, y: c.y, anchor: "start", v: "middle" },
        { x: x + hw + 9, y: lerpPt(a, b, 0.25).y, anchor: "start", v: "middle" },
        { x: x + hw + 9, y: lerpPt(a, b, 0.8).y, anchor: "start", v: "middle" },
        { x: Math.min(a.x, b.x) - hw - 9, y: c.y, anchor: "end", v: "middle" },
        { x: Math.min(a.x, b.x) - hw - 9, y: lerpPt(a, b, 0.8).y, anchor: "end", v: "middle" },
      ],
      ventMeta,
      true,
      [[lines[0]!, ...failLines(fails.vent, m, 1)], [lines[0]!]],
    );
    if (placed) labels.push(...placed);
  }

  // On a common vent: each appliance's label, its connector's name, or a mark where it has none.
  if (multi) labelCommonVentAppliances();
  // Appliance label under the floor line, and what sits on its outlet.
  else {
    const label = (typeof app?.label === "string" && app.label.trim()) || kindWord;
    const inputBtuh = num(app?.inputBtuh);
    const outlet = num(app?.outletDiameterIn);
    const second = [inputBtuh !== null ? `${fmtNum(inputBtuh, 0)} Btu/h` : "", outlet !== null ? `${fmtNum(outlet)} in outlet` : ""].filter(Boolean).join(" · ");
    const lines: LabelLine[] = [
      { text: label, role: appFail ? "label-fail" : "label", size: m.font, weight: "bold" },
      ...(second ? [{ text: second, role: "label-muted" as const, size: m.small }] : []),
      ...failLines(appFail, m),
    ];
    const placed = placer.place(lines, [{ x: Math.max(m.pad, boxL), y: floorY + 9, anchor: "start", v: "top" }], appMeta, true);
    if (placed) labels.push(...placed);
    if (segs.length === 0 && !hasVent) {
      const np = placer.place(
        [
          { text: "No connector segments yet.", role: "note", size: m.font },
          { text: "Add segments to draw the vent run.", role: "label-muted", size: m.small },
        ],
        [{ x: boxL + m.appW + 16, y: boxTop + m.appH / 2, anchor: "start", v: "middle" }],
        {},
        true,
      );
      if (np) labels.push(...np);
    }
    const hood = placer.place([{ text: natural ? "draft hood" : "flue collar", role: "label-muted", size: m.small - 0.5 }], [
      { x: collar.x + hw + 12, y: collar.y + m.hoodH / 2, anchor: "start", v: "middle" },
      { x: collar.x - hw - 12, y: collar.y + m.hoodH / 2, anchor: "end", v: "middle" },
    ], appMeta);
    if (hood) labels.push(...hood);
  }

  function labelCommonVentAppliances(): void {
    for (const d of drawn) {
      const { ch, collar: c, appFail: f, appMeta: meta, boxL: bl, kindWord: kw, label } = d;
      const inputBtuh = num(ch.app?.inputBtuh);
      const second = [label !== kw ? kw : "", inputBtuh !== null ? `${fmtNum(inputBtuh, 0)} Btu/h` : "input?"].filter(Boolean).join(" · ");
      const connFail = ch.segIdx.some((i) => segs[i]!.fail);
      const conn: LabelLine = ch.segIdx.length > 0
        ? { text: `connector: ${segmentList(ch.segIdx)}`, role: connFail ? "label-fail" : "label-muted", size: m.small }
        : { text: "connector: none", role: f ? "label-fail" : "label-muted", size: m.small };
      const lines: LabelLine[] = [
        { text: label, role: f ? "label-fail" : "label", size: m.font, weight: "bold" },
        { text: second, role: "label-muted", size: m.small },
        conn,
        ...failLines(f, m, 1),
      ];
      const outer: LabelCandidate =
        ch.side < 0 ? { x: Math.max(m.pad, bl), y: floorY + 9, anchor: "start", v: "top" } : { x: Math.min(W - m.pad, bl + m.appW), y: floorY + 9, anchor: "end", v: "top" };
      const placed = placer.place(lines, [outer, { x: c.x, y: floorY + 9, anchor: "middle", v: "top" }], meta, true, [[lines[0]!, lines[1]!, conn], [lines[0]!, conn], [lines[0]!]]);
      if (placed) labels.push(...placed);
      const away = ch.side < 0 ? "end" : "start";
      if (!ch.connectorEnd || !ch.junction) continue;
      if (!m.compact) {
        const hood = placer.place([{ text: d.natural ? "draft hood" : "flue collar", role: "label-muted", size: m.small - 0.5 }], [
          { x: c.x + ch.side * (hw + 12), y: c.y + m.hoodH / 2, anchor: ch.side < 0 ? "end" : "start", v: "middle" },
          { x: c.x - ch.side * (hw + 12), y: c.y + m.hoodH / 2, anchor: ch.side < 0 ? "start" : "end", v: "middle" },
        ], meta);
        if (hood) labels.push(...hood);
      }
    }
  }

  // Legend and the scale note along the bottom.
  if (termFail || anyAppFail) drawnKeys.add("fail");
  const finalLegend = legendLayout(legendRows.entries.filter((e) => drawnKeys.has(e.key)), W, m);
  const legendPrims = drawLegend(finalLegend, H - legendH + 4, m, segs.length > 0);

  const primitives: ScenePrimitive[] = [...back, ...pipes, ...front, ...labels, ...legendPrims];
  const fitted = fitInto(primitives, W, H);

  const segInfo: SceneSegmentInfo[] = segs.map((sg, i) => ({
    id: sg.id,
    index: i,
    orientation: sg.orientation,
    material: sg.material,
    lengthFt: sg.nominal ? num(rawSegs[i]?.lengthFt) : sg.lengthFt,
    riseIn: sg.riseIn,
    nominalLength: sg.nominal,
    shortened: sg.shortened,
    trueSlope: sg.trueSlope,
    drawnSlope: sg.orientation === "vertical" ? 0 : sg.drawnSlope,
    start: fitted.map(segA[i]!),
    end: fitted.map(segB[i]!),
    supports: sg.supports,
    labelled: labelled.has(i),
    highlight: !!sg.fail,
    findingCodes: sg.fail?.codes ?? [],
    findingTitles: sg.fail?.titles ?? [],
  }));

  const failingParts: FailingPart[] = [];
  if (!multi && appFail) failingParts.push({ partId: "appliance", kind: "appliance", label: (app?.label as string) || kindWord, findingCodes: appFail.codes, titles: appFail.titles });
  if (multi) for (const d of drawn) if (d.appFail) failingParts.push({ partId: d.ch.partId, kind: "appliance", label: d.label, findingCodes: d.appFail.codes, titles: d.appFail.titles });
  const connectorOf = (i: number): string => {
    const d = multi ? drawn.find((q) => q.ch.segIdx.includes(i)) : undefined;
    return d ? `, ${d.label} connector` : "";
  };
  for (const sg of segs)
    if (sg.fail) failingParts.push({ partId: sg.id, kind: "segment", label: `Segment ${sg.index + 1}${connectorOf(sg.index)}`, findingCodes: sg.fail.codes, titles: sg.fail.titles });
  if (ventFail) failingParts.push({ partId: "vent", kind: "vent", label: "Vent", findingCodes: fails.vent.codes, titles: fails.vent.titles });
  if (termFail) failingParts.push({ partId: "termination", kind: "termination", label: "Termination", findingCodes: fails.termination.codes, titles: fails.termination.titles });
  if (fails.run.codes.length) failingParts.push({ partId: "run", kind: "run", label: "Vent run", findingCodes: fails.run.codes, titles: fails.run.titles });

  const appLabel = (typeof app?.label === "string" && app.label.trim()) || kindWord;
  const names = drawn.map((d) => d.label);
  const servedText = names.length > 1 ? `${names.slice(0, -1).join(", ")} and ${names.at(-1)}` : names[0] ?? "";
  const connectorsText = drawn
    .map((d) => `${d.label}: ${d.ch.segIdx.length > 0 ? plural(d.ch.segIdx.length, "connector segment") : "no connector"}`)
    .join("; ");
  const sceneAppliances: SceneApplianceInfo[] = drawn.map((d) => ({
    id: d.ch.appId,
    partId: d.ch.partId,
    label: d.label,
    collar: fitted.map(d.collar),
    junction: d.ch.junction ? fitted.map(d.ch.junction) : null,
    segmentIds: d.ch.segIdx.map((i) => segs[i]!.id),
    noConnector: d.ch.segIdx.length === 0,
    highlight: !!d.appFail,
    findingCodes: d.appFail?.codes ?? [],
  }));
  const summary = summarize(segs, ventMaterial, ventHeightFt, term ? { pitch: pitchNominal ? null : pitch, hab: habNominal ? null : habFt } : null, failingParts);
  return {
    width: W,
    height: H,
    title: multi ? `Side view of the common vent serving ${servedText}` : `Side view of the vent run from ${appLabel}`,
    summary: multi ? `Common vent serving ${servedText} (${connectorsText}). ${summary}` : summary,
    appliances: sceneAppliances,
    primitives: fitted.primitives,
    legend: finalLegend.entries,
    segments: segInfo,
    failingParts,
    slopeExaggeration: SLOPE_EXAGGERATION,
    roof: roofInfo ? { ...roofInfo, start: fitted.map(roofInfo.start), end: fitted.map(roofInfo.end) } : null,
    unitsPerFt: s * fitted.k,
  };
}

/** Failing finding titles as label lines, at most two and a count of the rest. */
function failLines(f: PartFailures | undefined, m: M, max = 2): LabelLine[] {
  if (!f || f.titles.length === 0) return [];
  const shown = f.titles.slice(0, max).map((t) => ({ text: t, role: "label-fail" as const, size: m.small }));
  const rest = f.titles.length - max;
  if (rest > 0) {
    const last = shown[shown.length - 1]!;
    shown[shown.length - 1] = { ...last, text: `${last.text} +${rest} more` };
  }
  return shown;
}

/** A straight pipe: single-wall as one heavy line, double-wall as two lines with the pipe between. */
function drawPipe(
  out: ScenePrimitive[],
  a: Point,
  b: Point,
  material: "single_wall" | "type_b" | null,
  role: SceneRole,
  meta: { partId: string; highlight?: boolean; findingCodes?: readonly FindingCode[] },
  hw: number,
  nominal: boolean,
): void {
  const dash = nominal ? [6, 4] : undefined;
  if (material === "type_b") {
    const u = unit(sub(b, a));
    const c = lerpPt(a, b, 0.5);
    out.push({ kind: "polygon", role, ...meta, points: orientedRect(c, u, len(sub(b, a)) / 2, hw), fill: "paper", strokeWidth: 1.4, ...(dash ? { dash } : {}) });
  } else {
    out.push({ kind: "line", role, ...meta, x1: a.x, y1: a.y, x2: b.x, y2: b.y, strokeWidth: material === null ? 2.2 : 3, ...(dash ? { dash } : {}) });
  }
}

/** A joint between two pieces: a small collar over the pipe. */
function knuckle(p: Point, hw: number, role: SceneRole, meta: { partId: string; highlight?: boolean; findingCodes?: readonly FindingCode[] }): ScenePrimitive {
  return { kind: "circle", role, ...meta, cx: p.x, cy: p.y, r: hw + 0.8, fill: "paper", strokeWidth: 1.1 };
}

/** Break marks on a run drawn shorter than to scale. */
function breakMark(out: ScenePrimitive[], c: Point, u: Point, hw: number, partId: string): void {
  const v = leftNormal(u);
  out.push({ kind: "polygon", role: "break", partId, points: orientedRect(c, u, 3, hw + 2), fill: "paper", strokeWidth: 0 });
  for (const k of [-3, 3]) {
    const p = add(add(c, mul(u, k - 2)), mul(v, -(hw + 5)));
    const q = add(add(c, mul(u, k + 2)), mul(v, hw + 5));
    out.push({ kind: "line", role: "break", partId, x1: p.x, y1: p.y, x2: q.x, y2: q.y, strokeWidth: 1.3 });
  }
}

function boxOf(points: readonly Point[]): Box {
  return {
    x0: Math.min(...points.map((p) => p.x)),
    y0: Math.min(...points.map((p) => p.y)),
    x1: Math.max(...points.map((p) => p.x)),
    y1: Math.max(...points.map((p) => p.y)),
  };
}

interface Note {
  readonly text: string;
  readonly role: SceneRole;
}

function topNotes(
  segs: readonly SegModel[],
  fails: ReturnType<typeof failuresByPart>,
  otherApps: ReadonlySet<string>,
  appliances: readonly Partial<Appliance>[],
  appIds: readonly string[],
  term: Partial<Termination> | null,
  hasVent: boolean,
  maxFail: number,
): Note[] {
  const notes: Note[] = [];
  for (const t of fails.run.titles.slice(0, 2)) notes.push({ text: `${t} (whole run)`, role: "label-fail" });
  const failing = segs.filter((s) => s.fail).length;
  if (failing > maxFail) notes.push({ text: `${failing} failing segments; labels on the first ones`, role: "label-fail" });
  if (otherApps.size > 0) {
    const names = [...otherApps].map((id) => {
      const i = appIds.indexOf(id);
      const l = i >= 0 ? appliances[i]?.label : undefined;
      return typeof l === "string" && l ? l : id;
    });
    notes.push({ text: `Also on this vent: ${names.slice(0, 2).join(", ")}${names.length > 2 ? ` +${names.length - 2}` : ""}`, role: "note" });
  }
  if (hasVent && term === null) notes.push({ text: "Termination not entered", role: "note" });
  return notes;
}

function legendEntries(
  segs: readonly SegModel[],
  ventMaterial: string | null,
  fails: ReturnType<typeof failuresByPart>,
  findings: readonly Finding[],
): LegendEntry[] {
  const out: LegendEntry[] = [];
  const has = (k: LegendKey, label: string, when: boolean) => when && out.push({ key: k, label });
  has("single-wall", "single-wall", segs.some((s) => s.material !== "type_b") || ventMaterial === "single_wall");
  has("type-b", "Type B", segs.some((s) => s.material === "type_b") || (segs.length > 0 && ventMaterial !== "single_wall"));
  has("support", "support", segs.some((s) => s.supports > 0));
  has("combustible", "combustible", segs.some((s) => s.clearanceIn !== null));
  has("passage", "passage", segs.some((s) => s.passage !== null));
  const anyFail =
    fails.segments.size > 0 || fails.vent.codes.length > 0 || fails.termination.codes.length > 0 || fails.appliances.size > 0 || findings.some((f) => f.status === "fail");
  has("fail", "failing part", anyFail);
  return out;
}

interface LegendRows {
  readonly entries: LegendEntry[];
  readonly rows: { entry: LegendEntry; x: number }[][];
}

const SWATCH = 20;

function legendLayout(entries: LegendEntry[], W: number, m: M): LegendRows {
  const rows: { entry: LegendEntry; x: number }[][] = [];
  let row: { entry: LegendEntry; x: number }[] = [];
  let x = m.pad;
  for (const e of entries) {
    const w = SWATCH + 5 + textWidth(e.label, m.small) + 14;
    if (row.length > 0 && x + w > W - m.pad) {
      rows.push(row);
      row = [];
      x = m.pad;
    }
    row.push({ entry: e, x });
    x += w;
  }
  if (row.length) rows.push(row);
  return { entries, rows };
}

function drawLegend(l: LegendRows, y0: number, m: M, withNote: boolean): ScenePrimitive[] {
  const out: ScenePrimitive[] = [];
  const base = { partId: "legend" } as const;
  l.rows.forEach((row, r) => {
    const cy = y0 + r * 17 + 6;
    for (const { entry, x } of row) {
      const x1 = x + SWATCH;
      switch (entry.key) {
        case "single-wall":
          out.push({ kind: "line", role: "connector", ...base, x1: x, y1: cy, x2: x1, y2: cy, strokeWidth: 3 });
          break;
        case "type-b":
          out.push({ kind: "rect", role: "vent", ...base, x, y: cy - m.hw, width: SWATCH, height: 2 * m.hw, fill: "paper", strokeWidth: 1.4 });
          break;
        case "support":
          out.push({ kind: "line", role: "connector", ...base, x1: x, y1: cy + 3, x2: x1, y2: cy + 3, strokeWidth: 2 });
          out.push({ kind: "polyline", role: "support", ...base, points: [pt(x + 10, cy + 2), pt(x + 10, cy - 5), pt(x + 6, cy - 5), pt(x + 14, cy - 5)], strokeWidth: 1.4 });
          break;
        case "combustible":
          out.push({ kind: "line", role: "combustible", ...base, x1: x, y1: cy + 2, x2: x1, y2: cy + 2, strokeWidth: 1.1, dash: [5, 2] });
          for (let k = 0; k < 3; k++) out.push({ kind: "line", role: "combustible", ...base, x1: x + 3 + k * 7, y1: cy + 2, x2: x + 6 + k * 7, y2: cy - 2, strokeWidth: 0.6 });
          break;
        case "passage": {
          const c = pt(x + SWATCH / 2, cy);
          out.push({ kind: "polygon", role: "passage", ...base, points: orientedRect(c, pt(1, 0), SWATCH / 2, 4), fill: "tint", strokeWidth: 0.9 });
          for (const [p, q] of hatchLines(c, pt(1, 0), SWATCH / 2, 4, 4)) out.push({ kind: "line", role: "passage", ...base, x1: p.x, y1: p.y, x2: q.x, y2: q.y, strokeWidth: 0.6 });
          break;
        }
        case "fail":
          out.push({ kind: "line", role: "halo", ...base, x1: x + 5, y1: cy, x2: x1 - 5, y2: cy, strokeWidth: 2 * m.hw + 7 });
          out.push({ kind: "line", role: "connector-fail", ...base, x1: x + 2, y1: cy, x2: x1 - 2, y2: cy, strokeWidth: 3 });
          break;
        default:
          entry.key satisfies never;
      }
      out.push({ kind: "text", role: "legend", ...base, x: x1 + 5, y: cy + m.small * 0.36, text: entry.label, anchor: "start", size: m.small, weight: "normal" });
    }
  });
  const noteY = y0 + l.rows.length * 17 + 6;
  if (withNote)
    out.push({
    kind: "text",
    role: "note",
    ...base,
    x: m.pad,
    y: noteY + m.small * 0.36,
    text: m.compact ? `Slopes drawn ×${SLOPE_EXAGGERATION} steeper · not to scale` : `Slopes drawn ×${SLOPE_EXAGGERATION} steeper than true; appliance, fittings and offsets not to scale`,
    anchor: "start",
    size: m.small - 0.5,
    weight: "normal",
  });
  return out;
}

function summarize(
  segs: readonly SegModel[],
  ventMaterial: string | null,
  ventHeightFt: number | null,
  term: { pitch: number | null; hab: number | null } | null,
  failing: readonly FailingPart[],
): string {
  const parts: string[] = [];
  const hor = segs.filter((s) => s.orientation === "horizontal" && !s.nominal).reduce((a, s) => a + (s.lengthFt ?? 0), 0);
  const ver = segs.filter((s) => s.orientation === "vertical" && !s.nominal).reduce((a, s) => a + (s.lengthFt ?? 0), 0);
  const missing = segs.filter((s) => s.nominal).length;
  let conn = `${plural(segs.length, "connector segment")}`;
  if (segs.length > 0) conn += `, ${fmtNum(hor)} ft horizontal, ${fmtNum(ver)} ft vertical`;
  if (missing > 0) conn += ` (${missing} without a length)`;
  parts.push(conn);
  if (ventMaterial || ventHeightFt !== null)
    parts.push(`vent ${ventMaterial ? MATERIAL_WORDS[ventMaterial] ?? ventMaterial : ""}${ventHeightFt !== null ? ` ${fmtNum(ventHeightFt)} ft` : ""}`.replace(/\s+/g, " ").trim());
  if (term) parts.push(`roof ${term.pitch !== null ? `${fmtNum(term.pitch)}/12` : "pitch not entered"}, ${term.hab !== null ? `ends ${fmtNum(term.hab)} ft above the roof` : "height above roof not entered"}`);
  const f =
    failing.length === 0
      ? "no failing parts"
      : `${plural(failing.length, "failing part")}: ${failing.map((p) => `${p.label} (${p.titles.join(", ")})`).join("; ")}`;
  return `Vent run: ${parts.join("; ")}; ${f}.`;
}

/** Bounding box of everything drawn, text included. */
function sceneBox(prims: readonly ScenePrimitive[]): Box {
  const b: Box = { x0: Infinity, y0: Infinity, x1: -Infinity, y1: -Infinity };
  const grow = (x: number, y: number, r = 0) => {
    b.x0 = Math.min(b.x0, x - r);
    b.y0 = Math.min(b.y0, y - r);
    b.x1 = Math.max(b.x1, x + r);
    b.y1 = Math.max(b.y1, y + r);
  };
  for (const p of prims) {
    switch (p.kind) {
      case "line":
        grow(p.x1, p.y1);
        grow(p.x2, p.y2);
        break;
      case "polyline":
      case "polygon":
        for (const q of p.points) grow(q.x, q.y);
        break;
      case "rect":
        grow(p.x, p.y);
        grow(p.x + p.width, p.y + p.height);
        break;
      case "circle":
        grow(p.cx, p.cy, p.r);
        break;
      case "text": {
        const t = textBox(p.x, p.y, p.text, p.size, p.anchor, p.weight === "bold");
        grow(t.x0, t.y0);
        grow(t.x1, t.y1);
        break;
      }
      default:
        p satisfies never;
    }
  }
  return b;
}

/**
 * Safety net: if anything reaches outside the scene (a steep roof, a crowded label), scale the
 * whole drawing uniformly about the origin and move it back inside, so that angles and slopes
 * are kept and every coordinate stays within the viewBox.
 */
function fitInto(prims: readonly ScenePrimitive[], W: number, H: number): { primitives: ScenePrimitive[]; map: (p: Point) => Point; k: number } {
  const b = sceneBox(prims);
  const margin = 2;
  const inside = b.x0 >= margin && b.y0 >= margin && b.x1 <= W - margin && b.y1 <= H - margin;
  if (inside || !Number.isFinite(b.x0 + b.x1 + b.y0 + b.y1)) return { primitives: [...prims], map: (p) => p, k: 1 };
  const k = Math.min(1, (W - 2 * margin) / Math.max(b.x1 - b.x0, 1e-6), (H - 2 * margin) / Math.max(b.y1 - b.y0, 1e-6));
  const bw = (b.x1 - b.x0) * k;
  const bh = (b.y1 - b.y0) * k;
  const tx = clamp(b.x0 * k, margin, W - margin - bw) - b.x0 * k;
  const ty = clamp(b.y0 * k, margin, H - margin - bh) - b.y0 * k;
  const map = (p: Point): Point => pt(p.x * k + tx, p.y * k + ty);
  const mx = (x: number) => x * k + tx;
  const my = (y: number) => y * k + ty;
  const out = prims.map((p): ScenePrimitive => {
    switch (p.kind) {
      case "line":
        return { ...p, x1: mx(p.x1), y1: my(p.y1), x2: mx(p.x2), y2: my(p.y2) };
      case "polyline":
      case "polygon":
        return { ...p, points: p.points.map(map) };
      case "rect":
        return { ...p, x: mx(p.x), y: my(p.y), width: p.width * k, height: p.height * k };
      case "circle":
        return { ...p, cx: mx(p.cx), cy: my(p.cy), r: p.r * k };
      case "text":
        return { ...p, x: mx(p.x), y: my(p.y), size: p.size * k };
      default:
        return p satisfies never;
    }
  });
  return { primitives: out, map, k };
}
