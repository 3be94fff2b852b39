"use client";

import { useFieldArray, useWatch, type Control } from "react-hook-form";
import { QuantityInput } from "@/components/inspection/quantity-input";
import { fieldId } from "@/components/inspection/field-id";
import { AIR_OPENING_KIND_LABELS, LOUVER_LABELS } from "@/components/inspection/options";
import { formatNumber, type AirSpaceSizing } from "@/lib/venting";
import { Readout, Section, SelectField, TriState } from "./form-bits";
import { newId, type InspectionFormValues } from "./form-values";

export function AirSection({ control, editable, sizing }: { control: Control<InspectionFormValues>; editable: boolean; sizing: AirSpaceSizing | null }) {
  const rooms = useFieldArray({ control, name: "airSpace.rooms", keyName: "key" });
  const openings = useFieldArray({ control, name: "airSpace.openings", keyName: "key" });
  const roomValues = useWatch({ control, name: "airSpace.rooms" });
  const openingValues = useWatch({ control, name: "airSpace.openings" });
  const requirement = sizing?.requirement ?? null;
  const enough = requirement && sizing?.availableVolumeCuFt != null ? sizing.availableVolumeCuFt >= requirement.volumeCuFt : null;

  return (
    <Section id="airSpace" title="Combustion air">
      <div className="grid gap-3 sm:grid-cols-3" aria-live="polite">
        <Readout label="Input drawing room air" value={sizing?.totalInputBtuh != null ? `${formatNumber(sizing.totalInputBtuh)} Btu/h` : "—"} note="Direct-vent appliances are left out" />
        <Readout
          label="Volume required"
          value={requirement ? `${formatNumber(requirement.volumeCuFt)} ft³` : "—"}
          note={requirement ? (requirement.method === "standard" ? "Standard method (volume per 1,000 Btu/h)" : `Known-infiltration method at ${formatNumber(requirement.achUsed ?? 0)} ACH`) : "Enter the appliances' input"}
        />
        <Readout
          label="Volume available"
          value={sizing?.availableVolumeCuFt != null ? `${formatNumber(sizing.availableVolumeCuFt)} ft³` : "—"}
          note={enough === null ? "Enter room sizes" : enough ? "Indoor air is enough by volume" : "Not enough: add openings to other rooms or outdoors"}
          tone={enough === null ? "neutral" : enough ? "pass" : "fail"}
        />
      </div>

      <h3 className="text-base font-bold">Rooms</h3>
      <ul className="space-y-3" id={fieldId("airSpace.rooms")}>
        {rooms.fields.map((field, index) => (
          <li key={field.key} id={fieldId(`airSpace.rooms.${index}`)}>
            <fieldset disabled={!editable} className="card grid gap-3 p-4 sm:grid-cols-2 lg:grid-cols-3">
              <legend className="px-1 text-sm font-bold text-ink-700">{index === 0 ? "Room with the appliances" : `Connected room ${index}`}</legend>
              <div>
                <label className="label" htmlFor={fieldId(`airSpace.rooms.${index}.label`)}>
                  Name
                </label>
                <input id={fieldId(`airSpace.rooms.${index}.label`)} className="input" placeholder="e.g. Utility room" {...control.register(`airSpace.rooms.${index}.label`)} />
              </div>
              <QuantityInput control={control} name={`airSpace.rooms.${index}.lengthFt`} label="Length" kind="ft" />
              <QuantityInput control={control} name={`airSpace.rooms.${index}.widthFt`} label="Width" kind="ft" />
              <QuantityInput control={control} name={`airSpace.rooms.${index}.heightFt`} label="Ceiling height" kind="ft" />
              <QuantityInput control={control} name={`airSpace.rooms.${index}.volumeCuFt`} label="Or volume" unit="ft³" hint="For rooms that are not a simple box" />
              {index > 0 ? <TriState control={control} name={`airSpace.rooms.${index}.openToApplianceRoom`} label="Open to the appliance room (no door)" /> : null}
              {editable ? (
                <div className="flex items-end">
                  <button type="button" className="btn-ghost text-fail" onClick={() => rooms.remove(index)}>
                    Remove room
                  </button>
                </div>
              ) : null}
            </fieldset>
          </li>
        ))}
      </ul>
      {editable ? (
        <button type="button" className="btn-secondary" onClick={() => rooms.append({ id: newId("room"), label: rooms.fields.length === 0 ? "Appliance room" : "" })}>
          {rooms.fields.length === 0 ? "Add the appliance room" : "Add connected room"}
        </button>
      ) : null}
      <fieldset disabled={!editable} className="grid gap-3 sm:grid-cols-3">
        <QuantityInput control={control} name="airSpace.airChangesPerHour" label="Known air changes per hour" unit="ACH" hint="Only from a measured blower-door result" />
      </fieldset>

      <h3 className="text-base font-bold">Air openings</h3>
      <ul className="space-y-3" id={fieldId("airSpace.openings")}>
        {openings.fields.map((field, index) => {
          const opening = openingValues?.[index];
          const openingSizing = sizing?.openings.find((o) => o.openingId === opening?.id);
          return (
            <li key={field.key} id={fieldId(`airSpace.openings.${index}`)}>
              <fieldset disabled={!editable} className="card grid gap-3 p-4 sm:grid-cols-2 lg:grid-cols-3">
                <legend className="px-1 text-sm font-bold text-ink-700">Opening {index + 1}</legend>
                <SelectField control={control} name={`airSpace.openings.${index}.kind`} label="Arrangement" options={AIR_OPENING_KIND_LABELS} />
                {opening?.kind?.startsWith("indoor") ? (
                  <SelectField
                    control={control}
                    name={`airSpace.openings.${index}.roomId`}
                    label="To room"
                    options={(roomValues ?? []).slice(1).map((r, i) => ({ value: r.id, label: r.label || `Connected room ${i + 1}` }))}
                    allowEmpty="Choose…"
                  />
                ) : null}
                <SelectField control={control} name={`airSpace.openings.${index}.position`} label="Position" options={{ high: "High (within 12 in of the ceiling)", low: "Low (within 12 in of the floor)" }} allowEmpty="Choose…" />
                <QuantityInput control={control} name={`airSpace.openings.${index}.widthIn`} label="Width" kind="in" />
                <QuantityInput control={control} name={`airSpace.openings.${index}.heightIn`} label="Height" kind="in" />
                <QuantityInput control={control} name={`airSpace.openings.${index}.diameterIn`} label="Or round duct diameter" kind="in" />
                <SelectField control={control} name={`airSpace.openings.${index}.louver`} label="Louver or grille" options={LOUVER_LABELS} />
                {opening?.louver === "other" ? (
                  <QuantityInput control={control} name={`airSpace.openings.${index}.freeAreaShare`} label="Stated free-area share" unit="0–1" hint="From the louver maker, e.g. 0.6" />
                ) : null}
                <QuantityInput control={control} name={`airSpace.openings.${index}.freeAreaSqIn`} label="Or stated free area" unit="in²" />
                <div className="sm:col-span-2 lg:col-span-3">
                  <Readout
                    label="This opening"
                    value={`${openingSizing?.freeAreaSqIn != null ? formatNumber(openingSizing.freeAreaSqIn) : "—"} in² free of ${openingSizing?.requiredFreeAreaSqIn != null ? formatNumber(openingSizing.requiredFreeAreaSqIn) : "—"} in² needed`}
                    note={openingSizing?.requiredGrossAreaSqIn != null ? `Gross size needed with this louver: ${formatNumber(openingSizing.requiredGrossAreaSqIn)} in²` : undefined}
                    tone={openingSizing?.freeAreaSqIn != null && openingSizing.requiredFreeAreaSqIn != null ? (openingSizing.freeAreaSqIn >= openingSizing.requiredFreeAreaSqIn ? "pass" : "fail") : "neutral"}
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
        <button type="button" className="btn-secondary" onClick={() => openings.append({ id: newId("air"), kind: "indoor_same_story", louver: "none" })}>
          Add air opening
        </button>
      ) : null}
    </Section>
  );
}
