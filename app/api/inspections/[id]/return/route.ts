import { apiRoute, json, parseJsonBody, parseParams } from "@/lib/api/handler";
import { requireRole } from "@/lib/auth/session";
import { returnInspection } from "@/lib/data/inspections";
import { idParamsSchema } from "@/lib/schemas/common";
import { returnSchema } from "@/lib/schemas/inspection";

export const POST = apiRoute<{ id: string }>(async (request, context) => {
  const member = await requireRole("supervisor", "admin");
  const { id } = await parseParams(context, idParamsSchema);
  const input = await parseJsonBody(request, returnSchema, 100_000);
  return json({ inspection: await returnInspection({ member, id, comments: input.comments }) });
});
