import { z } from "zod";
import {
  AIR_OPENING_KINDS,
  APPLIANCE_KINDS,
  CONNECTOR_MATERIALS,
  DRAFT_TYPES,
  FUELS,
  LOUVER_TYPES,
  OPENING_POSITIONS,
  ORIENTATIONS,
  PASSAGES,
  RETURN_AIR_SPACES,
  TERMINATION_OPENINGS,
  VENT_CATEGORIES,
  VENT_MATERIALS,
} from "./enums";
import { fmt } from "./format";

/**
 * Inputs of the engine. Every measured or observed field is optional and nullable so that a
 * half-filled draft still evaluates; a check that needs a missing value reports `needs-info`.
 */

const id = z.string().min(1).max(100);

/**
 * A measured quantity within the range a residential or light-commercial job can have, so that
 * a slip of the finger (an extra zero, a value in the wrong unit) is caught with a message
 * naming the field, the range and its unit instead of reaching the checks. Optional and
 * nullable like every measured field.
 */
function quantity(label: string, min: number, max: number, unit: string, options: { aboveMin?: boolean } = {}) {
  const sentence = `${label} must be ${options.aboveMin ? "more than" : "between"} ${fmt(min)}${options.aboveMin ? " and at most" : " and"} ${fmt(max)}${unit ? ` ${unit}` : ""}`;
  const range = sentence.endsWith(".") ? sentence : `${sentence}.`;
  const base = z.number({ error: `${label} must be a number${unit ? ` in ${unit}` : ""}.` });
  return (options.aboveMin ? base.gt(min, { error: range }) : base.min(min, { error: range })).max(max, { error: range }).nullish();
}

/** A whole count from 0 up to `max`. */
function count(label: string, max: number) {
  const range = `${label} must be a whole number between 0 and ${fmt(max)}.`;
  return z.int({ error: range }).min(0, { error: range }).max(max, { error: range }).nullish();
}

/** Ranges shared by several fields, in the field's unit. */
const LENGTH_FT = [0, 500] as const;
const HEIGHT_FT = [0, 300] as const;
const DIAMETER_IN = [1, 48] as const;
const INPUT_BTUH = [0, 10_000_000] as const;
const CLEARANCE_IN = [0, 120] as const;
const TURNS = 50;
const CO_PPM = [0, 10_000] as const;
const TEMPERATURE_F = [-60, 600] as const;

/** A gas appliance. */
export const applianceSchema = z.object({
  id,
  label: z.string().max(200).default(""),
  kind: z.enum(APPLIANCE_KINDS).nullish(),
  fuel: z.enum(FUELS).nullish(),
  /** Rated input from the rating plate, Btu/h. */
  inputBtuh: quantity("Input", ...INPUT_BTUH, "Btu/h"),
  category: z.enum(VENT_CATEGORIES).nullish(),
  draft: z.enum(DRAFT_TYPES).nullish(),
  /** Flue collar or draft-hood outlet diameter, in. */
  outletDiameterIn: quantity("Outlet diameter", ...DIAMETER_IN, "in"),
  /** Listed by a testing agency. */
  listed: z.boolean().nullish(),
  /** Connector clearance to combustibles stated in the appliance's instructions, in; governs when given. */
  manualClearanceIn: quantity("Clearance from the appliance instructions", ...CLEARANCE_IN, "in"),
  condensing: z.boolean().nullish(),
});

/** One piece of vent connector between the appliance outlet and the vent. */
export const connectorSegmentSchema = z.object({
  id,
  /** Appliance this connector belongs to; may be omitted when the run serves one appliance. */
  applianceId: id.nullish(),
  material: z.enum(CONNECTOR_MATERIALS).nullish(),
  diameterIn: quantity("Diameter", ...DIAMETER_IN, "in"),
  /** Length along the pipe, ft. */
  lengthFt: quantity("Length", ...LENGTH_FT, "ft"),
  orientation: z.enum(ORIENTATIONS).nullish(),
  /** Rise over the segment's length when horizontal, in. */
  riseIn: quantity("Rise", -600, 600, "in"),
  turns45: count("Turns of 45°", TURNS),
  turns90: count("Turns of 90°", TURNS),
  /** Measured clearance to the nearest combustible material, in. */
  clearanceIn: quantity("Clearance", ...CLEARANCE_IN, "in"),
  supportsInstalled: count("Supports", 500),
  /** Fewest fasteners found at any joint of the segment. */
  fastenersPerJoint: count("Fasteners per joint", 20),
  joints: count("Joints", 500),
  /** Every section locked (seams and joints engaged as listed). */
  sectionsLocked: z.boolean().nullish(),
  passesThrough: z.enum(PASSAGES).nullish(),
  /** A listed ventilated thimble where the segment passes through a wall. */
  thimble: z.boolean().nullish(),
});

