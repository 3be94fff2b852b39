import type { InspectionListQuery } from "@/lib/schemas/inspection";

/** The review queue's filters as they appear in its address, their defaults and labels. */
export interface ReviewFilterValues {
  [key: string]: string;
  q: string;
  status: string;
  sort: string;
}

export const REVIEW_FILTER_DEFAULTS: ReviewFilterValues = { q: "", status: "submitted", sort: "submitted_asc" };

export const REVIEW_SORT_LABELS = {
  submitted_asc: "Oldest submitted first",
  submitted_desc: "Newest submitted first",
  customer_asc: "Customer A–Z",
  installer_asc: "Installer A–Z",
} as const satisfies Record<InspectionListQuery["sort"], string>;

export const REVIEW_STATUS_LABELS = {
  submitted: "Awaiting review",
  returned: "Returned",
  draft: "Drafts",
  approved: "Approved",
  all: "All",
} as const satisfies Record<InspectionListQuery["status"], string>;

export function reviewFilterValues(query: InspectionListQuery): ReviewFilterValues {
  return { q: query.q, status: query.status, sort: query.sort };
}
