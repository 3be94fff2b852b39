import { apiRoute, json, parseJsonBody, parseQuery } from "@/lib/api/handler";
import { requirePermission } from "@/lib/auth/session";
import { createRulebook, listRulebooks } from "@/lib/data/rulebooks";
import { rulebookCreateSchema } from "@/lib/schemas/rulebook";
import { z } from "zod";

const listQuerySchema = z.object({ archived: z.enum(["0", "1"]).default("0") });

export const GET = apiRoute(async (request) => {
  const member = await requirePermission("rulebooks.read");
  const query = parseQuery(request, listQuerySchema);
  return json({ rulebooks: await listRulebooks({ companyId: member.companyId, includeArchived: query.archived === "1" }) });
});

/** Create a rulebook from content, or copy another rulebook's latest version. */
export const POST = apiRoute(async (request) => {
  const member = await requirePermission("rulebooks.write");
  const input = await parseJsonBody(request, rulebookCreateSchema, 5_000_000);
  const result = await createRulebook({ companyId: member.companyId, actor: { userId: member.userId, name: member.name }, ...input });
  return json(result, { status: 201 });
});
