"use client";

import { SearchFilter, SelectFilter } from "@/components/ui/filter-fields";
import { useListFilters } from "@/components/ui/use-list-filters";
import { REVIEW_FILTER_DEFAULTS, REVIEW_SORT_LABELS, REVIEW_STATUS_LABELS, type ReviewFilterValues } from "./review-filter-values";

const STATUS_OPTIONS = Object.entries(REVIEW_STATUS_LABELS);
const SORT_OPTIONS = Object.entries(REVIEW_SORT_LABELS);

/** Search, status and sort for the review queue; the queue itself is rendered on the server. */
export function ReviewFilters({ current }: { current: ReviewFilterValues }) {
  const { values, set, pending } = useListFilters(current, REVIEW_FILTER_DEFAULTS, ["q"]);
  return (
    <div className="card grid gap-3 p-3 sm:grid-cols-3" aria-busy={pending}>
      <SearchFilter id="queue-q" placeholder="Customer, reference or installer" value={values.q} onChange={(v) => set("q", v)} />
      <SelectFilter id="queue-status" label="Status" value={values.status} options={STATUS_OPTIONS} onChange={(v) => set("status", v)} />
      <SelectFilter id="queue-sort" label="Sort" value={values.sort} options={SORT_OPTIONS} onChange={(v) => set("sort", v)} />
      <p className="sr-only" aria-live="polite">
        {pending ? "Updating the queue…" : ""}
      </p>
    </div>
  );
}
