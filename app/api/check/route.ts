import { apiRoute, json, parseJsonBody } from "@/lib/api/handler";
import { requirePermission } from "@/lib/auth/session";
import { checkRequestSchema, runCheck } from "@/lib/checks/run-check";

/** Runs the engine on a posted vent run, air space and readings against a rulebook version. */
export const POST = apiRoute(async (request) => {
  const member = await requirePermission("rulebooks.read");
  const body = await parseJsonBody(request, checkRequestSchema);
  return json(await runCheck({ companyId: member.companyId, request: body }));
});
