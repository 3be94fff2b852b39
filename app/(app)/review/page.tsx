import Link from "next/link";
import { requirePagePermission } from "@/lib/auth/session";
import { listInspections, type InspectionSummaryRow } from "@/lib/data/inspections";
import { inspectionListQuerySchema, type InspectionListQuery } from "@/lib/schemas/inspection";
import { listSearch, readListAddress } from "@/lib/lists/list-address";
import { AddressProblem } from "@/components/ui/address-problem";
import { InspectionStatusBadge } from "@/components/inspection/inspection-status-badge";
import { EmptyState } from "@/components/ui/states";
import { Pager } from "@/components/ui/pager";
import { ReviewFilters } from "./review-filters";
import { REVIEW_FILTER_DEFAULTS, reviewFilterValues, type ReviewFilterValues } from "./review-filter-values";

export const metadata = { title: "Review queue" };

type SearchParams = Record<string, string | string[] | undefined>;

function age(iso: string, now: number): string {
  const hours = Math.max(0, Math.round((now - Date.parse(iso)) / 3_600_000));
  return hours < 24 ? `${hours} h` : `${Math.round(hours / 24)} d`;
}

/** How long a submitted inspection has waited; for the others, when they were submitted, if ever. */
function submittedWhen(row: InspectionSummaryRow, now: number): string {
  if (!row.submittedAt) return "not submitted";
  return row.status === "submitted" ? `waiting ${age(row.submittedAt, now)}` : `submitted ${age(row.submittedAt, now)} ago`;
}

/** Fails in a submitted revision were justified before it could be sent; a draft's are not yet. */
function findingCounts(row: InspectionSummaryRow): string {
  if (!row.summary) return "—";
  const { counts } = row.summary;
  const fails = counts.fail ?? 0;
  const justified = row.status !== "draft" && fails > 0 ? " (justified)" : "";
  const notApplicable = counts["not-applicable"] ?? 0;
  return `${fails} fail${justified}, ${counts.warn ?? 0} warn, ${counts.pass ?? 0} pass${notApplicable ? `, ${notApplicable} not applicable` : ""}`;
}

/** Submitted inspections (by default), searched, filtered, sorted and paged by the page's address. */
export default async function ReviewPage({ searchParams }: { searchParams: Promise<SearchParams> }) {
  const member = await requirePagePermission("inspections.review");
  const { query, problem } = readListAddress<InspectionListQuery>(inspectionListQuerySchema, await searchParams);
  const result = await listInspections({ companyId: member.companyId, query });
  const filters = reviewFilterValues(query);
  const address = (values: ReviewFilterValues, page = 1) => `/review${listSearch(values, REVIEW_FILTER_DEFAULTS, page)}`;
  const now = Date.now();

  const header = (key: InspectionListQuery["sort"] | null, label: string) => (
    <th className="px-3 py-2" aria-sort={key && query.sort === key ? "ascending" : undefined}>
      {key ? (
        <Link href={address({ ...filters, sort: key })} scroll={false} className="font-semibold uppercase hover:text-ink-800">
          {label}
          {query.sort === key ? " ▲" : ""}
        </Link>
      ) : (
        label
      )}
    </th>
  );

  return (
    <div className="space-y-4">
      <div>
        <h1 className="text-2xl font-bold tracking-tight">Review queue</h1>
        <p className="text-sm text-ink-600">Submitted inspections, oldest first. Open one to return it with comments or approve and sign it.</p>
      </div>
      <div className="space-y-3">
        <ReviewFilters current={filters} />
        <AddressProblem problem={problem} shown="the inspections awaiting review are" />
        {result.items.length === 0 ? (
          <EmptyState title={query.status === "submitted" && !query.q ? "Nothing waiting for review" : "No inspections match"} />
        ) : (
          <>
            {/* Phones: one card per inspection, nothing scrolls sideways. */}
            <ul className="space-y-2 md:hidden" aria-label="Inspections">
              {result.items.map((row) => (
                <li key={row.id}>
                  <Link href={`/inspections/${row.id}`} className="card block p-3 active:bg-ink-50">
                    <div className="flex items-start justify-between gap-2">
                      <p className="font-semibold">{row.customerName}</p>
                      <InspectionStatusBadge status={row.status} />
                    </div>
                    <p className="mt-0.5 text-sm text-ink-600">
                      {row.siteCity} · {row.installerName ?? "No installer"} · {submittedWhen(row, now)}
                    </p>
                    <p className="mt-1 text-xs text-ink-500">
                      <span className="font-mono">{row.jobReference}</span> revision {row.revision} · {findingCounts(row)}
                    </p>
                  </Link>
                </li>
              ))}
            </ul>
            <div className="card hidden overflow-x-auto md:block">
              <table className="w-full text-left text-sm" aria-label="Inspections">
                <thead className="border-b border-ink-200 bg-ink-50 text-xs uppercase tracking-wide text-ink-500">
                  <tr>
                    {header(null, "Job")}
                    {header("customer_asc", "Customer")}
                    {header("installer_asc", "Installer")}
                    {header("submitted_asc", "Submitted")}
                    {header(null, "Findings")}
                    {header(null, "Status")}
                  </tr>
                </thead>
                <tbody>
                  {result.items.map((row) => (
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
                      <td className="px-3 py-2">{submittedWhen(row, now)}</td>
                      <td className="px-3 py-2 text-xs">{findingCounts(row)}</td>
                      <td className="px-3 py-2">
                        <InspectionStatusBadge status={row.status} />
                      </td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
            <Pager total={result.total} page={result.page} pageCount={result.pageCount} noun="inspection" hrefFor={(page) => address(filters, page)} />
          </>
        )}
      </div>
    </div>
  );
}
