import { apiRoute, json, parseJsonBody, parseParams } from "@/lib/api/handler";
import { requirePermission } from "@/lib/auth/session";
import { can } from "@/lib/auth/roles";
import { getJobById, updateJob } from "@/lib/data/jobs";
import { idParamsSchema } from "@/lib/schemas/common";
import { jobUpdateSchema } from "@/lib/schemas/job";

export const GET = apiRoute<{ id: string }>(async (_request, context) => {
  const member = await requirePermission("jobs.read");
  const { id } = await parseParams(context, idParamsSchema);
  return json({ job: await getJobById({ companyId: member.companyId, id }) });
});

export const PUT = apiRoute<{ id: string }>(async (request, context) => {
  const member = await requirePermission("jobs.write");
  const { id } = await parseParams(context, idParamsSchema);
  const values = await parseJsonBody(request, jobUpdateSchema);
  const job = await updateJob({
    companyId: member.companyId,
    id,
    actor: { userId: member.userId, name: member.name },
    values,
    mayAssign: can(member.role, "jobs.assign"),
  });
  return json({ job });
});
