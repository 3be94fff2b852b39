"use client";

import Link from "next/link";
import { useEffect, useState } from "react";
import { keepPreviousData, useQuery } from "@tanstack/react-query";
import { withQueryClient } from "@/components/query-client";
import { JobStatusBadge } from "@/components/jobs/job-status-badge";
import { EmptyState, ErrorState, ListSkeleton } from "@/components/ui/states";
import { Pager } from "@/components/ui/pager";
import { apiFetch } from "@/lib/client/api";
import { JOB_STATUSES, JOB_STATUS_LABELS, type JobSort, type JobStatus } from "@/lib/schemas/job-values";

interface JobRow {
  id: number;
  reference: string;
  customerName: string;
  siteStreet: string;
  siteCity: string;
  status: JobStatus;
  assignedInstallerName: string | null;
  scheduledFor: string;
  updatedAt: string;
}
interface JobPage {
  items: JobRow[];
  total: number;
  page: number;
  pageCount: number;
}

const SORT_LABELS: Record<JobSort, string> = {
  updated_desc: "Recently updated",
  updated_asc: "Least recently updated",
  customer_asc: "Customer A–Z",
  customer_desc: "Customer Z–A",
  scheduled_asc: "Visit date",
  reference_desc: "Newest reference",
};

function useDebounced<T>(value: T, ms: number): T {
  const [debounced, setDebounced] = useState(value);
  useEffect(() => {
    const timer = setTimeout(() => setDebounced(value), ms);
    return () => clearTimeout(timer);
  }, [value, ms]);
  return debounced;
}

function JobsListView() {
  const [search, setSearch] = useState("");
  const [status, setStatus] = useState<JobStatus | "">("");
  const [sort, setSort] = useState<JobSort>("updated_desc");
  const [mine, setMine] = useState(false);
  const [page, setPage] = useState(1);
  const q = useDebounced(search.trim(), 250);

  useEffect(() => setPage(1), [q, status, sort, mine]);

  const params = new URLSearchParams({ q, status, sort, page: String(page), pageSize: "20", mine: mine ? "1" : "0" });
  const query = useQuery({
    queryKey: ["jobs", q, status, sort, page, mine],
    queryFn: ({ signal }) => apiFetch<JobPage>(`/api/jobs?${params.toString()}`, { signal }),
    placeholderData: keepPreviousData,
  });

  return (
    <div className="space-y-3">
      <div className="card grid gap-3 p-3 sm:grid-cols-[1fr_auto_auto_auto] sm:items-end">
        <div>
          <label htmlFor="job-search" className="label">
            Search
          </label>
          <input
            id="job-search"
            type="search"
            className="input"
            placeholder="Customer, street, town or reference"
            value={search}
            maxLength={100}
            onChange={(e) => setSearch(e.target.value)}
          />
        </div>
        <div>
          <label htmlFor="job-status" className="label">
            Status
          </label>
          <select id="job-status" className="input" value={status} onChange={(e) => setStatus(e.target.value as JobStatus | "")}>
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
          <select id="job-sort" className="input" value={sort} onChange={(e) => setSort(e.target.value as JobSort)}>
            {Object.entries(SORT_LABELS).map(([value, label]) => (
              <option key={value} value={value}>
                {label}
              </option>
            ))}
          </select>
        </div>
        <label className="flex min-h-[44px] items-center gap-2 text-sm font-medium text-ink-700">
          <input type="checkbox" className="h-5 w-5 accent-copper-600" checked={mine} onChange={(e) => setMine(e.target.checked)} />
          Assigned to me
        </label>
      </div>

      {query.isPending ? (
        <ListSkeleton label="Loading jobs" />
      ) : query.isError ? (
        <ErrorState title="Jobs could not be loaded." message={query.error.message} onRetry={() => query.refetch()} />
      ) : query.data.items.length === 0 ? (
        <EmptyState title={q || status || mine ? "No jobs match" : "No jobs yet"}>
          {q || status || mine ? "Change the search or the filters." : <Link href="/jobs/new" className="font-semibold text-copper-700 underline">Create the first job</Link>}
        </EmptyState>
      ) : (
        <>
          <ul className="space-y-2 md:hidden" aria-label="Jobs">
            {query.data.items.map((job) => (
              <li key={job.id}>
                <Link href={`/jobs/${job.id}`} className="card block p-3 active:bg-ink-50">
                  <div className="flex items-start justify-between gap-2">
                    <p className="font-semibold">{job.customerName}</p>
                    <JobStatusBadge status={job.status} />
                  </div>
                  <p className="mt-0.5 text-sm text-ink-600">
                    {job.siteStreet}, {job.siteCity}
                  </p>
                  <p className="mt-1 text-xs text-ink-500">
                    {job.reference} · {job.scheduledFor ? `Visit ${job.scheduledFor}` : "No visit date"} · {job.assignedInstallerName ?? "Unassigned"}
                  </p>
                </Link>
              </li>
            ))}
          </ul>
          <div className="card hidden overflow-x-auto md:block">
            <table className="w-full text-left text-sm">
              <thead className="border-b border-ink-200 bg-ink-50 text-xs uppercase tracking-wide text-ink-500">
                <tr>
                  <th className="px-3 py-2">Reference</th>
                  <th className="px-3 py-2">Customer</th>
                  <th className="px-3 py-2">Site</th>
                  <th className="px-3 py-2">Status</th>
                  <th className="px-3 py-2">Installer</th>
                  <th className="px-3 py-2">Visit</th>
                </tr>
              </thead>
              <tbody>
                {query.data.items.map((job) => (
                  <tr key={job.id} className="border-b border-ink-100 last:border-0 hover:bg-ink-50">
                    <td className="px-3 py-2 font-mono text-xs">{job.reference}</td>
                    <td className="px-3 py-2">
                      <Link href={`/jobs/${job.id}`} className="font-semibold text-ink-900 hover:text-copper-700 hover:underline">
                        {job.customerName}
                      </Link>
                    </td>
                    <td className="px-3 py-2 text-ink-600">
                      {job.siteStreet}, {job.siteCity}
                    </td>
                    <td className="px-3 py-2">
                      <JobStatusBadge status={job.status} />
                    </td>
                    <td className="px-3 py-2 text-ink-600">{job.assignedInstallerName ?? "Unassigned"}</td>
                    <td className="px-3 py-2 text-ink-600">{job.scheduledFor || "—"}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          <Pager total={query.data.total} page={query.data.page} pageCount={query.data.pageCount} noun="job" onPage={setPage} />
        </>
      )}
    </div>
  );
}

export const JobsList = withQueryClient(JobsListView);
