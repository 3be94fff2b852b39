import { requirePagePermission } from "@/lib/auth/session";
import { MembersManager } from "./members-manager";

export const metadata = { title: "Members" };

export default async function MembersPage() {
  const member = await requirePagePermission("members.manage");
  return (
    <div className="space-y-4">
      <div>
        <h1 className="text-2xl font-bold tracking-tight">Members</h1>
        <p className="text-sm text-ink-600">Who works in {member.companyName} on Flueward, and what each may do.</p>
      </div>
      <MembersManager currentUserId={member.userId} />
    </div>
  );
}
