import { requirePagePermission } from "@/lib/auth/session";
import { listMembers } from "@/lib/data/members";
import { EmptyState } from "@/components/ui/states";
import { AddMemberForm } from "./add-member-form";
import { MemberActions } from "./member-actions";

export const metadata = { title: "Members" };

/**
 * The company's members, read on the server; only the controls that change a member, and the
 * form that adds one, run in the browser. Both refresh this page after a change, so the list is
 * always what the database holds.
 */
export default async function MembersPage() {
  const member = await requirePagePermission("members.manage");
  const members = await listMembers({ companyId: member.companyId });
  return (
    <div className="space-y-4">
      <div>
        <h1 className="text-2xl font-bold tracking-tight">Members</h1>
        <p className="text-sm text-ink-600">Who works in {member.companyName} on Flueward, and what each may do.</p>
      </div>
      <div className="grid gap-6 lg:grid-cols-[1fr_20rem]">
        <section aria-labelledby="members-title" className="space-y-3">
          <h2 id="members-title" className="sr-only">
            Current members
          </h2>
          {members.length === 0 ? (
            <EmptyState title="No members yet" />
          ) : (
            <ul className="space-y-2">
              {members.map((m) => (
                <li key={m.id} className={`card flex flex-wrap items-center gap-3 p-3 ${m.active ? "" : "opacity-70"}`} data-testid={`member-${m.email}`}>
                  {/* On a phone the name and e-mail take the whole row; the role and button wrap beneath. */}
                  <div className="min-w-0 basis-full sm:flex-1 sm:basis-0">
                    <p className="break-words font-semibold">
                      {m.name} {m.id === member.userId ? <span className="text-xs font-normal text-ink-500">(you)</span> : null}
                    </p>
                    <p className="break-all text-sm text-ink-600 sm:truncate sm:break-normal">{m.email}</p>
                    <p className="text-xs text-ink-500">
                      {m.active ? "Active" : "Deactivated"}
                      {m.mustChangePassword && m.active ? " · temporary password not yet changed" : ""}
                    </p>
                  </div>
                  <MemberActions key={`${m.role}-${m.active}`} member={{ id: m.id, name: m.name, role: m.role, active: m.active }} isSelf={m.id === member.userId} />
                </li>
              ))}
            </ul>
          )}
        </section>
        <AddMemberForm />
      </div>
    </div>
  );
}
