import { apiRoute, json, parseJsonBody, parseParams } from "@/lib/api/handler";
import { requireRole } from "@/lib/auth/session";
import { repinInspection } from "@/lib/data/inspections";
import { idParamsSchema } from "@/lib/schemas/common";
import { repinSchema } from "@/lib/schemas/inspection";

export const POST = apiRoute<{ id: string }>(async (request, context) => {
  const member = await requireRole("supervisor", "admin");
  const { id } = await parseParams(context, idParamsSchema);
  const input = await parseJsonBody(request, repinSchema, 10_000);
  return json({ inspection: await repinInspection({ member, id, rulebookVersionId: input.rulebookVersionId }) });
});
