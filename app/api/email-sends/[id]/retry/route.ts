import { apiRoute, json, parseParams } from "@/lib/api/handler";
import { requirePermission } from "@/lib/auth/session";
import { retryRecordEmail } from "@/lib/records/email-record";
import { idParamsSchema } from "@/lib/schemas/common";

/** Sends a failed e-mail again. */
export const POST = apiRoute<{ id: string }>(async (_request, context) => {
  const member = await requirePermission("records.share");
  const { id } = await parseParams(context, idParamsSchema);
  return json({ emailSend: await retryRecordEmail({ companyId: member.companyId, actor: { userId: member.userId, name: member.name }, emailSendId: id }) });
});
