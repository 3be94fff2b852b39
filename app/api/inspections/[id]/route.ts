import { apiRoute, jsonBody, parseParams } from "@/lib/api/handler";
import { requireMember } from "@/lib/auth/session";
import { getInspectionJsonBody } from "@/lib/data/inspections";
import { idParamsSchema } from "@/lib/schemas/common";

export const GET = apiRoute<{ id: string }>(async (_request, context) => {
  const member = await requireMember();
  const { id } = await parseParams(context, idParamsSchema);
  return jsonBody(await getInspectionJsonBody({ companyId: member.companyId, id }));
});
