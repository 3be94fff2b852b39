import { fmt } from "./format";
import type { RuleRef } from "./rulebook/prepare";

/**
 * Outcome of one check. `needs-info` means a value the check needs is missing (or the rulebook
 * lacks the value: "not checked"); `not-applicable` means the rule does not apply to what was
 * entered, with the reason in the message.
 */
export type FindingStatus = "pass" | "not-applicable" | "fail" | "warn" | "needs-info";

/**
 * Statuses from best to worst, in display order. `not-applicable` says nothing about the work,
 * so a summary's `worst` passes over it unless every finding is not applicable.
 */
export const FINDING_STATUSES = ["pass", "not-applicable", "warn", "needs-info", "fail"] as const satisfies readonly FindingStatus[];

/** Safety cautions that a UI and the PDF must make prominent. */
export type SafetyFlag = "co" | "spillage" | "concealed_single_wall";

/** Comparators used in required values. */
export type Comparator = "≥" | "≤" | "<" | ">" | "=" | "between";

/** A number with its unit. */
export interface Quantity {
  readonly value: number;
  readonly unit: string;
}

/** A required value: `measured comparator value` must hold (`between` uses `upperValue`). */
export interface Requirement extends Quantity {
  readonly comparator: Comparator;
  readonly upperValue?: number;
}

/** The input sections a finding can point at. */
export type TargetSection = "appliances" | "ventRun" | "airSpace" | "readings" | "removedAppliances" | "returnAir";

/** The input field a finding concerns, for the UI to jump to. */
export interface FindingTarget {
  readonly section: TargetSection;
  /** `id` of the segment, appliance, room, opening or readings entry; null for the section itself. */
  readonly itemId: string | null;
  /** Field name within the item, or null. */
  readonly field: string | null;
  /** Dotted path into the check input, e.g. `ventRun.segments.2.riseIn`. */
  readonly path: string;
}

/** Every stable finding code. */
export const FINDING_CODES = {
  connectorSlope: "connector.slope",
  connectorHorizontalLength: "connector.horizontal_length",
  connectorLengthPerDiameter: "connector.length_per_diameter",
  connectorDiameter: "connector.diameter",
  ventCategory: "vent.category",
  ventCapacity: "vent.capacity",
  connectorCapacity: "connector.capacity",
  commonVentNoConnector: "common_vent.no_connector",
  commonVentHorizontalLength: "common_vent.horizontal_length",
  ventAreaRatio: "vent.area_ratio",
  ventMinHeight: "vent.min_height",
  clearanceCombustibles: "clearance.combustibles",
  supportsSpacing: "supports.spacing",
  jointsFasteners: "joints.fasteners",
  jointsLocked: "joints.locked",
  passageSingleWall: "passage.single_wall",
  terminationHeight: "termination.height",
  terminationDistance: "termination.distance",
  airVolume: "air.volume",
  airOpenings: "air.openings",
  airOpeningDimension: "air.opening_dimension",
  readingsCoAirFree: "readings.co_air_free",
  readingsAmbientCo: "readings.ambient_co",
  readingsDraft: "readings.draft",
  readingsSpillage: "readings.spillage",
  readingsTemperatureRise: "readings.temperature_rise",
  readingsInputRate: "readings.input_rate",
  commonVentOrphaned: "common_vent.orphaned",
  returnAirArea: "return_air.area",
  returnAirVelocity: "return_air.velocity",
  returnAirLocation: "return_air.location",
  returnAirDraftHood: "return_air.draft_hood_distance",
} as const;

/** A finding code. */
export type FindingCode = (typeof FINDING_CODES)[keyof typeof FINDING_CODES];

/** The outcome of one check. */
export interface Finding {
  readonly code: FindingCode;
  readonly status: FindingStatus;
  readonly title: string;
  /** Plain sentence: for a problem, what is wrong and how to fix it; for a pass, what was confirmed. */
  readonly message: string;
  readonly measured?: Quantity;
  readonly required?: Requirement;
  /** Citation text of the rulebook row used; null when the rulebook lacks the value. */
  readonly citation: string | null;
  /** The rulebook row used, for linking to the editor. */
  readonly ruleRef: RuleRef | null;
  readonly target: FindingTarget;
  readonly safety: SafetyFlag | null;
  /** The smallest diameter the company's tables allow here, for the installer to fetch. */
  readonly smallest?: Quantity;
}

/** Entry of the finding catalogue. */
export interface FindingCatalogueEntry {
  readonly title: string;
  readonly description: string;
}

