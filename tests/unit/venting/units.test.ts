import fc from "fast-check";
import { evaluate, unit } from "mathjs";
import { describe, expect, expectTypeOf, test } from "vitest";
import {
  btuhToKw,
  cToF,
  circleAreaSqIn,
  cuFtToCuM,
  cuMToCuFt,
  fToC,
  ftToM,
  inToMm,
  inWcToPa,
  kwToBtuh,
  mToFt,
  mmToIn,
  paToInWc,
  parseLength,
  roomVolumeCuFt,
  sqCmToSqIn,
  sqInToSqCm,
  type ParseLengthResult,
} from "@/lib/venting";

// Cross-checks against mathjs, a general-purpose units library.
describe("conversions agree with mathjs", () => {
  test.each([
    ["in → mm", inToMm(7), unit(7, "inch").toNumber("mm")],
    ["ft → m", ftToM(7), unit(7, "ft").toNumber("m")],
    ["ft³ → m³", cuFtToCuM(7), unit(7, "ft^3").toNumber("m^3")],
    ["in² → cm²", sqInToSqCm(7), unit(7, "inch^2").toNumber("cm^2")],
    ["Btu/h → kW", btuhToKw(100_000), unit(100_000, "BTU/h").toNumber("kW")],
    ["°F → °C", fToC(212), unit(212, "degF").toNumber("degC")],
    ["°C → °F", cToF(-40), unit(-40, "degC").toNumber("degF")],
  ])("%s", (_name, ours, theirs) => {
    expect(ours).toBeCloseTo(theirs, 3);
  });

  test("in w.c. → Pa equals ρ·g·h for water at 4 °C (1,000 kg/m³, standard gravity)", () => {
    const pa = evaluate("1000 kg/m^3 * 9.80665 m/s^2 * 1 inch").toNumber("Pa");
    expect(inWcToPa(1)).toBeCloseTo(pa, 3);
    expect(inWcToPa(-0.02)).toBeCloseTo(-4.98, 2); // REFERENCE.md D5: −0.02 in w.c. ≈ −5 Pa
  });

  test("circle area and room volume", () => {
    expect(circleAreaSqIn(4)).toBeCloseTo(evaluate("pi * 4^2 / 4"), 12);
    expect(circleAreaSqIn(6)).toBeCloseTo(28.274, 3);
    expect(roomVolumeCuFt(20, 30, 8)).toBe(evaluate("20 * 30 * 8"));
    expect(unit(roomVolumeCuFt(20, 30, 8), "ft^3").toNumber("m^3")).toBeCloseTo(cuFtToCuM(4800), 9);
  });
});

describe("round trips", () => {
  const pairs: [string, (x: number) => number, (x: number) => number][] = [
    ["in/mm", inToMm, mmToIn],
    ["ft/m", ftToM, mToFt],
    ["ft³/m³", cuFtToCuM, cuMToCuFt],
    ["in²/cm²", sqInToSqCm, sqCmToSqIn],
    ["Btu/h/kW", btuhToKw, kwToBtuh],
    ["°F/°C", fToC, cToF],
    ["in w.c./Pa", inWcToPa, paToInWc],
  ];
  test.each(pairs)("%s", (_n, to, from) => {
    fc.assert(
      fc.property(fc.double({ min: -1e6, max: 1e6, noNaN: true }), (x) => {
        expect(from(to(x))).toBeCloseTo(x, 6);
      }),
    );
  });
});

describe("parseLength", () => {
  test.each([
    [`6' 4"`, 6 + 4 / 12],
    ["6ft 4in", 6 + 4 / 12],
    ["6 feet 4 inches", 6 + 4 / 12],
    ["6'4", 6 + 4 / 12],
    ["76 in", 76 / 12],
    ['76"', 76 / 12],
    ["1.93 m", 1.93 / 0.3048],
    ["1930 mm", 1.93 / 0.3048],
    ["193 cm", 1.93 / 0.3048],
    ["12", 12],
    ["2,5 m", 2.5 / 0.3048],
    [".5 ft", 0.5],
  ])("%s", (text, ft) => {
    const r = parseLength(text);
    expect(r.ok).toBe(true);
    if (r.ok) expect(r.valueFt).toBeCloseTo(ft, 9);
  });

  test("plain numbers take the default unit", () => {
    const r = parseLength("18", "in");
    expect(r.ok && r.valueFt).toBeCloseTo(1.5, 12);
  });

  test.each(["", "abc", "-3 ft", "6 m 4 in", "4 in 6 ft", "5 furlongs", "1 2 3"])("refuses %j with a message", (text) => {
    const r = parseLength(text);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.error).toContain("Enter a length");
  });

  test("agrees with mathjs for feet-and-inches", () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 200 }), fc.integer({ min: 0, max: 11 }), (feet, inches) => {
        const r = parseLength(`${feet}' ${inches}"`);
        expect(r.ok && r.valueFt).toBeCloseTo(unit(`${feet} ft`).toNumber("ft") + unit(`${inches} inch`).toNumber("ft"), 9);
      }),
    );
  });

  test("type-level: the result is a discriminated union", () => {
    expectTypeOf(parseLength).returns.toEqualTypeOf<ParseLengthResult>();
    expectTypeOf<Extract<ParseLengthResult, { ok: true }>>().toHaveProperty("valueFt");
  });
});