/** The vent the connectors join. */
export const ventSchema = z.object({
  material: z.enum(VENT_MATERIALS).nullish(),
  diameterIn: quantity("Vent diameter", ...DIAMETER_IN, "in"),
  /** From the highest draft-hood outlet or flue collar to the top of the vent, ft. */
  heightFt: quantity("Vent height", ...HEIGHT_FT, "ft"),
  /** Horizontal offset in the vent itself, ft. */
  lateralFt: quantity("Vent lateral", ...LENGTH_FT, "ft"),
  turns45: count("Turns of 45°", TURNS),
  turns90: count("Turns of 90°", TURNS),
  serves: z.enum(["single", "common"]).nullish(),
  /** Horizontal length of a manifold joining the connectors before the common vent, ft (0 or empty: none). */
  manifoldLengthFt: quantity("Manifold length", ...LENGTH_FT, "ft"),
});

/** A building opening near the termination. */
export const terminationOpeningSchema = z.object({
  id,
  kind: z.enum(TERMINATION_OPENINGS),
  /** Shortest distance from the termination to the opening, ft. */
  distanceFt: quantity("Distance to the opening", ...LENGTH_FT, "ft"),
  /** How far the termination is above the opening, ft (negative when below). */
  ventAboveFt: quantity("Height above the opening", -HEIGHT_FT[1], HEIGHT_FT[1], "ft"),
});

/** Where the vent ends. */
export const terminationSchema = z.object({
  /** Roof pitch as rise in inches per 12 in of run. */
  roofPitchPer12: quantity("Roof pitch", 0, 48, "in per 12"),
  /** Height of the lowest discharge opening above the roof where the vent passes through, ft. */
  heightAboveRoofFt: quantity("Height above the roof", ...HEIGHT_FT, "ft"),
  /** Size of the vent cap, in; with `listedCap`, whether the roof-pitch table applies. */
  capSizeIn: quantity("Cap size", ...DIAMETER_IN, "in"),
  listedCap: z.boolean().nullish(),
  distanceToVerticalWallFt: quantity("Distance to a vertical wall", ...LENGTH_FT, "ft"),
  /** Height above any part of the building within 10 ft, ft (needed outside the pitch table). */
  heightAboveNearbyStructureFt: quantity("Height above the building within 10 ft", -HEIGHT_FT[1], HEIGHT_FT[1], "ft"),
  nearbyOpenings: z.array(terminationOpeningSchema).default([]),
});

/** Everything from the appliance outlet(s) to the termination. */
export const ventRunSchema = z.object({
  id: id.default("vent-run"),
  /** Appliances served; when omitted, every non-direct-vent appliance of the inspection. */
  applianceIds: z.array(id).nullish(),
  segments: z.array(connectorSegmentSchema).default([]),
  vent: ventSchema.default({}),
  termination: terminationSchema.nullish(),
});

/** A room of an air space. */
export const roomSchema = z.object({
  id,
  label: z.string().max(200).default(""),
  lengthFt: quantity("Room length", ...LENGTH_FT, "ft"),
  widthFt: quantity("Room width", ...LENGTH_FT, "ft"),
  heightFt: quantity("Room height", ...HEIGHT_FT, "ft"),
  /** Volume when the room is not a simple box, ft³; used in place of the dimensions. */
  volumeCuFt: quantity("Room volume", 0, 10_000_000, "ft³"),
  /** Joined to the appliance room without a door (one open space). */
  openToApplianceRoom: z.boolean().nullish(),
});

