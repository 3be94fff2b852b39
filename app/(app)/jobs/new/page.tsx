import { JobForm } from "@/components/jobs/job-form";
import { requirePagePermission } from "@/lib/auth/session";
import { can } from "@/lib/auth/roles";
import { listMembers } from "@/lib/data/members";

export const metadata = { title: "New job" };

export default async function NewJobPage() {
  const member = await requirePagePermission("jobs.write");
  const members = await listMembers({ companyId: member.companyId, activeOnly: true });
  return (
    <div className="mx-auto max-w-3xl space-y-4">
      <h1 className="text-2xl font-bold tracking-tight">New job</h1>
      <JobForm
        mode="create"
        members={members.map((m) => ({ id: m.id, name: m.name, role: m.role }))}
        canAssign={can(member.role, "jobs.assign")}
        currentUserId={member.userId}
      />
    </div>
  );
}
