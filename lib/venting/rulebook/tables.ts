import { z } from "zod";
import {
  APPLIANCE_KINDS,
  APPLIANCE_LISTINGS,
  CONNECTOR_MATERIALS,
  ORIENTATIONS,
  RATED_LOUVER_TYPES,
  RESTRICTED_PASSAGES,
  TERMINATION_OPENINGS,
  VENT_MATERIALS,
  VENT_SYSTEMS,
} from "../enums";
import { PARAMETER_KEYS } from "./parameters";

/**
 * The rulebook is a set of tables. Every row carries the citation the user typed for it, so a
 * finding can always name the source of the number it used.
 */

const citation = z.string();
const num = z.number();

/** Row of the `parameters` table: one named scalar value. */
export const parameterRowSchema = z.object({
  key: z.enum(PARAMETER_KEYS),
  value: num,
  unit: z.string(),
  citation,
});
/** Row of the `connectorLengthShare` table. */
export const connectorLengthShareRowSchema = z.object({
  connectorMaterial: z.enum(CONNECTOR_MATERIALS),
  shareOfVentHeight: num,
  citation,
});
/** Row of the `clearances` table. */
export const clearanceRowSchema = z.object({
  pipeMaterial: z.enum(CONNECTOR_MATERIALS),
  applianceListing: z.enum(APPLIANCE_LISTINGS),
  clearanceIn: num,
  citation,
});
/** Row of the `supportSpacing` table. */
export const supportSpacingRowSchema = z.object({
  material: z.enum(CONNECTOR_MATERIALS),
  orientation: z.enum(ORIENTATIONS),
  maxSpacingFt: num,
  citation,
});
/** Row of the `fasteners` table. */
export const fastenerRowSchema = z.object({
  material: z.enum(CONNECTOR_MATERIALS),
  minPerJoint: num,
  citation,
});
/** Row of the `prohibitedPassages` table. */
export const prohibitedPassageRowSchema = z.object({
  material: z.enum(CONNECTOR_MATERIALS),
  passage: z.enum(RESTRICTED_PASSAGES),
  prohibited: z.boolean(),
  allowedWithThimble: z.boolean(),
  note: z.string(),
  citation,
});
/** Row of the `terminationHeights` table: roof pitch range (rise per 12) → minimum height. */
export const terminationHeightRowSchema = z.object({
  pitchFromPer12: num,
  pitchToPer12: num,
  minHeightFt: num,
  citation,
});
/** Row of the `terminationDistances` table. */
export const terminationDistanceRowSchema = z.object({
  ventSystem: z.enum(VENT_SYSTEMS),
  opening: z.enum(TERMINATION_OPENINGS),
  minDistanceFt: num,
  orAboveFt: num.nullable(),
  citation,
});
/** Row of the `capacity` table: one cell set of a single-appliance capacity table. */
export const capacityRowSchema = z.object({
  ventMaterial: z.enum(VENT_MATERIALS),
  connectorMaterial: z.enum(CONNECTOR_MATERIALS),
  heightFt: num,
  lateralFt: num,
  diameterIn: num,
  fanMinBtuh: num.nullable(),
  fanMaxBtuh: num.nullable(),
  naturalMaxBtuh: num.nullable(),
  citation,
});
/** Row of the `louverShares` table. */
export const louverShareRowSchema = z.object({
  louver: z.enum(RATED_LOUVER_TYPES),
  freeAreaShare: num,
  citation,
});
/** Row of the `flueCoLimits` table. */
export const flueCoLimitRowSchema = z.object({
  applianceKind: z.enum(APPLIANCE_KINDS),
  maxAirFreeCoPpm: num,
  citation,
});

/** How a column's cells are typed. */
export type ColumnKind = "number" | "text" | "enum" | "boolean";

/** Metadata of one editable column, for grids and CSV. */
export interface ColumnDefinition {
  readonly key: string;
  readonly label: string;
  readonly unit?: string;
  readonly kind: ColumnKind;
  readonly options?: readonly string[];
  /** False when the cell may be left empty (null number or empty text). */
  readonly required: boolean;
  /** Smallest allowed value of a number column (inclusive). */
  readonly min?: number;
  /** Largest allowed value of a number column (inclusive). */
  readonly max?: number;
  /** True when a number column takes whole numbers only. */
  readonly integer?: boolean;
}

/** Metadata of one rulebook table. */
export interface TableDefinition {
  readonly title: string;
  readonly description: string;
  readonly columns: readonly ColumnDefinition[];
  readonly rowSchema: z.ZodType;
  /** Columns that together identify a row; two rows with the same values are duplicates. */
  readonly uniqueBy: readonly string[];
}

