import { apiRoute, json, parseJsonBody } from "@/lib/api/handler";
import { requirePermission } from "@/lib/auth/session";
import { reorderSiteCheckItems } from "@/lib/data/site-checks";
import { siteCheckReorderSchema } from "@/lib/schemas/site-check";

/** Replaces the order of the whole list with the ids sent. */
export const PUT = apiRoute(async (request) => {
  const member = await requirePermission("site_checks.manage");
  const { ids } = await parseJsonBody(request, siteCheckReorderSchema);
  return json({ items: await reorderSiteCheckItems({ companyId: member.companyId, actor: { userId: member.userId, name: member.name }, ids }) });
});
