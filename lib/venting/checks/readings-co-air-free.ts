import { atMost } from "../compare";
import { FINDING_CODES, MESSAGES, type Finding } from "../findings";
import { airFreeCoPpm } from "../sizing/readings";
import { readingTarget, type ReadingsContext } from "./readings-shared";
import { finding, known, missingRuleFinding } from "./shared";

const CODE = FINDING_CODES.readingsCoAirFree;

/** Air-free flue CO at or below the limit for the appliance kind. */
export function checkCoAirFree(ctx: ReadingsContext, out: Finding[]): void {
  const { r, appliance } = ctx;
  const m = MESSAGES.readingsCoAirFree;
  const kind = appliance.kind ?? "other";
  const limit = ctx.rb.flueCoLimits.get(kind);
  const t = readingTarget(ctx, "flueCoPpm");
  if (!limit) {
    out.push(missingRuleFinding(CODE, `the flue CO limit for ${kind.replace(/_/g, " ")} appliances`, "flueCoLimits", t));
    return;
  }
  if (!known(r.flueCoPpm) || !known(r.flueO2Pct)) {
    out.push(finding(CODE, "needs-info", m.needsInfo(), known(r.flueCoPpm) ? readingTarget(ctx, "flueO2Pct") : t, limit));
    return;
  }
  const af = airFreeCoPpm(r.flueCoPpm, r.flueO2Pct);
  if (af === null) {
    out.push(finding(CODE, "needs-info", m.badO2(r.flueO2Pct), readingTarget(ctx, "flueO2Pct"), limit));
    return;
  }
  const ok = atMost(af, limit.value);
  out.push(
    finding(CODE, ok ? "pass" : "fail", (ok ? m.pass : m.fail)(af, limit.value), t, limit, {
      measured: { value: af, unit: "ppm air-free" },
      required: { value: limit.value, unit: "ppm air-free", comparator: "≤" },
      safety: ok ? null : "co",
    }),
  );
}
