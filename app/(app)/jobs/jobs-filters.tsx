"use client";

import { SearchFilter, SelectFilter } from "@/components/ui/filter-fields";
import { useListFilters } from "@/components/ui/use-list-filters";
import { JOB_FILTER_DEFAULTS, type JobFilterValues } from "./job-filter-values";
import { JOB_SORT_LABELS, JOB_STATUSES, JOB_STATUS_LABELS } from "@/lib/schemas/job-values";

const STATUS_OPTIONS = [["", "All statuses"], ...JOB_STATUSES.map((s) => [s, JOB_STATUS_LABELS[s]] as const)] as const;
const SORT_OPTIONS = Object.entries(JOB_SORT_LABELS);

/** Search, status, sort and "mine" for the jobs list; the list itself is rendered on the server. */
export function JobsFilters({ current }: { current: JobFilterValues }) {
  const { values, set, pending } = useListFilters(current, JOB_FILTER_DEFAULTS, ["q"]);
  return (
    <div className="card grid gap-3 p-3 sm:grid-cols-[1fr_auto_auto_auto] sm:items-end" aria-busy={pending}>
      <SearchFilter id="job-search" placeholder="Customer, street, town or reference" value={values.q} onChange={(v) => set("q", v)} />
      <SelectFilter id="job-status" label="Status" value={values.status} options={STATUS_OPTIONS} onChange={(v) => set("status", v)} />
      <SelectFilter id="job-sort" label="Sort" value={values.sort} options={SORT_OPTIONS} onChange={(v) => set("sort", v)} />
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
