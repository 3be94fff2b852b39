import type { SiteCheckItemDefinition } from "./types";

/**
 * The list every company starts with. Admins can reword, reorder, deactivate and add items; keys
 * stay as they are so that answers and photos keep pointing at the right item.
 */
export const DEFAULT_SITE_CHECK_ITEMS = [
  {
    key: "connector_joints_fastened",
    label: "Every vent connector joint is mechanically fastened",
    help: "Sheet-metal screws or rivets at every joint, or the vent maker's own locking method for listed pipe. Three fasteners per joint on single-wall connector is common practice.",
    appliesTo: "all",
    commonPractice: true,
  },
  {
    key: "no_tape_on_vent",
    label: "No tape is used as a joint or a seal on the vent or connector",
    help: "Foil or duct tape neither holds a joint together nor seals it against flue gases. Take it off and make the joint properly.",
    appliesTo: "all",
  },
  {
    key: "type_b_sections_locked",
    label: "Type B sections are fully engaged and locked",
    help: "Each section pushed fully home and turned or snapped until its locking feature engages, as the vent maker's instructions describe.",
    appliesTo: "all",
  },
  {
    key: "connector_supported",
    label: "The connector is supported along its run, without dips or sags",
    help: "Straps or hangers at the spacing the rulebook gives. A low spot collects condensate and slows the flow of flue gases.",
    appliesTo: "all",
  },
  {
    key: "vent_cap_clear",
    label: "The vent cap is in place and clear",
    help: "A listed cap is fitted and undamaged, and nothing blocks it: no nests, leaves, debris or ice.",
    appliesTo: "all",
  },
  {
    key: "condensate_trap_overflow",
    label: "The condensate trap has a union and an overflow safety switch",
    help: "A union or other joint that lets the trap be taken off and cleaned, and a switch that shuts the appliance down if the drain backs up.",
    appliesTo: "condensing",
  },
  {
    key: "return_air_not_from_draft_hood_room",
    label: "Return air is not drawn from the room of a draft-hood appliance",
    help: "A return grille or leaky return duct in that room lowers its pressure and can pull flue gases out of the draft hood. Seal it or move it.",
    appliesTo: "draft_hood",
    safety: "spillage",
  },
  {
    key: "draft_hood_relief_clear",
    label: "The draft hood relief opening is clear",
    help: "Nothing stored against the relief opening or blocking it, and the hood is the one supplied with the appliance, unaltered.",
    appliesTo: "draft_hood",
    safety: "spillage",
  },
  {
    key: "no_solid_fuel_on_vent",
    label: "The vent does not also serve a wood- or coal-burning appliance",
    help: "A natural-draft gas appliance keeps its own vent or a flue shared only with other gas appliances.",
    appliesTo: "natural_draft",
  },
  {
    key: "filter_rack_sealed",
    label: "The filter rack and its door are sealed",
    help: "No gaps around the filter or its door where the blower could pull air from the appliance room.",
    appliesTo: "all",
  },
  {
    key: "thermostat_transformer_working",
    label: "The thermostat and the control transformer work",
    help: "The thermostat starts and ends a call for heat (and cooling where fitted); the transformer puts out its rated voltage.",
    appliesTo: "all",
  },
  {
    key: "gas_leak_check",
    label: "A gas leak check was done on every joint made or disturbed",
    help: "Leak-detection solution or an electronic detector on each joint, with the gas on and under pressure.",
    appliesTo: "all",
  },
  {
    key: "gas_shutoff_accessible",
    label: "The appliance's gas shut-off valve is accessible",
    help: "A manual shut-off valve for this appliance that can be reached and turned without moving anything out of the way.",
    appliesTo: "all",
  },
  {
    key: "co_alarm_working",
    label: "A CO alarm is present and working in the home",
    help: "Press its test button. If there is none, or it fails, tell the homeowner and write it in the note. Common practice; local rules may require one.",
    appliesTo: "all",
    commonPractice: true,
    safety: "co",
  },
] as const satisfies readonly SiteCheckItemDefinition[];

/** A default item's key. */
export type DefaultSiteCheckKey = (typeof DEFAULT_SITE_CHECK_ITEMS)[number]["key"];

// The list's companions, so that one import gives the items, their applicability and their findings.
export { applicableItems } from "./applicability";
export { siteCheckFindings } from "./findings";
