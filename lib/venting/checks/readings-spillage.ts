import { atMost } from "../compare";
import { FINDING_CODES, MESSAGES, type Finding } from "../findings";
import { readingTarget, type ReadingsContext } from "./readings-shared";
import { finding, known, missingRuleFinding, param } from "./shared";

const CODE = FINDING_CODES.readingsSpillage;

/** Spillage at the draft hood stops within the maximum time; only for natural-draft (draft-hood) appliances. */
export function checkSpillage(ctx: ReadingsContext, out: Finding[]): void {
  const draft = ctx.appliance.draft;
  const t = readingTarget(ctx, "spillageSeconds");
  if (draft === "direct_vent" || draft === "fan_assisted") {
    const message = draft === "direct_vent" ? MESSAGES.readingsSpillage.directVent() : MESSAGES.readingsSpillage.fanAssisted();
    out.push(finding(CODE, "not-applicable", message, t, null));
    return;
  }
  const max = param(ctx.rb, "spillage_max_seconds");
  if (!max) {
    out.push(missingRuleFinding(CODE, "the longest allowed spillage", "parameters", t));
    return;
  }
  const s = ctx.r.spillageSeconds;
  if (!known(s)) {
    out.push(finding(CODE, "needs-info", MESSAGES.readingsSpillage.needsInfo(), t, max));
    return;
  }
  const ok = atMost(s, max.value);
  out.push(
    finding(CODE, ok ? "pass" : "fail", (ok ? MESSAGES.readingsSpillage.pass : MESSAGES.readingsSpillage.fail)(s, max.value), t, max, {
      measured: { value: s, unit: "s" },
      required: { value: max.value, unit: "s", comparator: "≤" },
      safety: ok ? null : "spillage",
    }),
  );
}
