import { apiRoute, json, parseQuery } from "@/lib/api/handler";
import { requireMember } from "@/lib/auth/session";
import { can } from "@/lib/auth/roles";
import { AppError } from "@/lib/errors";
import { listInspections } from "@/lib/data/inspections";
import { inspectionListQuerySchema } from "@/lib/schemas/inspection";

/** The review queue and other lists by status. Installers see lists of drafts and returned ones only. */
export const GET = apiRoute(async (request) => {
  const member = await requireMember();
  const query = parseQuery(request, inspectionListQuerySchema);
  if (!can(member.role, "inspections.review") && !["draft", "returned"].includes(query.status)) {
    throw new AppError("forbidden", "The review queue is for supervisors and admins.");
  }
  return json(await listInspections({ companyId: member.companyId, query }));
});
