import { atLeast } from "../compare";
import { FINDING_CODES, MESSAGES, type Finding } from "../findings";
import { requiredVolumeCuFt, type VolumeRequirement } from "../sizing/air";
import { roomVolume, type AirContext } from "./air-context";
import { finding, missingRuleFinding, param, target } from "./shared";

const CODE = FINDING_CODES.airVolume;

/** Volume result handed to the outdoor-opening check. */
export interface VolumeResult {
  readonly availableCuFt: number;
  readonly requirement: VolumeRequirement;
}

/**
 * The space's volume (appliance room, rooms open to it, rooms joined by adequate openings)
 * against the standard or known-infiltration requirement.
 * @returns the volumes, or null when they cannot be told
 */
export function checkAirVolume(ctx: AirContext, countedRoomIds: ReadonlySet<string>, out: Finding[]): VolumeResult | null {
  const m = MESSAGES.airVolume;
  const anchor = target("airSpace", null, "rooms", "airSpace.rooms");
  if (ctx.roomAir.length === 0) {
    out.push(finding(CODE, "pass", m.none(), anchor, null));
    return null;
  }
  if (ctx.inputMissing) {
    const i = ctx.appliances.indexOf(ctx.inputMissing);
    out.push(finding(CODE, "needs-info", m.needsInfo(), target("appliances", ctx.inputMissing.id, "inputBtuh", `appliances.${i}.inputBtuh`), null));
    return null;
  }
  const perK = param(ctx.rb, "air_volume_per_1000_btuh_cuft");
  if (!perK) {
    out.push(missingRuleFinding(CODE, "the volume per 1,000 Btu/h", "parameters", anchor));
    return null;
  }
  const ach = ctx.space.airChangesPerHour ?? null;
  const c21 = param(ctx.rb, "infiltration_constant_other_cuft");
  const c15 = param(ctx.rb, "infiltration_constant_fan_cuft");
  const thr = param(ctx.rb, "infiltration_ach_threshold");
  const max = param(ctx.rb, "infiltration_ach_max");
  if (ach !== null && (!c21 || !c15 || !thr || !max || !(max.value > 0))) {
    out.push(missingRuleFinding(CODE, "the known-infiltration constants and air-change limits", "parameters", target("airSpace", null, "airChangesPerHour", "airSpace.airChangesPerHour")));
    return null;
  }
  const requirement = requiredVolumeCuFt(ctx.otherInputBtuh, ctx.fanInputBtuh, ach, {
    perKbtuhCuFt: perK.value,
    otherConstant: c21?.value ?? 0,
    fanConstant: c15?.value ?? 0,
    achThreshold: thr?.value ?? 0,
    achMax: max?.value ?? Number.POSITIVE_INFINITY,
  });
  const rooms = ctx.space.rooms;
  let available = 0;
  for (let i = 0; i < rooms.length; i++) {
    const r = rooms[i]!;
    const counts = r === ctx.applianceRoom || r.openToApplianceRoom === true || countedRoomIds.has(r.id);
    if (!counts) continue;
    const v = roomVolume(r);
    if (v === null) {
      const field = typeof r.lengthFt !== "number" ? "lengthFt" : typeof r.widthFt !== "number" ? "widthFt" : "heightFt";
      out.push(finding(CODE, "needs-info", m.needsInfo(), target("airSpace", r.id, field, `airSpace.rooms.${i}.${field}`), perK));
      return null;
    }
    available += v;
  }
  if (!ctx.applianceRoom) {
    out.push(finding(CODE, "needs-info", m.needsInfo(), anchor, perK));
    return null;
  }
  const method = requirement.method === "standard" ? m.standard : m.infiltration(requirement.achUsed ?? 0);
  const rule = requirement.method === "standard" ? perK : { citation: `${c21!.citation}; ${max!.citation}`, ref: c21!.ref };
  const extras = {
    measured: { value: available, unit: "ft³" },
    required: { value: requirement.volumeCuFt, unit: "ft³", comparator: "≥" as const },
  };
  if (atLeast(available, requirement.volumeCuFt)) {
    out.push(finding(CODE, "pass", m.pass(available, requirement.volumeCuFt, method), anchor, rule, extras));
  } else if (ctx.space.openings.some((o) => o.kind.startsWith("outdoor_"))) {
    out.push(finding(CODE, "warn", m.shortWithOutdoor(available, requirement.volumeCuFt, method), anchor, rule, extras));
  } else {
    out.push(finding(CODE, "fail", m.fail(available, requirement.volumeCuFt, method), anchor, rule, extras));
  }
  return { availableCuFt: available, requirement };
}
