import type { InspectionFinding } from "@/lib/inspections/evaluate";
import { FINDING_STATUSES, type FindingStatus } from "@/lib/venting";
import { AREAS, areaOf, justificationFor, targetLabel, type RenderContext } from "../context";
import { DASH, quantity, requirement, STATUS_COLOURS, STATUS_WORDS, withUnit } from "../format";
import { drawTable, type Cell, type CellBlock, type Column } from "../table";
import { COLOURS, SIZE } from "../theme";

const SAFETY_WORDS = {
  co: "Carbon-monoxide caution: stop, make the appliance safe and ventilate before going on.",
  spillage: "Spillage caution: flue gases may enter the home; stop, make the appliance safe and ventilate.",
  concealed_single_wall: "Single-wall pipe where it is not allowed: a fire and flue-gas hazard until it is replaced or rerouted.",
} as const;

/** Counts of a group in words: "6 checks: 4 PASS, 2 FAIL". */
function countLine(fs: readonly InspectionFinding[]): string {
  const counts = new Map<FindingStatus, number>();
  for (const f of fs) counts.set(f.status, (counts.get(f.status) ?? 0) + 1);
  const parts = [...FINDING_STATUSES].reverse().filter((s) => counts.get(s)).map((s) => `${counts.get(s)} ${STATUS_WORDS[s]}`);
  return `${fs.length} ${fs.length === 1 ? "check" : "checks"}: ${parts.join(", ")}`;
}

function checkCell(ctx: RenderContext, f: InspectionFinding): Cell {
  const blocks: CellBlock[] = [];
  const where = targetLabel(ctx.input, f);
  blocks.push({ text: where ? `${f.title} · ${where}` : f.title, weight: "bold", color: COLOURS.ink });
  blocks.push({ text: f.message, gapBefore: 1 });
  if (f.smallest) blocks.push({ text: `Smallest that works (company tables): ${withUnit(f.smallest.value, f.smallest.unit)}`, weight: "bold", gapBefore: 1, size: SIZE.small });
  blocks.push({ text: `Source: ${f.citation ?? (f.status === "not-applicable" ? "none, the rule does not apply" : "no rulebook value")}`, size: SIZE.footer, color: COLOURS.muted, gapBefore: 1.5 });
  if (f.safety && f.status !== "pass" && f.status !== "not-applicable") blocks.push({ text: SAFETY_WORDS[f.safety], weight: "bold", color: COLOURS.fail, gapBefore: 2 });
  const j = f.status === "fail" || f.status === "needs-info" ? justificationFor(ctx.input, f) : null;
  if (j) {
    const text = j.number !== null ? `Left as found with a written justification: see Justifications, item ${j.number}.` : `Left as found with a written justification: ${j.text}${j.reference ? ` (Reference: ${j.reference})` : ""}`;
    blocks.push({ text, color: COLOURS.needsInfo, weight: "bold", gapBefore: 2, size: SIZE.small });
  }
  return blocks;
}

/** Findings grouped by area; every finding, passes included, with its status as a word. */
export function drawFindings(ctx: RenderContext, number: number): void {
  const { layout, input } = ctx;
  layout.heading(number, "Findings", 200);
  layout.paragraph(
    "Each check compares what was measured or confirmed on site with the value the company's rulebook requires; its source names the rulebook row (citation) the value came from. Units are given with every number.",
    { weight: "regular", size: SIZE.body, color: COLOURS.muted },
    { after: 6 },
  );
  const cols: Column[] = [
    { header: "Status", width: 58 },
    { header: "Check, result and source (citation)", width: 342 },
    { header: "Measured", width: 62 },
    { header: "Required", width: layout.width - 58 - 342 - 62 },
  ];
  for (const area of AREAS) {
    const fs = input.findings.filter((f) => areaOf(f) === area.key);
    if (fs.length === 0) continue;
    const rows: Cell[][] = fs.map((f) => [
      [{ text: STATUS_WORDS[f.status], badge: STATUS_COLOURS[f.status], size: SIZE.footer }],
      checkCell(ctx, f),
      quantity(f.measured),
      requirement(f.required),
    ]);
    drawTable(layout, cols, rows, { title: `${area.title} — ${countLine(fs)}`, caption: `Findings: ${area.title.toLowerCase()}`, rowMark: (i) => STATUS_COLOURS[fs[i]?.status ?? "pass"] });
  }
  if (input.findings.length === 0) layout.paragraph(`No findings were recorded ${DASH} the record holds no checks.`, { weight: "regular", size: SIZE.body, color: COLOURS.body });
}
