/**
 * The scalar values a rulebook may hold in its `parameters` table. Each key has a fixed unit so
 * that a value typed in the wrong unit is caught when the rulebook is validated.
 */

/** Describes one allowed parameter key. */
export interface ParameterDefinition {
  /** Unit label shown beside the value and required in the row's `unit` column. */
  readonly unit: string;
  /** What the value means, in plain words. */
  readonly description: string;
  /** Smallest sensible value (inclusive). */
  readonly min?: number;
  /** Largest sensible value (inclusive). */
  readonly max?: number;
  /** True when the value is a yes/no flag stored as 1 or 0. */
  readonly flag?: boolean;
}

/** Every parameter key a rulebook may define, with its unit and meaning. */
export const PARAMETER_DEFINITIONS = {
  connector_min_slope_in_per_ft: {
    unit: "in/ft",
    description: "Minimum rise of a vent connector per foot of horizontal run.",
    min: 0,
  },
  connector_max_length_ft_per_in_diameter: {
    unit: "ft/in",
    description:
      "Connector length per inch of connector diameter that common-vent tables assume; longer connectors lose capacity.",
    min: 0,
  },
  connector_capacity_loss_per_extra_length_multiple_pct: {
    unit: "%",
    description:
      "Reduction of a connector's maximum capacity (fan-assisted or natural-draft max of the connector table) for each extra multiple of that horizontal length.",
    min: 0,
    max: 100,
  },
  common_connector_assumed_90_turns: {
    unit: "count",
    description: "90° turns the multiple-appliance connector table already assumes in each connector.",
    min: 0,
  },
  common_vent_loss_per_45_turn_pct: {
    unit: "%",
    description: "Reduction of the common vent's maximum capacity for each turn of 45° or less in the common vent.",
    min: 0,
    max: 100,
  },
  common_vent_loss_per_90_turn_pct: {
    unit: "%",
    description: "Reduction of the common vent's maximum capacity for each turn over 45° up to 90° in the common vent.",
    min: 0,
    max: 100,
  },
  common_vent_offset_max_in_per_in_diameter: {
    unit: "in/in",
    description: "Longest horizontal offset of the common vent, in inches per inch of common-vent diameter.",
    min: 0,
  },
  common_vent_manifold_loss_pct: {
    unit: "%",
    description: "Reduction of the common vent's maximum capacity when the connectors are joined in a manifold before the common vent.",
    min: 0,
    max: 100,
  },
  common_vent_manifold_max_in_per_in_diameter: {
    unit: "in/in",
    description: "Longest connector manifold, in inches per inch of common-vent diameter.",
    min: 0,
  },
  vent_max_area_ratio_to_outlet: {
    unit: "ratio",
    description:
      "Largest flow area of the vent as a multiple of the smallest draft-hood outlet or flue collar area it serves.",
    min: 1,
  },
  vent_reduction_fan_max_loss_pct: {
    unit: "%",
    description: "Reduction of the table maximum for a fan-assisted appliance on a vent one size smaller than its outlet.",
    min: 0,
    max: 100,
  },
  vent_min_height_above_collar_ft: {
    unit: "ft",
    description: "Minimum gas-vent height above the highest connected draft-hood outlet or flue collar.",
    min: 0,
  },
  vent_reduction_min_height_ft: {
    unit: "ft",
    description: "Vent height at or above which a vent one size smaller than the outlet may be considered.",
    min: 0,
  },
  termination_listed_cap_max_in: {
    unit: "in",
    description: "Largest listed-cap vent size to which the roof-pitch height table applies.",
    min: 0,
  },
  termination_wall_distance_min_ft: {
    unit: "ft",
    description: "Minimum distance from a vertical wall for the roof-pitch height table to apply.",
    min: 0,
  },
  termination_height_otherwise_ft: {
    unit: "ft",
    description:
      "Height above the roof (and above any part of the building within 10 ft) for vents outside the roof-pitch table.",
    min: 0,
  },
  capacity_interpolation_allowed: {
    unit: "flag",
    description: "1 when capacities may be interpolated between table rows; 0 to use the conservative row.",
    flag: true,
  },
  capacity_assumed_90_turns_with_lateral: {
    unit: "count",
    description: "Number of 90° turns the capacity table already assumes when the run has a lateral.",
    min: 0,
  },
  capacity_loss_per_extra_45_turn_pct: {
    unit: "%",
    description: "Reduction of maximum capacity for each extra turn of 45° or less.",
    min: 0,
    max: 100,
  },
  capacity_loss_per_extra_90_turn_pct: {
    unit: "%",
    description: "Reduction of maximum capacity for each extra turn over 45° up to 90°.",
    min: 0,
    max: 100,
  },
  air_volume_per_1000_btuh_cuft: {
    unit: "ft³ per 1,000 Btu/h",
    description: "Standard method: room volume needed per 1,000 Btu/h of appliances drawing room air.",
    min: 0,
  },
  infiltration_constant_other_cuft: {
    unit: "ft³·ACH per 1,000 Btu/h",
    description: "Known-infiltration method: constant for appliances other than fan-assisted.",
    min: 0,
  },
  infiltration_constant_fan_cuft: {
    unit: "ft³·ACH per 1,000 Btu/h",
    description: "Known-infiltration method: constant for fan-assisted appliances.",
    min: 0,
  },
  infiltration_ach_threshold: {
    unit: "ACH",
    description: "Below this known air-change rate the standard method may not be used.",
    min: 0,
  },
  infiltration_ach_max: {
    unit: "ACH",
    description: "Highest air-change rate the known-infiltration method may use.",
    min: 0,
  },
  opening_indoor_same_story_sqin_per_1000_btuh: {
    unit: "in² per 1,000 Btu/h",
    description: "Free area of each of the two indoor openings joining rooms on the same story.",
    min: 0,
  },
  opening_indoor_min_area_sqin: {
    unit: "in²",
    description: "Smallest free area of each indoor opening on the same story.",
    min: 0,
  },
  opening_indoor_different_stories_sqin_per_1000_btuh: {
    unit: "in² per 1,000 Btu/h",
    description: "Total free area of openings joining rooms on different stories.",
    min: 0,
  },
  opening_outdoor_vertical_btuh_per_sqin: {
    unit: "Btu/h per in²",
    description: "Two outdoor openings, direct or through vertical ducts: input served by each in² of free area.",
    min: 0,
  },
  opening_outdoor_horizontal_btuh_per_sqin: {
    unit: "Btu/h per in²",
    description: "Two outdoor openings through horizontal ducts: input served by each in² of free area.",
    min: 0,
  },
  opening_outdoor_single_btuh_per_sqin: {
    unit: "Btu/h per in²",
    description: "One high outdoor opening: input served by each in² of free area.",
    min: 0,
  },
  opening_min_dimension_in: {
    unit: "in",
    description: "Smallest dimension of an air opening or duct.",
    min: 0,
  },
  combination_method_allowed: {
    unit: "flag",
    description: "1 when outdoor openings may be reduced by the share of indoor volume available.",
    flag: true,
  },
  ambient_co_marginal_ppm: {
    unit: "ppm",
    description: "Ambient CO at or above which a caution is shown.",
    min: 0,
  },
  ambient_co_max_ppm: {
    unit: "ppm",
    description: "Ambient CO at or above which work stops: ventilate, find the source.",
    min: 0,
  },
  draft_max_inwc: {
    unit: "in. w.c.",
    description: "Weakest acceptable draft at steady state (a reading must be at or below this, i.e. as negative).",
  },
  spillage_max_seconds: {
    unit: "s",
    description: "Longest spillage at the draft hood before the draft must be established.",
    min: 0,
  },
  input_rate_tolerance_pct: {
    unit: "%",
    description: "Allowed difference between clocked gas input and the rated input.",
    min: 0,
    max: 100,
  },
  return_air_area_sqin_per_1000_btuh_output: {
    unit: "in² per 1,000 Btu/h",
    description: "Smallest total free area of the return-air openings to a furnace per 1,000 Btu/h of its output.",
    min: 0,
  },
  return_air_cfm_per_ton: {
    unit: "cfm/ton",
    description: "Nominal blower airflow per ton of cooling, used when the airflow is known only from the cooling size.",
    min: 0,
  },
  return_air_sensible_heat_btuh_per_cfm_f: {
    unit: "Btu/h per cfm·°F",
    description: "Sensible-heat factor of standard air: airflow = output ÷ (factor × temperature rise).",
    min: 0,
  },
  return_air_grille_velocity_max_fpm: {
    unit: "fpm",
    description: "Face velocity through a return grille's free area above which the return is likely to be noisy.",
    min: 0,
  },
  return_air_filter_grille_velocity_max_fpm: {
    unit: "fpm",
    description: "Highest face velocity through a filter grille's free area.",
    min: 0,
  },
  return_air_draft_hood_min_distance_ft: {
    unit: "ft",
    description: "Smallest distance from a return opening to a draft hood or open combustion chamber in the same space.",
    min: 0,
  },
  return_air_sole_source_fuel_space_prohibited: {
    unit: "flag",
    description: "1 when return air may not be taken solely from a space that holds a fuel-burning appliance.",
    flag: true,
  },
} as const satisfies Record<string, ParameterDefinition>;

/** A parameter key. */
export type ParameterKey = keyof typeof PARAMETER_DEFINITIONS;

/** All parameter keys in their catalogue order. */
export const PARAMETER_KEYS = Object.keys(PARAMETER_DEFINITIONS) as [ParameterKey, ...ParameterKey[]];
