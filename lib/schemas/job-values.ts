/**
 * Job statuses, their labels and the list sorts, without any validation code: the browser
 * imports these for menus and badges; the schemas in ./job build on the same lists.
 */
export const JOB_STATUSES = ["scheduled", "in_progress", "awaiting_review", "completed", "cancelled"] as const;
export type JobStatus = (typeof JOB_STATUSES)[number];

export const JOB_STATUS_LABELS = {
  scheduled: "Scheduled",
  in_progress: "In progress",
  awaiting_review: "Awaiting review",
  completed: "Completed",
  cancelled: "Cancelled",
} as const satisfies Record<JobStatus, string>;

export const JOB_SORTS = ["updated_desc", "updated_asc", "customer_asc", "customer_desc", "scheduled_asc", "reference_desc"] as const;
export type JobSort = (typeof JOB_SORTS)[number];

export const JOB_SORT_LABELS: Record<JobSort, string> = {
  updated_desc: "Recently updated",
  updated_asc: "Least recently updated",
  customer_asc: "Customer A–Z",
  customer_desc: "Customer Z–A",
  scheduled_asc: "Visit date",
  reference_desc: "Newest reference",
};
