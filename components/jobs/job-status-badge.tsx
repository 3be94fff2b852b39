import { JOB_STATUS_LABELS, type JobStatus } from "@/lib/schemas/job-values";

const STYLES = {
  scheduled: "bg-info-soft text-info",
  in_progress: "bg-copper-100 text-copper-800",
  awaiting_review: "bg-warn-soft text-warn",
  completed: "bg-pass-soft text-pass",
  cancelled: "bg-ink-100 text-ink-600",
} as const satisfies Record<JobStatus, string>;

export function JobStatusBadge({ status }: { status: JobStatus }) {
  return <span className={`inline-flex items-center rounded-full px-2.5 py-0.5 text-xs font-semibold ${STYLES[status]}`}>{JOB_STATUS_LABELS[status]}</span>;
}
