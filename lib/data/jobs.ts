import "server-only";
import type { Knex } from "knex";
import { getDb } from "@/db/knex";
import { AppError } from "@/lib/errors";
import type { JobFormValues, JobListQuery, JobStatus, JobUpdateValues } from "@/lib/schemas/job";
import { recordAudit, type AuditActor } from "./audit";
import { nowIso } from "./clock";
import { JOB_SEARCH_COLUMNS, candidateJobs, indexJobSearch, planJobTextSearch, whereJobTextMatches } from "./job-search";
import { countCompanyJobs, refreshJobTotals } from "./job-totals";

export interface Job {
  id: number;
  reference: string;
  customerName: string;
  customerPhone: string;
  customerEmail: string;
  siteStreet: string;
  siteCity: string;
  siteRegion: string;
  sitePostalCode: string;
  status: JobStatus;
  assignedInstallerId: number | null;
  assignedInstallerName: string | null;
  scheduledFor: string;
  notes: string;
  version: number;
  createdAt: string;
  updatedAt: string;
}

export interface JobPage {
  items: Job[];
  total: number;
  page: number;
  pageSize: number;
  pageCount: number;
}

const JOB_COLUMNS = [
  "j.id",
  "j.reference",
  "j.customer_name",
  "j.customer_phone",
  "j.customer_email",
  "j.site_street",
  "j.site_city",
  "j.site_region",
  "j.site_postal_code",
  "j.status",
  "j.assigned_installer_id",
  "u.name as assigned_installer_name",
  "j.scheduled_for",
  "j.notes",
  "j.version",
  "j.created_at",
  "j.updated_at",
];

type JobRow = Record<string, unknown>;

function toJob(row: JobRow): Job {
  return {
    id: row.id as number,
    reference: row.reference as string,
    customerName: row.customer_name as string,
    customerPhone: row.customer_phone as string,
    customerEmail: row.customer_email as string,
    siteStreet: row.site_street as string,
    siteCity: row.site_city as string,
    siteRegion: row.site_region as string,
    sitePostalCode: row.site_postal_code as string,
    status: row.status as JobStatus,
    assignedInstallerId: (row.assigned_installer_id as number | null) ?? null,
    assignedInstallerName: (row.assigned_installer_name as string | null) ?? null,
    scheduledFor: (row.scheduled_for as string | null) ?? "",
    notes: row.notes as string,
    version: row.version as number,
    createdAt: row.created_at as string,
    updatedAt: row.updated_at as string,
  };
}

function jobsOfCompany(db: Knex | Knex.Transaction, companyId: number) {
  return db("jobs as j").where("j.company_id", companyId);
}

/** The columns of JOB_COLUMNS need the assigned installer's name. */
function withInstallerName(query: Knex.QueryBuilder) {
  return query.leftJoin("users as u", "u.id", "j.assigned_installer_id");
}

function baseQuery(db: Knex | Knex.Transaction, companyId: number) {
  return withInstallerName(jobsOfCompany(db, companyId));
}

const SORT_COLUMNS = {
  updated_desc: [["j.updated_at", "desc"]],
  updated_asc: [["j.updated_at", "asc"]],
  customer_asc: [["j.customer_name", "asc"]],
  customer_desc: [["j.customer_name", "desc"]],
  scheduled_asc: [["j.scheduled_for", "asc"]],
  reference_desc: [["j.reference", "desc"]],
} as const satisfies Record<JobListQuery["sort"], ReadonlyArray<readonly [string, "asc" | "desc"]>>;

/**
 * A text search reads its candidates (the jobs holding the text's rarest trigram) and sorts them
 * when its page needs more than about a twentieth of the matches; otherwise it walks the jobs in
 * the sorted order, testing each, until the page is full. The walk reads about
 * pageEnd × jobs / matches rows, the candidates at least `matches`: on 10,000 jobs they cost the
 * same near 450 matches for the first page of 20 (bench/db-queries: "brook", 682 matches, walks
 * in 0.27 ms against 0.48 ms; "kettle yard", 45 matches, reads its 450 candidates in 0.7 ms against
 * a 2.1 ms walk).
 */
