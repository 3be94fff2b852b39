import type { PDFImage } from "pdf-lib";
import { findingKey, type InspectionFinding } from "@/lib/inspections/evaluate";
import { AIR_OPENING_KIND_LABELS, TERMINATION_OPENING_LABELS } from "@/components/inspection/options";
import type { RecordInput } from "../record-input";
import type { DocumentFonts } from "./fonts";
import type { Layout } from "./layout";

/** What every section of the record reads. */
export interface RenderContext {
  readonly input: RecordInput;
  readonly layout: Layout;
  readonly fonts: DocumentFonts;
  /** Photos embedded once, in input order. */
  readonly photos: readonly PDFImage[];
}

/** Areas the findings are grouped by, in the order an installation is built. */
export const AREAS = [
  { key: "appliances", title: "Appliances" },
  { key: "connector", title: "Vent connector" },
  { key: "vent", title: "Vent and termination" },
  { key: "air", title: "Combustion air" },
  { key: "returnAir", title: "Return air" },
  { key: "readings", title: "Readings" },
  { key: "siteChecks", title: "Site checks" },
] as const;
export type AreaKey = (typeof AREAS)[number]["key"];

export function areaOf(f: InspectionFinding): AreaKey {
  switch (f.target.section) {
    case "ventRun":
      if (f.target.path.startsWith("ventRun.segments") || f.code === "connector.horizontal_length" || f.code === "connector.length_per_diameter") return "connector";
      return "vent";
    case "removedAppliances":
      return "vent";
    case "airSpace":
      return "air";
    case "returnAir":
      return "returnAir";
    case "readings":
      return "readings";
    case "siteChecks":
      return "siteChecks";
    default:
      return "appliances";
  }
}

export function applianceLabel(input: RecordInput, id: string | null | undefined): string {
  const i = input.appliances.findIndex((a) => a.id === id);
  const a = input.appliances[i];
  if (!a) return id ?? "Appliance";
  return a.label.trim() || `Appliance ${i + 1}`;
}

/** Index of the n-th item of a dotted path, e.g. `ventRun.segments.2.riseIn` → 2. */
function indexAfter(path: string, prefix: string): number | null {
  if (!path.startsWith(prefix)) return null;
  const n = Number.parseInt(path.slice(prefix.length), 10);
  return Number.isInteger(n) ? n : null;
}

/** Which part of the installation a finding is about, in words ("Segment 2", "Vent"). */
export function targetLabel(input: RecordInput, f: InspectionFinding): string | null {
  const p = f.target.path;
  const data = input.data;
  const seg = indexAfter(p, "ventRun.segments.");
  if (seg !== null) return `Segment ${seg + 1}`;
  const near = indexAfter(p, "ventRun.termination.nearbyOpenings.");
  if (near !== null) {
    const o = data.ventRun?.termination?.nearbyOpenings[near];
    return o ? `Termination, ${TERMINATION_OPENING_LABELS[o.kind].toLowerCase()}` : "Termination";
  }
  if (p.startsWith("ventRun.termination")) return "Termination";
  if (p.startsWith("ventRun.vent")) return "Vent";
  const opening = indexAfter(p, "airSpace.openings.");
  if (opening !== null) return openingLabel(input, opening);
  const room = indexAfter(p, "airSpace.rooms.");
  if (room !== null) return data.airSpace?.rooms[room]?.label || `Room ${room + 1}`;
  if (p.startsWith("airSpace")) return "Air space";
  const returnOpening = indexAfter(p, "returnAir.openings.");
  if (returnOpening !== null) return data.returnAir?.openings[returnOpening]?.label.trim() || `Return opening ${returnOpening + 1}`;
  if (p.startsWith("returnAir")) return "Return air";
  const reading = indexAfter(p, "readings.");
  if (reading !== null) return applianceLabel(input, data.readings[reading]?.applianceId);
  const appliance = indexAfter(p, "appliances.");
  if (appliance !== null) return applianceLabel(input, input.appliances[appliance]?.id);
  if (f.target.section === "removedAppliances" || f.code === "common_vent.orphaned") return "Former common vent";
  return null;
}

export function openingLabel(input: RecordInput, index: number): string {
  const o = input.data.airSpace?.openings[index];
  if (!o) return `Opening ${index + 1}`;
  return `Opening ${index + 1}: ${AIR_OPENING_KIND_LABELS[o.kind].toLowerCase()}${o.position ? `, ${o.position}` : ""}`;
}

/** The justification entry (1-based number in the list) a finding carries, if any. */
export function justificationFor(input: RecordInput, f: InspectionFinding): { number: number | null; text: string; reference: string } | null {
  const j = input.data.justifications[findingKey(f)];
  if (!j || !j.text.trim()) return null;
  const i = input.justifications.findIndex((x) => x.code === f.code && x.text.trim() === j.text.trim());
  return { number: i >= 0 ? i + 1 : null, text: j.text.trim(), reference: j.reference.trim() };
}

/** What a photo is attached to, in words. */
export function attachmentLabel(input: RecordInput, attachedTo: string | null): string {
  if (!attachedTo) return "the inspection as a whole";
  if (attachedTo.startsWith("segment:")) {
    const id = attachedTo.slice("segment:".length);
    const i = input.data.ventRun?.segments.findIndex((s) => s.id === id) ?? -1;
    return i >= 0 ? `Segment ${i + 1}` : `segment ${id}`;
  }
  if (attachedTo.startsWith("check:")) {
    const key = attachedTo.slice("check:".length);
    return `site check “${input.siteChecks.find((c) => c.key === key)?.label ?? key}”`;
  }
  return attachedTo;
}
