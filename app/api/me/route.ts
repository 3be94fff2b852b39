import { apiRoute, json } from "@/lib/api/handler";
import { requireMember } from "@/lib/auth/session";

export const GET = apiRoute(async () => {
  const member = await requireMember({ allowTemporaryPassword: true });
  return json({
    member: { id: member.userId, name: member.name, email: member.email, role: member.role, companyId: member.companyId, companyName: member.companyName, mustChangePassword: member.mustChangePassword },
  });
});
