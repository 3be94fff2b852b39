import { buildVentRunScene } from "@/lib/drawing";
import type { Finding } from "@/lib/venting";
import {
  APPLIANCE_KIND_LABELS,
  CATEGORY_LABELS,
  CONNECTOR_MATERIAL_LABELS,
  DRAFT_LABELS,
  FUEL_LABELS,
  PASSAGE_LABELS,
  TERMINATION_OPENING_LABELS,
  VENT_MATERIAL_LABELS,
} from "@/components/inspection/options";
import { applianceLabel, type RenderContext } from "../context";
import { DASH, label, STATUS_COLOURS, STATUS_WORDS, withUnit, yesNo } from "../format";
import { drawScene } from "../scene";
import { drawTable, type Cell, type CellBlock, type Column } from "../table";
import { COLOURS, SIZE } from "../theme";
import type { TextStyle } from "../text";
import { rect } from "../draw";

/** Connector materials in the few letters a narrow column holds. */
const SHORT_MATERIAL = { single_wall: "Single-wall", type_b: "Type B" } as const satisfies Record<keyof typeof CONNECTOR_MATERIAL_LABELS, string>;

/** Where a segment runs, in a word or two. */
const SHORT_PASSAGE = {
  none: "Open space",
  attic: "Attic",
  concealed_space: "Concealed space",
  floor: "Floor",
  ceiling: "Ceiling",
  wall: "Wall",
  crawl_space: "Crawl space",
} as const satisfies Record<keyof typeof PASSAGE_LABELS, string>;

const muted: TextStyle = { weight: "regular", size: SIZE.body, color: COLOURS.muted };
const body: TextStyle = { weight: "regular", size: SIZE.body, color: COLOURS.body };

/** Widths from shares of the content width. */
function widths(total: number, shares: readonly number[]): number[] {
  const sum = shares.reduce((a, b) => a + b, 0);
  const out = shares.map((s) => Math.floor((total * s) / sum));
  out[out.length - 1] = total - out.slice(0, -1).reduce((a, b) => a + b, 0);
  return out;
}

function cols(total: number, spec: readonly [string, number, Column["align"]?][]): Column[] {
  const ws = widths(total, spec.map((s) => s[1]));
  return spec.map(([header, , align], i) => ({ header, width: ws[i] ?? 0, align }));
}

export function drawAppliances(ctx: RenderContext, number: number): void {
  const { layout, input } = ctx;
  layout.heading(number, "Appliances", 60);
  if (input.appliances.length === 0) {
    layout.paragraph("No appliance was entered.", body);
    return;
  }
  const columns = cols(layout.width, [
    ["Appliance", 1.45],
    ["Kind", 0.8],
    ["Fuel", 0.85],
    ["Input", 0.95, "right"],
    ["Category", 0.75],
    ["Draft", 1.1],
    ["Outlet diameter", 0.72, "right"],
    ["Listed", 0.5],
    ["Condensing", 0.78],
  ]);
  const rows: Cell[][] = input.appliances.map((a, i) => [
    [{ text: a.label.trim() || `Appliance ${i + 1}`, weight: "bold", color: COLOURS.ink }],
    label(APPLIANCE_KIND_LABELS, a.kind),
    label(FUEL_LABELS, a.fuel),
    withUnit(a.inputBtuh, "Btu/h", 0),
    label(CATEGORY_LABELS, a.category),
    label(DRAFT_LABELS, a.draft),
    withUnit(a.outletDiameterIn, "in"),
    yesNo(a.listed),
    yesNo(a.condensing),
  ]);
  drawTable(layout, columns, rows, { caption: "Appliances" });
  const manual = input.appliances.filter((a) => typeof a.manualClearanceIn === "number");
  for (const a of manual) {
    layout.paragraph(`${applianceLabel(input, a.id)}: the manufacturer's instructions state a connector clearance of ${withUnit(a.manualClearanceIn, "in")}, which governs the clearance check.`, muted);
  }
}

