import { atLeast, atMost } from "../compare";
import { FINDING_CODES, MESSAGES, type Finding } from "../findings";
import { temperatureRiseF } from "../sizing/readings";
import { readingTarget, type ReadingsContext } from "./readings-shared";
import { finding, known } from "./shared";

const CODE = FINDING_CODES.readingsTemperatureRise;
const RULE = { citation: "Appliance rating plate (temperature-rise range as entered)", ref: null } as const;

/** Furnaces only (not applicable to other kinds): supply − return within the rating-plate range. */
export function checkTemperatureRise(ctx: ReadingsContext, out: Finding[]): void {
  const { r } = ctx;
  const m = MESSAGES.readingsTemperatureRise;
  const kind = ctx.appliance.kind;
  if (kind !== "furnace") {
    const t = readingTarget(ctx, "supplyTempF");
    if (kind == null) out.push(finding(CODE, "needs-info", m.needsKind(), t, RULE));
    else out.push(finding(CODE, "not-applicable", m.notFurnace(), t, RULE));
    return;
  }
  if (!known(r.supplyTempF) || !known(r.returnTempF) || !known(r.nameplateRiseMinF) || !known(r.nameplateRiseMaxF)) {
    const field = !known(r.supplyTempF) ? "supplyTempF" : !known(r.returnTempF) ? "returnTempF" : !known(r.nameplateRiseMinF) ? "nameplateRiseMinF" : "nameplateRiseMaxF";
    out.push(finding(CODE, "needs-info", m.needsInfo(), readingTarget(ctx, field), RULE));
    return;
  }
  const rise = temperatureRiseF(r.supplyTempF, r.returnTempF);
  const min = r.nameplateRiseMinF;
  const max = r.nameplateRiseMaxF;
  const extras = { measured: { value: rise, unit: "°F" }, required: { value: min, upperValue: max, unit: "°F", comparator: "between" as const } };
  const t = readingTarget(ctx, "supplyTempF");
  if (!atLeast(rise, min)) out.push(finding(CODE, "fail", m.low(rise, min, max), t, RULE, extras));
  else if (!atMost(rise, max)) out.push(finding(CODE, "fail", m.high(rise, min, max), t, RULE, extras));
  else out.push(finding(CODE, "pass", m.pass(rise, min, max), t, RULE, extras));
}