/** Every finding code with its title and what it checks, for documentation and the PDF. */
export const FINDING_CATALOGUE = {
  "connector.slope": {
    title: "Connector slope",
    description: "Each horizontal connector segment rises toward the vent by at least the rulebook's minimum per foot.",
  },
  "connector.horizontal_length": {
    title: "Connector horizontal length",
    description: "Total horizontal connector length stays within the rulebook's share of the vent height for the connector material.",
  },
  "connector.length_per_diameter": {
    title: "Connector length per diameter",
    description: "A connector into a common vent is no longer than the length per inch of diameter that the tables assume; beyond it capacity is reduced.",
  },
  "connector.diameter": {
    title: "Connector and vent diameter",
    description: "The connector is not smaller than the flue collar or draft-hood outlet, nor the vent smaller than allowed; a common vent is not smaller than its largest connector.",
  },
  "vent.category": {
    title: "Venting category",
    description: "The vent-run checks apply to Category I appliances (natural draft with a draft hood, or fan-assisted); other categories follow the manufacturer's instructions.",
  },
  "vent.capacity": {
    title: "Vent capacity",
    description:
      "A single appliance's input lies between the minimum and maximum of the capacity table for the vent's height, lateral and diameter, after derating for extra turns; a common vent's combined input is within the common-vent table's maximum for its draft types, after its reductions.",
  },
  "connector.capacity": {
    title: "Connector capacity (common vent)",
    description:
      "Each appliance's connector into a common vent holds its input between the connector table's minimum and maximum at the vent height and the connector's rise, after the reductions for extra turns and extra length.",
  },
  "common_vent.no_connector": {
    title: "Connector of each appliance",
    description: "Every appliance on a common vent has its own connector, and every connector segment says which appliance it serves.",
  },
  "common_vent.horizontal_length": {
    title: "Common vent offset and manifold",
    description: "An offset in the common vent and a manifold joining the connectors stay within their length per inch of common-vent diameter.",
  },
  "vent.area_ratio": {
    title: "Vent not oversized",
    description: "The vent's flow area is no more than the rulebook's multiple of the smallest draft-hood outlet or flue collar it serves.",
  },
  "vent.min_height": {
    title: "Vent height above collar",
    description: "The vent reaches at least the rulebook's minimum height above the highest draft-hood outlet or flue collar.",
  },
  "clearance.combustibles": {
    title: "Clearance to combustibles",
    description: "Measured clearance of each connector segment meets the rulebook table, or the appliance manual's value where entered.",
  },
  "supports.spacing": {
    title: "Supports",
    description: "Each segment has at least as many supports as its length divided by the maximum support spacing.",
  },
  "joints.fasteners": {
    title: "Fasteners per joint",
    description: "Each joint has at least the rulebook's number of mechanical fasteners for the material.",
  },
  "joints.locked": {
    title: "Sections locked",
    description: "Every section and joint is locked or engaged as its listing requires.",
  },
  "passage.single_wall": {
    title: "Where the connector passes",
    description: "A connector does not pass through places the rulebook prohibits for its material (single-wall in attics, concealed spaces, floors, ceilings); walls only with a thimble.",
  },
  "termination.height": {
    title: "Termination height",
    description: "The vent ends high enough above the roof for the roof pitch, or at the fixed height where the pitch table does not apply.",
  },
  "termination.distance": {
    title: "Termination distance",
    description: "The termination is far enough from doors, operable windows and air inlets, or high enough above them.",
  },
  "air.volume": {
    title: "Combustion-air volume",
    description: "The air space holds the volume the standard or known-infiltration method requires for the appliances drawing room air.",
  },
  "air.openings": {
    title: "Combustion-air openings",
    description: "Indoor and outdoor openings give the free area each arrangement requires, allowing for the louver's free-area share.",
  },
  "air.opening_dimension": {
    title: "Opening dimension",
    description: "No air opening or duct is narrower than the rulebook's minimum dimension.",
  },
  "readings.co_air_free": {
    title: "Flue CO (air-free)",
    description: "Air-free CO computed from measured CO and O2 stays at or below the rulebook's limit for the appliance kind.",
  },
  "readings.ambient_co": {
    title: "Ambient CO",
    description: "Ambient CO in the appliance space is below the rulebook's stop level; a caution is shown from the marginal level.",
  },
  "readings.draft": {
    title: "Draft",
    description: "Steady-state draft is at least as strong (as negative) as the rulebook's limit.",
  },
  "readings.spillage": {
    title: "Spillage",
    description: "Spillage at the draft hood stops within the rulebook's maximum time.",
  },
  "readings.temperature_rise": {
    title: "Temperature rise",
    description: "Supply minus return temperature lies within the rating-plate range.",
  },
  "readings.input_rate": {
    title: "Gas input (clocked)",
    description: "Input from meter clocking is within the rulebook's tolerance of the rated input.",
  },
  "common_vent.orphaned": {
    title: "Appliance left on a common vent",
    description: "An appliance left alone on a vent that was common is re-checked against the single-appliance capacity table, minimum and maximum.",
  },
  "return_air.area": {
    title: "Return-air opening area",
    description: "The return openings' total free area is at least the rulebook's area per 1,000 Btu/h of the furnace's output.",
  },
  "return_air.velocity": {
    title: "Return grille face velocity",
    description: "Airflow through each return grille's free area stays at or below the rulebook's quiet-return target, or the filter-grille maximum for a filter grille (common practice: a warning, not a failure).",
  },
  "return_air.location": {
    title: "Where return air is drawn from",
    description: "No return opening draws from a space the rulebook prohibits, and a space holding a fuel-burning appliance is not the only source of return air, unless the rulebook's exception applies.",
  },
  "return_air.draft_hood_distance": {
    title: "Return opening distance from a draft hood",
    description: "A return opening is at least the rulebook's distance from a draft hood or open combustion chamber in the same space.",
  },
} as const satisfies Record<FindingCode, FindingCatalogueEntry>;

const n = fmt;
const ft = (v: number) => `${n(v)} ft`;
const inch = (v: number) => `${n(v)} in`;
const btuh = (v: number) => `${n(v, 0)} Btu/h`;
const HUMAN: Record<string, string> = {
  single_wall: "single-wall",
  type_b: "Type B",
  masonry_lined: "lined masonry",
  natural_draft: "natural-draft",
  mechanical_draft: "mechanical-draft",
};
const human = (s: string) => HUMAN[s] ?? s.replace(/_/g, " ");
const plural = (count: number, one: string, many: string) => `${n(count, 0)} ${count === 1 ? one : many}`;
/** "an attic", "a floor". */
const aOrAn = (word: string) => `${/^[aeiou]/i.test(word) ? "an" : "a"} ${word}`;

/** A return-air space with its article, for messages. */
const RETURN_SPACE_PHRASES: Record<string, string> = {
  living_area: "a living area",
  bedroom: "a bedroom",
  hallway: "a hallway",
  appliance_room: "an appliance room",
  bathroom: "a bathroom",
  toilet_room: "a toilet room",
  kitchen: "a kitchen",
  closet: "a closet",
  garage: "a garage",
  unconditioned_space: "an unconditioned space",
  other: "another space",
};
const aSpace = (s: string) => RETURN_SPACE_PHRASES[s] ?? `a ${human(s)}`;

