import { atLeast } from "../compare";
import { FINDING_CODES, MESSAGES, type Finding, type FindingTarget } from "../findings";
import type { RuleRef } from "../rulebook/prepare";
import type { AirOpening } from "../inputs";
import {
  combinationFactor,
  grossAreaSqIn,
  indoorDifferentStoriesAreaSqIn,
  indoorSameStoryAreaSqIn,
  outdoorOpeningAreaSqIn,
  singleOpeningAreaSqIn,
} from "../sizing/air";
import { openingArea, type AirContext } from "./air-context";
import { finding, missingRuleFinding, param, target } from "./shared";

const CODE = FINDING_CODES.airOpenings;

/** Sizing answer for one opening. */
export interface OpeningSizing {
  readonly openingId: string;
  /** Free area the opening needs, in² (null when it cannot be told). */
  readonly requiredFreeAreaSqIn: number | null;
  /** Gross opening needed with the opening's louver, in². */
  readonly requiredGrossAreaSqIn: number | null;
  /** Free area the opening gives, in². */
  readonly freeAreaSqIn: number | null;
}

const NAMES = {
  indoor_same_story: "indoor opening",
  indoor_different_stories: "opening between stories",
  outdoor_direct_or_vertical_duct: "outdoor opening (direct or vertical duct)",
  outdoor_horizontal_duct: "outdoor opening (horizontal duct)",
  outdoor_single_high: "single high outdoor opening",
} as const satisfies Record<AirOpening["kind"], string>;

function openingTarget(ctx: AirContext, o: AirOpening, field: string | null): FindingTarget {
  const i = ctx.space.openings.indexOf(o);
  return target("airSpace", o.id, field, field === null ? `airSpace.openings.${i}` : `airSpace.openings.${i}.${field}`);
}

/** Gross opening for a free area, or null when the share is too small to give one (a share near 0). */
function grossFor(freeSqIn: number, share: number): number | null {
  if (!(share > 0)) return null;
  const g = grossAreaSqIn(freeSqIn, share);
  return Number.isFinite(g) ? g : null;
}

function checkOne(
  ctx: AirContext,
  o: AirOpening,
  requiredSqIn: number,
  rule: { citation: string; ref: RuleRef | null },
  out: Finding[],
  sizing: OpeningSizing[],
): boolean {
  const what = NAMES[o.kind];
  const area = openingArea(o, ctx.rb);
  if (!area.ok) {
    const msg = area.field === "freeAreaShare" ? MESSAGES.airOpenings.needsShare(what) : area.field === "louver" ? MESSAGES.missingRule(`the ${o.louver} louver share`, "Louver free-area share") : MESSAGES.airOpenings.needsInfo(what);
    out.push(finding(CODE, "needs-info", msg, openingTarget(ctx, o, area.field), rule));
    sizing.push({ openingId: o.id, requiredFreeAreaSqIn: requiredSqIn, requiredGrossAreaSqIn: null, freeAreaSqIn: null });
    return false;
  }
  const gross = grossFor(requiredSqIn, area.share);
  sizing.push({ openingId: o.id, requiredFreeAreaSqIn: requiredSqIn, requiredGrossAreaSqIn: gross, freeAreaSqIn: area.freeSqIn });
  const ok = atLeast(area.freeSqIn, requiredSqIn);
  const citation = area.shareRule ? `${rule.citation}; ${area.shareRule.citation}` : rule.citation;
  out.push(
    finding(
      CODE,
      ok ? "pass" : "fail",
      ok ? MESSAGES.airOpenings.pass(area.freeSqIn, requiredSqIn, what) : MESSAGES.airOpenings.fail(area.freeSqIn, requiredSqIn, what, area.share < 1 ? gross : null),
      openingTarget(ctx, o, "widthIn"),
      { citation, ref: rule.ref },
      { measured: { value: area.freeSqIn, unit: "in²" }, required: { value: requiredSqIn, unit: "in²", comparator: "≥" } },
    ),
  );
  return ok;
}

/**
 * Indoor openings joining other rooms to the appliance room. Same story: two openings, each at
 * least the per-1,000 Btu/h area and the minimum. Different stories: a total area per 1,000 Btu/h.
 * @returns ids of rooms that count toward the space volume through adequate openings
 */