const WALK_WHEN_MATCHES_EXCEED_PAGE_END_TIMES = 20;

/** A page of the company's jobs, searched, filtered and sorted. */
export async function listJobs(args: { companyId: number; userId: number; query: JobListQuery }): Promise<JobPage> {
  const { query } = args;
  const db = getDb();
  const plan = query.q ? await planJobTextSearch(db, { companyId: args.companyId, text: query.q }) : null;
  if (plan?.kind === "none") return { items: [], total: 0, page: 1, pageSize: query.pageSize, pageCount: 1 };
  // Filters touch only the jobs table, so the count runs on jobs alone (an index-only count
  // without a search); the installer's name is joined in for the one page of rows.
  const filtered = (options: { byCandidates?: boolean } = {}) => {
    const q = options.byCandidates && plan?.kind === "trigram" ? candidateJobs(db, { companyId: args.companyId, plan }) : jobsOfCompany(db, args.companyId);
    if (query.status) q.andWhere("j.status", query.status);
    if (query.mine === "1") q.andWhere("j.assigned_installer_id", args.userId);
    if (query.q) whereJobTextMatches(q, { alias: "j", text: query.q, columns: JOB_SEARCH_COLUMNS });
    return q;
  };
  // Every job of the company: read from the kept total (lib/data/job-totals.ts).
  const unfiltered = !query.q && !query.status && query.mine !== "1";
  const total = unfiltered
    ? await countCompanyJobs(db, args.companyId)
    : Number((await filtered({ byCandidates: true }).count<{ n: number | string }[]>({ n: "*" }).first())?.n ?? 0);
  const pageCount = Math.max(1, Math.ceil(total / query.pageSize));
  const page = Math.min(query.page, pageCount);
  const offset = (page - 1) * query.pageSize;
  if (total === 0) return { items: [], total, page, pageSize: query.pageSize, pageCount };
  const fewMatches = plan !== null && (offset + query.pageSize) * WALK_WHEN_MATCHES_EXCEED_PAGE_END_TIMES > total;
  // Few matches: read the trigram candidates, or for a one- or two-letter search (no trigram) find
  // the matches in one pass over the covering search index; only those rows are read and sorted.
  const listQuery = fewMatches
    ? plan.kind === "trigram"
      ? withInstallerName(filtered({ byCandidates: true })).select(JOB_COLUMNS)
      : baseQuery(db, args.companyId).whereIn("j.id", filtered().select("j.id")).select(JOB_COLUMNS)
    : withInstallerName(filtered()).select(JOB_COLUMNS);
  for (const [column, direction] of SORT_COLUMNS[query.sort]) listQuery.orderBy(column, direction);
  listQuery.orderBy("j.id", "desc");
  const rows = await listQuery.limit(query.pageSize).offset(offset);
  return { items: rows.map(toJob), total, page, pageSize: query.pageSize, pageCount };
}

/** One job of the company, or a not_found error (also for another company's id). */
export async function getJobById(args: { companyId: number; id: number }): Promise<Job> {
  const row = await baseQuery(getDb(), args.companyId).andWhere("j.id", args.id).first(JOB_COLUMNS);
  if (!row) throw new AppError("not_found", "No such job in your company.");
  return toJob(row);
}

async function assertInstallerInCompany(db: Knex.Transaction, companyId: number, userId: number | null) {
  if (userId === null) return;
  const user = await db("users").where({ id: userId, company_id: companyId, active: true }).first("id");
  if (!user) throw new AppError("validation_failed", undefined, { fields: { assignedInstallerId: "Choose an active member of your company." } });
}

