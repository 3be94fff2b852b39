import type { InspectionStatus } from "@/lib/data/inspection-access";

export const INSPECTION_STATUS_LABELS = {
  draft: "Draft",
  submitted: "Awaiting review",
  returned: "Returned for fixes",
  approved: "Approved",
  superseded: "Superseded",
} as const satisfies Record<InspectionStatus, string>;

const STYLES = {
  draft: "bg-ink-100 text-ink-700",
  submitted: "bg-warn-soft text-warn",
  returned: "bg-copper-100 text-copper-800",
  approved: "bg-pass-soft text-pass",
  superseded: "bg-ink-100 text-ink-500 line-through",
} as const satisfies Record<InspectionStatus, string>;

export function InspectionStatusBadge({ status }: { status: InspectionStatus }) {
  return <span className={`inline-flex items-center rounded-full px-2.5 py-0.5 text-xs font-semibold ${STYLES[status]}`}>{INSPECTION_STATUS_LABELS[status]}</span>;
}
