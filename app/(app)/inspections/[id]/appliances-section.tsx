"use client";

import { useFieldArray, type Control, type UseFormGetValues, type UseFormSetValue } from "react-hook-form";
import { QuantityInput } from "@/components/inspection/quantity-input";
import { fieldId } from "@/components/inspection/field-id";
import { APPLIANCE_KIND_LABELS, CATEGORY_LABELS, DRAFT_LABELS, FUEL_LABELS } from "@/components/inspection/options";
import type { Appliance } from "@/lib/venting";
import { Section, SelectField, TriState } from "./form-bits";
import { newId, type InspectionFormValues } from "./form-values";

export function AppliancesSection({
  control,
  editable,
  jobAppliances,
  getValues,
  setValue,
}: {
  control: Control<InspectionFormValues>;
  editable: boolean;
  jobAppliances: Appliance[];
  getValues: UseFormGetValues<InspectionFormValues>;
  setValue: UseFormSetValue<InspectionFormValues>;
}) {
  const { fields, append, remove } = useFieldArray({ control, name: "appliances", keyName: "key" });
  const addAppliance = (appliance: Appliance) => {
    append(appliance);
    const readings = getValues("readings");
    if (!readings.some((r) => r.applianceId === appliance.id)) setValue("readings", [...readings, { applianceId: appliance.id }], { shouldDirty: true });
  };
  const present = new Set(fields.map((f) => (f as unknown as Appliance).label));
  const pickable = jobAppliances.filter((a) => !present.has(a.label));

  return (
    <Section id="appliances" title="Appliances">
      <div id={fieldId("appliances")} className="space-y-3">
        {fields.length === 0 ? <p className="text-sm text-ink-600">Add each appliance from its rating plate.</p> : null}
        {fields.map((field, index) => (
          <fieldset key={field.key} className="card grid gap-3 p-4 sm:grid-cols-2" disabled={!editable}>
            <legend className="px-1 text-sm font-bold text-ink-700">Appliance {index + 1}</legend>
            <div className="sm:col-span-2">
              <label htmlFor={fieldId(`appliances.${index}.label`)} className="label">
                Name on site
              </label>
              <input
                id={fieldId(`appliances.${index}.label`)}
                className="input"
                placeholder="e.g. Basement furnace"
                {...control.register(`appliances.${index}.label`)}
              />
            </div>
            <SelectField control={control} name={`appliances.${index}.kind`} label="Kind" options={APPLIANCE_KIND_LABELS} allowEmpty="Choose…" />
            <SelectField control={control} name={`appliances.${index}.fuel`} label="Fuel" options={FUEL_LABELS} allowEmpty="Choose…" />
            <QuantityInput control={control} name={`appliances.${index}.inputBtuh`} label="Rated input" kind="btuh" />
            <SelectField control={control} name={`appliances.${index}.category`} label="Venting category" options={CATEGORY_LABELS} allowEmpty="Choose…" />
            <SelectField control={control} name={`appliances.${index}.draft`} label="Draft" options={DRAFT_LABELS} allowEmpty="Choose…" />
            <QuantityInput control={control} name={`appliances.${index}.outletDiameterIn`} label="Flue collar / draft-hood outlet" kind="in" hint="Diameter, from the appliance" />
            <TriState control={control} name={`appliances.${index}.listed`} label="Listed by a testing agency" />
            <TriState control={control} name={`appliances.${index}.condensing`} label="Condensing" />
            <QuantityInput
              control={control}
              name={`appliances.${index}.manualClearanceIn`}
              label="Connector clearance in the manual"
              kind="in"
              hint="Only if the installation instructions state one; it then governs"
            />
            {editable ? (
              <div className="flex items-end justify-end sm:col-span-2">
                <button type="button" className="btn-danger" onClick={() => remove(index)}>
                  Remove appliance
                </button>
              </div>
            ) : null}
          </fieldset>
        ))}
        {editable ? (
          <div className="flex flex-wrap gap-2">
            <button
              type="button"
              className="btn-secondary"
              onClick={() => addAppliance({ id: newId("appl"), label: "", kind: "furnace", fuel: "natural_gas", category: "I", draft: "fan_assisted", listed: true, condensing: false })}
            >
              Add appliance
            </button>
            {pickable.map((a) => (
              <button key={a.id} type="button" className="btn-ghost" onClick={() => addAppliance({ ...a })}>
                Add “{a.label || a.kind}” from this job
              </button>
            ))}
          </div>
        ) : null}
      </div>
    </Section>
  );
}
