import { apiRoute, json, parseParams } from "@/lib/api/handler";
import { requireRole } from "@/lib/auth/session";
import { reviseInspection } from "@/lib/data/inspections";
import { idParamsSchema } from "@/lib/schemas/common";

/** Open a correction of an approved inspection as its next revision. */
export const POST = apiRoute<{ id: string }>(async (_request, context) => {
  const member = await requireRole("supervisor", "admin");
  const { id } = await parseParams(context, idParamsSchema);
  return json(await reviseInspection({ member, id }), { status: 201 });
});
