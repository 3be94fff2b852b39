import { apiRoute, json, parseJsonBody, parseParams } from "@/lib/api/handler";
import { requirePermission } from "@/lib/auth/session";
import { getJobById } from "@/lib/data/jobs";
import { createInspection, listInspectionsForJob } from "@/lib/data/inspections";
import { idParamsSchema } from "@/lib/schemas/common";
import { inspectionCreateSchema } from "@/lib/schemas/inspection";

export const GET = apiRoute<{ id: string }>(async (_request, context) => {
  const member = await requirePermission("jobs.read");
  const { id } = await parseParams(context, idParamsSchema);
  await getJobById({ companyId: member.companyId, id });
  return json({ inspections: await listInspectionsForJob({ companyId: member.companyId, jobId: id }) });
});

/** Start an inspection on the job, pinned to the company's current rulebook version. */
export const POST = apiRoute<{ id: string }>(async (request, context) => {
  const member = await requirePermission("jobs.write");
  const { id } = await parseParams(context, idParamsSchema);
  const input = await parseJsonBody(request, inspectionCreateSchema, 10_000);
  return json(await createInspection({ member, jobId: id, copyAppliancesFrom: input.copyAppliancesFrom }), { status: 201 });
});