const citationColumn = {
  key: "citation",
  label: "Citation",
  kind: "text",
  required: true,
} as const satisfies ColumnDefinition;

/** Every rulebook table with its columns, row schema and uniqueness rule. */
export const RULEBOOK_TABLES = {
  parameters: {
    title: "Parameters",
    description: "Single values: slopes, heights, air factors, reading limits. Each key has a fixed unit.",
    columns: [
      { key: "key", label: "Parameter", kind: "enum", options: PARAMETER_KEYS, required: true },
      { key: "value", label: "Value", kind: "number", required: true },
      { key: "unit", label: "Unit", kind: "text", required: true },
      citationColumn,
    ],
    rowSchema: parameterRowSchema,
    uniqueBy: ["key"],
  },
  connectorLengthShare: {
    title: "Connector horizontal length",
    description: "Longest horizontal connector run as a share of the vent height, per connector material.",
    columns: [
      { key: "connectorMaterial", label: "Connector material", kind: "enum", options: CONNECTOR_MATERIALS, required: true },
      { key: "shareOfVentHeight", label: "Share of vent height", unit: "share (0–1)", kind: "number", required: true, min: 0, max: 1 },
      citationColumn,
    ],
    rowSchema: connectorLengthShareRowSchema,
    uniqueBy: ["connectorMaterial"],
  },
  clearances: {
    title: "Clearance to combustibles",
    description: "Minimum clearance of a connector to combustible material, by pipe and appliance listing.",
    columns: [
      { key: "pipeMaterial", label: "Pipe material", kind: "enum", options: CONNECTOR_MATERIALS, required: true },
      { key: "applianceListing", label: "Appliance listing", kind: "enum", options: APPLIANCE_LISTINGS, required: true },
      { key: "clearanceIn", label: "Clearance", unit: "in", kind: "number", required: true, min: 0 },
      citationColumn,
    ],
    rowSchema: clearanceRowSchema,
    uniqueBy: ["pipeMaterial", "applianceListing"],
  },
  supportSpacing: {
    title: "Support spacing",
    description: "Longest distance between supports, by material and orientation.",
    columns: [
      { key: "material", label: "Material", kind: "enum", options: CONNECTOR_MATERIALS, required: true },
      { key: "orientation", label: "Orientation", kind: "enum", options: ORIENTATIONS, required: true },
      { key: "maxSpacingFt", label: "Max spacing", unit: "ft", kind: "number", required: true, min: 0 },
      citationColumn,
    ],
    rowSchema: supportSpacingRowSchema,
    uniqueBy: ["material", "orientation"],
  },
  fasteners: {
    title: "Fasteners per joint",
    description: "Fewest mechanical fasteners at each connector joint, by material.",
    columns: [
      { key: "material", label: "Material", kind: "enum", options: CONNECTOR_MATERIALS, required: true },
      { key: "minPerJoint", label: "Min per joint", unit: "count", kind: "number", required: true, min: 0, integer: true },
      citationColumn,
    ],
    rowSchema: fastenerRowSchema,
    uniqueBy: ["material"],
  },
  prohibitedPassages: {
    title: "Where a material may not pass",
    description: "Places a connector of each material may not run through; walls may be allowed with a listed thimble.",
    columns: [
      { key: "material", label: "Material", kind: "enum", options: CONNECTOR_MATERIALS, required: true },
      { key: "passage", label: "Passes through", kind: "enum", options: RESTRICTED_PASSAGES, required: true },
      { key: "prohibited", label: "Prohibited", kind: "boolean", required: true },
      { key: "allowedWithThimble", label: "Allowed with thimble", kind: "boolean", required: true },
      { key: "note", label: "Note", kind: "text", required: false },
      citationColumn,
    ],
    rowSchema: prohibitedPassageRowSchema,
    uniqueBy: ["material", "passage"],
  },
  terminationHeights: {
    title: "Termination height by roof pitch",
    description:
      "Minimum height of a listed-cap vent above the roof. A row covers pitches above 'from' up to and including 'to' (the first row includes 'from').",
    columns: [
      { key: "pitchFromPer12", label: "Pitch from", unit: "in per 12", kind: "number", required: true, min: 0 },
      { key: "pitchToPer12", label: "Pitch to", unit: "in per 12", kind: "number", required: true, min: 0 },
      { key: "minHeightFt", label: "Min height", unit: "ft", kind: "number", required: true, min: 0 },
      citationColumn,
    ],
    rowSchema: terminationHeightRowSchema,
    uniqueBy: ["pitchFromPer12"],
  },
  terminationDistances: {
    title: "Termination distances",
    description:
      "A termination passes when it is at least 'min distance' from the opening, or (where given) at least 'or above' higher than it.",
    columns: [
      { key: "ventSystem", label: "Vent system", kind: "enum", options: VENT_SYSTEMS, required: true },
      { key: "opening", label: "Opening", kind: "enum", options: TERMINATION_OPENINGS, required: true },
      { key: "minDistanceFt", label: "Min distance", unit: "ft", kind: "number", required: true, min: 0 },
      { key: "orAboveFt", label: "Or above by", unit: "ft", kind: "number", required: false, min: 0 },
      citationColumn,
    ],
    rowSchema: terminationDistanceRowSchema,
    uniqueBy: ["ventSystem", "opening"],
  },
  capacity: {
    title: "Vent capacity (single appliance)",
    description:
      "Input limits by vent height, lateral and diameter. Leave a cell empty where the table gives no value.",
    columns: [
      { key: "ventMaterial", label: "Vent material", kind: "enum", options: VENT_MATERIALS, required: true },
      { key: "connectorMaterial", label: "Connector material", kind: "enum", options: CONNECTOR_MATERIALS, required: true },
      { key: "heightFt", label: "Height", unit: "ft", kind: "number", required: true, min: 0 },
      { key: "lateralFt", label: "Lateral", unit: "ft", kind: "number", required: true, min: 0 },
      { key: "diameterIn", label: "Diameter", unit: "in", kind: "number", required: true, min: 0 },
      { key: "fanMinBtuh", label: "Fan-assisted min", unit: "Btu/h", kind: "number", required: false, min: 0 },
      { key: "fanMaxBtuh", label: "Fan-assisted max", unit: "Btu/h", kind: "number", required: false, min: 0 },
      { key: "naturalMaxBtuh", label: "Natural-draft max", unit: "Btu/h", kind: "number", required: false, min: 0 },
      citationColumn,
    ],
    rowSchema: capacityRowSchema,
    uniqueBy: ["ventMaterial", "connectorMaterial", "heightFt", "lateralFt", "diameterIn"],
  },
  louverShares: {
    title: "Louver free-area share",
    description: "Free area as a share of the gross opening when the louver's own rating is unknown.",
    columns: [
      { key: "louver", label: "Louver", kind: "enum", options: RATED_LOUVER_TYPES, required: true },
      { key: "freeAreaShare", label: "Free-area share", unit: "share (0–1)", kind: "number", required: true, min: 0, max: 1 },
      citationColumn,
    ],
    rowSchema: louverShareRowSchema,
    uniqueBy: ["louver"],
  },
  flueCoLimits: {
    title: "Flue CO limits",
    description: "Highest air-free CO in the flue gases, by appliance kind.",
    columns: [
      { key: "applianceKind", label: "Appliance kind", kind: "enum", options: APPLIANCE_KINDS, required: true },
      { key: "maxAirFreeCoPpm", label: "Max air-free CO", unit: "ppm", kind: "number", required: true, min: 0 },
      citationColumn,
    ],
    rowSchema: flueCoLimitRowSchema,
    uniqueBy: ["applianceKind"],
  },
} as const satisfies Record<string, TableDefinition>;

