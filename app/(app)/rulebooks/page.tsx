import Link from "next/link";
import { requirePagePermission } from "@/lib/auth/session";
import { can } from "@/lib/auth/roles";
import { listRulebooks } from "@/lib/data/rulebooks";
import { EmptyState } from "@/components/ui/states";
import { RulebookCopyButton } from "./rulebook-copy-button";

export const metadata = { title: "Rulebooks" };

export default async function RulebooksPage({ searchParams }: { searchParams: Promise<{ archived?: string }> }) {
  const member = await requirePagePermission("rulebooks.read");
  const showArchived = (await searchParams).archived === "1";
  const rulebooks = await listRulebooks({ companyId: member.companyId, includeArchived: showArchived });
  const canEdit = can(member.role, "rulebooks.write");
  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-2xl font-bold tracking-tight">Rulebooks</h1>
          <p className="max-w-2xl text-sm text-ink-600">
            Your company&apos;s tables: every number the checks use, with the citation it came from. Editing saves a new version; inspections keep the version they were checked against.
          </p>
        </div>
        <div className="flex gap-2">
          <Link href="/check" className="btn-secondary">
            Try a check
          </Link>
          <Link href={showArchived ? "/rulebooks" : "/rulebooks?archived=1"} className="btn-ghost">
            {showArchived ? "Hide archived" : "Show archived"}
          </Link>
        </div>
      </div>
      {rulebooks.length === 0 ? (
        <EmptyState title="No rulebooks yet">Ask a supervisor to create one.</EmptyState>
      ) : (
        <ul className="grid gap-3 md:grid-cols-2">
          {rulebooks.map((rb) => (
            <li key={rb.id} className="card flex flex-col gap-2 p-4">
              <div className="flex flex-wrap items-center gap-2">
                <Link href={`/rulebooks/${rb.id}`} className="text-lg font-semibold hover:text-copper-700 hover:underline">
                  {rb.name}
                </Link>
                {rb.isDefault ? <span className="rounded-full bg-copper-100 px-2 py-0.5 text-xs font-semibold text-copper-800">Current</span> : null}
                {rb.status === "archived" ? <span className="rounded-full bg-ink-100 px-2 py-0.5 text-xs font-semibold text-ink-600">Archived</span> : null}
              </div>
              {rb.description ? <p className="text-sm text-ink-600">{rb.description}</p> : null}
              <p className="text-xs text-ink-500">
                Version {rb.latestVersionNumber} · updated {rb.updatedAt.slice(0, 10)}
              </p>
              <div className="mt-auto flex gap-2 pt-1">
                <Link href={`/rulebooks/${rb.id}`} className="btn-secondary">
                  {canEdit && rb.status === "active" ? "Open and edit" : "Open"}
                </Link>
                {canEdit ? <RulebookCopyButton rulebookId={rb.id} name={rb.name} /> : null}
              </div>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
