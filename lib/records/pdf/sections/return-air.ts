import { RETURN_AIR_SPACE_LABELS } from "@/components/inspection/options";
import { formatNumber, type AirflowSource, type OutputSource } from "@/lib/venting";
import { applianceLabel, type RenderContext } from "../context";
import { DASH, STATUS_COLOURS, STATUS_WORDS, withUnit, yesNo } from "../format";
import { drawTable, type Cell, type Column } from "../table";
import type { TextStyle } from "../text";
import { COLOURS, SIZE } from "../theme";

const body: TextStyle = { weight: "regular", size: SIZE.body, color: COLOURS.body };
const muted: TextStyle = { weight: "regular", size: SIZE.body, color: COLOURS.muted };
const strong: TextStyle = { weight: "bold", size: SIZE.body, color: COLOURS.ink };

/** The caution printed with the return-air values. */
export const RETURN_AIR_CAUTION =
  "Return air is judged against the company's rulebook; the furnace maker's instructions, the locally adopted code and the authority having jurisdiction govern. A return that depressurises a room with a draft hood can pull flue gases into the home: a spillage test with the blower running belongs with this check.";

const OUTPUT_SOURCE_WORDS: Record<OutputSource, string> = {
  entered: "from the rating plate, as entered",
  input_efficiency: "rated input × efficiency, as entered",
};

const AIRFLOW_SOURCE_WORDS: Record<AirflowSource, string> = {
  nameplate: "rating-plate airflow, as entered",
  cooling_tons: "cooling tons × the rulebook's airflow per ton",
  temperature_rise: "output ÷ (the rulebook's sensible-heat factor × temperature rise)",
};

function columns(total: number, spec: readonly [string, number, Column["align"]?][]): Column[] {
  const sum = spec.reduce((a, s) => a + s[1], 0);
  let used = 0;
  return spec.map(([header, share, align], i) => {
    const width = i === spec.length - 1 ? total - used : Math.floor((total * share) / sum);
    used += width;
    return { header, width, align };
  });
}

