import { apiRoute, json, parseParams } from "@/lib/api/handler";
import { requirePermission } from "@/lib/auth/session";
import { getRulebookVersion } from "@/lib/data/rulebooks";
import { rulebookVersionParamsSchema } from "@/lib/schemas/rulebook";

export const GET = apiRoute<{ id: string; version: string }>(async (_request, context) => {
  const member = await requirePermission("rulebooks.read");
  const { id, version } = await parseParams(context, rulebookVersionParamsSchema);
  return json({ version: await getRulebookVersion({ companyId: member.companyId, rulebookId: id, versionNumber: version }) });
});
