import { apiRoute, json, parseJsonBody, parseParams } from "@/lib/api/handler";
import { requirePermission } from "@/lib/auth/session";
import { getRulebook, getRulebookVersion, updateRulebook } from "@/lib/data/rulebooks";
import { idParamsSchema } from "@/lib/schemas/common";
import { rulebookUpdateSchema } from "@/lib/schemas/rulebook";

/** The rulebook, its version history and the content of its latest version. */
export const GET = apiRoute<{ id: string }>(async (_request, context) => {
  const member = await requirePermission("rulebooks.read");
  const { id } = await parseParams(context, idParamsSchema);
  const [rulebook, latest] = await Promise.all([getRulebook({ companyId: member.companyId, id }), getRulebookVersion({ companyId: member.companyId, rulebookId: id })]);
  return json({ rulebook, latest });
});

/** Rename, describe, archive or restore, or make current. */
export const PATCH = apiRoute<{ id: string }>(async (request, context) => {
  const member = await requirePermission("rulebooks.write");
  const { id } = await parseParams(context, idParamsSchema);
  const input = await parseJsonBody(request, rulebookUpdateSchema);
  return json({ rulebook: await updateRulebook({ companyId: member.companyId, actor: { userId: member.userId, name: member.name }, id, ...input }) });
});
