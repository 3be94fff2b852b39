import { apiRoute, json } from "@/lib/api/handler";
import { requirePermission } from "@/lib/auth/session";
import { listMembers } from "@/lib/data/members";

/** Active members a job can be assigned to: names and ids only, for the job form. */
export const GET = apiRoute(async () => {
  const member = await requirePermission("jobs.read");
  const members = await listMembers({ companyId: member.companyId, activeOnly: true });
  return json({ installers: members.map((m) => ({ id: m.id, name: m.name, role: m.role })) });
});
