/** Renderer-neutral drawings built from engine inputs and findings. */
export { buildVentRunScene, SLOPE_EXAGGERATION, MAX_DRAWN_SLOPE } from "./vent-run-scene";
export type { BuildVentRunSceneInput, DrawingVentRun } from "./vent-run-scene";
export { servedApplianceIds } from "./served-appliances";
export type * from "./scene-types";