export function checkIndoorOpenings(ctx: AirContext, out: Finding[], sizing: OpeningSizing[]): Set<string> {
  const counted = new Set<string>();
  const indoor = ctx.space.openings.filter((o) => o.kind === "indoor_same_story" || o.kind === "indoor_different_stories");
  if (indoor.length === 0 || ctx.roomAir.length === 0) return counted;
  const same = param(ctx.rb, "opening_indoor_same_story_sqin_per_1000_btuh");
  const min = param(ctx.rb, "opening_indoor_min_area_sqin");
  const diff = param(ctx.rb, "opening_indoor_different_stories_sqin_per_1000_btuh");
  const byRoom = new Map<string, AirOpening[]>();
  for (const o of indoor) {
    if (!o.roomId) {
      out.push(finding(CODE, "needs-info", MESSAGES.airOpenings.noRoom(NAMES[o.kind]), openingTarget(ctx, o, "roomId"), null));
      continue;
    }
    const list = byRoom.get(o.roomId);
    if (list) list.push(o);
    else byRoom.set(o.roomId, [o]);
  }
  for (const [roomId, list] of byRoom) {
    const first = list[0]!;
    if (ctx.inputMissing) {
      out.push(finding(CODE, "needs-info", MESSAGES.airVolume.needsInfo(), openingTarget(ctx, first, null), null));
      continue;
    }
    const sameList = list.filter((o) => o.kind === "indoor_same_story");
    const diffList = list.filter((o) => o.kind === "indoor_different_stories");
    let roomOk = false;
    if (sameList.length > 0) {
      if (!same || !min) {
        out.push(missingRuleFinding(CODE, "the indoor opening area per 1,000 Btu/h and its minimum", "parameters", openingTarget(ctx, first, null)));
      } else {
        const req = indoorSameStoryAreaSqIn(ctx.totalInputBtuh, same.value, min.value);
        const rule = { citation: same.citation === min.citation ? same.citation : `${same.citation}; ${min.citation}`, ref: same.ref };
        let all = true;
        for (const o of sameList) all = checkOne(ctx, o, req, rule, out, sizing) && all;
        if (sameList.length < 2) {
          all = false;
          out.push(finding(CODE, "fail", MESSAGES.airOpenings.count("same-story indoor", sameList.length, 2), openingTarget(ctx, first, null), rule, {
            measured: { value: sameList.length, unit: "openings" },
            required: { value: 2, unit: "openings", comparator: "≥" },
          }));
        }
        roomOk ||= all;
      }
    }
    if (diffList.length > 0) {
      if (!diff) {
        out.push(missingRuleFinding(CODE, "the area of openings between stories per 1,000 Btu/h", "parameters", openingTarget(ctx, diffList[0]!, null)));
      } else {
        const req = indoorDifferentStoriesAreaSqIn(ctx.totalInputBtuh, diff.value);
        // The requirement is a total over all openings between the stories.
        let total = 0;
        let missing: AirOpening | null = null;
        for (const o of diffList) {
          const a = openingArea(o, ctx.rb);
          if (a.ok) total += a.freeSqIn;
          else missing ??= o;
        }
        if (missing) {
          out.push(finding(CODE, "needs-info", MESSAGES.airOpenings.needsInfo(NAMES[missing.kind]), openingTarget(ctx, missing, "widthIn"), diff));
        } else {
          const ok = atLeast(total, req);
          for (const o of diffList) {
            const a = openingArea(o, ctx.rb);
            sizing.push({ openingId: o.id, requiredFreeAreaSqIn: req, requiredGrossAreaSqIn: a.ok ? grossFor(req, a.share) : null, freeAreaSqIn: a.ok ? a.freeSqIn : null });
          }
          out.push(
            finding(
              CODE,
              ok ? "pass" : "fail",
              ok ? MESSAGES.airOpenings.pass(total, req, "openings between stories") : MESSAGES.airOpenings.fail(total, req, "openings between stories", null),
              openingTarget(ctx, diffList[0]!, "widthIn"),
              diff,
              { measured: { value: total, unit: "in²" }, required: { value: req, unit: "in²", comparator: "≥" } },
            ),
          );
          roomOk ||= ok;
        }
      }
    }
    if (roomOk) counted.add(roomId);
  }
  return counted;
}

