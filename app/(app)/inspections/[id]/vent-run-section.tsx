"use client";

import type { ReactNode } from "react";
import { useFieldArray, useWatch, type Control, type UseFormGetValues } from "react-hook-form";
import { QuantityInput } from "@/components/inspection/quantity-input";
import { fieldId } from "@/components/inspection/field-id";
import { CONNECTOR_MATERIAL_LABELS, PASSAGE_LABELS, TERMINATION_OPENING_LABELS, VENT_MATERIAL_LABELS } from "@/components/inspection/options";
import { servedApplianceIds } from "@/lib/drawing/served-appliances";
import { formatNumber, type VentRunSizing } from "@/lib/venting";
import { Readout, Section, SelectField, TriState } from "./form-bits";
import { newId, type InspectionFormValues } from "./form-values";

type Segment = InspectionFormValues["ventRun"]["segments"][number];

export function VentRunSection({
  control,
  editable,
  getValues,
  sizing,
  drawing,
}: {
  control: Control<InspectionFormValues>;
  editable: boolean;
  getValues: UseFormGetValues<InspectionFormValues>;
  sizing: VentRunSizing | null;
  drawing: ReactNode;
}) {
  const segments = useFieldArray({ control, name: "ventRun.segments", keyName: "key" });
  const openings = useFieldArray({ control, name: "ventRun.termination.nearbyOpenings", keyName: "key" });
  const removed = useFieldArray({ control, name: "removedAppliances", keyName: "key" });
  const watched = useWatch({ control, name: "ventRun.segments" });
  const appliances = useWatch({ control, name: "appliances" });
  const runApplianceIds = useWatch({ control, name: "ventRun.applianceIds" });
  const applianceName = (id: string | null | undefined): string | null => {
    const i = appliances.findIndex((a) => a.id === id);
    return i < 0 ? null : appliances[i]!.label || `Appliance ${i + 1}`;
  };
  // On a common vent each appliance has its own connector: the segments are badged with their
  // appliance and each appliance gets its own "add" button.
  const served = servedApplianceIds({ applianceIds: runApplianceIds, segments: watched }, appliances);
  const common = served.length > 1;

  const newSegment = (applianceId?: string): Segment => {
    const all = getValues("ventRun.segments");
    const last = applianceId === undefined ? all.at(-1) : all.filter((s) => s.applianceId === applianceId).at(-1);
    const appliance = appliances.find((a) => a.id === (applianceId ?? last?.applianceId)) ?? appliances[0];
    return {
      id: newId("seg"),
      applianceId: applianceId ?? last?.applianceId ?? appliances[0]?.id ?? null,
      material: last?.material ?? "single_wall",
      diameterIn: last?.diameterIn ?? appliance?.outletDiameterIn ?? null,
      orientation: "horizontal",
      turns45: 0,
      turns90: 0,
      passesThrough: "none",
      sectionsLocked: null,
    };
  };
  /** Adds a segment at the end of that appliance's connector, so that each connector stays in one piece. */
  const addFor = (applianceId: string) => {
    const lastIndex = (getValues("ventRun.segments") ?? []).findLastIndex((s) => s.applianceId === applianceId);
    if (lastIndex < 0) segments.append(newSegment(applianceId));
    else segments.insert(lastIndex + 1, newSegment(applianceId));
  };
  const segmentNumbers = (applianceId: string): number[] => (watched ?? []).flatMap((s, i) => (s?.applianceId === applianceId ? [i + 1] : []));

  return (
    <Section id="ventRun" title="Vent run" aside={<span className="text-xs text-ink-500">From the flue collar to the termination</span>}>
      <div className="card overflow-hidden p-2">{drawing}</div>

      <h3 className="text-base font-bold">Connector segments</h3>
      <ol className="space-y-3" id={fieldId("ventRun.segments")}>
        {segments.fields.map((field, index) => {
          const seg = watched?.[index];
          const segSizing = sizing?.segments.find((s) => s.segmentId === seg?.id);
          const horizontal = seg?.orientation !== "vertical";
          return (
            <li key={field.key} id={fieldId(`ventRun.segments.${index}`)} className="card space-y-3 p-4">
              <div className="flex flex-wrap items-center justify-between gap-2">
                <p className="flex flex-wrap items-center gap-2 font-bold">
                  Segment {index + 1}
                  {common ? (
                    applianceName(seg?.applianceId) ? (
                      <span className="inline-flex items-center rounded-full bg-copper-100 px-2.5 py-0.5 text-xs font-semibold text-copper-800">{applianceName(seg?.applianceId)} connector</span>
                    ) : (
                      <span className="inline-flex items-center rounded-full bg-warn-soft px-2.5 py-0.5 text-xs font-semibold text-warn">Appliance not chosen</span>
                    )
                  ) : null}
                </p>
                {editable ? (
                  <div className="flex flex-wrap gap-1">
                    <button type="button" className="btn-ghost min-h-[40px] px-2" aria-label={`Move segment ${index + 1} up`} disabled={index === 0} onClick={() => segments.move(index, index - 1)}>
                      ↑
                    </button>
                    <button
                      type="button"
                      className="btn-ghost min-h-[40px] px-2"
                      aria-label={`Move segment ${index + 1} down`}
                      disabled={index === segments.fields.length - 1}
                      onClick={() => segments.move(index, index + 1)}
                    >
                      ↓
                    </button>
                    <button type="button" className="btn-ghost min-h-[40px] px-2" onClick={() => segments.insert(index + 1, { ...getValues(`ventRun.segments.${index}`), id: newId("seg") })}>
                      Duplicate
                    </button>
                    <button type="button" className="btn-ghost min-h-[40px] px-2 text-fail" onClick={() => segments.remove(index)}>
                      Remove
                    </button>
                  </div>
                ) : null}
              </div>
              <fieldset disabled={!editable} className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
                {appliances.length > 1 ? (
                  <SelectField
                    control={control}
                    name={`ventRun.segments.${index}.applianceId`}
                    label="Connects appliance"
                    options={appliances.map((a, i) => ({ value: a.id, label: a.label || `Appliance ${i + 1}` }))}
                    allowEmpty="Choose…"
                  />
                ) : null}
                <SelectField control={control} name={`ventRun.segments.${index}.material`} label="Material" options={CONNECTOR_MATERIAL_LABELS} allowEmpty="Choose…" />
                <SelectField control={control} name={`ventRun.segments.${index}.orientation`} label="Runs" options={{ horizontal: "Horizontal (sloped)", vertical: "Vertical" }} />
                <QuantityInput control={control} name={`ventRun.segments.${index}.diameterIn`} label="Diameter" kind="in" />
                <QuantityInput control={control} name={`ventRun.segments.${index}.lengthFt`} label="Length" kind="ft" />
                {horizontal ? (
                  <QuantityInput
                    control={control}
                    name={`ventRun.segments.${index}.riseIn`}
                    label="Rise over its length"
                    kind="in"
                    allowNegative
                    hint={segSizing?.requiredRiseIn != null ? `Needs at least ${formatNumber(segSizing.requiredRiseIn)} in toward the vent` : "Rise toward the vent; a dip is negative"}
                  />
                ) : null}
                <QuantityInput control={control} name={`ventRun.segments.${index}.turns90`} label="90° turns" kind="count" hint="Elbows in this segment" />
                <QuantityInput control={control} name={`ventRun.segments.${index}.turns45`} label="45° turns" kind="count" hint="Elbows in this segment" />
                <QuantityInput control={control} name={`ventRun.segments.${index}.clearanceIn`} label="Clearance to combustibles" kind="in" hint="Measured to the nearest combustible" />
                <QuantityInput
                  control={control}
                  name={`ventRun.segments.${index}.supportsInstalled`}
                  label="Supports installed"
                  kind="count"
                  hint={segSizing?.supportsNeeded != null ? `At least ${segSizing.supportsNeeded} needed for this length` : "Hangers or straps on this segment"}
                />
                <QuantityInput control={control} name={`ventRun.segments.${index}.joints`} label="Joints" kind="count" hint="Joints in this segment" />
                <QuantityInput control={control} name={`ventRun.segments.${index}.fastenersPerJoint`} label="Fasteners per joint" kind="count" hint="The fewest found at any joint" />
                <SelectField control={control} name={`ventRun.segments.${index}.passesThrough`} label="Passes through" options={PASSAGE_LABELS} />
                {seg?.passesThrough === "wall" ? <TriState control={control} name={`ventRun.segments.${index}.thimble`} label="Listed ventilated thimble" /> : null}
                <TriState control={control} name={`ventRun.segments.${index}.sectionsLocked`} label="Every section locked" />
              </fieldset>
            </li>
          );
        })}
      </ol>
      {common ? (
        <ul className="space-y-2" aria-label="Connectors on this common vent">
          {served.map((id) => {
            const numbers = segmentNumbers(id);
            const name = applianceName(id) ?? id;
            return (
              <li key={id} className="card flex flex-wrap items-center justify-between gap-2 p-3">
                <p className="text-sm">
                  <span className="font-semibold">{name}</span>{" "}
                  {numbers.length === 0 ? (
                    <span className="text-warn">has no connector segment yet</span>
                  ) : (
                    <span className="text-ink-600">
                      connector: {numbers.length === 1 ? "segment" : "segments"} {numbers.join(", ")}
                    </span>
                  )}
                </p>
                {editable ? (
                  <button type="button" className="btn-secondary" onClick={() => addFor(id)}>
                    Add a connector segment for {name}
                  </button>
                ) : null}
              </li>
            );
          })}
        </ul>
      ) : editable ? (
        <button type="button" className="btn-secondary" onClick={() => segments.append(newSegment())}>
          Add connector segment
        </button>
      ) : null}

      <h3 className="pt-2 text-base font-bold">Vent</h3>
      <fieldset disabled={!editable} className="card grid gap-3 p-4 sm:grid-cols-2 lg:grid-cols-3" id={fieldId("ventRun.vent")}>
        <SelectField control={control} name="ventRun.vent.material" label="Material" options={VENT_MATERIAL_LABELS} allowEmpty="Choose…" />
        <QuantityInput control={control} name="ventRun.vent.diameterIn" label="Diameter" kind="in" />
        <QuantityInput control={control} name="ventRun.vent.heightFt" label="Height above the highest collar" kind="ft" hint="From the highest draft hood or flue collar to the top" />
        <QuantityInput control={control} name="ventRun.vent.lateralFt" label="Lateral (offset) in the vent" kind="ft" />
        <QuantityInput control={control} name="ventRun.vent.turns90" label="90° turns in the vent" kind="count" />
        <QuantityInput control={control} name="ventRun.vent.turns45" label="45° turns in the vent" kind="count" />
        <SelectField control={control} name="ventRun.vent.serves" label="Serves" options={{ single: "One appliance", common: "Several appliances (common vent)" }} />
        <QuantityInput control={control} name="ventRun.vent.manifoldLengthFt" label="Connector manifold length" kind="ft" hint="Only when the connectors join in a manifold before the common vent" />
        {sizing?.maxHorizontalConnectorFt != null ? (
          <Readout label="Longest horizontal connector allowed" value={`${formatNumber(sizing.maxHorizontalConnectorFt)} ft`} note="From the vent height and connector material in the rulebook" />
        ) : null}
        {sizing?.capacity ? (
          <Readout
            label={`Capacity at ${formatNumber(sizing.capacity.diameterIn)} in`}
            value={`${sizing.capacity.minBtuh != null ? formatNumber(sizing.capacity.minBtuh) : "—"} to ${sizing.capacity.maxBtuh != null ? formatNumber(sizing.capacity.maxBtuh) : "—"} Btu/h`}
            note={`${sizing.capacity.interpolated ? "Interpolated" : "Table row"}${sizing.capacity.deratePct ? `, derated ${formatNumber(sizing.capacity.deratePct)} % for extra turns` : ""}${sizing.capacity.smallestDiameterIn != null ? `; smallest that fits: ${formatNumber(sizing.capacity.smallestDiameterIn)} in` : ""}`}
          />
        ) : null}
        {sizing?.common ? (
          <>
            {sizing.common.connectors.map((c) => (
              <Readout
                key={c.applianceId}
                label={`Connector of ${appliances.find((a) => a.id === c.applianceId)?.label || c.applianceId}`}
                value={`${c.minBtuh != null ? `${formatNumber(c.minBtuh, 0)} to ` : "up to "}${c.maxBtuh != null ? formatNumber(c.maxBtuh, 0) : "—"} Btu/h at ${formatNumber(c.diameterIn)} in`}
                note={`Rise ${formatNumber(c.riseFt)} ft, horizontal ${formatNumber(c.horizontalFt)} ft${c.deratePct ? `, maximum reduced ${formatNumber(c.deratePct)} %` : ""}; smallest that works: ${c.smallestDiameterIn != null ? `${formatNumber(c.smallestDiameterIn)} in` : "none in the table"}`}
              />
            ))}
            <Readout
              label={`Common vent${sizing.common.column ? ` (${sizing.common.column === "fan_fan" ? "FAN+FAN" : sizing.common.column === "fan_nat" ? "FAN+NAT" : "NAT+NAT"})` : ""}`}
              value={`${sizing.common.totalInputBtuh != null ? formatNumber(sizing.common.totalInputBtuh, 0) : "—"} of ${sizing.common.maxBtuh != null ? formatNumber(sizing.common.maxBtuh, 0) : "—"} Btu/h`}
              note={`Smallest that works: ${sizing.common.smallestDiameterIn != null ? `${formatNumber(sizing.common.smallestDiameterIn)} in` : "none in the table"}${sizing.common.deratePct ? `; maximum reduced ${formatNumber(sizing.common.deratePct)} %` : ""}`}
            />
          </>
        ) : null}
      </fieldset>

      <h3 className="pt-2 text-base font-bold">Termination</h3>
      <fieldset disabled={!editable} className="card grid gap-3 p-4 sm:grid-cols-2 lg:grid-cols-3" id={fieldId("ventRun.termination")}>
        <QuantityInput control={control} name="ventRun.termination.roofPitchPer12" label="Roof pitch" unit="rise per 12" hint="e.g. 6 for a 6/12 roof" />
        <QuantityInput control={control} name="ventRun.termination.heightAboveRoofFt" label="Height above the roof" kind="ft" hint="Lowest discharge opening, where the vent passes through" />
        <TriState control={control} name="ventRun.termination.listedCap" label="Listed cap" />
        <QuantityInput control={control} name="ventRun.termination.capSizeIn" label="Cap size" kind="in" />
        <QuantityInput control={control} name="ventRun.termination.distanceToVerticalWallFt" label="Distance to a vertical wall" kind="ft" />
        <QuantityInput control={control} name="ventRun.termination.heightAboveNearbyStructureFt" label="Height above the building within 10 ft" kind="ft" />
      </fieldset>
      <div className="space-y-2" id={fieldId("ventRun.termination.nearbyOpenings")}>
        <p className="text-sm font-semibold text-ink-700">Doors, windows and air inlets near the termination</p>
        {openings.fields.map((field, index) => (
          <fieldset key={field.key} disabled={!editable} className="card grid gap-3 p-3 sm:grid-cols-4">
            <SelectField control={control} name={`ventRun.termination.nearbyOpenings.${index}.kind`} label="Opening" options={TERMINATION_OPENING_LABELS} />
            <QuantityInput control={control} name={`ventRun.termination.nearbyOpenings.${index}.distanceFt`} label="Distance" kind="ft" />
            <QuantityInput control={control} name={`ventRun.termination.nearbyOpenings.${index}.ventAboveFt`} label="Vent above it" unit="ft, negative if below" allowNegative />
            {editable ? (
              <div className="flex items-end">
                <button type="button" className="btn-ghost text-fail" onClick={() => openings.remove(index)}>
                  Remove
                </button>
              </div>
            ) : null}
          </fieldset>
        ))}
        {editable ? (
          <button type="button" className="btn-ghost" onClick={() => openings.append({ id: newId("open"), kind: "operable_window" })}>
            Add nearby opening
          </button>
        ) : null}
      </div>

      <details className="card p-4" id={fieldId("removedAppliances")} open={removed.fields.length > 0}>
        <summary className="cursor-pointer text-sm font-semibold">An appliance was taken off this vent</summary>
        <p className="mt-2 text-sm text-ink-600">
          When one appliance leaves a shared vent, the one left behind is checked alone against the table: an oversized vent can fail to draft.
        </p>
        <div className="mt-3 space-y-2">
          {removed.fields.map((field, index) => (
            <fieldset key={field.key} disabled={!editable} className="grid gap-3 sm:grid-cols-3">
              <div>
                <label className="label" htmlFor={fieldId(`removedAppliances.${index}.label`)}>
                  Removed appliance
                </label>
                <input id={fieldId(`removedAppliances.${index}.label`)} className="input" {...control.register(`removedAppliances.${index}.label`)} />
              </div>
              <QuantityInput control={control} name={`removedAppliances.${index}.inputBtuh`} label="Its input" kind="btuh" />
              {editable ? (
                <div className="flex items-end">
                  <button type="button" className="btn-ghost text-fail" onClick={() => removed.remove(index)}>
                    Remove
                  </button>
                </div>
              ) : null}
            </fieldset>
          ))}
          {editable ? (
            <button type="button" className="btn-ghost" onClick={() => removed.append({ id: newId("removed"), label: "" })}>
              Add removed appliance
            </button>
          ) : null}
        </div>
      </details>
    </Section>
  );
}
