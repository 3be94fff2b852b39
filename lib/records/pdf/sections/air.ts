import { AIR_OPENING_KIND_LABELS, LOUVER_LABELS } from "@/components/inspection/options";
import { formatNumber, roomVolumeCuFt } from "@/lib/venting";
import { applianceLabel, type RenderContext } from "../context";
import { DASH, STATUS_COLOURS, STATUS_WORDS, withUnit } from "../format";
import { drawTable, type Cell, type Column } from "../table";
import type { TextStyle } from "../text";
import { COLOURS, SIZE } from "../theme";

const body: TextStyle = { weight: "regular", size: SIZE.body, color: COLOURS.body };
const muted: TextStyle = { weight: "regular", size: SIZE.body, color: COLOURS.muted };
const strong: TextStyle = { weight: "bold", size: SIZE.body, color: COLOURS.ink };

function columns(total: number, spec: readonly [string, number, Column["align"]?][]): Column[] {
  const sum = spec.reduce((a, s) => a + s[1], 0);
  let used = 0;
  return spec.map(([header, share, align], i) => {
    const width = i === spec.length - 1 ? total - used : Math.floor((total * share) / sum);
    used += width;
    return { header, width, align };
  });
}

/** The combustion-air calculation written out: method, inputs, openings and the result. */
export function drawCombustionAir(ctx: RenderContext, number: number): void {
  const { layout, input } = ctx;
  const space = input.data.airSpace;
  const sizing = input.sizing.airSpace;
  layout.heading(number, "Combustion air", 90);
  if (!space || (space.rooms.length === 0 && space.openings.length === 0)) {
    layout.paragraph("No air space was entered, so the combustion-air volume and openings were not checked.", body);
    return;
  }
  const ids = space.applianceIds ?? input.appliances.map((a) => a.id);
  const inSpace = input.appliances.filter((a) => ids.includes(a.id));
  const drawing = inSpace.filter((a) => a.draft !== "direct_vent");
  const fanBtuh = drawing.filter((a) => a.draft === "fan_assisted").reduce((s, a) => s + (a.inputBtuh ?? 0), 0);
  const otherBtuh = drawing.filter((a) => a.draft !== "fan_assisted").reduce((s, a) => s + (a.inputBtuh ?? 0), 0);
  const total = sizing?.totalInputBtuh ?? null;
  const req = sizing?.requirement ?? null;

  layout.subheading("1. Appliances drawing air from the space", 40);
  if (drawing.length === 0) layout.paragraph("None: direct-vent appliances take their combustion air from outdoors and are left out.", body);
  for (const a of drawing) layout.paragraph(`${applianceLabel(input, a.id)}: ${withUnit(a.inputBtuh, "Btu/h", 0)} (${a.draft === "fan_assisted" ? "fan-assisted" : a.draft === "natural" ? "natural draft" : "draft not entered"})`, body, { indent: 10, after: 1 });
  const direct = inSpace.filter((a) => a.draft === "direct_vent");
  if (direct.length) layout.paragraph(`Left out (direct-vent): ${direct.map((a) => applianceLabel(input, a.id)).join(", ")}.`, muted, { indent: 10 });
  layout.paragraph(`Total input I = ${withUnit(total, "Btu/h", 0)}`, strong, { indent: 10, after: 6 });

  layout.subheading("2. Required volume", 50);
  if (!req || total === null) {
    layout.paragraph("The required volume could not be worked out: an appliance input or a rulebook value is missing (see the combustion-air findings).", body);
  } else if (req.method === "standard") {
    const factor = total > 0 ? (req.volumeCuFt * 1000) / total : null;
    layout.paragraph("Standard method: required volume V = I ÷ 1,000 × F, where F is the rulebook's room volume per 1,000 Btu/h.", body, { after: 2 });
    layout.paragraph(`V = ${formatNumber(total, 0)} Btu/h ÷ 1,000 × ${factor === null ? "F" : `${formatNumber(factor, 2)} ft³`} = ${withUnit(req.volumeCuFt, "ft³", 0)}`, strong, { indent: 10, after: 6 });
  } else {
    layout.paragraph(
      "Known-infiltration method (the building's air-change rate was measured): V = A ÷ ACH × I(other) ÷ 1,000 + B ÷ ACH × I(fan-assisted) ÷ 1,000, with the rulebook's constants A and B and the rate limited to the rulebook's maximum.",
      body,
      { after: 2 },
    );
    layout.paragraph(`ACH used = ${withUnit(req.achUsed, "ACH", 2)} (entered: ${withUnit(space.airChangesPerHour, "ACH", 2)}); I(other) = ${withUnit(otherBtuh, "Btu/h", 0)}; I(fan-assisted) = ${withUnit(fanBtuh, "Btu/h", 0)}`, body, { indent: 10, after: 2 });
    layout.paragraph(`V = ${withUnit(req.volumeCuFt, "ft³", 0)}`, strong, { indent: 10, after: 6 });
  }

  const applianceRoom = space.applianceRoomId ?? space.rooms[0]?.id ?? null;
  const roomRows: Cell[][] = space.rooms.map((r, i) => {
    const dims = typeof r.lengthFt === "number" && typeof r.widthFt === "number" && typeof r.heightFt === "number" ? `${formatNumber(r.lengthFt)} × ${formatNumber(r.widthFt)} × ${formatNumber(r.heightFt)} ft` : "not entered";
    const vol = typeof r.volumeCuFt === "number" ? withUnit(r.volumeCuFt, "ft³", 0) : dims === "not entered" ? "not entered" : withUnit(roomVolumeCuFt(r.lengthFt ?? 0, r.widthFt ?? 0, r.heightFt ?? 0), "ft³", 0);
    const how = r.id === applianceRoom ? "Appliance room" : r.openToApplianceRoom ? "Open to the appliance room" : "Through indoor openings (below)";
    return [[{ text: r.label || `Room ${i + 1}`, weight: "bold", color: COLOURS.ink }], typeof r.volumeCuFt === "number" ? "volume entered" : dims, vol, how];
  });
  if (roomRows.length) {
    drawTable(layout, columns(layout.width, [["Room", 1.4], ["Length × width × height", 1.3], ["Volume", 0.8, "right"], ["How it joins the appliance room", 1.6]]), roomRows, { title: "3. Rooms of the air space", caption: "Rooms" });
  } else {
    layout.subheading("3. Rooms of the air space", 30);
    layout.paragraph("No room was entered.", body);
  }
  layout.paragraph(`Volume that counts toward combustion air: ${withUnit(sizing?.availableVolumeCuFt, "ft³", 0)}. A room other than the appliance room counts when it is open to it or joined by indoor openings that meet the requirement.`, body, { after: 6 });

  const openings = space.openings;
  if (openings.length) {
    const os = new Map((sizing?.openings ?? []).map((o) => [o.openingId, o]));
    const rows: Cell[][] = openings.map((o, i) => {
      const z = os.get(o.id);
      const size = typeof o.freeAreaSqIn === "number" ? `${withUnit(o.freeAreaSqIn, "in²", 1)} free (stated)` : typeof o.widthIn === "number" && typeof o.heightIn === "number" ? `${formatNumber(o.widthIn)} × ${formatNumber(o.heightIn)} in` : typeof o.diameterIn === "number" ? `${formatNumber(o.diameterIn)} in round` : "not entered";
      const share = typeof o.freeAreaShare === "number" ? ` (${formatNumber(o.freeAreaShare * 100, 0)} % free)` : "";
      const finding = input.findings.find((f) => f.code === "air.openings" && f.target.path.startsWith(`airSpace.openings.${i}.`));
      const joins = o.roomId ? (space.rooms.find((r) => r.id === o.roomId)?.label ?? o.roomId) : o.kind.startsWith("outdoor") ? "Outdoors" : "not entered";
      return [
        [{ text: `${i + 1}. ${AIR_OPENING_KIND_LABELS[o.kind]}`, weight: "bold", color: COLOURS.ink }, { text: `${o.position ? `${o.position === "high" ? "High" : "Low"}, ` : ""}to ${joins}`, size: SIZE.footer, color: COLOURS.muted }],
        size,
        `${LOUVER_LABELS[o.louver]}${share}`,
        withUnit(z?.freeAreaSqIn, "in²", 1),
        withUnit(z?.requiredFreeAreaSqIn, "in²", 1),
        withUnit(z?.requiredGrossAreaSqIn, "in²", 1),
        finding ? [{ text: STATUS_WORDS[finding.status], badge: STATUS_COLOURS[finding.status], size: SIZE.footer }] : DASH,
      ];
    });
    drawTable(
      layout,
      columns(layout.width, [["Opening", 1.7], ["Size", 0.95], ["Louver", 1.05], ["Free area", 0.75, "right"], ["Free area needed", 0.8, "right"], ["Gross opening needed", 0.85, "right"], ["Result", 0.7]]),
      rows,
      { title: "4. Air openings", caption: "Air openings", size: SIZE.small },
    );
    layout.paragraph("Free area is the gross opening times the louver's free-area share (the maker's stated share, or the rulebook's default for wood or metal louvers).", { ...muted, size: SIZE.footer });
  }

  layout.subheading("Result", 40);
  const vol = input.findings.find((f) => f.code === "air.volume");
  if (vol) {
    layout.paragraph(`${STATUS_WORDS[vol.status]}: available ${withUnit(sizing?.availableVolumeCuFt, "ft³", 0)} against the required ${withUnit(req?.volumeCuFt, "ft³", 0)}. ${vol.message}`, { ...strong, color: STATUS_COLOURS[vol.status] });
  }
  const others = input.findings.filter((f) => f.target.section === "airSpace" && f.code !== "air.volume" && f.status !== "pass");
  for (const f of others) layout.paragraph(`${STATUS_WORDS[f.status]}: ${f.title}: ${f.message}`, { ...body, color: STATUS_COLOURS[f.status] });
  if (!vol && others.length === 0) layout.paragraph("No combustion-air finding was recorded.", body);
}