/** Key of a rulebook table. */
export type RulebookTableKey = keyof typeof RULEBOOK_TABLES;

/** All table keys in display order. */
export const RULEBOOK_TABLE_KEYS = Object.keys(RULEBOOK_TABLES) as RulebookTableKey[];

/** The row type of a table. */
export type RulebookRow<K extends RulebookTableKey> = z.infer<(typeof RULEBOOK_TABLES)[K]["rowSchema"]>;

/** The whole rulebook content: edition text, an optional demo-data note and every table. */
export const rulebookContentSchema = z.object({
  edition: z.string(),
  demoDataNote: z.string().optional(),
  parameters: z.array(parameterRowSchema),
  connectorLengthShare: z.array(connectorLengthShareRowSchema),
  clearances: z.array(clearanceRowSchema),
  supportSpacing: z.array(supportSpacingRowSchema),
  fasteners: z.array(fastenerRowSchema),
  prohibitedPassages: z.array(prohibitedPassageRowSchema),
  terminationHeights: z.array(terminationHeightRowSchema),
  terminationDistances: z.array(terminationDistanceRowSchema),
  capacity: z.array(capacityRowSchema),
  louverShares: z.array(louverShareRowSchema),
  flueCoLimits: z.array(flueCoLimitRowSchema),
});

/** Rulebook content as stored in a rulebook version. */
export type RulebookContent = z.infer<typeof rulebookContentSchema>;

/** Parameter row. */
export type ParameterRow = z.infer<typeof parameterRowSchema>;
/** Capacity row. */
export type CapacityRow = z.infer<typeof capacityRowSchema>;
/** Termination-height row. */
export type TerminationHeightRow = z.infer<typeof terminationHeightRowSchema>;
