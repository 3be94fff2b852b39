import Link from "next/link";
import { notFound } from "next/navigation";
import { requirePageMember } from "@/lib/auth/session";
import { AppError } from "@/lib/errors";
import { getInspection, listInspectionsForJob, type InspectionDetail } from "@/lib/data/inspections";
import { getRulebookVersionById, getRulebook } from "@/lib/data/rulebooks";
import { listSiteCheckItems } from "@/lib/data/site-checks";
import { mayEditInspection, EDITABLE_STATUSES } from "@/lib/data/inspection-access";
import { idSchema } from "@/lib/schemas/common";
import { inspectionDataSchema } from "@/lib/inspections/data";
import type { Appliance } from "@/lib/venting";
import { InspectionEditor } from "./inspection-editor";
import { InspectionStatusBadge } from "@/components/inspection/inspection-status-badge";
import { RepinControl } from "./repin-control";
import { RecordPanel, ReviewPanel } from "./lazy-panels";
import { can } from "@/lib/auth/roles";
import { getJobById } from "@/lib/data/jobs";

export const metadata = { title: "Inspection" };

async function jobAppliances(companyId: number, jobId: number, exceptId: number): Promise<Appliance[]> {
  const rows = await listInspectionsForJob({ companyId, jobId });
  const seen = new Map<string, Appliance>();
  for (const row of rows) {
    if (row.id === exceptId) continue;
    const detail = await getInspection({ companyId, id: row.id });
    for (const a of detail.data.appliances) if (!seen.has(a.label)) seen.set(a.label, a);
  }
  return [...seen.values()];
}

export default async function InspectionPage({ params }: { params: Promise<{ id: string }> }) {
  const member = await requirePageMember();
  const id = idSchema.safeParse((await params).id);
  if (!id.success) notFound();
  let inspection: InspectionDetail;
  try {
    inspection = await getInspection({ companyId: member.companyId, id: id.data });
  } catch (error) {
    if (error instanceof AppError && error.code === "not_found") notFound();
    throw error;
  }
  const [version, items, fromJob, rulebook, job] = await Promise.all([
    getRulebookVersionById({ companyId: member.companyId, versionId: inspection.rulebookVersion.id }),
    listSiteCheckItems({ companyId: member.companyId }),
    jobAppliances(member.companyId, inspection.jobId, inspection.id),
    getRulebook({ companyId: member.companyId, id: inspection.rulebookVersion.rulebookId }),
    getJobById({ companyId: member.companyId, id: inspection.jobId }),
  ]);
  const editable =
    EDITABLE_STATUSES.includes(inspection.status) &&
    mayEditInspection({ id: inspection.id, companyId: member.companyId, jobId: inspection.jobId, status: inspection.status, revision: inspection.revision, installerId: inspection.installerId, createdBy: null }, member);
  const isReviewer = member.role === "supervisor" || member.role === "admin";
  const rulebookLabel = `${inspection.rulebookVersion.name}, version ${inspection.rulebookVersion.versionNumber}`;
  const returnComments = inspection.comments.filter((c) => c.kind === "return");

  const header = (
    <div className="space-y-2">
      <nav className="text-sm text-ink-500">
        <Link href="/jobs" className="hover:underline">
          Jobs
        </Link>{" "}
        /{" "}
        <Link href={`/jobs/${inspection.jobId}`} className="hover:underline">
          {inspection.jobReference}
        </Link>{" "}
        / Inspection #{inspection.id}
      </nav>
      <div className="flex flex-wrap items-center gap-3">
        <h1 className="text-2xl font-bold tracking-tight">{inspection.customerName}</h1>
        <InspectionStatusBadge status={inspection.status} />
        <span className="text-sm text-ink-600">Revision {inspection.revision}</span>
      </div>
      <p className="text-sm text-ink-600">
        {inspection.siteStreet}, {inspection.siteCity} · installer {inspection.installerName ?? "—"}
      </p>
      <div className="flex flex-wrap items-center gap-2 text-sm">
        <span className="text-ink-600">
          Checked against <span className="font-semibold">{rulebookLabel}</span>
        </span>
        {isReviewer && EDITABLE_STATUSES.includes(inspection.status) ? (
          <RepinControl inspectionId={inspection.id} currentVersionId={inspection.rulebookVersion.id} versions={rulebook.versions.map((v) => ({ id: v.id, versionNumber: v.versionNumber }))} />
        ) : null}
      </div>
      {returnComments.length > 0 && EDITABLE_STATUSES.includes(inspection.status) ? (
        <div role="note" className="rounded-md border-l-4 border-copper-500 bg-copper-50 px-4 py-3 text-sm">
          <p className="font-semibold text-copper-800">Returned by your supervisor — fix these and submit again:</p>
          <ul className="mt-1 list-disc space-y-1 pl-5">
            {returnComments.map((c) => (
              <li key={c.id}>
                <span className="font-medium">{c.section}:</span> {c.body} <span className="text-xs text-ink-500">— {c.authorName}</span>
              </li>
            ))}
          </ul>
        </div>
      ) : null}
    </div>
  );

  const data = inspectionDataSchema.parse(inspection.data);
  return (
    <InspectionEditor
      key={`${inspection.id}-${inspection.status}-${inspection.version}`}
      inspectionId={inspection.id}
      version={inspection.version}
      status={inspection.status}
      editable={editable}
      data={data}
      rulebookContent={version.content}
      rulebookLabel={rulebookLabel}
      siteCheckItems={items}
      jobAppliances={fromJob}
      memberName={member.name}
      header={header}
      reviewPanel={
        !editable ? (
          <>
            <ReviewPanel inspection={serializeForReview(inspection)} isReviewer={isReviewer} memberName={member.name} />
            {inspection.status === "approved" || inspection.status === "superseded" ? (
              <RecordPanel inspectionId={inspection.id} canShare={can(member.role, "records.share")} customerEmail={job.customerEmail} />
            ) : null}
          </>
        ) : undefined
      }
    />
  );
}

function serializeForReview(i: InspectionDetail) {
  return {
    id: i.id,
    status: i.status,
    revision: i.revision,
    comments: i.comments,
    installerName: i.installerName,
    installerSignedName: i.installerSignedName,
    installerSignaturePng: i.installerSignaturePng,
    submittedAt: i.submittedAt,
    supervisorName: i.supervisorName,
    supervisorSignedName: i.supervisorSignedName,
    supervisorSignaturePng: i.supervisorSignaturePng,
    approvedAt: i.approvedAt,
    revisions: i.revisions,
    justifications: Object.entries(i.data.justifications)
      .filter(([, j]) => j.text.trim())
      .map(([key, j]) => ({ key, title: i.findings.find((f) => `${f.code}@${f.target.path}` === key)?.title ?? key, ...j })),
  };
}

