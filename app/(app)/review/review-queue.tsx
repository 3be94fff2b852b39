"use client";

import Link from "next/link";
import { useEffect, useState } from "react";
import { keepPreviousData, useQuery } from "@tanstack/react-query";
import { withQueryClient } from "@/components/query-client";
import { InspectionStatusBadge } from "@/components/inspection/inspection-status-badge";
import { EmptyState, ErrorState, ListSkeleton } from "@/components/ui/states";
import { Pager } from "@/components/ui/pager";
import { apiFetch } from "@/lib/client/api";
import type { InspectionStatus } from "@/lib/data/inspection-access";

interface Row {
  id: number;
  jobId: number;
  jobReference: string;
  customerName: string;
  siteCity: string;
  status: InspectionStatus;
  revision: number;
  installerName: string | null;
  submittedAt: string | null;
  summary: { counts: Record<string, number> } | null;
}
interface Page {
  items: Row[];
  total: number;
  page: number;
  pageCount: number;
}

const SORTS = { submitted_asc: "Oldest submitted first", submitted_desc: "Newest submitted first", customer_asc: "Customer A–Z", installer_asc: "Installer A–Z" } as const;
const STATUSES = { submitted: "Awaiting review", returned: "Returned", draft: "Drafts", approved: "Approved", all: "All" } as const;

function age(iso: string | null): string {
  if (!iso) return "—";
  const hours = Math.max(0, Math.round((Date.now() - Date.parse(iso)) / 3_600_000));
  return hours < 24 ? `${hours} h` : `${Math.round(hours / 24)} d`;
}

function ReviewQueueView() {
  const [status, setStatus] = useState<keyof typeof STATUSES>("submitted");
  const [sort, setSort] = useState<keyof typeof SORTS>("submitted_asc");
  const [q, setQ] = useState("");
  const [page, setPage] = useState(1);
  useEffect(() => setPage(1), [status, sort, q]);
  const query = useQuery({
    queryKey: ["inspections", status, sort, q, page],
    queryFn: ({ signal }) => apiFetch<Page>(`/api/inspections?${new URLSearchParams({ status, sort, q, page: String(page) })}`, { signal }),
    placeholderData: keepPreviousData,
  });
  const header = (key: keyof typeof SORTS | null, label: string) => (
    <th className="px-3 py-2" aria-sort={key && sort === key ? "ascending" : undefined}>
      {key ? (
        <button type="button" className="font-semibold uppercase hover:text-ink-800" onClick={() => setSort(key)}>
          {label}
          {sort === key ? " ▲" : ""}
        </button>
      ) : (
        label
      )}
    </th>
  );
  return (
    <div className="space-y-3">
      <div className="card grid gap-3 p-3 sm:grid-cols-3">
        <div>
          <label htmlFor="queue-q" className="label">
            Search
          </label>
          <input id="queue-q" type="search" className="input" placeholder="Customer, reference or installer" value={q} maxLength={100} onChange={(e) => setQ(e.target.value)} />
        </div>
        <div>
          <label htmlFor="queue-status" className="label">
            Status
          </label>
          <select id="queue-status" className="input" value={status} onChange={(e) => setStatus(e.target.value as keyof typeof STATUSES)}>
            {Object.entries(STATUSES).map(([v, l]) => (
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
          <select id="queue-sort" className="input" value={sort} onChange={(e) => setSort(e.target.value as keyof typeof SORTS)}>
            {Object.entries(SORTS).map(([v, l]) => (
              <option key={v} value={v}>
                {l}
              </option>
            ))}
          </select>
        </div>
      </div>
      {query.isPending ? (
        <ListSkeleton label="Loading the queue" />
      ) : query.isError ? (
        <ErrorState title="The queue could not be loaded." message={query.error.message} onRetry={() => query.refetch()} />
      ) : query.data.items.length === 0 ? (
        <EmptyState title={status === "submitted" ? "Nothing waiting for review" : "No inspections match"} />
      ) : (
        <>
          <div className="card overflow-x-auto">
            <table className="w-full min-w-[40rem] text-left text-sm" aria-label="Inspections">
              <thead className="border-b border-ink-200 bg-ink-50 text-xs uppercase tracking-wide text-ink-500">
                <tr>
                  {header(null, "Job")}
                  {header("customer_asc", "Customer")}
                  {header("installer_asc", "Installer")}
                  {header("submitted_asc", "Waiting")}
                  {header(null, "Findings")}
                  {header(null, "Status")}
                </tr>
              </thead>
              <tbody>
                {query.data.items.map((row) => (
                  <tr key={row.id} className="border-b border-ink-100 last:border-0 hover:bg-ink-50">
                    <td className="px-3 py-2 font-mono text-xs">
                      {row.jobReference} · r{row.revision}
                    </td>
                    <td className="px-3 py-2">
                      <Link href={`/inspections/${row.id}`} className="font-semibold hover:text-copper-700 hover:underline">
                        {row.customerName}
                      </Link>
                      <span className="block text-xs text-ink-500">{row.siteCity}</span>
                    </td>
                    <td className="px-3 py-2">{row.installerName ?? "—"}</td>
                    <td className="px-3 py-2">{age(row.submittedAt)}</td>
                    <td className="px-3 py-2 text-xs">
                      {row.summary ? `${row.summary.counts.fail ?? 0} fail (justified), ${row.summary.counts.warn ?? 0} warn, ${row.summary.counts.pass ?? 0} pass` : "—"}
                    </td>
                    <td className="px-3 py-2">
                      <InspectionStatusBadge status={row.status} />
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          <Pager total={query.data.total} page={query.data.page} pageCount={query.data.pageCount} noun="inspection" onPage={setPage} />
        </>
      )}
    </div>
  );
}

export const ReviewQueue = withQueryClient(ReviewQueueView);
