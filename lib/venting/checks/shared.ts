import {
  FINDING_CATALOGUE,
  MESSAGES,
  type Finding,
  type FindingCode,
  type FindingStatus,
  type FindingTarget,
  type Quantity,
  type Requirement,
  type SafetyFlag,
  type TargetSection,
} from "../findings";
import type { Appliance, ConnectorSegment, VentRun } from "../inputs";
import { PARAMETER_DEFINITIONS, type ParameterKey } from "../rulebook/parameters";
import type { Cited, PreparedRulebook, RuleRef } from "../rulebook/prepare";
import { RULEBOOK_TABLES, type RulebookTableKey } from "../rulebook/table-definitions";

/** Optional parts of a finding. */
export interface FindingExtras {
  readonly measured?: Quantity;
  readonly required?: Requirement;
  readonly safety?: SafetyFlag | null;
  /** The smallest diameter the tables allow, shown beside the finding. */
  readonly smallest?: Quantity;
}

/** Builds a finding with the catalogue title. */
export function finding(
  code: FindingCode,
  status: FindingStatus,
  message: string,
  target: FindingTarget,
  rule: { readonly citation: string; readonly ref: RuleRef | null } | null,
  extras?: FindingExtras,
): Finding {
  const f: {
    -readonly [K in keyof Finding]: Finding[K];
  } = {
    code,
    status,
    title: FINDING_CATALOGUE[code].title,
    message,
    citation: rule ? rule.citation : null,
    ruleRef: rule ? rule.ref : null,
    target,
    safety: extras?.safety ?? null,
  };
  if (extras?.measured) f.measured = extras.measured;
  if (extras?.required) f.required = extras.required;
  if (extras?.smallest) f.smallest = extras.smallest;
  return f;
}

/** Builds a target. */
export function target(section: TargetSection, itemId: string | null, field: string | null, path: string): FindingTarget {
  return { section, itemId, field, path };
}

/** Target of a field of a vent-run segment. */
export function segmentTarget(index: number, seg: ConnectorSegment, field: string | null): FindingTarget {
  return {
    section: "ventRun",
    itemId: seg.id,
    field,
    path: field === null ? `ventRun.segments.${index}` : `ventRun.segments.${index}.${field}`,
  };
}

/** A needs-info finding for a value the rulebook lacks. */
export function missingRuleFinding(code: FindingCode, what: string, table: RulebookTableKey, t: FindingTarget): Finding {
  return finding(code, "needs-info", MESSAGES.missingRule(what, RULEBOOK_TABLES[table].title), t, null);
}

/** Reads a parameter, or undefined when the rulebook lacks it. */
export function param(rb: PreparedRulebook, key: ParameterKey): Cited<number> | undefined {
  return rb.params.get(key);
}

/** Unit of a parameter. */
export function paramUnit(key: ParameterKey): string {
  return PARAMETER_DEFINITIONS[key].unit;
}

/** True when a value is a finite number (not null or undefined). */
export function known(v: number | null | undefined): v is number {
  return typeof v === "number";
}

/** Where a vent run's appliances sit relative to the Category I rules. */
export type CategoryStatus = "category_i" | "other" | "unknown";

/** Everything the vent-run checks share, computed once per evaluation. */
export interface VentRunContext {
  readonly run: VentRun;
  readonly rb: PreparedRulebook;
  /** Appliances the run serves, in input order. */
  readonly served: readonly Appliance[];
  readonly byId: ReadonlyMap<string, Appliance>;
  /** Every appliance of the inspection, in input order (for target paths). */
  readonly allAppliances: readonly Appliance[];
  readonly isCommon: boolean;
  readonly category: CategoryStatus;
  /** Segments grouped by the appliance whose connector they form (null: not known). */
  readonly connectors: readonly ConnectorGroup[];
  /** Vent system for termination-distance rows. */
  readonly ventSystem: "natural_draft" | "mechanical_draft";
}

/** The segments that make up one appliance's connector. */
export interface ConnectorGroup {
  readonly appliance: Appliance | null;
  readonly segmentIndexes: readonly number[];
}

/** Groups a run's segments by appliance. */
export function groupConnectors(run: VentRun, served: readonly Appliance[], byId: ReadonlyMap<string, Appliance>): ConnectorGroup[] {
  const groups = new Map<string, { appliance: Appliance | null; segmentIndexes: number[] }>();
  const only = served.length === 1 ? served[0] : undefined;
  for (let i = 0; i < run.segments.length; i++) {
    const seg = run.segments[i]!;
    const a = seg.applianceId ? byId.get(seg.applianceId) : only;
    const key = a ? a.id : "\u0000unknown";
    let g = groups.get(key);
    if (!g) groups.set(key, (g = { appliance: a ?? null, segmentIndexes: [] }));
    g.segmentIndexes.push(i);
  }
  return [...groups.values()];
}

/** Whether an appliance is vented by the Category I rules. */
export function applianceCategory(a: Appliance): CategoryStatus {
  if (a.draft === "direct_vent") return "other";
  if (a.category && a.category !== "I") return "other";
  if (a.category === "I") return "category_i";
  if (a.draft === "natural" || a.draft === "fan_assisted") return "category_i";
  return "unknown";
}

/** The appliance a segment belongs to, if it can be told. */
export function segmentAppliance(ctx: VentRunContext, seg: ConnectorSegment): Appliance | undefined {
  if (seg.applianceId) return ctx.byId.get(seg.applianceId);
  return ctx.served.length === 1 ? ctx.served[0] : undefined;
}
