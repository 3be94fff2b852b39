import { apiRoute, json, parseJsonBody, parseQuery } from "@/lib/api/handler";
import { requirePermission } from "@/lib/auth/session";
import { can } from "@/lib/auth/roles";
import { AppError } from "@/lib/errors";
import { createJob, listJobs } from "@/lib/data/jobs";
import { jobFormSchema, jobListQuerySchema } from "@/lib/schemas/job";

export const GET = apiRoute(async (request) => {
  const member = await requirePermission("jobs.read");
  const query = parseQuery(request, jobListQuerySchema);
  return json(await listJobs({ companyId: member.companyId, userId: member.userId, query }));
});

export const POST = apiRoute(async (request) => {
  const member = await requirePermission("jobs.write");
  const values = await parseJsonBody(request, jobFormSchema);
  if (values.assignedInstallerId !== null && values.assignedInstallerId !== member.userId && !can(member.role, "jobs.assign")) {
    throw new AppError("forbidden", "Only a supervisor or admin can assign a job to someone else.");
  }
  const job = await createJob({ companyId: member.companyId, actor: { userId: member.userId, name: member.name }, values });
  return json({ job }, { status: 201 });
});
