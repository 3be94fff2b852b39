import Link from "next/link";
import { notFound } from "next/navigation";
import { requirePagePermission } from "@/lib/auth/session";
import { can } from "@/lib/auth/roles";
import { AppError } from "@/lib/errors";
import { getRulebook, getRulebookVersion, type RulebookDetail, type RulebookVersion } from "@/lib/data/rulebooks";
import { idSchema } from "@/lib/schemas/common";
import { rulebookGridLayouts } from "@/lib/rulebooks/grid-layout";
import { rulebookChoiceLabels } from "@/lib/venting/rulebook/labels";
import { RulebookStatusActions } from "../rulebook-status-actions";
import { RulebookEditor } from "./rulebook-editor";

export const metadata = { title: "Rulebook" };

export default async function RulebookPage({ params, searchParams }: { params: Promise<{ id: string }>; searchParams: Promise<{ version?: string }> }) {
  const member = await requirePagePermission("rulebooks.read");
  const id = idSchema.safeParse((await params).id);
  if (!id.success) notFound();
  const requested = (await searchParams).version;
  const versionNumber = requested ? idSchema.safeParse(requested) : null;
  if (versionNumber && !versionNumber.success) notFound();

  let rulebook: RulebookDetail;
  let version: RulebookVersion;
  try {
    rulebook = await getRulebook({ companyId: member.companyId, id: id.data });
    version = await getRulebookVersion({ companyId: member.companyId, rulebookId: id.data, versionNumber: versionNumber?.data });
  } catch (error) {
    if (error instanceof AppError && error.code === "not_found") notFound();
    throw error;
  }
  const isLatest = version.versionNumber === rulebook.latestVersionNumber;
  const canEdit = can(member.role, "rulebooks.write") && rulebook.status === "active" && isLatest;

  return (
    <div className="space-y-4">
      <nav className="text-sm text-ink-500">
        <Link href="/rulebooks" className="hover:underline">
          Rulebooks
        </Link>{" "}
        / {rulebook.name}
      </nav>
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <h1 className="text-2xl font-bold tracking-tight">{rulebook.name}</h1>
          <p className="text-sm text-ink-600">
            Showing version {version.versionNumber} of {rulebook.latestVersionNumber}
            {rulebook.isDefault ? " · current rulebook for new inspections" : ""}
            {rulebook.status === "archived" ? " · archived" : ""}
          </p>
        </div>
        {can(member.role, "rulebooks.write") ? <RulebookStatusActions rulebookId={rulebook.id} status={rulebook.status} isDefault={rulebook.isDefault} /> : null}
      </div>

      {!isLatest ? (
        <p role="status" className="rounded-md border-l-4 border-info bg-info-soft px-4 py-3 text-sm">
          This is an older version, kept unchanged for the inspections checked against it.{" "}
          <Link href={`/rulebooks/${rulebook.id}`} className="font-semibold underline">
            Open the latest version
          </Link>
        </p>
      ) : null}

      <div className="space-y-2 rounded-md border-l-4 border-warn bg-warn-soft px-4 py-3 text-sm" role="note">
        <p>
          <span className="font-semibold">Edition: </span>
          {version.content.edition}
        </p>
        {version.content.demoDataNote ? (
          <p>
            <span className="font-semibold">Demo data: </span>
            {version.content.demoDataNote}
          </p>
        ) : null}
      </div>

      {/* The grid takes the full width so its citations stay readable on a 1280 px screen; the versions follow it. */}
      <div className="space-y-6">
        <RulebookEditor
          key={version.id}
          rulebookId={rulebook.id}
          versionNumber={version.versionNumber}
          content={version.content}
          canEdit={canEdit}
          labels={rulebookChoiceLabels()}
          layouts={rulebookGridLayouts(canEdit)}
        />
        <aside aria-labelledby="versions-title" className="space-y-2">
          <h2 id="versions-title" className="text-sm font-bold uppercase tracking-wide text-ink-500">
            Versions
          </h2>
          <ol className="grid gap-2 sm:grid-cols-2 lg:grid-cols-3">
            {rulebook.versions.map((v) => (
              <li key={v.id}>
                <Link
                  href={`/rulebooks/${rulebook.id}?version=${v.versionNumber}`}
                  aria-current={v.versionNumber === version.versionNumber ? "page" : undefined}
                  className={`card block p-3 text-sm hover:bg-ink-50 ${v.versionNumber === version.versionNumber ? "ring-2 ring-copper-400" : ""}`}
                >
                  <p className="font-semibold">Version {v.versionNumber}</p>
                  <p className="text-ink-700">{v.changeNote}</p>
                  <p className="mt-1 text-xs text-ink-500">
                    {v.createdByName ?? "Unknown"} · {v.createdAt.slice(0, 16).replace("T", " ")} UTC
                  </p>
                </Link>
              </li>
            ))}
          </ol>
        </aside>
      </div>
    </div>
  );
}
