import type { FindingStatus } from "@/lib/venting";

export const STATUS_LABELS = {
  pass: "Pass",
  fail: "Fail",
  warn: "Warning",
  "needs-info": "Needs info",
} as const satisfies Record<FindingStatus, string>;

const STYLES = {
  pass: "bg-pass-soft text-pass border-pass/30",
  fail: "bg-fail-soft text-fail border-fail/30",
  warn: "bg-warn-soft text-warn border-warn/30",
  "needs-info": "bg-info-soft text-info border-info/30",
} as const satisfies Record<FindingStatus, string>;

export function FindingStatusChip({ status }: { status: FindingStatus }) {
  return <span className={`inline-flex shrink-0 items-center rounded border px-2 py-0.5 text-xs font-bold uppercase tracking-wide ${STYLES[status]}`}>{STATUS_LABELS[status]}</span>;
}
