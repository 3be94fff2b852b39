import "server-only";
import { getDb } from "@/db/knex";
import { AppError } from "@/lib/errors";
import type { Role } from "@/lib/auth/roles";

export const INSPECTION_STATUSES = ["draft", "submitted", "returned", "approved", "superseded"] as const;
export type InspectionStatus = (typeof INSPECTION_STATUSES)[number];

/** Statuses in which the installer may still change the inspection (and its photos). */
export const EDITABLE_STATUSES: readonly InspectionStatus[] = ["draft", "returned"];

export interface InspectionAccess {
  id: number;
  companyId: number;
  jobId: number;
  status: InspectionStatus;
  revision: number;
  installerId: number | null;
  createdBy: number | null;
}

/**
 * Who may touch an inspection: any member of its company may read it; its installer, its
 * creator, supervisors and admins may change it while it is a draft or returned. Another
 * company's id is a 404, like a missing one.
 */
export async function getInspectionAccess(args: { companyId: number; inspectionId: number }): Promise<InspectionAccess> {
  const row = await getDb()("inspections")
    .where({ id: args.inspectionId, company_id: args.companyId })
    .first("id", "company_id", "job_id", "status", "revision", "installer_id", "created_by");
  if (!row) throw new AppError("not_found", "No such inspection in your company.");
  return {
    id: row.id,
    companyId: row.company_id,
    jobId: row.job_id,
    status: row.status,
    revision: row.revision,
    installerId: row.installer_id,
    createdBy: row.created_by,
  };
}

export function mayEditInspection(access: InspectionAccess, member: { userId: number; role: Role }): boolean {
  if (member.role === "supervisor" || member.role === "admin") return true;
  return access.installerId === member.userId || access.createdBy === member.userId;
}

/** Throws unless the member may change the inspection now: forbidden for others, unprocessable once it is submitted or locked. */
export function assertEditable(access: InspectionAccess, member: { userId: number; role: Role }): void {
  if (!mayEditInspection(access, member)) throw new AppError("forbidden", "Only the inspection's installer, a supervisor or an admin can change it.");
  if (!EDITABLE_STATUSES.includes(access.status)) {
    throw new AppError(
      "unprocessable",
      access.status === "submitted"
        ? "This inspection has been submitted for review and is read-only until a supervisor returns it."
        : "This inspection is approved and locked. Open a new revision to correct it.",
    );
  }
}
