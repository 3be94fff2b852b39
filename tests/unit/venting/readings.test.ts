import { describe, expect, test } from "vitest";
import { airFreeCoPpm, airflowCfm, clockedInputBtuh, evaluateReadings, readingsSchema } from "@/lib/venting";
import { RB, furnace, only, waterHeater, withCode } from "@/tests/fixtures/venting/rulebook";

const readings = (over: Record<string, unknown>) => readingsSchema.parse({ applianceId: "furnace", ...over });

describe("readings.co_air_free", () => {
  // Combustion-analysis practice (REFERENCE.md D3, memory): CO_af = CO × 20.9 / (20.9 − O2).
  test("100 ppm at 10.45 % O2 is 200 ppm air-free", () => {
    expect(airFreeCoPpm(100, 10.45)).toBeCloseTo(200, 9); // 20.9 / 10.45 = 2
    expect(airFreeCoPpm(50, 0)).toBe(50);
    expect(airFreeCoPpm(50, 20.9)).toBeNull();
  });

  // IRC/IFGC Appendix D Table D.6 (REFERENCE.md D2, memory): furnace 400, water heater 200 ppm air-free.
  test.each([
    { appliance: furnace(), co: 200, o2: 10.45, status: "pass" }, // 400 exactly (boundary)
    { appliance: furnace(), co: 201, o2: 10.45, status: "fail" }, // 402
    { appliance: waterHeater(), co: 100, o2: 10.45, status: "pass" }, // 200 exactly
    { appliance: waterHeater(), co: 101, o2: 10.45, status: "fail" },
  ])("$appliance.kind $co ppm at $o2 % → $status", ({ appliance, co, o2, status }) => {
    const f = only(evaluateReadings(readings({ applianceId: appliance.id, flueCoPpm: co, flueO2Pct: o2 }), appliance, RB), "readings.co_air_free");
    expect(f.status).toBe(status);
    expect(f.safety).toBe(status === "fail" ? "co" : null);
  });

  test("missing O2 or O2 at ambient is needs-info", () => {
    expect(only(evaluateReadings(readings({ flueCoPpm: 50 }), furnace(), RB), "readings.co_air_free").target.field).toBe("flueO2Pct");
    const f = only(evaluateReadings(readings({ flueCoPpm: 50, flueO2Pct: 20.9 }), furnace(), RB), "readings.co_air_free");
    expect(f.status).toBe("needs-info");
    expect(f.message).toContain("probe");
  });

  test("no limit for an 'other' appliance is needs-info", () => {
    expect(only(evaluateReadings(readings({ flueCoPpm: 5, flueO2Pct: 8 }), furnace({ kind: "other" }), RB), "readings.co_air_free").status).toBe("needs-info");
  });
});

describe("readings.ambient_co", () => {
  // IRC Appendix D, D.2 (REFERENCE.md D1, found): < 30 ppm continue; BPI bands (D8, found): from 10 ppm marginal.
  test.each([
    { ppm: 0, status: "pass" },
    { ppm: 9, status: "pass" },
    { ppm: 10, status: "warn" },
    { ppm: 29, status: "warn" },
    { ppm: 30, status: "fail" },
    { ppm: null, status: "needs-info" },
  ])("$ppm ppm → $status", ({ ppm, status }) => {
    expect(only(evaluateReadings(readings({ ambientCoPpm: ppm }), furnace(), RB), "readings.ambient_co").status).toBe(status);
  });
});

