import type { AirOpening, AirSpace, Appliance, Room } from "../inputs";
import type { Cited, PreparedRulebook, RuleRef } from "../rulebook/prepare";
import { circleAreaSqIn, roomVolumeCuFt } from "../units";

/** Free area of one opening, or why it cannot be told. */
export type OpeningArea =
  | {
      readonly ok: true;
      readonly freeSqIn: number;
      /** Free-area share used (1 with no louver). */
      readonly share: number;
      readonly shareRule: { readonly citation: string; readonly ref: RuleRef | null } | null;
    }
  | { readonly ok: false; readonly field: "widthIn" | "freeAreaShare" | "louver" };

/** Free area of an opening: stated free area, or gross area × louver share. */
export function openingArea(o: AirOpening, rb: PreparedRulebook): OpeningArea {
  let share = 1;
  let shareRule: { citation: string; ref: RuleRef | null } | null = null;
  switch (o.louver) {
    case "none":
      break;
    case "wood":
    case "metal": {
      if (typeof o.freeAreaShare === "number") {
        share = o.freeAreaShare;
        shareRule = { citation: "Louver maker's stated free area (entered)", ref: null };
      } else {
        const r: Cited<number> | undefined = rb.louverShares.get(o.louver);
        if (!r) return { ok: false, field: "louver" };
        share = r.value;
        shareRule = r;
      }
      break;
    }
    case "other":
      if (typeof o.freeAreaShare !== "number") return { ok: false, field: "freeAreaShare" };
      share = o.freeAreaShare;
      shareRule = { citation: "Louver maker's stated free area (entered)", ref: null };
      break;
    default:
      o.louver satisfies never;
  }
  if (typeof o.freeAreaSqIn === "number") return { ok: true, freeSqIn: o.freeAreaSqIn, share, shareRule };
  const gross = grossOf(o);
  if (gross === null) return { ok: false, field: "widthIn" };
  return { ok: true, freeSqIn: gross * share, share, shareRule };
}

/** Gross area from the dimensions, in², or null. */
export function grossOf(o: AirOpening): number | null {
  if (typeof o.widthIn === "number" && typeof o.heightIn === "number") return o.widthIn * o.heightIn;
  if (typeof o.diameterIn === "number") return circleAreaSqIn(o.diameterIn);
  return null;
}

/** Volume of a room, ft³, or null when a dimension is missing. */
export function roomVolume(r: Room): number | null {
  if (typeof r.volumeCuFt === "number") return r.volumeCuFt;
  if (typeof r.lengthFt === "number" && typeof r.widthFt === "number" && typeof r.heightFt === "number") {
    return roomVolumeCuFt(r.lengthFt, r.widthFt, r.heightFt);
  }
  return null;
}

/** What the air-space checks share. */
export interface AirContext {
  readonly space: AirSpace;
  readonly rb: PreparedRulebook;
  readonly appliances: readonly Appliance[];
  /** Appliances in the space that draw room air (not direct-vent). */
  readonly roomAir: readonly Appliance[];
  /** First appliance in the space with no input, if any. */
  readonly inputMissing: Appliance | null;
  readonly otherInputBtuh: number;
  readonly fanInputBtuh: number;
  readonly totalInputBtuh: number;
  readonly applianceRoom: Room | null;
  /** Total connector area of the appliances in the space, in² (for the single-opening method). */
  readonly connectorAreaSumSqIn: number;
  /** First appliance drawing room air whose connector (and outlet) diameter is unknown, so the total above falls short. */
  readonly connectorUnknown: Appliance | null;
}

/** Builds the air context. `connectorDiameterIn` overrides outlet diameters per appliance id. */
export function airContext(
  space: AirSpace,
  appliances: readonly Appliance[],
  rb: PreparedRulebook,
  connectorDiameterIn?: Readonly<Record<string, number>>,
): AirContext {
  const ids = space.applianceIds;
  const inSpace = ids ? appliances.filter((a) => ids.includes(a.id)) : appliances;
  const roomAir: Appliance[] = [];
  let other = 0;
  let fan = 0;
  let connectorArea = 0;
  let inputMissing: Appliance | null = null;
  let connectorUnknown: Appliance | null = null;
  for (const a of inSpace) {
    if (a.draft === "direct_vent") continue;
    roomAir.push(a);
    if (typeof a.inputBtuh !== "number") {
      inputMissing ??= a;
      continue;
    }
    if (a.draft === "fan_assisted") fan += a.inputBtuh;
    else other += a.inputBtuh;
    const d = connectorDiameterIn?.[a.id] ?? a.outletDiameterIn;
    if (typeof d === "number") connectorArea += circleAreaSqIn(d);
    else connectorUnknown ??= a;
  }
  const applianceRoom = (space.applianceRoomId ? space.rooms.find((r) => r.id === space.applianceRoomId) : space.rooms[0]) ?? null;
  return {
    space,
    rb,
    appliances,
    roomAir,
    inputMissing,
    otherInputBtuh: other,
    fanInputBtuh: fan,
    totalInputBtuh: other + fan,
    applianceRoom,
    connectorAreaSumSqIn: connectorArea,
    connectorUnknown,
  };
}
