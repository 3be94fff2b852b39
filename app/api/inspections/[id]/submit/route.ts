import { apiRoute, json, parseJsonBody, parseParams } from "@/lib/api/handler";
import { requireMember } from "@/lib/auth/session";
import { submitInspection } from "@/lib/data/inspections";
import { idParamsSchema } from "@/lib/schemas/common";
import { submitSchema } from "@/lib/schemas/inspection";
import { assertDrawnSignature } from "@/lib/signature/validate-png";

export const POST = apiRoute<{ id: string }>(async (request, context) => {
  const member = await requireMember();
  const { id } = await parseParams(context, idParamsSchema);
  const input = await parseJsonBody(request, submitSchema, 600_000);
  await assertDrawnSignature(input.signature.signaturePng);
  return json({ inspection: await submitInspection({ member, id, version: input.version, typedName: input.signature.typedName, signaturePng: input.signature.signaturePng }) });
});
