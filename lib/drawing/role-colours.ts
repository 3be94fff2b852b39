import type { SceneRole } from "./scene-types";

/**
 * The drawing's colours per role: one map for the on-screen SVG and the PDF record, kept out of
 * the React component so the server-side renderer does not load React.
 */
export interface RoleColour {
  readonly stroke: string;
  readonly tint: string;
  readonly text?: string;
  readonly opacity?: number;
}

export const PAPER = "#ffffff";
const FAIL = "#b3261e";
const FAIL_SOFT = "#fbe7e5";

export const ROLE_COLOURS = {
  appliance: { stroke: "#394851", tint: "#e7ecee" },
  "appliance-fail": { stroke: FAIL, tint: FAIL_SOFT },
  "draft-hood": { stroke: "#394851", tint: "#e7ecee" },
  floor: { stroke: "#a9b8bf", tint: "#f5f7f8" },
  connector: { stroke: "#283239", tint: "#e7ecee" },
  "connector-fail": { stroke: FAIL, tint: FAIL_SOFT },
  halo: { stroke: FAIL, tint: FAIL_SOFT, opacity: 0.16 },
  joint: { stroke: "#283239", tint: "#e7ecee" },
  support: { stroke: "#a74f22", tint: "#f9e6d6" },
  turn: { stroke: "#c4642b", tint: "#f9e6d6" },
  vent: { stroke: "#283239", tint: "#e7ecee" },
  "vent-fail": { stroke: FAIL, tint: FAIL_SOFT },
  roof: { stroke: "#5c727c", tint: "#e7ecee" },
  termination: { stroke: "#283239", tint: "#cfd8dc" },
  "termination-fail": { stroke: FAIL, tint: FAIL_SOFT },
  combustible: { stroke: "#8a5a00", tint: "#fdf1d8" },
  clearance: { stroke: "#5c727c", tint: "#e7ecee" },
  "clearance-fail": { stroke: FAIL, tint: FAIL_SOFT },
  passage: { stroke: "#7d929b", tint: "#f5f7f8" },
  "passage-fail": { stroke: FAIL, tint: FAIL_SOFT },
  dimension: { stroke: "#5c727c", tint: "#e7ecee" },
  "dimension-fail": { stroke: FAIL, tint: FAIL_SOFT },
  break: { stroke: "#283239", tint: PAPER },
  label: { stroke: "#1a2126", tint: PAPER, text: "#1a2126" },
  "label-fail": { stroke: FAIL, tint: PAPER, text: FAIL },
  "label-muted": { stroke: "#475a63", tint: PAPER, text: "#475a63" },
  note: { stroke: "#5c727c", tint: PAPER, text: "#5c727c" },
  "note-pass": { stroke: "#1f7a4d", tint: PAPER, text: "#1f7a4d" },
  legend: { stroke: "#394851", tint: PAPER, text: "#394851" },
} as const satisfies Record<SceneRole, RoleColour>;
