import { apiRoute, json, parseJsonBody, parseParams } from "@/lib/api/handler";
import { requireRole } from "@/lib/auth/session";
import { confirmOwnPassword } from "@/lib/auth/reauthenticate";
import { clientAddress } from "@/lib/auth/client-address";
import { approveInspection } from "@/lib/data/inspections";
import { idParamsSchema } from "@/lib/schemas/common";
import { approveSchema } from "@/lib/schemas/inspection";
import { assertDrawnSignature } from "@/lib/signature/validate-png";
import { publicBaseUrl } from "@/lib/api/base-url";

/** Approve and sign, confirmed with the supervisor's own password (limited and audited like sign-in). */
export const POST = apiRoute<{ id: string }>(async (request, context) => {
  const member = await requireRole("supervisor", "admin");
  const { id } = await parseParams(context, idParamsSchema);
  const input = await parseJsonBody(request, approveSchema, 600_000);
  await confirmOwnPassword({
    member,
    password: input.password,
    client: clientAddress(request.headers),
    purpose: { kind: "approve", inspectionId: id },
    field: "password",
    wrongMessage: "That is not your password. Approval needs your own password.",
  });
  await assertDrawnSignature(input.signature.signaturePng);
  return json({ inspection: await approveInspection({ member, id, typedName: input.signature.typedName, signaturePng: input.signature.signaturePng, baseUrl: publicBaseUrl(request) }) });
});
