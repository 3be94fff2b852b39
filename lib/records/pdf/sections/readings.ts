import { airFreeCoPpm, AMBIENT_O2_PCT, clockedInputBtuh, formatNumber, temperatureRiseF } from "@/lib/venting";
import { applianceLabel, type RenderContext } from "../context";
import { DASH, requiredValue, requirement, STATUS_COLOURS, STATUS_WORDS, withUnit } from "../format";
import { drawTable, type Cell, type Column } from "../table";
import type { TextStyle } from "../text";
import { COLOURS, SIZE } from "../theme";

const body: TextStyle = { weight: "regular", size: SIZE.body, color: COLOURS.body };

const READING_COLUMNS = (total: number): Column[] => {
  const w = [150, 96, 0, 72];
  w[2] = total - w[0]! - w[1]! - w[3]!;
  return [
    { header: "Reading", width: w[0]! },
    { header: "Measured", width: w[1]!, align: "right" },
    { header: "Worked out and compared with", width: w[2]! },
    { header: "Result", width: w[3]! },
  ];
};

/** Field readings per appliance, with the values worked out from them. */
export function drawReadings(ctx: RenderContext, number: number): void {
  const { layout, input } = ctx;
  layout.heading(number, "Readings", 190);
  const entries = input.data.readings;
  if (entries.length === 0) {
    layout.paragraph("No readings were entered.", body);
    return;
  }
  entries.forEach((r, i) => {
    const appliance = input.appliances.find((a) => a.id === r.applianceId);
    const found = (code: string) => input.findings.find((f) => f.code === code && f.target.path.startsWith(`readings.${i}.`));
    const result = (code: string): Cell => {
      const f = found(code);
      return f ? [{ text: STATUS_WORDS[f.status], badge: STATUS_COLOURS[f.status], size: SIZE.footer }] : [{ text: "not checked", color: COLOURS.muted }];
    };
    /** The requirement of a finding in words: "Below 10 ppm", "Limit ≤ 400 ppm air-free". */
    const req = (code: string, lead?: string): string => {
      const f = found(code);
      if (!f?.required) return DASH;
      if (lead === undefined) return `limit ${requirement(f.required)}`;
      return lead ? `${lead} ${requiredValue(f.required)}` : requiredValue(f.required);
    };
    const rows: Cell[][] = [];
    rows.push(["Ambient CO in the appliance space", withUnit(r.ambientCoPpm, "ppm", 0), req("readings.ambient_co", "Below"), result("readings.ambient_co")]);
    rows.push(["Draft at steady state", withUnit(r.draftInWc, "in. w.c.", 3), req("readings.draft", "At least as strong as"), result("readings.draft")]);
    rows.push(["Spillage at the draft hood", withUnit(r.spillageSeconds, "s", 0), appliance?.draft === "natural" ? req("readings.spillage", "Stops within") : "Tested on natural-draft appliances only", result("readings.spillage")]);
    const co = r.flueCoPpm;
    const o2 = r.flueO2Pct;
    let airFree = DASH;
    if (typeof co === "number" && typeof o2 === "number" && o2 < AMBIENT_O2_PCT) {
      airFree = `Air-free CO = ${formatNumber(co, 0)} × ${AMBIENT_O2_PCT} ÷ (${AMBIENT_O2_PCT} − ${formatNumber(o2, 1)}) = ${withUnit(airFreeCoPpm(co, o2), "ppm", 0)}; ${req("readings.co_air_free")}`;
    }
    rows.push(["Flue CO (as measured) and O2", `${withUnit(co, "ppm", 0)}; ${withUnit(o2, "%", 1)}`, airFree, result("readings.co_air_free")]);
    const rise = typeof r.supplyTempF === "number" && typeof r.returnTempF === "number" ? temperatureRiseF(r.supplyTempF, r.returnTempF) : null;
    const plate = typeof r.nameplateRiseMinF === "number" && typeof r.nameplateRiseMaxF === "number" ? `${formatNumber(r.nameplateRiseMinF, 0)}–${formatNumber(r.nameplateRiseMaxF, 0)} °F` : "not entered";
    rows.push([
      "Supply and return air",
      `${withUnit(r.supplyTempF, "°F", 1)}; ${withUnit(r.returnTempF, "°F", 1)}`,
      rise === null ? `Rating-plate rise ${plate}` : `Temperature rise = ${withUnit(rise, "°F", 1)}; rating plate ${plate}`,
      appliance?.kind === "furnace" ? result("readings.temperature_rise") : [{ text: "furnaces only", color: COLOURS.muted }],
    ]);
    const dial = r.meterDialCuFt;
    const sec = r.meterSecondsPerRev;
    const hv = r.heatingValueBtuPerCuFt;
    let clocked = DASH;
    if (typeof dial === "number" && typeof sec === "number" && typeof hv === "number") {
      const inputBtuh = clockedInputBtuh(dial, sec, hv);
      const rated = appliance?.inputBtuh;
      const diff = typeof rated === "number" && rated > 0 ? ` (${inputBtuh >= rated ? "+" : "−"}${formatNumber(Math.abs(((inputBtuh - rated) / rated) * 100), 1)} %)` : "";
      clocked = `Input = 3,600 ÷ ${formatNumber(sec, 1)} s × ${formatNumber(dial, 2)} ft³ × ${formatNumber(hv, 0)} Btu/ft³ = ${withUnit(inputBtuh, "Btu/h", 0)} against the rated ${withUnit(rated, "Btu/h", 0)}${diff}; accepted range ${req("readings.input_rate", "")}`;
    }
    rows.push(["Gas input, clocked at the meter", `${withUnit(dial, "ft³", 2)} dial; ${withUnit(sec, "s", 1)} per rev.; ${withUnit(hv, "Btu/ft³", 0)}`, clocked, result("readings.input_rate")]);
    drawTable(layout, READING_COLUMNS(layout.width), rows, { title: applianceLabel(input, r.applianceId), caption: `Readings: ${applianceLabel(input, r.applianceId)}` });
  });
}

const ANSWERS = { yes: "Yes", no: "No", na: "N/A" } as const;

export function drawSiteChecks(ctx: RenderContext, number: number): void {
  const { layout, input } = ctx;
  layout.heading(number, "Site checks", 190);
  if (input.siteChecks.length === 0) {
    layout.paragraph("The company's site-check list had no item for this job.", body);
    return;
  }
  layout.paragraph("What the installer confirmed on site. N/A: marked not applicable to this job.", { ...body, color: COLOURS.muted }, { after: 5 });
  const colour = { yes: COLOURS.pass, no: COLOURS.fail, na: COLOURS.muted } as const;
  const rows: Cell[][] = input.siteChecks.map((c) => [
    c.label,
    [{ text: c.answer ? ANSWERS[c.answer] : "Not answered", weight: "bold", color: c.answer ? colour[c.answer] : COLOURS.needsInfo }],
    c.note.trim() || DASH,
  ]);
  const w0 = Math.round(layout.width * 0.52);
  drawTable(layout, [
    { header: "Item", width: w0 },
    { header: "Answer", width: 72 },
    { header: "Note", width: layout.width - w0 - 72 },
  ], rows, { caption: "Site checks" });
}

/** What the installer wrote about the job as a whole. */
export function drawNotes(ctx: RenderContext): void {
  const notes = (ctx.input.inspection.notes || ctx.input.data.notes).trim();
  if (!notes) return;
  ctx.layout.subheading("Notes recorded with the inspection", 30);
  ctx.layout.paragraph(notes, body, { after: 6 });
}
