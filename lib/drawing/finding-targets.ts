import type { Finding, FindingCode } from "@/lib/venting";

/** Failing findings of one part of the drawing. */
export interface PartFailures {
  readonly codes: FindingCode[];
  readonly titles: string[];
}

/** Failing findings grouped by the part of the vent run they point at. */
export interface FailuresByPart {
  /** Keyed by segment index. */
  readonly segments: Map<number, PartFailures>;
  readonly vent: PartFailures;
  readonly termination: PartFailures;
  /** Keyed by appliance id. */
  readonly appliances: Map<string, PartFailures>;
  /** Vent-run failures that name no single part. */
  readonly run: PartFailures;
}

const empty = (): PartFailures => ({ codes: [], titles: [] });

function push(p: PartFailures, f: Finding): void {
  if (!p.codes.includes(f.code)) p.codes.push(f.code);
  if (!p.titles.includes(f.title)) p.titles.push(f.title);
}

const SEGMENT_PATH = /^ventRun\.segments\.(\d+)(?:\.|$)/;
const APPLIANCE_PATH = /^appliances\.(\d+)(?:\.|$)/;

/**
 * Sorts the failing findings onto the parts of the drawing. A segment fails when a failing
 * finding's `target.itemId` is its id or its path starts with `ventRun.segments.<index>`; the
 * vent and termination by path prefix; appliances by id or index.
 */
export function failuresByPart(
  findings: readonly Finding[],
  segmentIds: readonly string[],
  applianceIds: readonly string[],
): FailuresByPart {
  const out: FailuresByPart = { segments: new Map(), vent: empty(), termination: empty(), appliances: new Map(), run: empty() };
  const seg = (i: number): PartFailures => {
    let p = out.segments.get(i);
    if (!p) out.segments.set(i, (p = empty()));
    return p;
  };
  const app = (id: string): PartFailures => {
    let p = out.appliances.get(id);
    if (!p) out.appliances.set(id, (p = empty()));
    return p;
  };
  for (const f of findings) {
    if (f.status !== "fail") continue;
    const path = typeof f.target?.path === "string" ? f.target.path : "";
    const itemId = f.target?.itemId ?? null;
    if (f.target?.section === "appliances") {
      const m = APPLIANCE_PATH.exec(path);
      const byIndex = m ? applianceIds[Number(m[1])] : undefined;
      const id = itemId !== null && applianceIds.includes(itemId) ? itemId : byIndex;
      if (id !== undefined) push(app(id), f);
      continue;
    }
    if (f.target?.section !== "ventRun" && !path.startsWith("ventRun")) continue;
    if (path.startsWith("ventRun.termination")) {
      push(out.termination, f);
      continue;
    }
    if (path.startsWith("ventRun.vent")) {
      push(out.vent, f);
      continue;
    }
    const m = SEGMENT_PATH.exec(path);
    const byPath = m ? Number(m[1]) : -1;
    const byId = itemId !== null ? segmentIds.indexOf(itemId) : -1;
    const hit = new Set([byPath, byId].filter((i) => i >= 0 && i < segmentIds.length));
    if (hit.size === 0) push(out.run, f);
    for (const i of hit) push(seg(i), f);
  }
  return out;
}