async function nextReference(db: Knex.Transaction, companyId: number): Promise<string> {
  const row = await db("jobs").where({ company_id: companyId }).count<{ n: number | string }[]>({ n: "id" }).first();
  let n = Number(row?.n ?? 0) + 1;
  for (;;) {
    const reference = `J-${String(n).padStart(4, "0")}`;
    const taken = await db("jobs").where({ company_id: companyId, reference }).first("id");
    if (!taken) return reference;
    n += 1;
  }
}

function toColumns(values: JobFormValues) {
  return {
    customer_name: values.customerName,
    customer_phone: values.customerPhone,
    customer_email: values.customerEmail,
    site_street: values.siteStreet,
    site_city: values.siteCity,
    site_region: values.siteRegion,
    site_postal_code: values.sitePostalCode,
    status: values.status,
    assigned_installer_id: values.assignedInstallerId,
    scheduled_for: values.scheduledFor || null,
    notes: values.notes,
  };
}

export async function createJob(args: { companyId: number; actor: AuditActor; values: JobFormValues }): Promise<Job> {
  const id = await getDb().transaction(async (trx) => {
    await assertInstallerInCompany(trx, args.companyId, args.values.assignedInstallerId);
    const now = nowIso();
    const reference = await nextReference(trx, args.companyId);
    const [inserted] = await trx("jobs")
      .insert({ company_id: args.companyId, reference, ...toColumns(args.values), version: 1, created_by: args.actor.userId, created_at: now, updated_at: now })
      .returning("id");
    const jobId = typeof inserted === "object" ? (inserted as { id: number }).id : (inserted as number);
    await indexJobSearch(trx, [jobId]);
    await refreshJobTotals(trx, [args.companyId]);
    await recordAudit(trx, {
      companyId: args.companyId,
      actor: args.actor,
      action: "job.created",
      entityType: "job",
      entityId: jobId,
      summary: `Created job ${reference} for ${args.values.customerName}`,
      after: args.values,
    });
    return jobId;
  });
  return getJobById({ companyId: args.companyId, id });
}

/**
 * Updates a job if the caller saw its latest version; otherwise a conflict error, so two people
 * editing the same job never overwrite each other silently.
 */
export async function updateJob(args: { companyId: number; id: number; actor: AuditActor; values: JobUpdateValues; mayAssign: boolean }): Promise<Job> {
  await getDb().transaction(async (trx) => {
    const current = await baseQuery(trx, args.companyId).andWhere("j.id", args.id).first(JOB_COLUMNS);
    if (!current) throw new AppError("not_found", "No such job in your company.");
    const before = toJob(current);
    if (before.version !== args.values.version) throw new AppError("conflict");
    const { version: _version, ...values } = args.values;
    if (!args.mayAssign && values.assignedInstallerId !== before.assignedInstallerId) {
      throw new AppError("forbidden", "Only a supervisor or admin can change who a job is assigned to.");
    }
    await assertInstallerInCompany(trx, args.companyId, values.assignedInstallerId);
    const updated = await trx("jobs")
      .where({ id: args.id, company_id: args.companyId, version: before.version })
      .update({ ...toColumns(values), version: before.version + 1, updated_at: nowIso() });
    if (updated !== 1) throw new AppError("conflict");
    await indexJobSearch(trx, [args.id]);
    const changed = Object.fromEntries(
      Object.entries(values).filter(([key, value]) => (before as unknown as Record<string, unknown>)[key] !== value),
    );
    await recordAudit(trx, {
      companyId: args.companyId,
      actor: args.actor,
      action: "job.updated",
      entityType: "job",
      entityId: args.id,
      summary: `Updated ${Object.keys(changed).join(", ") || "nothing"} on job ${before.reference}`,
      before: Object.fromEntries(Object.keys(changed).map((key) => [key, (before as unknown as Record<string, unknown>)[key]])),
      after: changed,
    });
  });
  return getJobById({ companyId: args.companyId, id: args.id });
}
