import { apiRoute, jsonText, parseParams } from "@/lib/api/handler";
import { requireMember } from "@/lib/auth/session";
import { getInspectionJsonText } from "@/lib/data/inspections";
import { idParamsSchema } from "@/lib/schemas/common";

export const GET = apiRoute<{ id: string }>(async (_request, context) => {
  const member = await requireMember();
  const { id } = await parseParams(context, idParamsSchema);
  return jsonText(await getInspectionJsonText({ companyId: member.companyId, id }));
});
