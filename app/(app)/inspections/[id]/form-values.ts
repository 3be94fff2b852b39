import type { InspectionData } from "@/lib/inspections/data";

type VentRun = NonNullable<InspectionData["ventRun"]>;

/** The editor's form: like the stored data, but the vent run, its termination, the air space and the return air always exist. */
export type InspectionFormValues = Omit<InspectionData, "ventRun" | "airSpace" | "returnAir"> & {
  ventRun: Omit<VentRun, "termination"> & { termination: NonNullable<VentRun["termination"]> };
  airSpace: NonNullable<InspectionData["airSpace"]>;
  returnAir: NonNullable<InspectionData["returnAir"]>;
};

export function toFormValues(data: InspectionData): InspectionFormValues {
  const ventRun = data.ventRun ?? { id: "vent-run", segments: [], vent: {}, termination: null };
  return {
    ...data,
    ventRun: { ...ventRun, termination: ventRun.termination ?? { nearbyOpenings: [] } },
    airSpace: data.airSpace ?? { id: "air-space", rooms: [], openings: [] },
    returnAir: data.returnAir ?? { id: "return-air", openings: [] },
  };
}

/**
 * The form's values as inspection data. The form leaves `undefined` for fields registered but
 * never set (an unanswered site check); a JSON round trip drops them, as the server would.
 */
export function toData(values: InspectionFormValues): InspectionData {
  return JSON.parse(JSON.stringify(values)) as InspectionData;
}

let counter = 0;
/** A short id for a new segment, room, opening or appliance; unique within the inspection. */
export function newId(prefix: string): string {
  counter += 1;
  return `${prefix}-${Date.now().toString(36)}${counter.toString(36)}`;
}