/** A proposed or existing combustion-air opening. */
export const airOpeningSchema = z.object({
  id,
  kind: z.enum(AIR_OPENING_KINDS),
  /** For indoor openings: the room it joins to the appliance's space. */
  roomId: id.nullish(),
  position: z.enum(OPENING_POSITIONS).nullish(),
  widthIn: quantity("Opening width", 0, 600, "in"),
  heightIn: quantity("Opening height", 0, 600, "in"),
  /** For round ducts instead of width × height, in. */
  diameterIn: quantity("Duct diameter", 0, 120, "in"),
  louver: z.enum(LOUVER_TYPES).default("none"),
  /** Free-area share stated by the louver maker (0–1); required for `other`. */
  freeAreaShare: quantity("Free-area share", 0, 1, "(a share: 0.75 for 75 %)"),
  /** Free area stated outright, in²; takes the place of dimensions × share. */
  freeAreaSqIn: quantity("Free area", 0, 100_000, "in²"),
});

/** A room or set of connected rooms supplying combustion air. */
export const airSpaceSchema = z.object({
  id: id.default("air-space"),
  /** Room holding the appliances; defaults to the first room. */
  applianceRoomId: id.nullish(),
  rooms: z.array(roomSchema).default([]),
  /** Appliances in the space; when omitted, every appliance of the inspection. */
  applianceIds: z.array(id).nullish(),
  /** Known air changes per hour of the building, when measured. */
  airChangesPerHour: quantity("Air changes per hour", 0.01, 10, "ACH"),
  openings: z.array(airOpeningSchema).default([]),
});

/** Field readings for one appliance. */
export const readingsSchema = z.object({
  applianceId: id,
  /** Draft at steady state, in. w.c. (negative is draft toward the vent). */
  draftInWc: quantity("Draft", -1, 1, "in. w.c."),
  /** Seconds of spillage at the draft hood before the draft was established. */
  spillageSeconds: quantity("Spillage time", 0, 3600, "s"),
  /** Flue CO as measured (not air-free), ppm. */
  flueCoPpm: quantity("Flue CO", ...CO_PPM, "ppm"),
  /** Flue O2, % (20.9 % is outdoor air). */
  flueO2Pct: quantity("Flue O2", 0, 20.9, "%"),
  /** Ambient CO in the appliance space, ppm. */
  ambientCoPpm: quantity("Ambient CO", ...CO_PPM, "ppm"),
  supplyTempF: quantity("Supply temperature", ...TEMPERATURE_F, "°F"),
  returnTempF: quantity("Return temperature", ...TEMPERATURE_F, "°F"),
  /** Temperature-rise range on the rating plate, °F. */
  nameplateRiseMinF: quantity("Rating-plate rise, low end", 0, 200, "°F"),
  nameplateRiseMaxF: quantity("Rating-plate rise, high end", 0, 200, "°F"),
  /** Gas meter test dial size, ft³ per revolution. */
  meterDialCuFt: quantity("Meter dial size", 0, 100, "ft³", { aboveMin: true }),
  /** Seconds per revolution of that dial; at least a second, as no hand-timed dial turns faster. */
  meterSecondsPerRev: quantity("Seconds per revolution", 1, 3600, "s"),
  /** Heating value of the gas from the utility or supplier, Btu/ft³. */
  heatingValueBtuPerCuFt: quantity("Heating value", 500, 3500, "Btu/ft³"),
});

/** An appliance taken off a previously common vent. */
export const removedApplianceSchema = z.object({
  id,
  label: z.string().max(200).default(""),
  inputBtuh: quantity("Input", ...INPUT_BTUH, "Btu/h"),
});

/**
 * A measured return-air quantity with a physically sensible range. The message names the field
 * and the range, so the form and the API can show it as it stands.
 */
function returnAirQuantity(field: string, unit: string, min: number, max: number, minExclusive = false) {
  const range = `between ${fmt(min)} and ${fmt(max)} ${unit}`;
  const message = `${field} must be ${minExclusive ? "more than" : "at least"} ${fmt(min)} and at most ${fmt(max)} ${unit}.`;
  const base = z.number({ error: `${field} must be a number ${range}.` });
  return (minExclusive ? base.gt(min, message) : base.min(min, message)).max(max, message).nullish();
}

