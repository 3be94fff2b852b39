import Link from "next/link";
import { requirePagePermission } from "@/lib/auth/session";
import { JobsList } from "./jobs-list";

export const metadata = { title: "Jobs" };

export default async function JobsPage() {
  await requirePagePermission("jobs.read");
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
      <JobsList />
    </div>
  );
}
