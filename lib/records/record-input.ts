import type { Appliance, FindingSummary, AirSpaceSizing, ReturnAirSizing, VentRunSizing } from "@/lib/venting";
import type { InspectionData } from "@/lib/inspections/data";
import type { InspectionFinding } from "@/lib/inspections/evaluate";

/**
 * Everything the signed PDF record shows, gathered by the server when a supervisor approves.
 * Plain data: the renderer does no I/O of its own apart from loading the shipped fonts.
 */
export interface RecordInput {
  /** Human-facing record id, e.g. "R-000042". */
  recordNumber: string;
  revision: number;
  /** Short code printed on every page and in the QR code. */
  verificationCode: string;
  /** Full URL of the verification page with the code filled in. */
  verifyUrl: string;
  /** When the record was rendered (also the PDF's creation and modification date). */
  generatedAt: string;
  /** Earlier revision this one corrects, if any. */
  supersedesRevision: number | null;
  company: { name: string; licenceNumber: string; phone: string; email: string; address: string };
  job: { reference: string; customerName: string; siteAddress: string };
  inspection: { id: number; submittedAt: string; approvedAt: string; notes: string };
  appliances: Appliance[];
  data: InspectionData;
  findings: InspectionFinding[];
  summary: FindingSummary;
  sizing: { ventRun: VentRunSizing | null; airSpace: AirSpaceSizing | null; returnAir?: ReturnAirSizing | null };
  rulebook: { name: string; versionNumber: number; edition: string; demoDataNote: string | null; contentSha256: string };
  siteChecks: { key: string; label: string; answer: "yes" | "no" | "na" | null; note: string }[];
  justifications: { title: string; code: string; text: string; reference: string }[];
  photos: { caption: string; tag: string; attachedTo: string | null; width: number; height: number; jpegBytes: Uint8Array }[];
  installer: { signedName: string; signaturePng: string | null; signedAt: string };
  supervisor: { signedName: string; signaturePng: string | null; signedAt: string };
}
