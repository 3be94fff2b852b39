import { apiRoute, json, parseJsonBody, parseParams } from "@/lib/api/handler";
import { requirePermission } from "@/lib/auth/session";
import { revokeRecord } from "@/lib/data/records";
import { idParamsSchema } from "@/lib/schemas/common";
import { recordRevokeSchema } from "@/lib/schemas/record";

/** Marks a record revoked: verification then says so. The bytes stay, unchanged. */
export const POST = apiRoute<{ id: string }>(async (request, context) => {
  const member = await requirePermission("records.revoke");
  const { id } = await parseParams(context, idParamsSchema);
  const input = await parseJsonBody(request, recordRevokeSchema, 10_000);
  return json({ record: await revokeRecord({ companyId: member.companyId, actor: { userId: member.userId, name: member.name }, recordId: id, reason: input.reason }) });
});
