import type { ParameterKey } from "./parameters";
import { RULEBOOK_TABLES, type ColumnDefinition } from "./table-definitions";

/**
 * Human names for the rulebook's stored keys, for the editor, CSV previews and anywhere a person
 * reads a rulebook. The stored keys stay as they are (they are what the engine and CSV files
 * use); these are only what a person sees. Kept free of zod so the editor's bundle stays small.
 */

/** Short human name of every parameter key; its unit comes from PARAMETER_DEFINITIONS. */
export const PARAMETER_LABELS = {
  connector_min_slope_in_per_ft: "Connector minimum slope",
  connector_max_length_ft_per_in_diameter: "Connector length per inch of diameter",
  connector_capacity_loss_per_extra_length_multiple_pct: "Capacity loss per extra connector length",
  vent_min_height_above_collar_ft: "Vent minimum height above the collar",
  vent_reduction_min_height_ft: "Vent height for a one-size-smaller vent",
  termination_listed_cap_max_in: "Largest cap size for the roof-pitch table",
  termination_wall_distance_min_ft: "Wall distance for the roof-pitch table",
  termination_height_otherwise_ft: "Termination height outside the table",
  capacity_interpolation_allowed: "Interpolate between capacity rows",
  capacity_assumed_90_turns_with_lateral: "90° turns the capacity table assumes",
  capacity_loss_per_extra_45_turn_pct: "Capacity loss per extra turn up to 45°",
  capacity_loss_per_extra_90_turn_pct: "Capacity loss per extra turn up to 90°",
  air_volume_per_1000_btuh_cuft: "Room volume per 1,000 Btu/h",
  infiltration_constant_other_cuft: "Infiltration constant, other appliances",
  infiltration_constant_fan_cuft: "Infiltration constant, fan-assisted",
  infiltration_ach_threshold: "Lowest air changes for the standard method",
  infiltration_ach_max: "Highest air changes the method may use",
  opening_indoor_same_story_sqin_per_1000_btuh: "Indoor openings, same story",
  opening_indoor_min_area_sqin: "Indoor opening minimum area",
  opening_indoor_different_stories_sqin_per_1000_btuh: "Indoor openings, different stories",
  opening_outdoor_vertical_btuh_per_sqin: "Outdoor openings, direct or vertical duct",
  opening_outdoor_horizontal_btuh_per_sqin: "Outdoor openings, horizontal duct",
  opening_outdoor_single_btuh_per_sqin: "One high outdoor opening",
  opening_min_dimension_in: "Air opening minimum dimension",
  combination_method_allowed: "Indoor and outdoor air may be combined",
  ambient_co_marginal_ppm: "Ambient CO caution level",
  ambient_co_max_ppm: "Ambient CO stop-work level",
  draft_max_inwc: "Weakest acceptable draft",
  spillage_max_seconds: "Longest draft-hood spillage",
  input_rate_tolerance_pct: "Clocked input tolerance",
  common_connector_assumed_90_turns: "Turns assumed in a common-vent connector",
  common_vent_loss_per_45_turn_pct: "Common vent loss per 45° turn",
  common_vent_loss_per_90_turn_pct: "Common vent loss per 90° turn",
  common_vent_offset_max_in_per_in_diameter: "Longest common-vent offset per inch",
  common_vent_manifold_loss_pct: "Common vent loss for a connector manifold",
  common_vent_manifold_max_in_per_in_diameter: "Longest connector manifold per inch",
  vent_max_area_ratio_to_outlet: "Largest vent area per outlet area",
  vent_reduction_fan_max_loss_pct: "Fan-assisted loss, vent one size smaller",
  return_air_area_sqin_per_1000_btuh_output: "Return area per 1,000 Btu/h output",
  return_air_cfm_per_ton: "Airflow per ton of cooling",
  return_air_sensible_heat_btuh_per_cfm_f: "Sensible-heat factor of air",
  return_air_grille_velocity_max_fpm: "Quiet return-grille face velocity",
  return_air_filter_grille_velocity_max_fpm: "Filter-grille face velocity",
  return_air_draft_hood_min_distance_ft: "Return distance from a draft hood",
  return_air_sole_source_fuel_space_prohibited: "No sole return from a fuel-burner room",
} as const satisfies Record<ParameterKey, string>;

