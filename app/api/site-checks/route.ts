import { apiRoute, json, parseJsonBody, parseQuery } from "@/lib/api/handler";
import { can } from "@/lib/auth/roles";
import { requireMember, requirePermission } from "@/lib/auth/session";
import { createSiteCheckItem, listSiteCheckItems } from "@/lib/data/site-checks";
import { siteCheckItemCreateSchema, siteCheckListQuerySchema } from "@/lib/schemas/site-check";

/** The company's site-check list. Every member reads the active items; admins may ask for inactive ones too. */
export const GET = apiRoute(async (request) => {
  const member = await requireMember();
  const query = parseQuery(request, siteCheckListQuerySchema);
  const wantsInactive = query.includeInactive === "1" || query.includeInactive === "true";
  const includeInactive = wantsInactive && can(member.role, "site_checks.manage");
  return json({ items: await listSiteCheckItems({ companyId: member.companyId, includeInactive }) });
});

export const POST = apiRoute(async (request) => {
  const member = await requirePermission("site_checks.manage");
  const input = await parseJsonBody(request, siteCheckItemCreateSchema);
  const item = await createSiteCheckItem({ companyId: member.companyId, actor: { userId: member.userId, name: member.name }, ...input });
  return json({ item }, { status: 201 });
});