/** Message templates, one group per finding code. */
export const MESSAGES = {
  missingRule: (what: string, table: string) =>
    `Not checked: the rulebook has no value for ${what}; add it to the "${table}" table to run this check.`,
  connectorSlope: {
    pass: (riseIn: number, lengthFt: number, requiredIn: number) =>
      `Rises ${inch(riseIn)} over ${ft(lengthFt)} of horizontal run; at least ${inch(requiredIn)} is needed.`,
    fail: (riseIn: number, lengthFt: number, requiredIn: number, slope: number) =>
      `Rises only ${inch(riseIn)} over ${ft(lengthFt)}; it needs at least ${inch(requiredIn)} (${n(slope, 3)} in per ft). Re-hang it to rise ${inch(requiredIn - riseIn)} more toward the vent.`,
    needsInfo: () => "Enter this horizontal segment's length and its rise to check the slope.",
  },
  connectorHorizontalLength: {
    pass: (totalFt: number, maxFt: number, share: number, heightFt: number, material: string) =>
      `Horizontal connector length ${ft(totalFt)} is within ${ft(maxFt)} (${n(share * 100, 1)} % of the ${ft(heightFt)} vent height for ${human(material)}).`,
    fail: (totalFt: number, maxFt: number, share: number, heightFt: number, material: string) =>
      `Horizontal connector length ${ft(totalFt)} exceeds ${ft(maxFt)} (${n(share * 100, 1)} % of the ${ft(heightFt)} vent height for ${human(material)}). Shorten the horizontal run, make the vent taller, or use a connector material the rulebook allows longer.`,
    needsInfo: () => "Enter the vent height and the material and length of every horizontal segment to check the connector length.",
  },
  connectorLengthPerDiameter: {
    pass: (label: string, lengthFt: number, maxFt: number, diameterIn: number) =>
      `The connector of ${label} has ${ft(lengthFt)} of horizontal length; the common-vent tables assume up to ${ft(maxFt)} for a ${inch(diameterIn)} connector.`,
    warn: (label: string, lengthFt: number, maxFt: number, diameterIn: number, lossPct: number) =>
      `The connector of ${label} has ${ft(lengthFt)} of horizontal length, more than the ${ft(maxFt)} the tables assume for ${inch(diameterIn)}: the connector's own maximum capacity (fan-assisted or natural-draft max in the connector table) is reduced by ${n(lossPct, 1)} %, and a fan-assisted minimum comes from the single-appliance table. The connector capacity finding applies this; shortening the connector removes it.`,
    needsInfo: (label: string) => `Enter the diameter and orientation of every segment of the connector of ${label}, and the length of its horizontal segments.`,
  },
  connectorDiameter: {
    pass: (diameterIn: number, outletIn: number, label: string) =>
      `Connector ${inch(diameterIn)} is not smaller than the ${inch(outletIn)} outlet of ${label}.`,
    fail: (diameterIn: number, outletIn: number, label: string) =>
      `Connector ${inch(diameterIn)} is smaller than the ${inch(outletIn)} outlet of ${label}. Use pipe of at least ${inch(outletIn)} unless the appliance instructions allow a reduction.`,
    needsInfo: (label: string) => `Enter the connector diameter and the outlet diameter of ${label}.`,
    ventPass: (ventIn: number, outletIn: number) => `Vent ${inch(ventIn)} is not smaller than the ${inch(outletIn)} appliance outlet.`,
    ventReduced: (ventIn: number, outletIn: number, heightFt: number) =>
      `Vent ${inch(ventIn)} is one size smaller than the ${inch(outletIn)} outlet on a ${ft(heightFt)} vent. This is only acceptable within the reduction rules of your code (never a 3 in vent on a 4 in draft hood; fan-assisted maximum reduced); confirm the capacity with the table.`,
    ventFail: (ventIn: number, outletIn: number, reason: string) =>
      `Vent ${inch(ventIn)} is smaller than the ${inch(outletIn)} appliance outlet and may not be: ${reason} Use a vent of at least ${inch(outletIn)}.`,
    reasonTooShort: (heightFt: number, minHeightFt: number) =>
      `a vent smaller than the outlet is considered only when it is at least ${ft(minHeightFt)} high, and this one is ${ft(heightFt)}.`,
    reasonMoreThanOneSize: (ventIn: number, outletIn: number, oneSizeIn: number) =>
      `only one table size smaller is allowed (${inch(oneSizeIn)} for a ${inch(outletIn)} outlet); ${inch(ventIn)} is more.`,
    reasonOutletOver12: (outletIn: number) => `the reduction applies only to outlets of 12 in or less; this outlet is ${inch(outletIn)}.`,
    reasonThreeOnFour: () => "a 3 in vent is never allowed on a 4 in draft-hood outlet.",
    reasonNeedsHeight: () => "enter the vent height to see whether a smaller vent may be considered.",
    outletCitation:
      "Appliance outlet (flue collar or draft-hood outlet) as entered; not smaller unless the appliance instructions allow",
    commonPass: (ventIn: number, connectorIn: number) =>
      `Common vent ${inch(ventIn)} is not smaller than the largest connector (${inch(connectorIn)}).`,
    commonFail: (ventIn: number, connectorIn: number) =>
      `Common vent ${inch(ventIn)} is smaller than the largest connector (${inch(connectorIn)}). Its area must be at least that of the largest connector: use a larger common vent.`,
    ventNeedsInfo: () => "Enter the vent diameter and the appliance outlet diameter.",
  },
  ventCategory: {
    notCategoryI: (label: string, what: string) =>
      `${label} is ${what}; its venting follows the manufacturer's instructions, which Flueward's Category I vent checks do not cover. Check the vent against those instructions.`,
    needsInfo: (label: string) => `Enter the venting category and draft type of ${label} to run the vent checks.`,
    skipped: (title: string, label: string, what: string) =>
      `Not applicable: "${title}" is a Category I rule and ${label} is ${what}; the manufacturer's instructions govern this part of its venting.`,
  },
  ventCapacity: {
    pass: (inputBtuh: number, minBtuh: number | null, maxBtuh: number, d: number, heightFt: number, lateralFt: number, note: string) =>
      `${btuh(inputBtuh)} is within ${minBtuh === null ? "" : `${btuh(minBtuh)}–`}${btuh(maxBtuh)} for a ${inch(d)} vent ${ft(heightFt)} high with ${ft(lateralFt)} lateral${note}.`,
    overMax: (inputBtuh: number, maxBtuh: number, d: number, heightFt: number, lateralFt: number, note: string, fix: string) =>
      `${btuh(inputBtuh)} exceeds the ${btuh(maxBtuh)} maximum for a ${inch(d)} vent ${ft(heightFt)} high with ${ft(lateralFt)} lateral${note}. ${fix}`,
    underMin: (inputBtuh: number, minBtuh: number, d: number, heightFt: number, lateralFt: number, fix: string) =>
      `${btuh(inputBtuh)} is below the ${btuh(minBtuh)} minimum for a fan-assisted appliance on a ${inch(d)} vent ${ft(heightFt)} high with ${ft(lateralFt)} lateral: the vent is too large and may condense. ${fix}`,
    notListed: (d: number, heightFt: number, lateralFt: number, draft: string, fix: string) =>
      `The capacity table gives no ${draft} value for a ${inch(d)} vent ${ft(heightFt)} high with ${ft(lateralFt)} lateral, so this size is not permitted. ${fix}`,
    outsideTable: (what: string) =>
      `${what} Flueward does not extrapolate beyond the table; size this vent from the full table in your code book or the vent maker's instructions.`,
    noTable: (ventMaterial: string, connectorMaterial: string, d: number) =>
      `The rulebook's capacity table has no rows for a ${inch(d)} ${human(ventMaterial)} vent with ${human(connectorMaterial)} connector; add them or size the vent from your code book.`,
    common: () =>
      "A common vent is sized from the multiple-appliance tables, which this rulebook does not hold. Size it from your code book or the vent maker's tables and record the result.",
    needsInfo: () => "Enter the appliance input, the vent material, diameter and height, the connector material, and the laterals to check vent capacity.",
    fixSmallest: (d: number) => `The smallest diameter the table allows is ${inch(d)}.`,
    fixNone: () => "No diameter in the table fits; change the vent height or lateral, or the appliance.",
    derated: (pct: number) => `, after a ${n(pct, 1)} % reduction for extra turns`,
    reducedVent: (pct: number) => `, after the ${n(pct, 1)} % reduction of the fan-assisted maximum for a vent smaller than the outlet`,
    interpolated: () => ", interpolated between table rows",
    conservative: () => ", from the conservative table rows",
  },
  commonVent: {
    noConnector: (label: string) =>
      `${label} is on the common vent but has no connector segment. Add its connector (each appliance needs its own) so it can be sized.`,
    segmentWithoutAppliance: () => "Choose which appliance this connector segment belongs to: on a common vent each connector is sized for its own appliance.",
    needsVent: () => "Enter the vent material and its total height H (from the highest draft-hood outlet or flue collar to the top) to size a common vent.",
    connectorNeedsInfo: (label: string) =>
      `Enter the input and draft type of ${label} and the material, diameter, orientation, length and rise of each piece of its connector to size it.`,
    commonNeedsInfo: () => "Enter the input and draft type of every appliance on the vent and the common vent's diameter to size the common vent.",
    noConnectorTable: () => "The rulebook's vent connector table (two or more appliances) has no rows for this vent and connector material at this diameter.",
    noCommonTable: () => "The rulebook's common vent table has no rows for this vent and connector material at this diameter.",
    heightOutside: (minFt: number, maxFt: number) => `The table covers vent heights of ${ft(minFt)} to ${ft(maxFt)}.`,
    riseOutside: (minFt: number, maxFt: number) => `The table covers connector rises of ${ft(minFt)} to ${ft(maxFt)}.`,
    missingRow: (heightFt: number, riseFt: number) => `The table has no row for ${ft(heightFt)} height with ${ft(riseFt)} rise.`,
    minOutsideSingle: () =>
      "This fan-assisted connector is longer than the tables assume, so its minimum comes from the single-appliance table, which has no value for this height and length.",
    outsideTable: (label: string, what: string) =>
      `The connector of ${label} is outside the company's table: ${what} Flueward does not extrapolate; size it from the full table in your code book.`,
    commonOutsideTable: (what: string) =>
      `The common vent is outside the company's table: ${what} Flueward does not extrapolate; size it from the full table in your code book.`,
    connectorWhere: (d: number, material: string, riseFt: number, heightFt: number) =>
      `a ${inch(d)} ${human(material)} connector with ${ft(riseFt)} rise on a common vent ${ft(heightFt)} high`,
    connectorNotes: (turnsPct: number, lengthPct: number, assumedFt: number, horizontalFt: number, minFromSingle: boolean, interpolated: boolean, conservative: boolean) => {
      const parts: string[] = [];
      if (interpolated) parts.push("interpolated between table rows");
      if (conservative) parts.push("from the conservative table rows");
      if (turnsPct > 0) parts.push(`maximum reduced ${n(turnsPct, 1)} % for turns beyond those the table assumes`);
      if (lengthPct > 0)
        parts.push(`connector maximum reduced ${n(lengthPct, 1)} % because its ${ft(horizontalFt)} horizontal length is over the ${ft(assumedFt)} the table assumes`);
      if (minFromSingle) parts.push("minimum read from the single-appliance table, as the code requires for a longer fan-assisted connector");
      return parts.length ? ` (${parts.join("; ")})` : "";
    },
    connectorPass: (label: string, input: number, min: number | null, max: number, where: string, notes: string, smallest: number | null) =>
      `${label}: ${btuh(input)} is within ${min === null ? "the " : `${btuh(min)}–`}${btuh(max)}${min === null ? " maximum" : ""} for ${where}${notes}.${smallest === null ? "" : ` Smallest connector the tables allow: ${inch(smallest)}.`}`,
    connectorOverMax: (label: string, input: number, max: number, where: string, notes: string, fix: string) =>
      `${label}: ${btuh(input)} exceeds the ${btuh(max)} maximum for ${where}${notes}. ${fix}`,
    connectorUnderMin: (label: string, input: number, min: number, where: string, notes: string, fix: string) =>
      `${label}: ${btuh(input)} is below the ${btuh(min)} fan-assisted minimum for ${where}${notes}: the connector is too large and may condense. ${fix}`,
    connectorNotListed: (label: string, fan: boolean, where: string, fix: string) =>
      `${label}: the connector table gives no ${fan ? "fan-assisted" : "natural-draft"} value for ${where}, so this size is not permitted. ${fix}`,
    connectorFixSmallest: (d: number) => `The smallest connector the tables allow is ${inch(d)}.`,
    connectorFixNone: () => "No connector diameter in the table works; change the rise or the vent height, or size it from your code book.",
    commonWhere: (d: number, heightFt: number, column: string) =>
      `a ${inch(d)} common vent ${ft(heightFt)} high (${column === "fan_fan" ? "FAN+FAN" : column === "fan_nat" ? "FAN+NAT" : "NAT+NAT"})`,
    commonNotes: (deratePct: number, interpolated: boolean, conservative: boolean) => {
      const parts: string[] = [];
      if (interpolated) parts.push("interpolated between table rows");
      if (conservative) parts.push("from the conservative table row");
      if (deratePct > 0) parts.push(`maximum reduced ${n(deratePct, 1)} % for turns and manifold in the common vent`);
      return parts.length ? ` (${parts.join("; ")})` : "";
    },
    commonPass: (total: number, max: number, where: string, notes: string, smallest: number | null) =>
      `The combined ${btuh(total)} is within the ${btuh(max)} maximum for ${where}${notes}.${smallest === null ? "" : ` Smallest common vent the tables allow: ${inch(smallest)}.`}`,
    commonOverMax: (total: number, max: number, where: string, notes: string, fix: string) =>
      `The combined ${btuh(total)} exceeds the ${btuh(max)} maximum for ${where}${notes}. ${fix}`,
    commonNotListed: (where: string, fix: string) => `The common vent table gives no value for ${where}, so this size is not permitted. ${fix}`,
    commonFixSmallest: (d: number) => `The smallest common vent the tables allow (not smaller than the largest connector) is ${inch(d)}.`,
    commonFixNone: () => "No common-vent diameter in the table works; change the vent height or the appliances, or size it from your code book.",
    horizontalPass: (what: string, lengthFt: number, maxFt: number, perIn: number, d: number) =>
      `The common vent's ${what} of ${ft(lengthFt)} is within ${ft(maxFt)} (${n(perIn)} in per inch of its ${inch(d)} diameter).`,
    horizontalFail: (what: string, lengthFt: number, maxFt: number, perIn: number, d: number) =>
      `The common vent's ${what} of ${ft(lengthFt)} is longer than ${ft(maxFt)} (${n(perIn)} in per inch of its ${inch(d)} diameter). Shorten it or enlarge the common vent.`,
  },
  ventAreaRatio: {
    pass: (ventIn: number, outletIn: number, ratio: number, max: number) =>
      `The ${inch(ventIn)} vent has ${n(ratio, 1)} × the flow area of the smallest outlet it serves (${inch(outletIn)}); at most ${n(max, 1)} × is allowed.`,
    fail: (ventIn: number, outletIn: number, ratio: number, max: number) =>
      `The ${inch(ventIn)} vent has ${n(ratio, 1)} × the flow area of the ${inch(outletIn)} outlet it serves; at most ${n(max, 1)} × is allowed. An oversized vent stays cold and may condense or spill: use a smaller vent or a listed liner sized from the tables.`,
    needsInfo: () => "Enter the vent diameter and the outlet diameter of every appliance on it to check that the vent is not oversized.",
    masonry: () => "The area-ratio check reads round vents; for a lined masonry chimney compare the liner's area with the outlets by hand.",
  },
  ventMinHeight: {
    pass: (heightFt: number, minFt: number) => `The vent is ${ft(heightFt)} above the highest collar or draft hood; at least ${ft(minFt)} is needed.`,
    fail: (heightFt: number, minFt: number) =>
      `The vent is only ${ft(heightFt)} above the highest collar or draft hood; it must reach at least ${ft(minFt)}. Extend the vent.`,
    needsInfo: () => "Enter the vent height from the highest collar or draft hood to the top of the vent.",
  },
  clearance: {
    pass: (measuredIn: number, requiredIn: number) => `Clearance ${inch(measuredIn)} meets the required ${inch(requiredIn)}.`,
    fail: (measuredIn: number, requiredIn: number) =>
      `Clearance ${inch(measuredIn)} is less than the required ${inch(requiredIn)}. Move the pipe or the combustible material, or use a listed clearance-reduction system.`,
    needsInfo: () => "Measure the clearance from this segment to the nearest combustible material.",
    needsMaterial: () => "Enter the segment's material and the appliance's listing to find the required clearance.",
  },
  supports: {
    pass: (installed: number, needed: number, lengthFt: number, spacingFt: number) =>
      `${plural(installed, "support", "supports")} on ${ft(lengthFt)}; at least ${plural(needed, "support", "supports")} needed at ${ft(spacingFt)} spacing.`,
    fail: (installed: number, needed: number, lengthFt: number, spacingFt: number) =>
      `Only ${plural(installed, "support", "supports")} on ${ft(lengthFt)}; at least ${plural(needed, "support", "supports")} needed at ${ft(spacingFt)} spacing. Add ${plural(needed - installed, "support", "supports")} so the pipe cannot sag or separate.`,
    needsInfo: () => "Enter the segment's length and the number of supports installed.",
  },
  fasteners: {
    pass: (count: number, min: number) =>
      min === 0 ? `${plural(count, "fastener", "fasteners")} at each joint; the rulebook asks for none beyond the listed joint.` : `${plural(count, "fastener", "fasteners")} at each joint; at least ${plural(min, "fastener", "fasteners")} needed.`,
    fail: (count: number, min: number) =>
      `Only ${plural(count, "fastener", "fasteners")} at a joint; each joint needs at least ${plural(min, "fastener", "fasteners")}. Add screws or rivets (never through the inner wall of Type B); tape is not a fastener.`,
    needsInfo: () => "Enter the fewest fasteners found at any joint of this segment.",
  },
  locked: {
    pass: () => "Every section of this segment is locked.",
    fail: () => "A section of this segment is not locked. Engage every joint and seam as the pipe's listing requires.",
    needsInfo: () => "Confirm whether every section of this segment is locked.",
  },
  passage: {
    pass: (material: string, passage: string) => `A ${human(material)} connector may pass through ${passage === "none" ? "open space" : aOrAn(human(passage))} under this rulebook.`,
    fail: (material: string, passage: string, note: string) =>
      `A ${human(material)} connector may not pass through ${aOrAn(human(passage))}. Replace this segment with Type B (or listed) pipe, or reroute it.${note ? ` ${note}` : ""}`,
    thimble: (material: string) =>
      `A ${human(material)} connector passes through a wall without a listed ventilated thimble. Fit the thimble or reroute.`,
    thimbleNeedsInfo: () => "Confirm whether a listed ventilated thimble is fitted where this segment passes through the wall.",
    thimbleOk: (material: string) => `A ${human(material)} connector passes through a wall with a listed thimble.`,
    needsInfo: () => "Enter what this segment passes through (or none).",
  },
  terminationHeight: {
    pass: (heightFt: number, minFt: number, why: string) => `The vent ends ${ft(heightFt)} above the roof; ${why} requires at least ${ft(minFt)}.`,
    fail: (heightFt: number, minFt: number, why: string) =>
      `The vent ends only ${ft(heightFt)} above the roof; ${why} requires at least ${ft(minFt)}. Extend the vent.`,
    pitchRow: (pitch: number) => `a roof of ${n(pitch)}/12 pitch`,
    fixed: (reason: string) => `a vent ${reason}`,
    nearbyFail: (aboveFt: number, minFt: number) =>
      `The vent is only ${ft(aboveFt)} above a part of the building within 10 ft; it must be at least ${ft(minFt)} above. Extend the vent.`,
    outsidePitch: (pitch: number, maxPitch: number) =>
      `The ${n(pitch)}/12 roof is steeper than the table's last row (${n(maxPitch)}/12); find the height in your code book.`,
    needsInfo: () => "Enter the roof pitch, the height above the roof, the cap size (or listed cap) and the distance to the nearest vertical wall.",
    needsNearby: () => "Enter the height above any part of the building within 10 ft: the roof-pitch table does not apply to this vent.",
  },
  terminationDistance: {
    pass: (what: string, distanceFt: number, minFt: number) => `The ${what} is ${ft(distanceFt)} away; at least ${ft(minFt)} is needed.`,
    passAbove: (what: string, aboveFt: number, aboveMinFt: number) =>
      `The termination is ${ft(aboveFt)} above the ${what}; at least ${ft(aboveMinFt)} above is accepted.`,
    fail: (what: string, distanceFt: number, minFt: number, aboveMinFt: number | null) =>
      `The termination is only ${ft(distanceFt)} from the ${what}; it must be at least ${ft(minFt)} away${aboveMinFt === null ? "" : ` or at least ${ft(aboveMinFt)} above it`}. Move the termination.`,
    needsInfo: (what: string) => `Enter the distance from the termination to the ${what} (and how far above it the termination is).`,
    otherSystem: (what: string, rowSystems: readonly string[], system: string) =>
      `Not applicable: the rulebook's distances from ${aOrAn(what)} are for ${rowSystems.map(human).join(" and ")} vents, and this vent is ${human(system)}.`,
  },
  airVolume: {
    pass: (availableCuFt: number, requiredCuFt: number, method: string) =>
      `The space holds ${n(availableCuFt, 0)} ft³; the ${method} requires ${n(requiredCuFt, 0)} ft³. Indoor air is enough.`,
    fail: (availableCuFt: number, requiredCuFt: number, method: string) =>
      `The space holds ${n(availableCuFt, 0)} ft³ but the ${method} requires ${n(requiredCuFt, 0)} ft³. Join more rooms through openings, or bring in outdoor air.`,
    shortWithOutdoor: (availableCuFt: number, requiredCuFt: number, method: string) =>
      `The space holds ${n(availableCuFt, 0)} ft³ of the ${n(requiredCuFt, 0)} ft³ the ${method} requires; the outdoor openings must make up the rest (see the opening checks).`,
    none: () => "No appliance in this space draws room air (direct-vent appliances are left out); no combustion-air volume is needed.",
    needsInfo: () => "Enter every room's dimensions (or volume) and the input of each appliance in the space.",
    standard: "standard method",
    infiltration: (ach: number) => `known-infiltration method at ${n(ach, 2)} ACH`,
  },
  airOpenings: {
    pass: (freeSqIn: number, requiredSqIn: number, what: string) =>
      `The ${what} gives ${n(freeSqIn, 1)} in² of free area; at least ${n(requiredSqIn, 1)} in² is needed.`,
    fail: (freeSqIn: number, requiredSqIn: number, what: string, grossSqIn: number | null) =>
      `The ${what} gives only ${n(freeSqIn, 1)} in² of free area; at least ${n(requiredSqIn, 1)} in² is needed.${grossSqIn === null ? "" : ` With this louver that is a gross opening of at least ${n(grossSqIn, 1)} in².`}`,
    count: (what: string, found: number, needed: number) =>
      `The ${what} arrangement needs ${n(needed, 0)} openings (one within 12 in of the top, one within 12 in of the bottom); ${plural(found, "opening is", "openings are")} given. Add the missing opening.`,
    notNeeded: () => "Indoor air is enough; outdoor openings are not required.",
    outdoorMissing: () => "Indoor air is not enough and no outdoor opening is given. Add outdoor openings sized by one of the rulebook's methods.",
    needsInfo: (what: string) => `Enter the ${what}'s width and height (or diameter, or stated free area) and its louver.`,
    needsShare: (what: string) => `Enter the free-area share stated by the maker of the ${what}'s louver.`,
    noRoom: (what: string) => `Say which room the ${what} joins to the appliance's space.`,
    needsConnector: (label: string) =>
      `Enter the connector diameter of ${label} (or its outlet diameter): a single outdoor opening must also be at least the total area of the vent connectors in the space, which cannot be checked without it.`,
  },
  airOpeningDimension: {
    pass: (dimIn: number, minIn: number) => `The smallest dimension is ${inch(dimIn)}; at least ${inch(minIn)} is needed.`,
    fail: (dimIn: number, minIn: number) => `The smallest dimension is only ${inch(dimIn)}; no opening or duct may be narrower than ${inch(minIn)}. Enlarge it.`,
    needsInfo: () => "Enter the opening's width and height, or its diameter.",
  },
  readingsCoAirFree: {
    pass: (coAf: number, limit: number) => `Air-free CO is ${n(coAf, 0)} ppm; the limit is ${n(limit, 0)} ppm.`,
    fail: (coAf: number, limit: number) =>
      `Air-free CO is ${n(coAf, 0)} ppm, above the ${n(limit, 0)} ppm limit. Do not leave the appliance running: find the cause (combustion air, burner, heat exchanger, venting) and retest.`,
    badO2: (o2: number) => `An O2 reading of ${n(o2, 1)} % means the probe is not sampling flue gases; reposition the probe and read again.`,
    needsInfo: () => "Enter the flue CO (ppm) and O2 (%) measured after the burner has run steadily.",
  },
  readingsAmbientCo: {
    pass: (ppm: number, marginal: number) => `Ambient CO is ${n(ppm, 0)} ppm, below the ${n(marginal, 0)} ppm caution level.`,
    warn: (ppm: number, marginal: number, max: number) =>
      `Ambient CO is ${n(ppm, 0)} ppm: at or above the ${n(marginal, 0)} ppm caution level (stop at ${n(max, 0)} ppm). Find the source before finishing.`,
    fail: (ppm: number, max: number) =>
      `Ambient CO is ${n(ppm, 0)} ppm, at or above the ${n(max, 0)} ppm stop level. Ventilate, get occupants out if needed, find and fix the source before continuing.`,
    needsInfo: () => "Measure ambient CO in the appliance space.",
  },
  readingsDraft: {
    pass: (draft: number, limit: number) => `Draft ${n(draft, 3)} in. w.c. is at least as strong as ${n(limit, 3)} in. w.c.`,
    fail: (draft: number, limit: number) =>
      `Draft ${n(draft, 3)} in. w.c. is weaker than ${n(limit, 3)} in. w.c. Check for a blocked or undersized vent, depressurisation of the space, or insufficient vent height.`,
    needsInfo: () => "Measure the steady-state draft.",
    directVent: () => "Not applicable: a direct-vent (sealed-combustion) appliance has no draft to measure at a draft hood or flue collar; follow the manufacturer's instructions.",
  },
  readingsSpillage: {
    pass: (s: number, max: number) => `Spillage stopped after ${n(s, 0)} s; at most ${n(max, 0)} s is allowed.`,
    fail: (s: number, max: number) =>
      `Spillage lasted ${n(s, 0)} s, longer than ${n(max, 0)} s. Find the cause (blocked vent, depressurisation, combustion air) and fix it before leaving.`,
    needsInfo: () => "Run a spillage test at the draft hood and enter the seconds until spillage stopped.",
    fanAssisted: () => "Not applicable: a fan-assisted appliance has no draft hood, so there is no spillage test at the draft hood.",
    directVent: () => "Not applicable: a direct-vent (sealed-combustion) appliance has no draft hood to test for spillage.",
  },
  readingsTemperatureRise: {
    pass: (rise: number, min: number, max: number) => `Temperature rise ${n(rise, 1)} °F is within the ${n(min, 0)}–${n(max, 0)} °F rating-plate range.`,
    low: (rise: number, min: number, max: number) =>
      `Temperature rise ${n(rise, 1)} °F is below the ${n(min, 0)}–${n(max, 0)} °F range: too much airflow or low input. Check blower speed and gas input.`,
    high: (rise: number, min: number, max: number) =>
      `Temperature rise ${n(rise, 1)} °F is above the ${n(min, 0)}–${n(max, 0)} °F range: too little airflow or over-firing. Check filter, duct restrictions, blower speed and gas input.`,
    needsInfo: () => "Enter the supply and return temperatures and the rating-plate temperature-rise range.",
    needsKind: () => "Enter the appliance kind: the temperature rise is checked on furnaces.",
    notFurnace: () => "Not applicable: the temperature rise across the heat exchanger is checked on furnaces, and this appliance is not a furnace.",
  },
  readingsInputRate: {
    pass: (measured: number, rated: number, diffPct: number, tol: number) =>
      `Clocked input ${btuh(measured)} is within ${n(tol, 1)} % of the rated ${btuh(rated)} (${n(diffPct, 1)} %).`,
    warn: (measured: number, rated: number, diffPct: number, tol: number) =>
      `Clocked input ${btuh(measured)} differs from the rated ${btuh(rated)} by ${n(diffPct, 1)} %, more than ${n(tol, 1)} %. Check manifold pressure, orifices and the heating value, and adjust.`,
    needsInfo: () => "Enter the meter dial size, the seconds per revolution, the gas heating value and the rated input.",
  },
  commonVentOrphaned: {
    pass: (label: string, inner: string) => `Re-checked alone on the former common vent: ${label}: ${inner}`,
    fail: (label: string, inner: string) => `${label}, now alone on the former common vent: ${inner} Resize or reline the vent for this appliance.`,
    needsInfo: (label: string, inner: string) => `${label}, now alone on the former common vent: ${inner}`,
    noneLeft: () => "No appliance is left on the vent; cap or remove it.",
    several: () => "More than one appliance is still on the vent; it is still common and is checked as such.",
    stillCommon: (inner: string) => `The appliances left on the vent still share it, re-checked against the multiple-appliance tables: ${inner}`,
  },
  returnAir: {
    pass: (freeSqIn: number, requiredSqIn: number, outputBtuh: number, perKbtuh: number) =>
      `The return openings give ${n(freeSqIn, 1)} in² of free area; ${btuh(outputBtuh)} of output needs at least ${n(requiredSqIn, 1)} in² (${n(perKbtuh)} in² per 1,000 Btu/h).`,
    fail: (freeSqIn: number, requiredSqIn: number, outputBtuh: number, perKbtuh: number) =>
      `The return openings give only ${n(freeSqIn, 1)} in² of free area; ${btuh(outputBtuh)} of output needs at least ${n(requiredSqIn, 1)} in² (${n(perKbtuh)} in² per 1,000 Btu/h). Enlarge the return or add an opening of at least ${n(requiredSqIn - freeSqIn, 1)} in² free area.`,
    noOpenings: () => "Add the return openings (grilles or ducts into the return) that serve this furnace.",
    needsOpening: (label: string) => `Enter the width and height (or diameter) and the free-area share of ${label}, or its stated free area.`,
    needsOutput: () => "Enter the furnace's output from the rating plate, or its efficiency so the output can be worked out from the rated input.",
    needsInput: (label: string) => `Enter the rated input of ${label}; with the efficiency it gives the output.`,
    needsFurnace: () => "Choose the furnace this return serves.",
    unknownFurnace: (id: string) => `The furnace "${id}" chosen for the return air is not among the appliances; choose it again.`,
    velocityPass: (label: string, fpm: number, maxFpm: number, cfm: number, what: string) =>
      `${label}: ${n(fpm, 0)} fpm through its free area (${n(cfm, 0)} cfm); at most ${n(maxFpm, 0)} fpm ${what}.`,
    velocityHigh: (label: string, fpm: number, maxFpm: number, cfm: number, what: string) =>
      `${label}: ${n(fpm, 0)} fpm through its free area (${n(cfm, 0)} cfm), above the ${n(maxFpm, 0)} fpm ${what}. Expect noise and a higher pressure drop: use a larger grille or add a return.`,
    needsFilterAnswer: (label: string, fpm: number, filterMaxFpm: number) =>
      `${label}: ${n(fpm, 0)} fpm through its free area, above the ${n(filterMaxFpm, 0)} fpm filter-grille maximum. Say whether this grille holds a filter.`,
    quietTarget: "quiet-return target",
    filterMax: "filter-grille maximum",
    needsAirflow: () => "Enter the blower airflow (rating plate), the cooling size in tons, or the temperature rise (or the supply and return temperatures in the readings) to work out the airflow.",
    badRise: (riseF: number) => `A temperature rise of ${n(riseF, 1)} °F cannot give the airflow; check the supply and return temperatures, or enter the airflow.`,
    needsAllOpenings: () => "Enter the free area of every return opening: the airflow is shared between them by free area.",
    needsSpace: (label: string) => `Say which kind of space ${label} draws its air from.`,
    otherSpace: (label: string) => `${label} draws from a space entered as "other", which the rulebook's list cannot judge. Choose the kind of space, or check it against your code.`,
    spaceAllowed: (label: string, space: string) => `${label} draws from ${aSpace(space)}, which the rulebook does not prohibit.`,
    spaceProhibited: (label: string, space: string, note: string) =>
      `${label} draws return air from ${aSpace(space)}, which the rulebook prohibits. Move the return to a permitted space or close it off.${note ? ` Exception: ${note} If it applies, say so and keep the evidence.` : ""}`,
    exceptionConfirmed: (label: string, space: string, note: string) =>
      `${label} draws from ${aSpace(space)}, normally prohibited; you confirmed the exception applies: ${note} Keep the evidence for the inspector.`,
    soleSourceNeedsInfo: (label: string, space: string) =>
      `${label} draws from ${aSpace(space)} that holds a fuel-burning appliance: say whether it is the system's only return source.`,
    soleSourceFail: (label: string, space: string, note: string) =>
      `${label} makes ${aSpace(space)} holding a fuel-burning appliance the only source of return air, which can depressurise the room and pull flue gases out of the draft hood. Add a return from another space.${note ? ` Exception: ${note} If it applies, say so.` : ""}`,
    soleSourceOk: (label: string, space: string) =>
      `${label} draws from ${aSpace(space)} holding a fuel-burning appliance, but it is not the only return source.`,
    distancePass: (label: string, distanceFt: number, minFt: number) =>
      `${label} is ${ft(distanceFt)} from the nearest draft hood or open combustion chamber in the same space; at least ${ft(minFt)} is needed.`,
    distanceFail: (label: string, distanceFt: number, minFt: number) =>
      `${label} is only ${ft(distanceFt)} from a draft hood or open combustion chamber in the same space; it must be at least ${ft(minFt)} away, or it can pull flue gases into the house. Move the return opening.`,
    distanceNeedsInfo: (label: string) => `Measure the distance from ${label} to the nearest draft hood or open combustion chamber in the same space.`,
    fuelApplianceNeedsInfo: (label: string) =>
      `Say whether the space ${label} draws from holds a fuel-burning appliance with a draft hood or open combustion chamber.`,
    noFuelAppliance: (label: string) => `No fuel-burning appliance is in the space ${label} draws from, so the draft-hood distance does not apply.`,
    furnaceCitation: "Furnace rating plate or instructions (as entered)",
  },
} as const;
