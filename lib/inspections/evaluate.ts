import { evaluateInspection, summarizeFindings, type AirSpaceSizing, type Finding, type FindingSummary, type PreparedRulebook, type ReturnAirSizing, type VentRunSizing } from "@/lib/venting";
import { applicableItems, siteCheckFindings, type SiteCheckItemDefinition } from "@/lib/site-checks";
import type { InspectionData } from "./data";

/** A finding of the engine or of the company's site checks (their codes are `site_check.<key>`). */
export type InspectionFinding = Omit<Finding, "code" | "target"> & {
  code: string;
  target: { section: string; itemId: string | null; field: string | null; path: string };
};

export interface InspectionEvaluation {
  findings: InspectionFinding[];
  summary: FindingSummary;
  sizing: { ventRun: VentRunSizing | null; airSpace: AirSpaceSizing | null; returnAir?: ReturnAirSizing | null };
}

/** The key a justification is stored under: one finding of one input. */
export function findingKey(finding: Pick<InspectionFinding, "code" | "target">): string {
  return `${finding.code}@${finding.target.path}`;
}

/**
 * Evaluates an inspection as stored: the engine over the appliances, vent run, air space and
 * readings, plus the site checks that apply. The same function runs in the editor (live) and in
 * the route handlers (stored), so both always agree.
 */
export function evaluateInspectionData(data: InspectionData, rulebook: PreparedRulebook, siteCheckItems: readonly SiteCheckItemDefinition[]): InspectionEvaluation {
  const findings: InspectionFinding[] = [];
  let sizing: InspectionEvaluation["sizing"] = { ventRun: null, airSpace: null, returnAir: null };
  if (data.appliances.length === 0) {
    findings.push({
      code: "inspection.appliances",
      status: "needs-info",
      title: "Appliances",
      message: "Add the appliance or appliances this inspection covers, from the rating plate.",
      citation: null,
      ruleRef: null,
      target: { section: "appliances", itemId: null, field: null, path: "appliances" },
      safety: null,
    });
  } else {
    const result = evaluateInspection(
      {
        appliances: data.appliances,
        ventRun: data.ventRun,
        airSpace: data.airSpace,
        readings: data.readings,
        removedAppliances: data.removedAppliances.length ? data.removedAppliances : null,
        returnAir: data.returnAir,
      },
      rulebook,
    );
    findings.push(...(result.findings as InspectionFinding[]));
    sizing = result.sizing;
  }
  findings.push(...(siteCheckFindings(applicableItems(siteCheckItems, data.appliances), data.siteChecks) as InspectionFinding[]));
  return { findings, summary: summarizeFindings(findings as unknown as Finding[]), sizing };
}

export const JUSTIFICATION_MIN_LENGTH = 15;

/**
 * Findings that stop a submission: every fail and needs-info must be fixed or carry a written
 * justification (for example the manufacturer's instructions that allow it, with a reference).
 */
export function submissionBlockers(findings: readonly InspectionFinding[], justifications: InspectionData["justifications"]): InspectionFinding[] {
  return findings.filter((f) => {
    if (f.status !== "fail" && f.status !== "needs-info") return false;
    const j = justifications[findingKey(f)];
    return !j || j.text.trim().length < JUSTIFICATION_MIN_LENGTH;
  });
}