/** One return-air opening or grille serving the furnace. */
export const returnAirOpeningSchema = z.object({
  id,
  label: z.string().max(200).default(""),
  widthIn: returnAirQuantity("Return opening width", "in", 0, 240, true),
  heightIn: returnAirQuantity("Return opening height", "in", 0, 240, true),
  /** Round duct or grille instead of width × height, in. */
  diameterIn: returnAirQuantity("Return opening diameter", "in", 0, 60, true),
  /** Free area as a share of the gross opening, from the grille maker (1 for an open duct). */
  freeAreaShare: returnAirQuantity("Grille free-area share", "(a share: 0.75 is 75 %)", 0, 1, true),
  /** Free area stated outright, in²; takes the place of dimensions × share. */
  freeAreaSqIn: returnAirQuantity("Stated free area", "in²", 0, 20000, true),
  /** The grille holds the system's filter (a filter grille). */
  filterGrille: z.boolean().nullish(),
  /** The kind of space the opening draws from. */
  space: z.enum(RETURN_AIR_SPACES).nullish(),
  /** A fuel-burning appliance with a draft hood or open combustion chamber is in that space. */
  fuelApplianceInSpace: z.boolean().nullish(),
  /** Distance to the nearest such draft hood or open combustion chamber in the same space, ft. */
  distanceToDraftHoodFt: returnAirQuantity("Distance to the draft hood", "ft", 0, 500),
  /** That space is the system's only source of return air. */
  soleReturnSource: z.boolean().nullish(),
  /** The installer confirms the exception the rulebook notes for this space applies. */
  exceptionApplies: z.boolean().nullish(),
});

/** The return-air side of a furnace: its output, its airflow and the openings it draws through. */
export const returnAirSchema = z.object({
  id: id.default("return-air"),
  /** The furnace the return serves; defaults to the only furnace of the inspection. */
  applianceId: id.nullish(),
  /** Heating output from the rating plate, Btu/h; otherwise input × efficiency. */
  outputBtuh: returnAirQuantity("Furnace output", "Btu/h", 0, 1000000, true),
  /** Efficiency used to turn the rated input into output, %. */
  efficiencyPct: returnAirQuantity("Furnace efficiency", "%", 0, 100, true),
  /** Blower airflow from the rating plate or the maker's table, cfm. */
  airflowCfm: returnAirQuantity("Airflow", "cfm", 0, 20000, true),
  /** Nominal cooling capacity served by the same blower, tons. */
  coolingTons: returnAirQuantity("Cooling capacity", "tons", 0, 50, true),
  /** Temperature rise across the furnace, °F; otherwise supply − return from the readings. */
  temperatureRiseF: returnAirQuantity("Temperature rise", "°F", 0, 200, true),
  openings: z.array(returnAirOpeningSchema).max(20, "At most 20 return openings.").default([]),
});

/** A complete check request: the appliances with an optional vent run, air space and readings. */
export const checkInputSchema = z.object({
  appliances: z.array(applianceSchema).min(1),
  ventRun: ventRunSchema.nullish(),
  airSpace: airSpaceSchema.nullish(),
  /** One entry per appliance, matched by `applianceId`. */
  readings: z.array(readingsSchema).nullish(),
  /** Appliances removed from a vent that was common; the ones left are re-checked alone. */
  removedAppliances: z.array(removedApplianceSchema).nullish(),
  /** The return-air side of a furnace replacement. */
  returnAir: returnAirSchema.nullish(),
});

export type Appliance = z.infer<typeof applianceSchema>;
export type ConnectorSegment = z.infer<typeof connectorSegmentSchema>;
export type Vent = z.infer<typeof ventSchema>;
export type TerminationOpeningInput = z.infer<typeof terminationOpeningSchema>;
export type Termination = z.infer<typeof terminationSchema>;
export type VentRun = z.infer<typeof ventRunSchema>;
export type Room = z.infer<typeof roomSchema>;
export type AirOpening = z.infer<typeof airOpeningSchema>;
export type AirSpace = z.infer<typeof airSpaceSchema>;
export type Readings = z.infer<typeof readingsSchema>;
export type RemovedAppliance = z.infer<typeof removedApplianceSchema>;
export type ReturnAirOpening = z.infer<typeof returnAirOpeningSchema>;
export type ReturnAir = z.infer<typeof returnAirSchema>;
export type CheckInput = z.infer<typeof checkInputSchema>;
/** A check request before defaults are applied (what a client sends). */
export type CheckInputRaw = z.input<typeof checkInputSchema>;
