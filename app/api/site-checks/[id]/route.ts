import { apiRoute, json, parseJsonBody, parseParams } from "@/lib/api/handler";
import { requirePermission } from "@/lib/auth/session";
import { updateSiteCheckItem } from "@/lib/data/site-checks";
import { idParamsSchema } from "@/lib/schemas/common";
import { siteCheckItemUpdateSchema } from "@/lib/schemas/site-check";

export const PATCH = apiRoute<{ id: string }>(async (request, context) => {
  const member = await requirePermission("site_checks.manage");
  const { id } = await parseParams(context, idParamsSchema);
  const input = await parseJsonBody(request, siteCheckItemUpdateSchema);
  return json({ item: await updateSiteCheckItem({ companyId: member.companyId, actor: { userId: member.userId, name: member.name }, id, ...input }) });
});