/** The vent run as vector graphics, from the same scene the screen draws. */
export function drawVentRunDrawing(ctx: RenderContext, number: number): void {
  const { layout, input } = ctx;
  const engineFindings = input.findings.filter((f) => !f.code.startsWith("site_check.")) as unknown as Finding[];
  const scene = buildVentRunScene({ ventRun: input.data.ventRun, appliances: input.appliances, findings: engineFindings, widthPx: 520, heightPx: 430 });
  const scale = Math.min(1, layout.width / scene.width);
  const h = scene.height * scale;
  layout.heading(number, "Vent-run drawing (side view)", h + 40);
  layout.paragraph(
    `${scene.summary} Not to scale: lengths are proportional along the pipe, but horizontal slopes are drawn ${scene.slopeExaggeration} times steeper so that a small rise shows. Parts with a failing check are drawn in red and named.`,
    muted,
    { after: 6 },
  );
  layout.ensure(h + 4);
  const x = layout.left + (layout.width - scene.width * scale) / 2;
  rect(layout.page, x - 0.5, layout.y - h - 0.5, scene.width * scale + 1, h + 1, { stroke: COLOURS.hairline, lineWidth: 0.6 });
  drawScene(layout.page, ctx.fonts, scene, x, layout.y, scale);
  layout.y -= h + 8;
  if (scene.failingParts.length > 0) {
    const list = scene.failingParts.map((p) => `${p.label}: ${p.titles.join(", ")}`).join("; ");
    layout.paragraph(`Parts with a failing check: ${list}.`, { ...body, color: COLOURS.fail });
  }
}

