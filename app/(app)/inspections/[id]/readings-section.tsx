"use client";

import { useEffect } from "react";
import { useWatch, type Control, type UseFormSetValue } from "react-hook-form";
import { QuantityInput } from "@/components/inspection/quantity-input";
import { airFreeCoPpm, clockedInputBtuh, formatNumber, temperatureRiseF } from "@/lib/venting";
import { Readout, Section } from "./form-bits";
import type { InspectionFormValues } from "./form-values";

export function ReadingsSection({ control, editable, setValue }: { control: Control<InspectionFormValues>; editable: boolean; setValue: UseFormSetValue<InspectionFormValues> }) {
  const appliances = useWatch({ control, name: "appliances" });
  const readings = useWatch({ control, name: "readings" });

  useEffect(() => {
    const missing = appliances.filter((a) => !readings.some((r) => r.applianceId === a.id));
    if (missing.length && editable) setValue("readings", [...readings, ...missing.map((a) => ({ applianceId: a.id }))], { shouldDirty: true });
  }, [appliances, readings, editable, setValue]);

  return (
    <Section id="readings" title="Readings">
      <p role="note" className="rounded-md border-l-4 border-fail bg-fail-soft px-3 py-2 text-sm text-ink-800">
        Measure ambient CO on entry. If it is high, or the flue CO or spillage test fails: stop, make the appliance safe, ventilate and follow your CO procedure before going on.
      </p>
      {appliances.length === 0 ? <p className="text-sm text-ink-600">Add an appliance first.</p> : null}
      {appliances.map((appliance, ai) => {
        const ri = readings.findIndex((r) => r.applianceId === appliance.id);
        if (ri < 0) return null;
        const r = readings[ri]!;
        const airFree = r.flueCoPpm != null && r.flueO2Pct != null ? airFreeCoPpm(r.flueCoPpm, r.flueO2Pct) : null;
        const rise = r.supplyTempF != null && r.returnTempF != null ? temperatureRiseF(r.supplyTempF, r.returnTempF) : null;
        const riseInRange = rise != null && r.nameplateRiseMinF != null && r.nameplateRiseMaxF != null ? rise >= r.nameplateRiseMinF && rise <= r.nameplateRiseMaxF : null;
        const clocked = r.meterDialCuFt != null && r.meterSecondsPerRev != null && r.heatingValueBtuPerCuFt != null ? clockedInputBtuh(r.meterDialCuFt, r.meterSecondsPerRev, r.heatingValueBtuPerCuFt) : null;
        const rated = appliance.inputBtuh ?? null;
        const deviation = clocked != null && rated ? ((clocked - rated) / rated) * 100 : null;
        const base = `readings.${ri}` as const;
        return (
          <fieldset key={appliance.id} disabled={!editable} className="card space-y-4 p-4" id={`f-readings-${ri}`}>
            <legend className="px-1 text-sm font-bold text-ink-700">{appliance.label || `Appliance ${ai + 1}`}</legend>
            <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
              <QuantityInput control={control} name={`${base}.ambientCoPpm`} label="Ambient CO" unit="ppm" />
              <QuantityInput control={control} name={`${base}.draftInWc`} label="Draft at steady state" unit="in. w.c." allowNegative hint="Negative is draft up the vent, e.g. -0.02" />
              <QuantityInput control={control} name={`${base}.spillageSeconds`} label="Spillage at the draft hood" unit="s" hint="Seconds until spillage stopped" />
              <QuantityInput control={control} name={`${base}.flueCoPpm`} label="Flue CO, as measured" unit="ppm" />
              <QuantityInput control={control} name={`${base}.flueO2Pct`} label="Flue O₂" unit="%" />
              <Readout
                label="Air-free CO"
                value={airFree != null ? `${formatNumber(airFree, 0)} ppm` : "—"}
                note="CO × 20.9 ÷ (20.9 − O₂)"
              />
            </div>
            <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
              <QuantityInput control={control} name={`${base}.returnTempF`} label="Return air" unit="°F" allowNegative />
              <QuantityInput control={control} name={`${base}.supplyTempF`} label="Supply air" unit="°F" allowNegative />
              <QuantityInput control={control} name={`${base}.nameplateRiseMinF`} label="Rating-plate rise, lowest" unit="°F" />
              <QuantityInput control={control} name={`${base}.nameplateRiseMaxF`} label="Rating-plate rise, highest" unit="°F" />
              <Readout
                label="Temperature rise"
                value={rise != null ? `${formatNumber(rise, 1)} °F` : "—"}
                note={riseInRange === null ? "Supply minus return" : riseInRange ? `Within ${r.nameplateRiseMinF}–${r.nameplateRiseMaxF} °F` : `Outside ${r.nameplateRiseMinF}–${r.nameplateRiseMaxF} °F`}
                tone={riseInRange === null ? "neutral" : riseInRange ? "pass" : "fail"}
              />
            </div>
            <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
              <QuantityInput control={control} name={`${base}.meterDialCuFt`} label="Meter test dial" unit="ft³ per revolution" />
              <QuantityInput control={control} name={`${base}.meterSecondsPerRev`} label="Seconds per revolution" unit="s" />
              <QuantityInput control={control} name={`${base}.heatingValueBtuPerCuFt`} label="Heating value" unit="Btu/ft³" hint="From the utility; natural gas is often about 1,000–1,050" />
              <Readout
                label="Clocked input"
                value={clocked != null ? `${formatNumber(clocked, 0)} Btu/h` : "—"}
                note={deviation != null ? `${deviation >= 0 ? "+" : ""}${formatNumber(deviation, 1)} % against the ${formatNumber(rated!)} Btu/h rating` : "3,600 × dial ÷ seconds × heating value"}
              />
            </div>
          </fieldset>
        );
      })}
    </Section>
  );
}