/**
 * Human words for the option values of rulebook tables and inputs. A value missing here still
 * reads acceptably through {@link optionLabel}; the unit tests list the ones a table uses.
 */
export const OPTION_LABELS = {
  // Pipe and vent materials
  single_wall: "Single-wall",
  type_b: "Type B",
  masonry_lined: "Lined masonry",
  // Draft types and vent systems
  natural: "Natural draft",
  natural_draft: "Natural draft",
  fan_assisted: "Fan-assisted",
  direct_vent: "Direct vent",
  mechanical_draft: "Mechanical draft",
  any: "Any",
  // Appliances
  furnace: "Furnace",
  boiler: "Boiler",
  water_heater: "Water heater",
  other: "Other",
  listed: "Listed",
  unlisted: "Unlisted",
  // Fuels
  natural_gas: "Natural gas",
  propane: "Propane",
  // Orientation and where a pipe passes
  horizontal: "Horizontal",
  vertical: "Vertical",
  none: "None",
  attic: "Attic",
  concealed_space: "Concealed space",
  floor: "Floor",
  ceiling: "Ceiling",
  wall: "Wall",
  crawl_space: "Crawl space",
  // Openings near a termination
  door: "Door",
  operable_window: "Operable window",
  gravity_inlet: "Gravity air inlet",
  mechanical_inlet: "Mechanical air inlet",
  // Combustion-air openings and louvers
  indoor_same_story: "Indoor, same story",
  indoor_different_stories: "Indoor, different stories",
  outdoor_direct_or_vertical_duct: "Outdoor, direct or vertical duct",
  outdoor_horizontal_duct: "Outdoor, horizontal duct",
  outdoor_single_high: "Outdoor, one high opening",
  wood: "Wood",
  metal: "Metal",
  high: "High",
  low: "Low",
  // Spaces return air may be drawn from
  living_area: "Living area",
  bedroom: "Bedroom",
  hallway: "Hallway",
  appliance_room: "Appliance room",
  bathroom: "Bathroom",
  toilet_room: "Toilet room",
  kitchen: "Kitchen",
  closet: "Closet",
  garage: "Garage",
  unconditioned_space: "Unconditioned space",
} as const satisfies Record<string, string>;

/** Turns an unknown snake_case value into words: "return_plenum" → "Return plenum". */
export function humanizeValue(value: string): string {
  const words = value.replace(/[_-]+/g, " ").trim();
  return words === "" ? value : words.charAt(0).toUpperCase() + words.slice(1);
}

/** Human words for an option value, or the value made readable when it has no label yet. */
export function optionLabel(value: string): string {
  return Object.hasOwn(OPTION_LABELS, value) ? OPTION_LABELS[value as keyof typeof OPTION_LABELS] : humanizeValue(value);
}

/** Human name of a parameter key, or the key made readable when it has no label yet. */
export function parameterLabel(key: string): string {
  return Object.hasOwn(PARAMETER_LABELS, key) ? PARAMETER_LABELS[key as ParameterKey] : humanizeValue(key);
}

/** Human names of every choice the rulebook tables offer: parameter keys and option values. */
export interface RulebookChoiceLabels {
  readonly parameters: Readonly<Record<string, string>>;
  readonly options: Readonly<Record<string, string>>;
}

/**
 * The names the rulebook editor shows, built on the server and handed to the grid as data, so
 * the editor's first load carries no label tables of its own.
 */
export function rulebookChoiceLabels(): RulebookChoiceLabels {
  const parameters: Record<string, string> = {};
  const options: Record<string, string> = {};
  for (const table of Object.values(RULEBOOK_TABLES)) {
    for (const column of table.columns as readonly ColumnDefinition[]) {
      if (column.kind !== "enum") continue;
      const isParameterKey = table === RULEBOOK_TABLES.parameters && column.key === "key";
      for (const value of column.options ?? []) {
        if (isParameterKey) parameters[value] = parameterLabel(value);
        else options[value] = optionLabel(value);
      }
    }
  }
  return { parameters, options };
}
