"use client";

import { useListFilters } from "@/components/ui/use-list-filters";
import { REVIEW_FILTER_DEFAULTS, REVIEW_SORT_LABELS, REVIEW_STATUS_LABELS, type ReviewFilterValues } from "./review-filter-values";

/** Search, status and sort for the review queue; the queue itself is rendered on the server. */
export function ReviewFilters({ current }: { current: ReviewFilterValues }) {
  const { values, set, pending } = useListFilters(current, REVIEW_FILTER_DEFAULTS, ["q"]);
  return (
    <div className="card grid gap-3 p-3 sm:grid-cols-3" aria-busy={pending}>
      <div>
        <label htmlFor="queue-q" className="label">
          Search
        </label>
        <input id="queue-q" type="search" className="input" placeholder="Customer, reference or installer" value={values.q} maxLength={100} onChange={(e) => set("q", e.target.value)} />
      </div>
      <div>
        <label htmlFor="queue-status" className="label">
          Status
        </label>
        <select id="queue-status" className="input" value={values.status} onChange={(e) => set("status", e.target.value)}>
          {Object.entries(REVIEW_STATUS_LABELS).map(([v, l]) => (
            <option key={v} value={v}>
              {l}
            </option>
          ))}
        </select>
      </div>
      <div>
        <label htmlFor="queue-sort" className="label">
          Sort
        </label>
        <select id="queue-sort" className="input" value={values.sort} onChange={(e) => set("sort", e.target.value)}>
          {Object.entries(REVIEW_SORT_LABELS).map(([v, l]) => (
            <option key={v} value={v}>
              {l}
            </option>
          ))}
        </select>
      </div>
      <p className="sr-only" aria-live="polite">
        {pending ? "Updating the queue…" : ""}
      </p>
    </div>
  );
}
