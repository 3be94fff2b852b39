import { apiRoute, json, parseJsonBody, parseParams } from "@/lib/api/handler";
import { requireRole } from "@/lib/auth/session";
import { commentOnInspection } from "@/lib/data/inspections";
import { idParamsSchema } from "@/lib/schemas/common";
import { commentSchema } from "@/lib/schemas/inspection";

/** A review comment on one section (supervisors and admins). */
export const POST = apiRoute<{ id: string }>(async (request, context) => {
  const member = await requireRole("supervisor", "admin");
  const { id } = await parseParams(context, idParamsSchema);
  const input = await parseJsonBody(request, commentSchema, 20_000);
  return json({ inspection: await commentOnInspection({ member, id, ...input }) }, { status: 201 });
});
