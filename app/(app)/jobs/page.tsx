import Link from "next/link";
import { requirePagePermission } from "@/lib/auth/session";
import { listJobs } from "@/lib/data/jobs";
import { jobListQuerySchema } from "@/lib/schemas/job";
import { listSearch, readListAddress } from "@/lib/lists/list-address";
import { AddressProblem } from "@/components/ui/address-problem";
import { JobStatusBadge } from "@/components/jobs/job-status-badge";
import { EmptyState } from "@/components/ui/states";
import { Pager } from "@/components/ui/pager";
import { JobsFilters } from "./jobs-filters";
import { JOB_FILTER_DEFAULTS, jobFilterValues } from "./job-filter-values";

export const metadata = { title: "Jobs" };

type SearchParams = Record<string, string | string[] | undefined>;

/** The company's jobs, searched, filtered, sorted and paged by the page's address. */
export default async function JobsPage({ searchParams }: { searchParams: Promise<SearchParams> }) {
  const member = await requirePagePermission("jobs.read");
  const { query, problem } = readListAddress(jobListQuerySchema, await searchParams);
  const result = await listJobs({ companyId: member.companyId, userId: member.userId, query });
  const filters = jobFilterValues(query);
  const filtered = Boolean(query.q || query.status || query.mine === "1");

  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-2xl font-bold tracking-tight">Jobs</h1>
          <p className="text-sm text-ink-600">Customer sites, their appliances and inspections.</p>
        </div>
        <Link href="/jobs/new" className="btn-primary">
          New job
        </Link>
      </div>
      <div className="space-y-3">
        <JobsFilters current={filters} />
        <AddressProblem problem={problem} shown="the full list is" />
        {result.items.length === 0 ? (
          <EmptyState title={filtered ? "No jobs match" : "No jobs yet"}>
            {filtered ? "Change the search or the filters." : <Link href="/jobs/new" className="font-semibold text-copper-700 underline">Create the first job</Link>}
          </EmptyState>
        ) : (
          <>
            <ul className="space-y-2 md:hidden" aria-label="Jobs">
              {result.items.map((job) => (
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
                  {result.items.map((job) => (
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
            <Pager total={result.total} page={result.page} pageCount={result.pageCount} noun="job" hrefFor={(page) => `/jobs${listSearch(filters, JOB_FILTER_DEFAULTS, page)}`} />
          </>
        )}
      </div>
    </div>
  );
}
