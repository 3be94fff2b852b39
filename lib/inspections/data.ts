import { z } from "zod";
import { airSpaceSchema, applianceSchema, readingsSchema, removedApplianceSchema, returnAirSchema, ventRunSchema } from "@/lib/venting";

/**
 * What an inspection holds while it is edited: the engine's inputs, the installer's site-check
 * answers and the written justifications for findings that remain. Pure and shared by the
 * editor (browser) and the route handlers (server).
 */
export const SITE_CHECK_ANSWERS = ["yes", "no", "na"] as const;
export type SiteCheckAnswer = (typeof SITE_CHECK_ANSWERS)[number];

export const siteCheckAnswerSchema = z.object({
  answer: z.enum(SITE_CHECK_ANSWERS).nullable().default(null),
  note: z.string().max(2000, "Keep the note under 2,000 characters.").default(""),
});

export const justificationSchema = z.object({
  text: z.string().max(2000, "Keep the justification under 2,000 characters.").default(""),
  reference: z.string().max(300, "Keep the reference under 300 characters.").default(""),
});

const key = z.string().min(1).max(200);

export const inspectionDataSchema = z.object({
  appliances: z.array(applianceSchema).max(20, "At most 20 appliances per inspection.").default([]),
  ventRun: ventRunSchema.nullable().default(null),
  airSpace: airSpaceSchema.nullable().default(null),
  readings: z.array(readingsSchema).max(20).default([]),
  removedAppliances: z.array(removedApplianceSchema).max(10).default([]),
  returnAir: returnAirSchema.nullable().default(null),
  siteChecks: z.record(key, siteCheckAnswerSchema).default({}),
  justifications: z.record(key, justificationSchema).default({}),
  notes: z.string().max(5000, "Keep the notes under 5,000 characters.").default(""),
});

export type InspectionData = z.output<typeof inspectionDataSchema>;

/**
 * Reads an inspection stored by an earlier version, whose schema may have been looser (numbers
 * outside today's ranges): a value the schema refuses is cleared, so the check asks for it again
 * (needs-info), instead of the whole draft being lost. Null when it still cannot be read.
 */
export function parseStoredInspectionData(raw: unknown): InspectionData | null {
  let value: unknown = raw;
  for (let attempt = 0; attempt < 5; attempt++) {
    const parsed = inspectionDataSchema.safeParse(value);
    if (parsed.success) return parsed.data;
    if (attempt === 0) value = structuredClone(raw);
    let cleared = false;
    for (const issue of parsed.error.issues) cleared = clearNumberAt(value, issue.path) || cleared;
    if (!cleared) return null;
  }
  return null;
}

/** Sets the number at a path to null; false when there is no number there. */
function clearNumberAt(root: unknown, path: readonly PropertyKey[]): boolean {
  if (path.length === 0) return false;
  let node: unknown = root;
  for (const key of path.slice(0, -1)) {
    if (!node || typeof node !== "object") return false;
    node = (node as Record<PropertyKey, unknown>)[key];
  }
  const last = path[path.length - 1]!;
  if (!node || typeof node !== "object" || typeof (node as Record<PropertyKey, unknown>)[last] !== "number") return false;
  (node as Record<PropertyKey, unknown>)[last] = null;
  return true;
}
export type InspectionDataInput = z.input<typeof inspectionDataSchema>;

/** Limits that keep a draft bounded (a phone can still hold a very large job). */
export const MAX_SEGMENTS = 60;
export const MAX_ROOMS = 20;

/** A fresh inspection: one vent run with the vent and termination ready to fill in. */
export function emptyInspectionData(appliances: InspectionData["appliances"] = []): InspectionData {
  return {
    appliances,
    ventRun: { id: "vent-run", segments: [], vent: { material: "type_b", serves: "single", turns45: 0, turns90: 0, lateralFt: 0 }, termination: { listedCap: true, nearbyOpenings: [] } },
    airSpace: { id: "air-space", rooms: [], openings: [] },
    readings: appliances.map((a) => ({ applianceId: a.id })),
    removedAppliances: [],
    returnAir: { id: "return-air", openings: [] },
    siteChecks: {},
    justifications: {},
    notes: "",
  };
}
