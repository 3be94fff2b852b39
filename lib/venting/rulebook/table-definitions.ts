import {
  APPLIANCE_KINDS,
  APPLIANCE_LISTINGS,
  CONNECTOR_MATERIALS,
  ORIENTATIONS,
  RATED_LOUVER_TYPES,
  RESTRICTED_PASSAGES,
  RETURN_AIR_SPACES,
  TERMINATION_OPENINGS,
  VENT_MATERIALS,
  VENT_SYSTEMS,
} from "../enums";
import { PARAMETER_KEYS } from "./parameters";

/**
 * Column metadata of every rulebook table, without any validation code: grids, CSV and the
 * findings (which name a table by its title) use it in the browser too. The row schemas are in
 * ./tables.
 */

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
  /** Columns that together identify a row; two rows with the same values are duplicates. */
  readonly uniqueBy: readonly string[];
  /** True for a table added after rulebooks were first stored: a stored version without it reads as empty. */
  readonly addedLater?: boolean;
}

const citationColumn = {
  key: "citation",
  label: "Citation",
  kind: "text",
  required: true,
} as const satisfies ColumnDefinition;

/** Every rulebook table with its columns and uniqueness rule; the row schemas are in ./tables. */
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
    uniqueBy: ["ventMaterial", "connectorMaterial", "heightFt", "lateralFt", "diameterIn"],
  },
  ventConnectorCapacity: {
    title: "Vent connector capacity (two or more appliances)",
    description:
      "Each appliance's connector into a common vent: input limits by total vent height H, connector rise R and connector diameter. Leave a cell empty where the table gives no value.",
    columns: [
      { key: "ventMaterial", label: "Vent material", kind: "enum", options: VENT_MATERIALS, required: true },
      { key: "connectorMaterial", label: "Connector material", kind: "enum", options: CONNECTOR_MATERIALS, required: true },
      { key: "heightFt", label: "Vent height H", unit: "ft", kind: "number", required: true, min: 0 },
      { key: "riseFt", label: "Connector rise R", unit: "ft", kind: "number", required: true, min: 0 },
      { key: "diameterIn", label: "Connector diameter", unit: "in", kind: "number", required: true, min: 0 },
      { key: "fanMinBtuh", label: "Fan-assisted min", unit: "Btu/h", kind: "number", required: false, min: 0 },
      { key: "fanMaxBtuh", label: "Fan-assisted max", unit: "Btu/h", kind: "number", required: false, min: 0 },
      { key: "naturalMaxBtuh", label: "Natural-draft max", unit: "Btu/h", kind: "number", required: false, min: 0 },
      citationColumn,
    ],
    uniqueBy: ["ventMaterial", "connectorMaterial", "heightFt", "riseFt", "diameterIn"],
    addedLater: true,
  },
  commonVentCapacity: {
    title: "Common vent capacity (two or more appliances)",
    description:
      "Largest combined input of the common vent by total vent height H and common-vent diameter, for two fan-assisted appliances, one of each, or two natural-draft. Leave a cell empty where the table gives no value.",
    columns: [
      { key: "ventMaterial", label: "Vent material", kind: "enum", options: VENT_MATERIALS, required: true },
      { key: "connectorMaterial", label: "Connector material", kind: "enum", options: CONNECTOR_MATERIALS, required: true },
      { key: "heightFt", label: "Vent height H", unit: "ft", kind: "number", required: true, min: 0 },
      { key: "diameterIn", label: "Common vent diameter", unit: "in", kind: "number", required: true, min: 0 },
      { key: "fanFanMaxBtuh", label: "FAN+FAN max", unit: "Btu/h", kind: "number", required: false, min: 0 },
      { key: "fanNatMaxBtuh", label: "FAN+NAT max", unit: "Btu/h", kind: "number", required: false, min: 0 },
      { key: "natNatMaxBtuh", label: "NAT+NAT max", unit: "Btu/h", kind: "number", required: false, min: 0 },
      citationColumn,
    ],
    uniqueBy: ["ventMaterial", "connectorMaterial", "heightFt", "diameterIn"],
    addedLater: true,
  },
  louverShares: {
    title: "Louver free-area share",
    description: "Free area as a share of the gross opening when the louver's own rating is unknown.",
    columns: [
      { key: "louver", label: "Louver", kind: "enum", options: RATED_LOUVER_TYPES, required: true },
      { key: "freeAreaShare", label: "Free-area share", unit: "share (0–1)", kind: "number", required: true, min: 0, max: 1 },
      citationColumn,
    ],
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
    uniqueBy: ["applianceKind"],
  },
  returnAirSpaces: {
    title: "Return-air spaces",
    description:
      "Spaces a furnace's return air may not be drawn from, with the exception the code allows. For the appliance room, the note holds the exceptions to the sole-source rule.",
    columns: [
      { key: "space", label: "Space", kind: "enum", options: RETURN_AIR_SPACES, required: true },
      { key: "prohibited", label: "Prohibited", kind: "boolean", required: true },
      { key: "exceptionNote", label: "Exception", kind: "text", required: false },
      citationColumn,
    ],
    uniqueBy: ["space"],
    addedLater: true,
  },
} as const satisfies Record<string, TableDefinition>;

/** Key of a rulebook table. */
export type RulebookTableKey = keyof typeof RULEBOOK_TABLES;

/** All table keys in display order. */
export const RULEBOOK_TABLE_KEYS = Object.keys(RULEBOOK_TABLES) as RulebookTableKey[];
