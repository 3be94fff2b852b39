import { apiRoute, json, parseJsonBody } from "@/lib/api/handler";
import { requirePermission } from "@/lib/auth/session";
import { createMember, listMembers } from "@/lib/data/members";
import { memberCreateSchema } from "@/lib/schemas/member";

export const GET = apiRoute(async () => {
  const member = await requirePermission("members.manage");
  return json({ members: await listMembers({ companyId: member.companyId }) });
});

export const POST = apiRoute(async (request) => {
  const member = await requirePermission("members.manage");
  const input = await parseJsonBody(request, memberCreateSchema);
  const result = await createMember({ companyId: member.companyId, actor: { userId: member.userId, name: member.name }, ...input });
  return json(result, { status: 201 });
});
