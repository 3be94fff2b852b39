import { apiRoute, json, parseJsonBody, parseParams } from "@/lib/api/handler";
import { requireMember } from "@/lib/auth/session";
import { saveDraft } from "@/lib/data/inspections";
import { idParamsSchema } from "@/lib/schemas/common";
import { draftSaveSchema } from "@/lib/schemas/inspection";

/** Autosave: the whole draft with the version it was edited from; 409 when someone saved in between. */
export const PUT = apiRoute<{ id: string }>(async (request, context) => {
  const member = await requireMember();
  const { id } = await parseParams(context, idParamsSchema);
  const input = await parseJsonBody(request, draftSaveSchema, 2_000_000);
  return json(await saveDraft({ member, id, version: input.version, data: input.data }));
});
