import { apiRoute, json, parseJsonBody } from "@/lib/api/handler";
import { requireMember } from "@/lib/auth/session";
import { changeOwnPassword } from "@/lib/auth/change-password";
import { clientAddress } from "@/lib/auth/client-address";
import { changePasswordSchema } from "@/lib/schemas/auth";

export const POST = apiRoute(async (request) => {
  // The one thing a member on a temporary password may do.
  const member = await requireMember({ allowTemporaryPassword: true });
  const input = await parseJsonBody(request, changePasswordSchema, 10_000);
  await changeOwnPassword({ member, currentPassword: input.currentPassword, newPassword: input.newPassword, client: clientAddress(request.headers) });
  return json({ ok: true });
});
