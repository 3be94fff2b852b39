import type { JobListQuery } from "@/lib/schemas/job";

/** The jobs list's filters as they appear in its address (all strings), and their defaults. */
export interface JobFilterValues {
  [key: string]: string;
  q: string;
  status: string;
  sort: string;
  mine: string;
}

export const JOB_FILTER_DEFAULTS: JobFilterValues = { q: "", status: "", sort: "updated_desc", mine: "0" };

export function jobFilterValues(query: JobListQuery): JobFilterValues {
  return { q: query.q, status: query.status, sort: query.sort, mine: query.mine };
}
