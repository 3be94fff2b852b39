import { apiRoute, json, parseJsonBody, parseParams } from "@/lib/api/handler";
import { requirePermission } from "@/lib/auth/session";
import { publicBaseUrl } from "@/lib/api/base-url";
import { emailRecord } from "@/lib/records/email-record";
import { idParamsSchema } from "@/lib/schemas/common";
import { recordEmailSchema } from "@/lib/schemas/record";

/** E-mail a share link (and optionally the PDF); the same idempotency key never sends twice. */
export const POST = apiRoute<{ id: string }>(async (request, context) => {
  const member = await requirePermission("records.share");
  const { id } = await parseParams(context, idParamsSchema);
  const input = await parseJsonBody(request, recordEmailSchema, 10_000);
  const result = await emailRecord({ companyId: member.companyId, actor: { userId: member.userId, name: member.name }, recordId: id, baseUrl: publicBaseUrl(request), ...input });
  return json(result, { status: result.duplicate ? 200 : 201 });
});
