"use client";

import { useListFilters } from "@/components/ui/use-list-filters";
import { JOB_FILTER_DEFAULTS, type JobFilterValues } from "./job-filter-values";
import { JOB_STATUSES, JOB_STATUS_LABELS, JOB_SORT_LABELS, type JobSort } from "@/lib/schemas/job-values";

/** Search, status, sort and "mine" for the jobs list; the list itself is rendered on the server. */
export function JobsFilters({ current }: { current: JobFilterValues }) {
  const { values, set, pending } = useListFilters(current, JOB_FILTER_DEFAULTS, ["q"]);
  return (
    <div className="card grid gap-3 p-3 sm:grid-cols-[1fr_auto_auto_auto] sm:items-end" aria-busy={pending}>
      <div>
        <label htmlFor="job-search" className="label">
          Search
        </label>
        <input
          id="job-search"
          type="search"
          className="input"
          placeholder="Customer, street, town or reference"
          value={values.q}
          maxLength={100}
          onChange={(e) => set("q", e.target.value)}
        />
      </div>
      <div>
        <label htmlFor="job-status" className="label">
          Status
        </label>
        <select id="job-status" className="input" value={values.status} onChange={(e) => set("status", e.target.value)}>
          <option value="">All statuses</option>
          {JOB_STATUSES.map((s) => (
            <option key={s} value={s}>
              {JOB_STATUS_LABELS[s]}
            </option>
          ))}
        </select>
      </div>
      <div>
        <label htmlFor="job-sort" className="label">
          Sort
        </label>
        <select id="job-sort" className="input" value={values.sort} onChange={(e) => set("sort", e.target.value as JobSort)}>
          {Object.entries(JOB_SORT_LABELS).map(([value, label]) => (
            <option key={value} value={value}>
              {label}
            </option>
          ))}
        </select>
      </div>
      <label className="flex min-h-[44px] items-center gap-2 text-sm font-medium text-ink-700">
        <input type="checkbox" className="h-5 w-5 accent-copper-600" checked={values.mine === "1"} onChange={(e) => set("mine", e.target.checked ? "1" : "0")} />
        Assigned to me
      </label>
      <p className="sr-only" aria-live="polite">
        {pending ? "Updating the list…" : ""}
      </p>
    </div>
  );
}
