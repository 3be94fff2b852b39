import { apiRoute, json, parseJsonBody, parseParams } from "@/lib/api/handler";
import { requirePermission } from "@/lib/auth/session";
import { getMemberById, updateMember } from "@/lib/data/members";
import { idParamsSchema } from "@/lib/schemas/common";
import { memberUpdateSchema } from "@/lib/schemas/member";

export const GET = apiRoute<{ id: string }>(async (_request, context) => {
  const member = await requirePermission("members.manage");
  const { id } = await parseParams(context, idParamsSchema);
  return json({ member: await getMemberById({ companyId: member.companyId, id }) });
});

export const PATCH = apiRoute<{ id: string }>(async (request, context) => {
  const member = await requirePermission("members.manage");
  const { id } = await parseParams(context, idParamsSchema);
  const input = await parseJsonBody(request, memberUpdateSchema);
  return json({ member: await updateMember({ companyId: member.companyId, actor: { userId: member.userId, name: member.name }, id, ...input }) });
});
