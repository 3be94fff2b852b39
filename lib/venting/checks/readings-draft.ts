import { atMost } from "../compare";
import { FINDING_CODES, MESSAGES, type Finding } from "../findings";
import { readingTarget, type ReadingsContext } from "./readings-shared";
import { finding, known, missingRuleFinding, param } from "./shared";

const CODE = FINDING_CODES.readingsDraft;

/** Steady-state draft at least as strong (as negative) as the limit; not for direct-vent appliances. */
export function checkDraft(ctx: ReadingsContext, out: Finding[]): void {
  const t = readingTarget(ctx, "draftInWc");
  if (ctx.appliance.draft === "direct_vent") {
    out.push(finding(CODE, "not-applicable", MESSAGES.readingsDraft.directVent(), t, null));
    return;
  }
  const limit = param(ctx.rb, "draft_max_inwc");
  if (!limit) {
    out.push(missingRuleFinding(CODE, "the draft limit", "parameters", t));
    return;
  }
  const d = ctx.r.draftInWc;
  if (!known(d)) {
    out.push(finding(CODE, "needs-info", MESSAGES.readingsDraft.needsInfo(), t, limit));
    return;
  }
  const ok = atMost(d, limit.value);
  out.push(
    finding(CODE, ok ? "pass" : "fail", (ok ? MESSAGES.readingsDraft.pass : MESSAGES.readingsDraft.fail)(d, limit.value), t, limit, {
      measured: { value: d, unit: "in. w.c." },
      required: { value: limit.value, unit: "in. w.c.", comparator: "≤" },
      safety: ok || d < 0 ? null : "spillage",
    }),
  );
}
