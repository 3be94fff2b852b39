import Link from "next/link";
import { notFound } from "next/navigation";
import { JobForm } from "./lazy-job-form";
import { JobStatusBadge } from "@/components/jobs/job-status-badge";
import { requirePagePermission } from "@/lib/auth/session";
import { can } from "@/lib/auth/roles";
import { AppError } from "@/lib/errors";
import { getJobById, type Job } from "@/lib/data/jobs";
import { listMembers } from "@/lib/data/members";
import { listJobHistory } from "@/lib/data/audit";
import { listInspectionsForJob } from "@/lib/data/inspections";
import { JobInspections } from "./job-inspections";
import { idSchema } from "@/lib/schemas/common";

export const metadata = { title: "Job" };

export default async function JobPage({ params }: { params: Promise<{ id: string }> }) {
  const member = await requirePagePermission("jobs.read");
  const parsed = idSchema.safeParse((await params).id);
  if (!parsed.success) notFound();
  let job: Job;
  try {
    job = await getJobById({ companyId: member.companyId, id: parsed.data });
  } catch (error) {
    if (error instanceof AppError && error.code === "not_found") notFound();
    throw error;
  }
  const [members, history, inspections] = await Promise.all([
    listMembers({ companyId: member.companyId, activeOnly: true }),
    listJobHistory({ companyId: member.companyId, jobId: job.id, limit: 60 }),
    listInspectionsForJob({ companyId: member.companyId, jobId: job.id }),
  ]);
  const { id: _id, reference: _ref, version, createdAt: _c, updatedAt: _u, assignedInstallerName: _n, ...values } = job;

  return (
    <div className="grid gap-6 lg:grid-cols-[1fr_18rem]">
      <div className="space-y-4">
        <nav className="text-sm text-ink-500">
          <Link href="/jobs" className="hover:underline">
            Jobs
          </Link>{" "}
          / <span className="font-mono">{job.reference}</span>
        </nav>
        <div className="flex flex-wrap items-center gap-3">
          <h1 className="text-2xl font-bold tracking-tight">{job.customerName}</h1>
          <JobStatusBadge status={job.status} />
        </div>
        <p className="text-ink-600">
          {job.siteStreet}, {job.siteCity}
          {job.sitePostalCode ? ` ${job.sitePostalCode}` : ""}
        </p>
        <JobInspections jobId={job.id} inspections={inspections} canStart={can(member.role, "jobs.write") && job.status !== "cancelled"} />
        <details className="group">
          <summary className="cursor-pointer text-lg font-bold">Job details</summary>
          <div className="mt-3">
        <JobForm
          mode="edit"
          jobId={job.id}
          version={version}
          initialValues={values}
          members={members.map((m) => ({ id: m.id, name: m.name, role: m.role }))}
          canAssign={can(member.role, "jobs.assign")}
          currentUserId={member.userId}
        />
          </div>
        </details>
      </div>
      <aside className="space-y-3" aria-labelledby="history-title">
        <h2 id="history-title" className="text-sm font-bold uppercase tracking-wide text-ink-500">
          History
        </h2>
        {history.length === 0 ? (
          <p className="text-sm text-ink-500">No changes recorded yet.</p>
        ) : (
          <ol className="space-y-2">
            {history.map((event) => (
              <li key={event.id} className="card p-3 text-sm">
                <p className="font-medium text-ink-800">{event.summary}</p>
                <p className="mt-0.5 text-xs text-ink-500">
                  {event.actorName || "System"} · <time dateTime={event.createdAt}>{event.createdAt.slice(0, 16).replace("T", " ")} UTC</time>
                </p>
              </li>
            ))}
          </ol>
        )}
      </aside>
    </div>
  );
}