/** Outdoor openings when indoor air is short: each sized by its method, reduced by the indoor share where allowed. */
export function checkOutdoorOpenings(
  ctx: AirContext,
  availableCuFt: number,
  requiredCuFt: number,
  out: Finding[],
  sizing: OpeningSizing[],
): void {
  const outdoor = ctx.space.openings.filter((o) => o.kind.startsWith("outdoor_"));
  if (outdoor.length === 0 || ctx.roomAir.length === 0) return;
  const anchor = target("airSpace", null, "openings", "airSpace.openings");
  if (availableCuFt >= requiredCuFt) {
    out.push(finding(CODE, "pass", MESSAGES.airOpenings.notNeeded(), anchor, null));
    return;
  }
  const combo = param(ctx.rb, "combination_method_allowed");
  const factor = combo?.value === 1 ? combinationFactor(availableCuFt, requiredCuFt) : 1;
  const hasSingle = outdoor.some((o) => o.kind === "outdoor_single_high");
  let twoCount = 0;
  let twoRule: { citation: string; ref: RuleRef | null } | null = null;
  for (const o of outdoor) {
    let key: "opening_outdoor_vertical_btuh_per_sqin" | "opening_outdoor_horizontal_btuh_per_sqin" | "opening_outdoor_single_btuh_per_sqin";
    switch (o.kind) {
      case "outdoor_direct_or_vertical_duct":
        key = "opening_outdoor_vertical_btuh_per_sqin";
        break;
      case "outdoor_horizontal_duct":
        key = "opening_outdoor_horizontal_btuh_per_sqin";
        break;
      case "outdoor_single_high":
        key = "opening_outdoor_single_btuh_per_sqin";
        break;
      default:
        continue;
    }
    const p = param(ctx.rb, key);
    if (!p || p.value <= 0) {
      out.push(missingRuleFinding(CODE, `the input served per in² of a ${NAMES[o.kind]}`, "parameters", openingTarget(ctx, o, null)));
      continue;
    }
    const reduced = factor < 1 && combo ? { citation: `${p.citation}; ${combo.citation}`, ref: p.ref } : p;
    let req: number;
    if (o.kind === "outdoor_single_high" && ctx.connectorUnknown) {
      // Without every connector's diameter the connector-area floor cannot be checked: only an
      // opening already too small for the input can be judged; anything else needs the diameter.
      const byInput = outdoorOpeningAreaSqIn(ctx.totalInputBtuh, p.value) * factor;
      const area = openingArea(o, ctx.rb);
      if (area.ok && !atLeast(area.freeSqIn, byInput)) {
        checkOne(ctx, o, byInput, reduced, out, sizing);
      } else {
        const a = ctx.connectorUnknown;
        out.push(finding(CODE, "needs-info", MESSAGES.airOpenings.needsConnector(a.label || a.id), openingTarget(ctx, o, null), reduced));
        sizing.push({ openingId: o.id, requiredFreeAreaSqIn: null, requiredGrossAreaSqIn: null, freeAreaSqIn: area.ok ? area.freeSqIn : null });
      }
      continue;
    }
    if (o.kind === "outdoor_single_high") {
      // The connector-area floor is not reduced by the indoor share.
      req = Math.max(outdoorOpeningAreaSqIn(ctx.totalInputBtuh, p.value) * factor, singleOpeningAreaSqIn(0, p.value, ctx.connectorAreaSumSqIn));
    } else {
      req = outdoorOpeningAreaSqIn(ctx.totalInputBtuh, p.value) * factor;
      twoCount++;
      twoRule ??= reduced;
    }
    checkOne(ctx, o, req, reduced, out, sizing);
  }
  if (!hasSingle && twoCount > 0 && twoCount < 2) {
    out.push(finding(CODE, "fail", MESSAGES.airOpenings.count("two-opening outdoor", twoCount, 2), anchor, twoRule, {
      measured: { value: twoCount, unit: "openings" },
      required: { value: 2, unit: "openings", comparator: "≥" },
    }));
  }
}
