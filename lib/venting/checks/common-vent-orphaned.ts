import { FINDING_CODES, MESSAGES, type Finding } from "../findings";
import type { Appliance, VentRun } from "../inputs";
import type { PreparedRulebook } from "../rulebook/prepare";
import { assessSingleCapacity } from "../sizing/assess-capacity";
import { finding, target } from "./shared";

const CODE = FINDING_CODES.commonVentOrphaned;

/**
 * An appliance left alone on a vent that used to be common: re-check it against the
 * single-appliance table, minimum as well as maximum, because the old vent is often too big.
 * @param remaining the appliances still connected to the vent
 */
export function checkOrphanedAppliance(
  run: VentRun,
  remaining: readonly Appliance[],
  allAppliances: readonly Appliance[],
  rb: PreparedRulebook,
  stillCommon: Finding | null = null,
): Finding {
  const m = MESSAGES.commonVentOrphaned;
  const t = target("ventRun", null, "serves", "ventRun.vent.serves");
  if (remaining.length === 0) return finding(CODE, "warn", m.noneLeft(), t, null);
  if (remaining.length > 1) {
    if (!stillCommon) return finding(CODE, "needs-info", m.several(), t, null);
    const extras: { measured?: typeof stillCommon.measured; required?: typeof stillCommon.required; smallest?: typeof stillCommon.smallest } = {};
    if (stillCommon.measured) extras.measured = stillCommon.measured;
    if (stillCommon.required) extras.required = stillCommon.required;
    if (stillCommon.smallest) extras.smallest = stillCommon.smallest;
    const rule = stillCommon.citation === null ? null : { citation: stillCommon.citation, ref: stillCommon.ruleRef };
    return finding(CODE, stillCommon.status, m.stillCommon(stillCommon.message), stillCommon.target, rule, extras);
  }
  const a = remaining[0]!;
  const idx = allAppliances.findIndex((x) => x.id === a.id);
  const r = assessSingleCapacity({ ...run, vent: { ...run.vent, serves: "single" } }, a, idx, rb);
  const label = a.label || a.id;
  const message = r.status === "pass" ? m.pass(label, r.message) : r.status === "fail" ? m.fail(label, r.message) : m.needsInfo(label, r.message);
  const extras: { measured?: typeof r.measured; required?: typeof r.required } = {};
  if (r.measured) extras.measured = r.measured;
  if (r.required) extras.required = r.required;
  if (r.sizing?.smallestDiameterIn != null) return finding(CODE, r.status, message, r.target, r.rule, { ...extras, smallest: { value: r.sizing.smallestDiameterIn, unit: "in" } });
  return finding(CODE, r.status, message, r.target, r.rule, extras);
}
