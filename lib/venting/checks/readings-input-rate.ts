import { atMost } from "../compare";
import { FINDING_CODES, MESSAGES, type Finding } from "../findings";
import { clockedInputBtuh } from "../sizing/readings";
import { readingTarget, type ReadingsContext } from "./readings-shared";
import { finding, known, missingRuleFinding, param } from "./shared";

const CODE = FINDING_CODES.readingsInputRate;

/** Clocked gas input within the tolerance of the rated input. */
export function checkInputRate(ctx: ReadingsContext, out: Finding[]): void {
  const { r, appliance } = ctx;
  const t = readingTarget(ctx, "meterSecondsPerRev");
  const tol = param(ctx.rb, "input_rate_tolerance_pct");
  if (!tol) {
    out.push(missingRuleFinding(CODE, "the input-rate tolerance", "parameters", t));
    return;
  }
  if (!known(r.meterDialCuFt) || !known(r.meterSecondsPerRev) || !known(r.heatingValueBtuPerCuFt) || !known(appliance.inputBtuh) || appliance.inputBtuh <= 0) {
    const field = !known(r.meterDialCuFt) ? "meterDialCuFt" : !known(r.meterSecondsPerRev) ? "meterSecondsPerRev" : "heatingValueBtuPerCuFt";
    out.push(finding(CODE, "needs-info", MESSAGES.readingsInputRate.needsInfo(), readingTarget(ctx, field), tol));
    return;
  }
  const measured = clockedInputBtuh(r.meterDialCuFt, r.meterSecondsPerRev, r.heatingValueBtuPerCuFt);
  const diffPct = ((measured - appliance.inputBtuh) / appliance.inputBtuh) * 100;
  const ok = atMost(Math.abs(diffPct), tol.value);
  out.push(
    finding(
      CODE,
      ok ? "pass" : "warn",
      (ok ? MESSAGES.readingsInputRate.pass : MESSAGES.readingsInputRate.warn)(measured, appliance.inputBtuh, diffPct, tol.value),
      t,
      tol,
      {
        measured: { value: measured, unit: "Btu/h" },
        required: { value: appliance.inputBtuh * (1 - tol.value / 100), upperValue: appliance.inputBtuh * (1 + tol.value / 100), unit: "Btu/h", comparator: "between" },
      },
    ),
  );
}