/** The return-air side of the furnace: output, airflow, required area, each opening and the findings. */
export function drawReturnAir(ctx: RenderContext, number: number): void {
  const { layout, input } = ctx;
  const ra = input.data.returnAir;
  const sizing = input.sizing.returnAir ?? null;
  const findings = input.findings.filter((f) => f.target.section === "returnAir");
  layout.heading(number, "Return air", 90);
  layout.paragraph(RETURN_AIR_CAUTION, { ...muted, size: SIZE.small }, { after: 4 });
  if (!ra || !sizing) {
    const hasFurnace = input.appliances.some((a) => a.kind === "furnace");
    layout.paragraph(hasFurnace ? "No return air was entered, so the return openings and grilles were not checked." : "No furnace is among the appliances, so return air was not checked.", body);
    return;
  }

  layout.subheading("1. Furnace output and airflow", 50);
  if (sizing.applianceId) layout.paragraph(`Furnace: ${applianceLabel(input, sizing.applianceId)}`, body, { indent: 10, after: 1 });
  layout.paragraph(`Output: ${withUnit(sizing.outputBtuh, "Btu/h", 0)}${sizing.outputSource ? ` (${OUTPUT_SOURCE_WORDS[sizing.outputSource]}${typeof ra.efficiencyPct === "number" && sizing.outputSource === "input_efficiency" ? `: ${formatNumber(ra.efficiencyPct, 1)} %` : ""})` : ""}`, body, { indent: 10, after: 1 });
  const rise = sizing.temperatureRiseF !== null ? `, temperature rise ${withUnit(sizing.temperatureRiseF, "°F", 1)}` : "";
  layout.paragraph(`Airflow: ${withUnit(sizing.airflowCfm, "cfm", 0)}${sizing.airflowSource ? ` (${AIRFLOW_SOURCE_WORDS[sizing.airflowSource]}${rise})` : ""}`, body, { indent: 10, after: 1 });
  if (typeof ra.coolingTons === "number") layout.paragraph(`Cooling size entered: ${withUnit(ra.coolingTons, "tons", 1)}`, body, { indent: 10, after: 1 });
  layout.paragraph(
    `Return free area needed: ${withUnit(sizing.requiredFreeAreaSqIn, "in²", 1)}; the openings give ${withUnit(sizing.totalFreeAreaSqIn, "in²", 1)}. Needed = output ÷ 1,000 × the rulebook's area per 1,000 Btu/h (source in the findings below).`,
    strong,
    { indent: 10, after: 6 },
  );

  if (ra.openings.length) {
    const bySizing = new Map(sizing.openings.map((o) => [o.openingId, o]));
    // Openings drawing from different kinds of space are not each the only source (as the check reads it).
    const kinds = new Set(ra.openings.map((o) => o.space).filter(Boolean)).size;
    const rows: Cell[][] = ra.openings.map((o, i) => {
      const z = bySizing.get(o.id);
      const size =
        typeof o.freeAreaSqIn === "number"
          ? `${withUnit(o.freeAreaSqIn, "in²", 1)} free (stated)`
          : typeof o.widthIn === "number" && typeof o.heightIn === "number"
            ? `${formatNumber(o.widthIn)} × ${formatNumber(o.heightIn)} in`
            : typeof o.diameterIn === "number"
              ? `${formatNumber(o.diameterIn)} in round`
              : "not entered";
      const share = typeof o.freeAreaShare === "number" && typeof o.freeAreaSqIn !== "number" ? `, ${formatNumber(o.freeAreaShare * 100, 0)} % free` : "";
      const worst = findings.filter((f) => f.target.itemId === o.id).sort((a, b) => rank(b.status) - rank(a.status))[0];
      return [
        [
          { text: `${i + 1}. ${o.label.trim() || "Return opening"}`, weight: "bold", color: COLOURS.ink },
          { text: `${o.space ? RETURN_AIR_SPACE_LABELS[o.space] : "space not entered"}${o.filterGrille ? ", filter grille" : ""}`, size: SIZE.footer, color: COLOURS.muted },
        ],
        `${size}${share}`,
        withUnit(z?.freeAreaSqIn, "in²", 1),
        withUnit(z?.airflowCfm, "cfm", 0),
        z?.faceVelocityFpm != null ? `${withUnit(z.faceVelocityFpm, "fpm", 0)}${z.velocityLimitFpm != null ? ` (≤ ${formatNumber(z.velocityLimitFpm, 0)})` : ""}` : "not worked out",
        typeof o.distanceToDraftHoodFt === "number" ? withUnit(o.distanceToDraftHoodFt, "ft", 1) : o.fuelApplianceInSpace === false ? "none in space" : "not entered",
        o.soleReturnSource == null && kinds > 1 ? "No (other returns)" : yesNo(o.soleReturnSource),
        worst ? [{ text: STATUS_WORDS[worst.status], badge: STATUS_COLOURS[worst.status], size: SIZE.footer }] : DASH,
      ];
    });
    drawTable(
      layout,
      columns(layout.width, [["Opening", 1.6], ["Size", 1.0], ["Free area", 0.7, "right"], ["Airflow", 0.65, "right"], ["Face velocity", 0.9, "right"], ["To draft hood", 0.75, "right"], ["Only source", 0.6], ["Result", 0.7]]),
      rows,
      { title: "2. Return openings", caption: "Return openings", size: SIZE.small },
    );
    layout.paragraph(
      "Free area is the gross opening times the grille maker's free-area share, or the stated free area. The airflow is shared between the openings by free area; face velocity is an opening's airflow ÷ its free area in ft². Face-velocity limits are common practice, not code.",
      { ...muted, size: SIZE.footer },
    );
  } else {
    layout.subheading("2. Return openings", 30);
    layout.paragraph("No return opening was entered.", body);
  }

  layout.subheading("Result", 40);
  for (const f of findings) {
    layout.paragraph(`${STATUS_WORDS[f.status]}: ${f.title}: ${f.message} (Source: ${f.citation ?? "no rulebook value"})`, { ...body, color: STATUS_COLOURS[f.status] });
  }
  if (findings.length === 0) layout.paragraph("No return-air finding was recorded.", body);
}

function rank(status: string): number {
  return status === "fail" ? 3 : status === "needs-info" ? 2 : status === "warn" ? 1 : 0;
}
