"use client";

import { useMemo } from "react";
import { useFieldArray, useWatch, type Control } from "react-hook-form";
import { QuantityInput } from "@/components/inspection/quantity-input";
import { fieldId } from "@/components/inspection/field-id";
import { RETURN_AIR_SPACE_LABELS } from "@/components/inspection/options";
import { formatNumber, returnAirSchema, type AirflowSource, type OutputSource, type ReturnAirSizing } from "@/lib/venting";
import type { InspectionFinding } from "@/lib/inspections/evaluate";
import { Readout, Section, SelectField, TriState } from "./form-bits";
import { newId, type InspectionFormValues } from "./form-values";

const OUTPUT_SOURCES: Record<OutputSource, string> = {
  entered: "From the rating plate, as entered",
  input_efficiency: "Rated input × efficiency",
};

const AIRFLOW_SOURCES: Record<AirflowSource, string> = {
  nameplate: "Rating-plate airflow, as entered",
  cooling_tons: "Cooling tons × the rulebook's cfm per ton",
  temperature_rise: "Output ÷ (rulebook factor × temperature rise)",
};

const RETURN_AIR_CAUTION =
  "Return openings are judged against the company's rulebook; the furnace maker's instructions and local code govern. A return that depressurises a room with a draft hood can pull flue gases into the house: run a spillage test with the blower on.";

/**
 * The return-air side of a furnace: its output and airflow, and each return opening with where it
 * draws from. Shown in full only when a furnace is among the appliances.
 */
