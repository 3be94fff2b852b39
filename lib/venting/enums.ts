/** Value lists shared by the input schemas and the rulebook tables. */

/** Appliance kinds. */
export const APPLIANCE_KINDS = ["furnace", "boiler", "water_heater", "other"] as const;
/** Fuels. */
export const FUELS = ["natural_gas", "propane"] as const;
/** Venting categories I–IV. */
export const VENT_CATEGORIES = ["I", "II", "III", "IV"] as const;
/** How the appliance moves its flue gases. */
export const DRAFT_TYPES = ["natural", "fan_assisted", "direct_vent"] as const;
/** Connector pipe materials. */
export const CONNECTOR_MATERIALS = ["single_wall", "type_b"] as const;
/** Vent materials. */
export const VENT_MATERIALS = ["type_b", "single_wall", "masonry_lined"] as const;
/** Segment orientations. */
export const ORIENTATIONS = ["horizontal", "vertical"] as const;
/** Places a connector segment can pass through. */
export const PASSAGES = ["none", "attic", "concealed_space", "floor", "ceiling", "wall", "crawl_space"] as const;
/** Places a rulebook can restrict (every passage except none). */
export const RESTRICTED_PASSAGES = ["attic", "concealed_space", "floor", "ceiling", "wall", "crawl_space"] as const;
/** Appliance listing classes used by the clearance table. */
export const APPLIANCE_LISTINGS = ["listed", "unlisted"] as const;
/** Kinds of building opening near a termination. */
export const TERMINATION_OPENINGS = ["door", "operable_window", "gravity_inlet", "mechanical_inlet"] as const;
/** Vent systems a termination-distance row applies to. */
export const VENT_SYSTEMS = ["any", "natural_draft", "mechanical_draft"] as const;
/** Combustion-air opening arrangements. */
export const AIR_OPENING_KINDS = [
  "indoor_same_story",
  "indoor_different_stories",
  "outdoor_direct_or_vertical_duct",
  "outdoor_horizontal_duct",
  "outdoor_single_high",
] as const;
/** Louver or grille types over an air opening. */
export const LOUVER_TYPES = ["none", "wood", "metal", "other"] as const;
/** Louver types a rulebook gives a default free-area share for. */
export const RATED_LOUVER_TYPES = ["wood", "metal"] as const;
/** Position of an air opening in its wall. */
export const OPENING_POSITIONS = ["high", "low"] as const;

export type ApplianceKind = (typeof APPLIANCE_KINDS)[number];
export type Fuel = (typeof FUELS)[number];
export type VentCategory = (typeof VENT_CATEGORIES)[number];
export type DraftType = (typeof DRAFT_TYPES)[number];
export type ConnectorMaterial = (typeof CONNECTOR_MATERIALS)[number];
export type VentMaterial = (typeof VENT_MATERIALS)[number];
export type Orientation = (typeof ORIENTATIONS)[number];
export type Passage = (typeof PASSAGES)[number];
export type RestrictedPassage = (typeof RESTRICTED_PASSAGES)[number];
export type ApplianceListing = (typeof APPLIANCE_LISTINGS)[number];
export type TerminationOpening = (typeof TERMINATION_OPENINGS)[number];
export type VentSystem = (typeof VENT_SYSTEMS)[number];
export type AirOpeningKind = (typeof AIR_OPENING_KINDS)[number];
export type LouverType = (typeof LOUVER_TYPES)[number];
export type RatedLouverType = (typeof RATED_LOUVER_TYPES)[number];
export type OpeningPosition = (typeof OPENING_POSITIONS)[number];

/** Where a return-air opening draws its air from. */
export const RETURN_AIR_SPACES = [
  "living_area",
  "bedroom",
  "hallway",
  "appliance_room",
  "bathroom",
  "toilet_room",
  "kitchen",
  "closet",
  "garage",
  "unconditioned_space",
  "other",
] as const;
export type ReturnAirSpace = (typeof RETURN_AIR_SPACES)[number];
