import { boxesOverlap, clamp, textBox, type Box } from "./geometry";
import type { SceneRole, TextPrimitive } from "./scene-types";

/** One line of a label block. */
export interface LabelLine {
  readonly text: string;
  readonly role: SceneRole;
  readonly size: number;
  readonly weight?: "normal" | "bold";
}

/** Where a block may go: `x` by `anchor`, `y` is the block's top, middle or bottom edge. */
export interface LabelCandidate {
  readonly x: number;
  readonly y: number;
  readonly anchor: "start" | "middle" | "end";
  readonly v: "top" | "middle" | "bottom";
}

/** Extra fields copied onto every placed text primitive. */
export interface LabelMeta {
  readonly partId?: string;
  readonly highlight?: boolean;
  readonly findingCodes?: TextPrimitive["findingCodes"];
}

const LINE_GAP = 1.22;

function layout(lines: readonly LabelLine[], c: LabelCandidate): { texts: TextPrimitive[]; boxes: Box[] } {
  const lineH = Math.max(...lines.map((l) => l.size)) * LINE_GAP;
  const h = lines.length * lineH;
  const top = c.v === "top" ? c.y : c.v === "middle" ? c.y - h / 2 : c.y - h;
  const texts: TextPrimitive[] = [];
  const boxes: Box[] = [];
  lines.forEach((l, k) => {
    const y = top + k * lineH + l.size * 0.8;
    const weight = l.weight ?? "normal";
    texts.push({ kind: "text", role: l.role, x: c.x, y, text: l.text, anchor: c.anchor, size: l.size, weight });
    boxes.push(textBox(c.x, y, l.text, l.size, c.anchor, weight === "bold"));
  });
  return { texts, boxes };
}

/**
 * Greedy label placement: each block takes the first candidate position that stays inside the
 * drawing and clear of labels already placed and of registered obstacles (pipes, the appliance).
 * Labels are placed in priority order, so a failing part's label wins over a plain length.
 */
export class LabelPlacer {
  private readonly placed: Box[] = [];
  private readonly obstacles: Box[] = [];

  constructor(private readonly bounds: Box) {}

  /** Registers a box that labels should avoid. */
  avoid(b: Box): void {
    this.obstacles.push(b);
  }

  /** Registers an already placed text (e.g. fixed notes) so that other labels keep clear of it. */
  reserve(b: Box): void {
    this.placed.push(b);
  }

  private inside(b: Box): boolean {
    return b.x0 >= this.bounds.x0 && b.x1 <= this.bounds.x1 && b.y0 >= this.bounds.y0 && b.y1 <= this.bounds.y1;
  }

  private free(boxes: readonly Box[]): boolean {
    return boxes.every(
      (b) => this.inside(b) && !this.placed.some((p) => boxesOverlap(b, p, 2)) && !this.obstacles.some((o) => boxesOverlap(b, o, 0.5)),
    );
  }

  /**
   * Places a block at the first free candidate. An `essential` block that finds no free place
   * searches around its candidates, then tries its shorter `variants` (e.g. without the finding
   * titles), and at last goes to the first candidate moved inside the drawing, where it may touch
   * other labels. Any other block is dropped and null returned.
   */
  place(
    lines: readonly LabelLine[],
    candidates: readonly LabelCandidate[],
    meta: LabelMeta = {},
    essential = false,
    variants: readonly (readonly LabelLine[])[] = [],
  ): TextPrimitive[] | null {
    if (lines.length === 0 || candidates.length === 0) return null;
    const tryAt = (ls: readonly LabelLine[], cs: readonly LabelCandidate[]) => {
      for (const c of cs) {
        const { texts, boxes } = layout(ls, c);
        if (this.free(boxes)) return this.commit(texts, boxes, meta);
      }
      return null;
    };
    const direct = tryAt(lines, candidates);
    if (direct || !essential) return direct;
    for (const ls of [lines, ...variants]) {
      if (ls.length === 0) continue;
      const got = tryAt(ls, candidates) ?? tryAt(ls, around(candidates));
      if (got) return got;
    }
    const last = [lines, ...variants].filter((l) => l.length > 0).pop() ?? lines;
    const first = candidates[0]!;
    const trial = layout(last, first);
    const x0 = Math.min(...trial.boxes.map((b) => b.x0));
    const x1 = Math.max(...trial.boxes.map((b) => b.x1));
    const y0 = Math.min(...trial.boxes.map((b) => b.y0));
    const y1 = Math.max(...trial.boxes.map((b) => b.y1));
    const dx = clamp(0, this.bounds.x0 - x0, this.bounds.x1 - x1);
    const dy = clamp(0, this.bounds.y0 - y0, this.bounds.y1 - y1);
    const moved = layout(last, { ...first, x: first.x + (Number.isFinite(dx) ? dx : 0), y: first.y + (Number.isFinite(dy) ? dy : 0) });
    return this.commit(moved.texts, moved.boxes, meta);
  }

  private commit(texts: TextPrimitive[], boxes: Box[], meta: LabelMeta): TextPrimitive[] {
    this.placed.push(...boxes);
    return texts.map((t) => ({ ...t, ...meta }));
  }
}

const OFFSETS_Y = [0, 14, -14, 28, -28, 42, -42, 56, -56];
const OFFSETS_X = [0, 30, -30, 60, -60, 100, -100];

/** Positions near the given ones, nearest first, for blocks that must be placed. */
function around(cs: readonly LabelCandidate[]): LabelCandidate[] {
  const out: LabelCandidate[] = [];
  for (const dy of OFFSETS_Y) for (const dx of OFFSETS_X) for (const c of cs) if (dx !== 0 || dy !== 0) out.push({ ...c, x: c.x + dx, y: c.y + dy });
  return out;
}
