import { apiRoute, json, parseJsonBody, parseParams } from "@/lib/api/handler";
import { requirePermission } from "@/lib/auth/session";
import { saveRulebookVersion } from "@/lib/data/rulebooks";
import { idParamsSchema } from "@/lib/schemas/common";
import { rulebookVersionCreateSchema } from "@/lib/schemas/rulebook";

/** Save edited content as the next version; older versions stay readable. */
export const POST = apiRoute<{ id: string }>(async (request, context) => {
  const member = await requirePermission("rulebooks.write");
  const { id } = await parseParams(context, idParamsSchema);
  const input = await parseJsonBody(request, rulebookVersionCreateSchema, 5_000_000);
  const result = await saveRulebookVersion({ companyId: member.companyId, actor: { userId: member.userId, name: member.name }, rulebookId: id, ...input });
  return json(result, { status: 201 });
});