/** Every connector segment with what was entered for it. */
export function drawSegments(ctx: RenderContext, number: number): void {
  const { layout, input } = ctx;
  const run = input.data.ventRun;
  layout.heading(number, "Vent connector, vent and termination", 190);
  const segs = run?.segments ?? [];
  const sizing = new Map((input.sizing.ventRun?.segments ?? []).map((s) => [s.segmentId, s]));
  const several = new Set(segs.map((s) => s.applianceId).filter(Boolean)).size > 1;
  if (segs.length === 0) {
    layout.paragraph("No connector segment was entered.", body);
  } else {
    const columns: Column[] = [
      { header: "#", width: 18 },
      { header: "Material", width: 50 },
      { header: "Dia.", width: 28, align: "right" },
      { header: "Length", width: 32, align: "right" },
      { header: "Run", width: 46 },
      { header: "Rise", width: 50, align: "right" },
      { header: "Turns 45° / 90°", width: 32, align: "center" },
      { header: "Clearance", width: 45, align: "right" },
      { header: "Supports", width: 42, align: "center" },
      { header: "Fasteners per joint (joints)", width: 44, align: "center" },
      { header: "Locked", width: 34 },
      { header: "Passes through", width: 50 },
    ];
    columns.push({ header: "Checks", width: layout.width - columns.reduce((a, c) => a + c.width, 0) });
    const needs = (text: string): CellBlock => ({ text, size: SIZE.footer - 0.5, color: COLOURS.muted });
    const rows: Cell[][] = segs.map((s, i) => {
      const z = sizing.get(s.id);
      const rise: Cell =
        s.orientation === "horizontal"
          ? [{ text: withUnit(s.riseIn, "in") }, ...(typeof z?.requiredRiseIn === "number" ? [needs(`needs ${withUnit(z.requiredRiseIn, "in")}`)] : [])]
          : DASH;
      const supports: Cell = [{ text: String(s.supportsInstalled ?? "not entered") }, ...(typeof z?.supportsNeeded === "number" ? [needs(`needs ${z.supportsNeeded}`)] : [])];
      const material: Cell = several
        ? [{ text: label(SHORT_MATERIAL, s.material) }, { text: applianceLabel(input, s.applianceId), size: SIZE.footer, color: COLOURS.muted }]
        : label(SHORT_MATERIAL, s.material);
      const passage = `${label(SHORT_PASSAGE, s.passesThrough)}${s.passesThrough === "wall" ? `; thimble: ${yesNo(s.thimble).toLowerCase()}` : ""}`;
      const mine = input.findings.filter((f) => f.target.path.startsWith(`ventRun.segments.${i}.`));
      const open = mine.filter((f) => f.status !== "pass");
      const passed = mine.length - open.length;
      const checks: Cell = [
        ...open.map((f): CellBlock => ({ text: `${STATUS_WORDS[f.status]}: ${f.title}`, color: STATUS_COLOURS[f.status] })),
        ...(passed > 0 ? [{ text: `${passed} PASS`, color: COLOURS.pass }] : []),
      ];
      return [
        [{ text: String(i + 1), weight: "bold", color: COLOURS.ink }],
        material,
        withUnit(s.diameterIn, "in"),
        withUnit(s.lengthFt, "ft"),
        s.orientation ? (s.orientation === "horizontal" ? "Horizontal" : "Vertical") : "not entered",
        rise,
        `${s.turns45 ?? 0} / ${s.turns90 ?? 0}`,
        withUnit(s.clearanceIn, "in"),
        supports,
        s.joints === 0 ? "single piece" : `${s.fastenersPerJoint ?? "?"} (${s.joints ?? "?"})`,
        yesNo(s.sectionsLocked),
        passage,
        mine.length ? checks : DASH,
      ];
    });
    drawTable(layout, columns, rows, { title: `Connector segments (${segs.length}), in order from the appliance`, caption: "Connector segments", size: SIZE.footer });
    layout.paragraph("“needs”: the rise the rulebook's minimum slope asks for over that length, and the supports its maximum spacing asks for. Turns, supports and fasteners are counts. Checks: the findings of that segment (see Findings, vent connector).", { ...muted, size: SIZE.footer });
  }

  if (!run) return;
  const v = run.vent;
  const t = run.termination;
  const kv = (pairs: [string, string][]): Cell[][] => {
    const rows: Cell[][] = [];
    for (let i = 0; i < pairs.length; i += 2) {
      const a = pairs[i];
      const b = pairs[i + 1];
      rows.push([
        [{ text: a?.[0] ?? "", color: COLOURS.muted }],
        a?.[1] ?? "",
        [{ text: b?.[0] ?? "", color: COLOURS.muted }],
        b?.[1] ?? "",
      ]);
    }
    return rows;
  };
  const kvCols: Column[] = cols(layout.width, [
    ["", 1.1],
    ["", 1.3],
    ["", 1.1],
    ["", 1.3],
  ]);
  const pairs: [string, string][] = [
    ["Vent material", label(VENT_MATERIAL_LABELS, v.material)],
    ["Vent diameter", withUnit(v.diameterIn, "in")],
    ["Height above highest collar", withUnit(v.heightFt, "ft")],
    ["Lateral in the vent", withUnit(v.lateralFt, "ft")],
    ["Turns in the vent (45° / 90°)", `${v.turns45 ?? 0} / ${v.turns90 ?? 0}`],
    ["Serves", v.serves === "common" ? "More than one appliance (common vent)" : v.serves === "single" ? "One appliance" : "not entered"],
  ];
  if (t) {
    pairs.push(
      ["Roof pitch", typeof t.roofPitchPer12 === "number" ? `${withUnit(t.roofPitchPer12, "")} in 12` : "not entered"],
      ["Height above the roof", withUnit(t.heightAboveRoofFt, "ft")],
      ["Cap size", withUnit(t.capSizeIn, "in")],
      ["Listed cap", yesNo(t.listedCap)],
      ["Distance to a vertical wall", withUnit(t.distanceToVerticalWallFt, "ft")],
      ["Height above structure within 10 ft", withUnit(t.heightAboveNearbyStructureFt, "ft")],
    );
  }
  drawTable(layout, kvCols, kv(pairs), { title: "Vent and termination", header: false, zebra: true });
  if (t && t.nearbyOpenings.length > 0) {
    drawTable(
      layout,
      cols(layout.width, [
        ["Opening near the termination", 2],
        ["Distance from the termination", 1.2, "right"],
        ["Termination above it", 1.2, "right"],
      ]),
      t.nearbyOpenings.map((o) => [TERMINATION_OPENING_LABELS[o.kind], withUnit(o.distanceFt, "ft"), withUnit(o.ventAboveFt, "ft")]),
      { caption: "Openings near the termination" },
    );
  }
  const cap = input.sizing.ventRun?.capacity;
  if (cap) {
    const range = `${typeof cap.minBtuh === "number" ? withUnit(cap.minBtuh, "Btu/h", 0) : "no minimum"} to ${typeof cap.maxBtuh === "number" ? withUnit(cap.maxBtuh, "Btu/h", 0) : "no maximum"}`;
    const how = [cap.interpolated ? "interpolated between table rows" : null, cap.conservative ? "from the conservative table rows" : null, cap.deratePct ? `maximum reduced ${withUnit(cap.deratePct, "%", 1)} for extra turns` : null].filter(Boolean).join("; ");
    const smallest = typeof cap.smallestDiameterIn === "number" ? ` The smallest table diameter that fits is ${withUnit(cap.smallestDiameterIn, "in")}.` : "";
    layout.paragraph(
      `Capacity from the rulebook's table for a ${withUnit(cap.diameterIn, "in")} vent ${withUnit(cap.heightFt, "ft")} high with ${withUnit(cap.lateralFt, "ft")} of lateral: ${range}${how ? ` (${how})` : ""}.${smallest}`,
      body,
    );
  }
  const common = input.sizing.ventRun?.common;
  if (common) {
    const column = common.column === "fan_fan" ? "FAN+FAN" : common.column === "fan_nat" ? "FAN+NAT" : common.column === "nat_nat" ? "NAT+NAT" : "—";
    drawTable(
      layout,
      cols(layout.width, [
        ["Common vent sizing (company tables)", 2],
        ["Installed", 0.8, "right"],
        ["Allowed input", 1.6, "right"],
        ["Smallest that works", 1, "right"],
      ]),
      [
        ...common.connectors.map((c) => [
          `Connector of ${applianceLabel(input, c.applianceId)} (rise ${withUnit(c.riseFt, "ft")}, horizontal ${withUnit(c.horizontalFt, "ft")})`,
          withUnit(c.diameterIn, "in"),
          `${typeof c.minBtuh === "number" ? `${withUnit(c.minBtuh, "Btu/h", 0)} to ` : "up to "}${typeof c.maxBtuh === "number" ? withUnit(c.maxBtuh, "Btu/h", 0) : "not permitted"}${c.deratePct ? ` (−${withUnit(c.deratePct, "%", 1)})` : ""}`,
          typeof c.smallestDiameterIn === "number" ? withUnit(c.smallestDiameterIn, "in") : "none in the table",
        ]),
        [
          `Common vent, ${column}, ${withUnit(common.heightFt, "ft")} high, combined ${withUnit(common.totalInputBtuh, "Btu/h", 0)}`,
          withUnit(common.diameterIn, "in"),
          `up to ${typeof common.maxBtuh === "number" ? withUnit(common.maxBtuh, "Btu/h", 0) : "—"}${common.deratePct ? ` (−${withUnit(common.deratePct, "%", 1)})` : ""}`,
          typeof common.smallestDiameterIn === "number" ? withUnit(common.smallestDiameterIn, "in") : "none in the table",
        ],
      ],
      { caption: "Common vent sizing" },
    );
  }
  const maxH = input.sizing.ventRun?.maxHorizontalConnectorFt;
  if (typeof maxH === "number") layout.paragraph(`Longest horizontal connector this vent height allows: ${withUnit(maxH, "ft")}.`, body);
}
