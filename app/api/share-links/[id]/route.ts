import { apiRoute, json, parseParams } from "@/lib/api/handler";
import { requirePermission } from "@/lib/auth/session";
import { revokeShareLink } from "@/lib/data/records";
import { idParamsSchema } from "@/lib/schemas/common";

/** Revokes a share link at once; its holder then gets 410. */
export const DELETE = apiRoute<{ id: string }>(async (_request, context) => {
  const member = await requirePermission("records.share");
  const { id } = await parseParams(context, idParamsSchema);
  await revokeShareLink({ companyId: member.companyId, actor: { userId: member.userId, name: member.name }, shareLinkId: id });
  return json({ ok: true });
});
