import type { FindingStatus } from "@/lib/venting";

export const STATUS_LABELS = {
  pass: "Pass",
  "not-applicable": "Not applicable",
  fail: "Fail",
  warn: "Warning",
  "needs-info": "Needs info",
} as const satisfies Record<FindingStatus, string>;

const STYLES = {
  pass: "bg-pass-soft text-pass border-pass/30",
  // The dashed edge tells "not applicable" apart without relying on its colour.
  "not-applicable": "bg-na-soft text-na border-na/50 border-dashed",
  fail: "bg-fail-soft text-fail border-fail/30",
  warn: "bg-warn-soft text-warn border-warn/30",
  "needs-info": "bg-info-soft text-info border-info/30",
} as const satisfies Record<FindingStatus, string>;

export function FindingStatusChip({ status }: { status: FindingStatus }) {
  return <span className={`inline-flex shrink-0 items-center rounded border px-2 py-0.5 text-xs font-bold uppercase tracking-wide ${STYLES[status]}`}>{STATUS_LABELS[status]}</span>;
}
