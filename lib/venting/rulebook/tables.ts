import { z } from "zod";
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
import type { RulebookTableKey } from "./table-definitions";

export {
  RULEBOOK_TABLES,
  RULEBOOK_TABLE_KEYS,
  type ColumnDefinition,
  type ColumnKind,
  type RulebookTableKey,
  type TableDefinition,
} from "./table-definitions";

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
/** Row of the `ventConnectorCapacity` table: one cell set of a multiple-appliance vent connector table. */
export const ventConnectorCapacityRowSchema = z.object({
  ventMaterial: z.enum(VENT_MATERIALS),
  connectorMaterial: z.enum(CONNECTOR_MATERIALS),
  /** Total vent height H, from the highest draft-hood outlet or flue collar to the top of the common vent, ft. */
  heightFt: num,
  /** Connector rise R, from the appliance's outlet to where its gases meet the common vent, ft. */
  riseFt: num,
  diameterIn: num,
  fanMinBtuh: num.nullable(),
  fanMaxBtuh: num.nullable(),
  naturalMaxBtuh: num.nullable(),
  citation,
});
/** Row of the `commonVentCapacity` table: the common vent of a multiple-appliance table, by height and diameter. */
export const commonVentCapacityRowSchema = z.object({
  ventMaterial: z.enum(VENT_MATERIALS),
  connectorMaterial: z.enum(CONNECTOR_MATERIALS),
  heightFt: num,
  diameterIn: num,
  fanFanMaxBtuh: num.nullable(),
  fanNatMaxBtuh: num.nullable(),
  natNatMaxBtuh: num.nullable(),
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

/** Row of the `returnAirSpaces` table: whether return air may be drawn from a kind of space. */
export const returnAirSpaceRowSchema = z.object({
  space: z.enum(RETURN_AIR_SPACES),
  prohibited: z.boolean(),
  exceptionNote: z.string(),
  citation,
});

/** The row type of a table. */
export type RulebookRow<K extends RulebookTableKey> = z.infer<typeof rulebookContentSchema>[K][number];

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
  // Rulebook versions stored before the multiple-appliance tables existed read as empty tables.
  ventConnectorCapacity: z.array(ventConnectorCapacityRowSchema).default([]),
  commonVentCapacity: z.array(commonVentCapacityRowSchema).default([]),
  louverShares: z.array(louverShareRowSchema),
  flueCoLimits: z.array(flueCoLimitRowSchema),
  // Rulebook versions stored before return air was checked have no such table.
  returnAirSpaces: z.array(returnAirSpaceRowSchema).default([]),
});

/** Rulebook content as stored in a rulebook version. */
export type RulebookContent = z.infer<typeof rulebookContentSchema>;

/** Parameter row. */
export type ParameterRow = z.infer<typeof parameterRowSchema>;
/** Capacity row. */
export type CapacityRow = z.infer<typeof capacityRowSchema>;
/** Multiple-appliance vent connector capacity row. */
export type VentConnectorCapacityRow = z.infer<typeof ventConnectorCapacityRowSchema>;
/** Multiple-appliance common vent capacity row. */
export type CommonVentCapacityRow = z.infer<typeof commonVentCapacityRowSchema>;
/** Return-air space row. */
export type ReturnAirSpaceRow = z.infer<typeof returnAirSpaceRowSchema>;
/** Termination-height row. */
export type TerminationHeightRow = z.infer<typeof terminationHeightRowSchema>;