export function ReturnAirSection({
  control,
  editable,
  sizing,
  findings,
}: {
  control: Control<InspectionFormValues>;
  editable: boolean;
  sizing: ReturnAirSizing | null;
  findings: readonly InspectionFinding[];
}) {
  const openings = useFieldArray({ control, name: "returnAir.openings", keyName: "key" });
  const appliances = useWatch({ control, name: "appliances" });
  const returnAir = useWatch({ control, name: "returnAir" });
  const furnaces = (appliances ?? []).filter((a) => a.kind === "furnace");
  // Values the engine refuses (out of range) keep the last good findings; say here what to fix.
  const problems = useMemo(() => {
    const parsed = returnAirSchema.safeParse(returnAir);
    return parsed.success ? [] : [...new Set(parsed.error.issues.map((i) => i.message))];
  }, [returnAir]);

  if (furnaces.length === 0 && !returnAir?.applianceId) {
    return (
      <Section id="returnAir" title="Return air">
        <p className="text-sm text-ink-600">Return air is checked for a furnace: add the furnace under Appliances to check its return openings and grilles.</p>
      </Section>
    );
  }

  const totalOk = sizing?.totalFreeAreaSqIn != null && sizing.requiredFreeAreaSqIn != null ? sizing.totalFreeAreaSqIn >= sizing.requiredFreeAreaSqIn : null;
  const locationFinding = (openingId: string) => findings.find((f) => f.code === "return_air.location" && f.target.itemId === openingId);

  return (
    <Section id="returnAir" title="Return air">
      <p role="note" className="rounded-md border-l-4 border-warn bg-warn-soft px-3 py-2 text-sm text-ink-800">
        {RETURN_AIR_CAUTION}
      </p>
      {problems.length ? (
        <ul role="alert" className="space-y-1 rounded-md border border-fail/40 bg-fail-soft px-3 py-2 text-sm font-medium text-fail">
          {problems.map((p) => (
            <li key={p}>{p}</li>
          ))}
        </ul>
      ) : null}

      <fieldset disabled={!editable} className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
        {furnaces.length > 1 || returnAir?.applianceId ? (
          <SelectField
            control={control}
            name="returnAir.applianceId"
            label="Furnace served"
            options={furnaces.map((a, i) => ({ value: a.id, label: a.label || `Furnace ${i + 1}` }))}
            allowEmpty="Choose…"
          />
        ) : null}
        <QuantityInput control={control} name="returnAir.outputBtuh" label="Output (rating plate)" kind="btuh" />
        <QuantityInput control={control} name="returnAir.efficiencyPct" label="Or efficiency" unit="%" hint="Output = rated input × efficiency" />
        <QuantityInput control={control} name="returnAir.airflowCfm" label="Blower airflow (rating plate)" unit="cfm" />
        <QuantityInput control={control} name="returnAir.coolingTons" label="Or cooling size" unit="tons" />
        <QuantityInput control={control} name="returnAir.temperatureRiseF" label="Or temperature rise" unit="°F" hint="Left empty: supply minus return from the readings" />
      </fieldset>

      <div className="grid gap-3 sm:grid-cols-3" aria-live="polite">
        <Readout
          label="Output"
          value={sizing?.outputBtuh != null ? `${formatNumber(sizing.outputBtuh, 0)} Btu/h` : "—"}
          note={sizing?.outputSource ? OUTPUT_SOURCES[sizing.outputSource] : "Enter the output, or the efficiency"}
        />
        <Readout
          label="Airflow"
          value={sizing?.airflowCfm != null ? `${formatNumber(sizing.airflowCfm, 0)} cfm` : "—"}
          note={
            sizing?.airflowSource
              ? `${AIRFLOW_SOURCES[sizing.airflowSource]}${sizing.temperatureRiseF != null ? ` (${formatNumber(sizing.temperatureRiseF, 1)} °F)` : ""}`
              : "Enter the airflow, the cooling tons or the temperature rise"
          }
        />
        <Readout
          label="Return free area"
          value={`${sizing?.totalFreeAreaSqIn != null ? formatNumber(sizing.totalFreeAreaSqIn, 1) : "—"} in² of ${sizing?.requiredFreeAreaSqIn != null ? formatNumber(sizing.requiredFreeAreaSqIn, 1) : "—"} in² needed`}
          note="Needed: the rulebook's area per 1,000 Btu/h of output"
          tone={totalOk === null ? "neutral" : totalOk ? "pass" : "fail"}
        />
      </div>

      <h3 className="text-base font-bold">Return openings and grilles</h3>
      <ul className="space-y-3" id={fieldId("returnAir.openings")}>
        {openings.fields.map((field, index) => {
          const o = returnAir?.openings?.[index];
          const os = sizing?.openings.find((x) => x.openingId === o?.id);
          const location = o ? locationFinding(o.id) : undefined;
          const showException = Boolean(location && (location.status === "fail" || location.status === "warn")) || o?.exceptionApplies != null;
          const fast = os?.faceVelocityFpm != null && os.velocityLimitFpm != null ? os.faceVelocityFpm > os.velocityLimitFpm : null;
          const base = `returnAir.openings.${index}` as const;
          return (
            <li key={field.key} id={fieldId(base)}>
              <fieldset disabled={!editable} className="card grid gap-3 p-4 sm:grid-cols-2 lg:grid-cols-3">
                <legend className="px-1 text-sm font-bold text-ink-700">Return opening {index + 1}</legend>
                <div>
                  <label className="label" htmlFor={fieldId(`${base}.label`)}>
                    Name
                  </label>
                  <input id={fieldId(`${base}.label`)} className="input" placeholder="e.g. Hall grille" {...control.register(`${base}.label`)} />
                </div>
                <SelectField control={control} name={`${base}.space`} label="Draws from" options={RETURN_AIR_SPACE_LABELS} allowEmpty="Choose…" />
                <QuantityInput control={control} name={`${base}.widthIn`} label="Width" kind="in" />
                <QuantityInput control={control} name={`${base}.heightIn`} label="Height" kind="in" />
                <QuantityInput control={control} name={`${base}.diameterIn`} label="Or round diameter" kind="in" />
                <QuantityInput control={control} name={`${base}.freeAreaShare`} label="Free-area share" unit="0–1" hint="From the grille maker, e.g. 0.7; 1 for an open duct" />
                <QuantityInput control={control} name={`${base}.freeAreaSqIn`} label="Or stated free area" unit="in²" />
                <TriState control={control} name={`${base}.filterGrille`} label="Holds the filter (filter grille)" />
                <TriState control={control} name={`${base}.fuelApplianceInSpace`} label="Draft hood or open burner in that space" />
                <QuantityInput control={control} name={`${base}.distanceToDraftHoodFt`} label="Distance to that draft hood" kind="ft" />
                <TriState control={control} name={`${base}.soleReturnSource`} label="That space is the only return source" />
                {showException ? <TriState control={control} name={`${base}.exceptionApplies`} label="The rulebook's exception applies (see the finding)" /> : null}
                <div className="sm:col-span-2 lg:col-span-3">
                  <Readout
                    label="This opening"
                    value={`${os?.freeAreaSqIn != null ? formatNumber(os.freeAreaSqIn, 1) : "—"} in² free · ${os?.airflowCfm != null ? formatNumber(os.airflowCfm, 0) : "—"} cfm · ${os?.faceVelocityFpm != null ? formatNumber(os.faceVelocityFpm, 0) : "—"} fpm`}
                    note={
                      os?.velocityLimitFpm != null
                        ? `Face velocity limit ${formatNumber(os.velocityLimitFpm, 0)} fpm (rulebook, common practice); airflow shared by free area`
                        : "Face velocity = its share of the airflow ÷ free area"
                    }
                    tone={fast === null ? "neutral" : fast ? "warn" : "pass"}
                  />
                </div>
                {editable ? (
                  <div className="flex items-end">
                    <button type="button" className="btn-ghost text-fail" onClick={() => openings.remove(index)}>
                      Remove opening
                    </button>
                  </div>
                ) : null}
              </fieldset>
            </li>
          );
        })}
      </ul>
      {editable ? (
        <button type="button" className="btn-secondary" onClick={() => openings.append({ id: newId("ret"), label: "" })}>
          Add return opening
        </button>
      ) : null}
    </Section>
  );
}
