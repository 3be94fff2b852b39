import { atLeast } from "../compare";
import { FINDING_CODES, MESSAGES, type Finding } from "../findings";
import type { AirContext } from "./air-context";
import { finding, missingRuleFinding, param, target } from "./shared";

const CODE = FINDING_CODES.airOpeningDimension;

/** No opening or duct narrower than the minimum dimension. */
export function checkAirOpeningDimension(ctx: AirContext, out: Finding[]): void {
  const openings = ctx.space.openings;
  if (openings.length === 0) return;
  const min = param(ctx.rb, "opening_min_dimension_in");
  for (let i = 0; i < openings.length; i++) {
    const o = openings[i]!;
    const t = target("airSpace", o.id, "widthIn", `airSpace.openings.${i}.widthIn`);
    if (!min) {
      out.push(missingRuleFinding(CODE, "the minimum opening dimension", "parameters", t));
      return;
    }
    let dim: number | null = null;
    if (typeof o.widthIn === "number" && typeof o.heightIn === "number") dim = Math.min(o.widthIn, o.heightIn);
    else if (typeof o.diameterIn === "number") dim = o.diameterIn;
    if (dim === null) {
      out.push(finding(CODE, "needs-info", MESSAGES.airOpeningDimension.needsInfo(), t, min));
      continue;
    }
    const ok = atLeast(dim, min.value);
    out.push(
      finding(CODE, ok ? "pass" : "fail", (ok ? MESSAGES.airOpeningDimension.pass : MESSAGES.airOpeningDimension.fail)(dim, min.value), t, min, {
        measured: { value: dim, unit: "in" },
        required: { value: min.value, unit: "in", comparator: "≥" },
      }),
    );
  }
}
