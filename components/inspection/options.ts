import type { AirOpeningKind, ApplianceKind, ConnectorMaterial, DraftType, Fuel, LouverType, Passage, ReturnAirSpace, TerminationOpening, VentCategory, VentMaterial } from "@/lib/venting";

/** Labels for the engine's value lists, in the trade's words. */
export const APPLIANCE_KIND_LABELS = { furnace: "Furnace", boiler: "Boiler", water_heater: "Water heater", other: "Other" } as const satisfies Record<ApplianceKind, string>;
export const FUEL_LABELS = { natural_gas: "Natural gas", propane: "Propane (LP)" } as const satisfies Record<Fuel, string>;
export const CATEGORY_LABELS = { I: "Category I", II: "Category II", III: "Category III", IV: "Category IV" } as const satisfies Record<VentCategory, string>;
export const DRAFT_LABELS = { natural: "Natural draft (draft hood)", fan_assisted: "Fan-assisted", direct_vent: "Direct-vent / sealed combustion" } as const satisfies Record<DraftType, string>;
export const CONNECTOR_MATERIAL_LABELS = { single_wall: "Single-wall metal", type_b: "Type B double-wall" } as const satisfies Record<ConnectorMaterial, string>;
export const VENT_MATERIAL_LABELS = { type_b: "Type B double-wall", single_wall: "Single-wall metal", masonry_lined: "Lined masonry chimney" } as const satisfies Record<VentMaterial, string>;
export const PASSAGE_LABELS = {
  none: "Open space in the appliance room",
  attic: "Attic",
  concealed_space: "Concealed space (chase, soffit)",
  floor: "Through a floor",
  ceiling: "Through a ceiling",
  wall: "Through a wall",
  crawl_space: "Crawl space",
} as const satisfies Record<Passage, string>;
export const TERMINATION_OPENING_LABELS = { door: "Door", operable_window: "Operable window", gravity_inlet: "Gravity air inlet", mechanical_inlet: "Mechanical (forced) air inlet" } as const satisfies Record<TerminationOpening, string>;
export const AIR_OPENING_KIND_LABELS = {
  indoor_same_story: "Indoor, same story",
  indoor_different_stories: "Indoor, between stories",
  outdoor_direct_or_vertical_duct: "Outdoor, direct or vertical duct",
  outdoor_horizontal_duct: "Outdoor, horizontal duct",
  outdoor_single_high: "Outdoor, single high opening",
} as const satisfies Record<AirOpeningKind, string>;
export const LOUVER_LABELS = { none: "No louver or grille", wood: "Wood louver", metal: "Metal louver", other: "Other (stated free area)" } as const satisfies Record<LouverType, string>;
export const RETURN_AIR_SPACE_LABELS = {
  living_area: "Living area",
  bedroom: "Bedroom",
  hallway: "Hallway",
  appliance_room: "Room with a fuel-burning appliance (e.g. open basement)",
  bathroom: "Bathroom",
  toilet_room: "Toilet room",
  kitchen: "Kitchen",
  closet: "Closet",
  garage: "Garage",
  unconditioned_space: "Unconditioned attic or crawl space",
  other: "Other",
} as const satisfies Record<ReturnAirSpace, string>;