describe("readings.draft and readings.spillage", () => {
  // BPI procedure as summarised by NORA (REFERENCE.md D5, found; common practice): about −0.01 to −0.02 in. w.c.
  test.each([
    { draft: -0.02, status: "pass" },
    { draft: -0.01, status: "pass" },
    { draft: -0.005, status: "fail" },
    { draft: 0.01, status: "fail" },
    { draft: null, status: "needs-info" },
  ])("draft $draft in. w.c. → $status", ({ draft, status }) => {
    const f = only(evaluateReadings(readings({ draftInWc: draft }), furnace(), RB), "readings.draft");
    expect(f.status).toBe(status);
    if (draft !== null && draft >= 0) expect(f.safety).toBe("spillage");
  });

  // BPI combustion safety test procedure (REFERENCE.md D4, found): fails past 60 s.
  test.each([
    { s: 60, status: "pass" },
    { s: 61, status: "fail" },
    { s: null, status: "needs-info" },
  ])("spillage $s s on a draft-hood appliance → $status", ({ s, status }) => {
    const wh = waterHeater();
    expect(only(evaluateReadings(readings({ applianceId: wh.id, spillageSeconds: s }), wh, RB), "readings.spillage").status).toBe(status);
  });

  // The spillage test is made at a draft hood (REFERENCE.md D4, found): a fan-assisted appliance
  // has none; a direct-vent appliance has neither a draft hood nor a draft to read (C12, found).
  test("spillage is not applicable to fan-assisted; draft and spillage are not applicable to direct-vent", () => {
    const fan = only(evaluateReadings(readings({ spillageSeconds: 500 }), furnace(), RB), "readings.spillage");
    expect(fan.status).toBe("not-applicable");
    expect(fan.message).toMatch(/^Not applicable: a fan-assisted appliance has no draft hood/);
    const dv = evaluateReadings(readings({ draftInWc: 0.5, spillageSeconds: 500 }), furnace({ draft: "direct_vent" }), RB);
    expect(only(dv, "readings.draft").status).toBe("not-applicable");
    expect(only(dv, "readings.spillage").status).toBe("not-applicable");
    expect(only(dv, "readings.spillage").message).toMatch(/direct-vent/);
    // A natural-draft appliance is still tested.
    expect(only(evaluateReadings(readings({ spillageSeconds: 500 }), furnace({ draft: "natural" }), RB), "readings.spillage").status).toBe("fail");
  });
});

describe("readings.temperature_rise", () => {
  // Rating plate (REFERENCE.md D7, found): rise within the plate range.
  test.each([
    { supply: 105, ret: 70, status: "pass" }, // 35 = min (boundary)
    { supply: 135, ret: 70, status: "pass" }, // 65 = max (boundary)
    { supply: 104, ret: 70, status: "fail" },
    { supply: 136, ret: 70, status: "fail" },
  ])("$supply − $ret against 35–65 °F → $status", ({ supply, ret, status }) => {
    const f = only(evaluateReadings(readings({ supplyTempF: supply, returnTempF: ret, nameplateRiseMinF: 35, nameplateRiseMaxF: 65 }), furnace(), RB), "readings.temperature_rise");
    expect(f.status).toBe(status);
    expect(f.measured?.value).toBe(supply - ret);
  });
  test("missing plate range is needs-info; a water heater's is not applicable; an unknown kind needs the kind", () => {
    expect(only(evaluateReadings(readings({ supplyTempF: 120, returnTempF: 70 }), furnace(), RB), "readings.temperature_rise").status).toBe("needs-info");
    const wh = only(evaluateReadings(readings({ applianceId: "wh", supplyTempF: 200, returnTempF: 70 }), waterHeater(), RB), "readings.temperature_rise");
    expect(wh.status).toBe("not-applicable");
    expect(wh.message).toMatch(/^Not applicable: .*furnaces/);
    const unknown = only(evaluateReadings(readings({ supplyTempF: 120, returnTempF: 70 }), furnace({ kind: null }), RB), "readings.temperature_rise");
    expect(unknown.status).toBe("needs-info");
    expect(unknown.message).toMatch(/appliance kind/);
  });
  test("airflow from output and rise", () => {
    // D7: cfm = output / (1.08 × ΔT)
    expect(airflowCfm(80_000, 60)).toBeCloseTo(1234.57, 2);
  });
});

describe("readings.input_rate", () => {
  // Physics / utility practice (REFERENCE.md D6, found / memory); ±10 % tolerance is common practice.
  test.each([
    { seconds: 45, status: "pass" }, // 3,600/45 × 1,000 = 80,000 (0 %)
    { seconds: 50, status: "pass" }, // 72,000: −10 % exactly (boundary)
    { seconds: 51, status: "warn" }, // 70,588: −11.8 %
    { seconds: 40, status: "warn" }, // 90,000: +12.5 %
  ])("1 ft³ in $seconds s at 1,000 Btu/ft³ on an 80,000 rating → $status", ({ seconds, status }) => {
    const f = only(evaluateReadings(readings({ meterDialCuFt: 1, meterSecondsPerRev: seconds, heatingValueBtuPerCuFt: 1000 }), furnace(), RB), "readings.input_rate");
    expect(f.status).toBe(status);
    expect(f.measured?.value).toBeCloseTo((3600 / seconds) * 1000, 6);
  });
  test("clocking formula and needs-info", () => {
    expect(clockedInputBtuh(0.5, 18, 1000)).toBe(100_000);
    expect(only(evaluateReadings(readings({ meterDialCuFt: 1, meterSecondsPerRev: 45 }), furnace(), RB), "readings.input_rate").status).toBe("needs-info");
  });
});
