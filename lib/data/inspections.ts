import "server-only";
import type { Knex } from "knex";
import { compiledRead } from "@/db/compiled-read";
import { getDb, isSqlite } from "@/db/knex";
import { AppError } from "@/lib/errors";
import type { Role } from "@/lib/auth/roles";
import { emptyInspectionData, parseStoredInspectionData, type InspectionData } from "@/lib/inspections/data";
import { evaluateInspectionData, submissionBlockers, type InspectionFinding } from "@/lib/inspections/evaluate";
import { preparedFor, preparedForRef } from "@/lib/checks/run-check";
import { readFindingSummary, type FindingSummary } from "@/lib/venting";
import type { InspectionListQuery, ReviewSection } from "@/lib/schemas/inspection";
import { recordAudit, type AuditActor } from "./audit";
import { nowIso } from "./clock";
import { candidateJobs, planJobTextSearch, whereJobTextMatches } from "./job-search";
import { containsPattern } from "./like";
import { getCurrentRulebookVersion, getRulebookVersionById, getRulebookVersionRef } from "./rulebooks";
import { listSiteCheckItems } from "./site-checks";
import { assertEditable, getInspectionAccess, type InspectionStatus } from "./inspection-access";
import { discardPreparedRecord, insertRecord, prepareRecord } from "./records";

export interface InspectionComment {
  id: number;
  section: ReviewSection;
  kind: "comment" | "return";
  body: string;
  authorName: string;
  createdAt: string;
}

export interface InspectionSummaryRow {
  id: number;
  jobId: number;
  jobReference: string;
  customerName: string;
  siteStreet: string;
  siteCity: string;
  status: InspectionStatus;
  revision: number;
  installerName: string | null;
  submittedAt: string | null;
  approvedAt: string | null;
  summary: FindingSummary | null;
  updatedAt: string;
}

export interface InspectionDetail extends InspectionSummaryRow {
  version: number;
  data: InspectionData;
  findings: InspectionFinding[];
  rulebookVersion: { id: number; rulebookId: number; name: string; versionNumber: number };
  latestRulebookVersionId: number | null;
  installerId: number | null;
  installerSignedName: string | null;
  installerSignaturePng: string | null;
  supervisorName: string | null;
  supervisorSignedName: string | null;
  supervisorSignaturePng: string | null;
  previousInspectionId: number | null;
  rootInspectionId: number;
  comments: InspectionComment[];
  revisions: { id: number; revision: number; status: InspectionStatus; approvedAt: string | null }[];
}

type Member = { userId: number; role: Role; name: string; companyId: number };

const actorOf = (m: Member): AuditActor => ({ userId: m.userId, name: m.name });

function parseJson<T>(text: string | null | undefined, fallback: T): T {
  if (!text) return fallback;
  try {
    return JSON.parse(text) as T;
  } catch {
    return fallback;
  }
}

/** Evaluates the data against the pinned version and the company's site checks: the stored, authoritative result. */
async function evaluateStored(companyId: number, rulebookVersionId: number, data: InspectionData) {
  const version = await getRulebookVersionRef({ companyId, versionId: rulebookVersionId });
  const items = await listSiteCheckItems({ companyId });
  return evaluateInspectionData(data, await preparedForRef(companyId, version!), items);
}

const SUMMARY_COLUMNS = [
  "i.id",
  "i.job_id",
  "j.reference as job_reference",
  "j.customer_name",
  "j.site_street",
  "j.site_city",
  "i.status",
  "i.revision",
  "inst.name as installer_name",
  "i.submitted_at",
  "i.approved_at",
  "i.summary_json",
  "i.updated_at",
];

function toSummary(row: Record<string, unknown>): InspectionSummaryRow {
  const summary = parseJson<unknown>(row.summary_json as string, null);
  return {
    id: row.id as number,
    jobId: row.job_id as number,
    jobReference: row.job_reference as string,
    customerName: row.customer_name as string,
    siteStreet: row.site_street as string,
    siteCity: row.site_city as string,
    status: row.status as InspectionStatus,
    revision: row.revision as number,
    installerName: (row.installer_name as string | null) ?? null,
    submittedAt: (row.submitted_at as string | null) ?? null,
    approvedAt: (row.approved_at as string | null) ?? null,
    summary: readFindingSummary(summary),
    updatedAt: row.updated_at as string,
  };
}

function summaryQuery(db: Knex | Knex.Transaction, companyId: number) {
  return db("inspections as i")
    .join("jobs as j", function joinJobs() {
      this.on("j.id", "=", "i.job_id").andOn("j.company_id", "=", "i.company_id");
    })
    .leftJoin("users as inst", "inst.id", "i.installer_id")
    .where("i.company_id", companyId);
}

export async function listInspectionsForJob(args: { companyId: number; jobId: number }): Promise<InspectionSummaryRow[]> {
  const rows = await summaryQuery(getDb(), args.companyId).andWhere("i.job_id", args.jobId).orderBy("i.id", "desc").select(SUMMARY_COLUMNS);
  return rows.map(toSummary);
}

const QUEUE_SORTS = {
  submitted_asc: [["i.submitted_at", "asc"]],
  submitted_desc: [["i.submitted_at", "desc"]],
  customer_asc: [["j.customer_name", "asc"]],
  installer_asc: [["inst.name", "asc"]],
} as const satisfies Record<InspectionListQuery["sort"], ReadonlyArray<readonly [string, "asc" | "desc"]>>;

/** The review queue (and other lists by status), oldest submission first by default. */
export async function listInspections(args: { companyId: number; query: InspectionListQuery }) {
  const { query } = args;
  const db = getDb();
  const byStatus = <Q extends Knex.QueryBuilder>(q: Q): Q => {
    if (query.status !== "all") q.andWhere("i.status", query.status);
    return q;
  };
  const jobPlan = query.q ? await planJobTextSearch(db, { companyId: args.companyId, text: query.q }) : null;
  const filtered = () => {
    const q = byStatus(summaryQuery(db, args.companyId));
    if (query.q) {
      const like = containsPattern(query.q);
      // Match the company's jobs and members first (the jobs through their search trigrams, the
      // members in one pass), then take their inspections by id: testing the text on every
      // joined inspection row costs three times as much on a large company.
      const matchingInstallers = db("users as su").where("su.company_id", args.companyId).andWhereRaw("su.name like ? escape '\\'", [like]).select("su.id");
      if (jobPlan?.kind === "none") {
        q.whereIn("i.installer_id", matchingInstallers);
      } else {
        const matchingJobs = jobPlan?.kind === "trigram" ? candidateJobs(db, { companyId: args.companyId, plan: jobPlan, alias: "sj" }) : db("jobs as sj").where("sj.company_id", args.companyId);
        whereJobTextMatches(matchingJobs, { alias: "sj", text: query.q, columns: ["customer_name", "reference"] });
        q.andWhere((w) => w.whereIn("i.job_id", matchingJobs.select("sj.id")).orWhereIn("i.installer_id", matchingInstallers));
      }
    }
    return q;
  };
  // Without a search the count needs no join: every inspection's job belongs to its company, so
  // counting the company's inspections by status is an index-only count.
  const counted = query.q ? filtered() : byStatus(db("inspections as i").where("i.company_id", args.companyId));
  const total = Number((await counted.count<{ n: number }[]>({ n: "i.id" }).first())?.n ?? 0);
  const pageCount = Math.max(1, Math.ceil(total / query.pageSize));
  const page = Math.min(query.page, pageCount);
  const list = filtered().select(SUMMARY_COLUMNS);
  for (const [column, direction] of QUEUE_SORTS[query.sort]) list.orderBy(column, direction);
  list.orderBy("i.id", "asc");
  const rows = await list.limit(query.pageSize).offset((page - 1) * query.pageSize);
  return { items: rows.map(toSummary), total, page, pageSize: query.pageSize, pageCount };
}

const inspectionRow = compiledRead("first", (db, p: { companyId: number; id: number }) =>
  summaryQuery(db, p.companyId)
    .andWhere("i.id", p.id)
    .leftJoin("users as sup", "sup.id", "i.approved_by")
    .join("rulebook_versions as rv", "rv.id", "i.rulebook_version_id")
    .join("rulebooks as rb", "rb.id", "rv.rulebook_id")
    // The rulebook's newest version, so the editor can offer to move to it.
    .leftJoin("rulebook_versions as lv", (on) => on.on("lv.rulebook_id", "rb.id").andOn("lv.version_number", "rb.latest_version_number").andOn("lv.company_id", "i.company_id"))
    .first(
      ...SUMMARY_COLUMNS,
      "i.version",
      "i.data_json",
      // On SQLite the stored findings come as bytes, checked to be well-formed JSON, so the API
      // can send them as stored without decoding, parsing and encoding 19 KB again.
      ...(isSqlite(db)
        ? [db.raw("cast(i.findings_json as blob) as findings_json"), db.raw("json_valid(i.findings_json) as findings_json_valid")]
        : ["i.findings_json"]),
      "i.installer_id",
      "i.installer_signed_name",
      "i.installer_signature_png",
      "i.supervisor_signed_name",
      "i.supervisor_signature_png",
      "i.previous_inspection_id",
      "i.root_inspection_id",
      "sup.name as supervisor_name",
      "rv.id as rv_id",
      "rv.version_number as rv_number",
      "rb.id as rb_id",
      "rb.name as rb_name",
      "lv.id as latest_rv_id",
    ),
);

const inspectionCommentRows = compiledRead("all", (db, p: { companyId: number; inspectionId: number }) =>
  db("inspection_comments").where({ company_id: p.companyId, inspection_id: p.inspectionId }).orderBy("id", "asc").select("*"),
);

// Every revision, the first included, carries root_inspection_id (createInspection sets it on
// the first), so this is one index search. An `or id = ?` here made SQLite walk every one of
// the company's inspections (5 ms per call at 50,000).
const revisionRows = compiledRead("all", (db, p: { companyId: number; rootId: number }) =>
  db("inspections").where({ company_id: p.companyId, root_inspection_id: p.rootId }).orderBy("revision", "asc").select("id", "revision", "status", "approved_at"),
);

interface InspectionRead {
  detail: Omit<InspectionDetail, "findings">;
  /** The stored findings' JSON: text, or on SQLite its UTF-8 bytes. */
  findingsJson: string | Uint8Array | null;
  /** The stored findings are known to be a well-formed JSON array (checked by SQLite). */
  findingsJsonIsArray: boolean;
}

async function readInspection(args: { companyId: number; id: number }): Promise<InspectionRead> {
  const db = getDb();
  const row = await inspectionRow(db, { companyId: args.companyId, id: args.id });
  if (!row) throw new AppError("not_found", "No such inspection in your company.");
  const id = row.id as number;
  const rootId = (row.root_inspection_id as number | null) ?? id;
  const [comments, revisions] = await Promise.all([
    inspectionCommentRows(db, { companyId: args.companyId, inspectionId: args.id }),
    revisionRows(db, { companyId: args.companyId, rootId }),
  ]);
  const storedData = parseStoredInspectionData(parseJson(row.data_json as string | null, {}));
  const findingsJson = (row.findings_json as string | Uint8Array | null) ?? null;
  return {
    detail: {
      ...toSummary(row),
      version: row.version as number,
      data: storedData ?? emptyInspectionData(),
      rulebookVersion: { id: row.rv_id as number, rulebookId: row.rb_id as number, name: row.rb_name as string, versionNumber: row.rv_number as number },
      latestRulebookVersionId: (row.latest_rv_id as number | null) ?? null,
      installerId: (row.installer_id as number | null) ?? null,
      installerSignedName: (row.installer_signed_name as string | null) ?? null,
      installerSignaturePng: (row.installer_signature_png as string | null) ?? null,
      supervisorName: (row.supervisor_name as string | null) ?? null,
      supervisorSignedName: (row.supervisor_signed_name as string | null) ?? null,
      supervisorSignaturePng: (row.supervisor_signature_png as string | null) ?? null,
      previousInspectionId: (row.previous_inspection_id as number | null) ?? null,
      rootInspectionId: rootId,
      comments: comments.map((c) => ({
        id: c.id as number,
        section: c.section as ReviewSection,
        kind: c.kind as InspectionComment["kind"],
        body: c.body as string,
        authorName: c.author_name as string,
        createdAt: c.created_at as string,
      })),
      revisions: revisions.map((r) => ({ id: r.id as number, revision: r.revision as number, status: r.status as InspectionStatus, approvedAt: (r.approved_at as string | null) ?? null })),
    },
    findingsJson,
    findingsJsonIsArray: Number(row.findings_json_valid) === 1 && findingsJson instanceof Uint8Array && startsWithBracket(findingsJson),
  };
}

/** Whether JSON bytes start, after any whitespace, with `[`. */
function startsWithBracket(bytes: Uint8Array): boolean {
  for (const byte of bytes) {
    if (byte === 0x5b) return true;
    if (byte !== 0x20 && byte !== 0x0a && byte !== 0x0d && byte !== 0x09) return false;
  }
  return false;
}

const asText = (json: string | Uint8Array | null): string | null => (json instanceof Uint8Array ? Buffer.from(json.buffer, json.byteOffset, json.byteLength).toString("utf8") : json);

export async function getInspection(args: { companyId: number; id: number }): Promise<InspectionDetail> {
  const { detail, findingsJson } = await readInspection(args);
  return { ...detail, findings: parseJson<InspectionFinding[]>(asText(findingsJson), []) };
}

/**
 * `{"inspection": …}` as the API's JSON body (UTF-8 bytes): the same fields as `getInspection`,
 * with the stored findings (most of the answer's bytes) sent as stored when SQLite has checked
 * them, instead of decoded, parsed, written out and encoded again.
 */
export async function getInspectionJsonBody(args: { companyId: number; id: number }): Promise<Buffer<ArrayBuffer>> {
  const { detail, findingsJson, findingsJsonIsArray } = await readInspection(args);
  // The detail is an object, so its JSON ends with its closing brace: findings go in just before.
  const head = Buffer.from(`{"inspection":${JSON.stringify(detail).slice(0, -1)},"findings":`, "utf8");
  const findings = findingsJsonIsArray ? (findingsJson as Uint8Array) : Buffer.from(JSON.stringify(parseJson<InspectionFinding[]>(asText(findingsJson), [])), "utf8");
  // Buffer.concat always copies into a buffer of its own (never a SharedArrayBuffer).
  return Buffer.concat([head, findings, Buffer.from("}}")]) as Buffer<ArrayBuffer>;
}

function insertedId(inserted: unknown): number {
  return typeof inserted === "object" && inserted !== null ? (inserted as { id: number }).id : (inserted as number);
}

/** Starts an inspection on a job, pinned to the company's current rulebook version. */
export async function createInspection(args: { member: Member; jobId: number; copyAppliancesFrom?: number }): Promise<{ id: number }> {
  const { member } = args;
  const db = getDb();
  const job = await db("jobs").where({ id: args.jobId, company_id: member.companyId }).first("id", "reference", "assigned_installer_id");
  if (!job) throw new AppError("not_found", "No such job in your company.");
  const version = await getCurrentRulebookVersion({ companyId: member.companyId });
  if (!version) throw new AppError("unprocessable", "Your company has no current rulebook. Ask a supervisor to make one current.");
  let appliances: InspectionData["appliances"] = [];
  const source = args.copyAppliancesFrom
    ? await db("inspections").where({ id: args.copyAppliancesFrom, company_id: member.companyId, job_id: args.jobId }).first("data_json")
    : await db("inspections").where({ company_id: member.companyId, job_id: args.jobId }).orderBy("id", "desc").first("data_json");
  if (args.copyAppliancesFrom && !source) throw new AppError("not_found", "No such inspection on this job to copy appliances from.");
  if (source) {
    const parsed = parseStoredInspectionData(parseJson(source.data_json, {}));
    if (parsed) appliances = parsed.appliances;
  }
  const data = emptyInspectionData(appliances);
  const evaluation = await evaluateStored(member.companyId, version.id, data);
  const installerId = member.role === "installer" ? member.userId : (job.assigned_installer_id ?? member.userId);
  const id = await db.transaction(async (trx) => {
    const now = nowIso();
    const [inserted] = await trx("inspections")
      .insert({
        company_id: member.companyId,
        job_id: args.jobId,
        status: "draft",
        revision: 1,
        rulebook_version_id: version.id,
        data_json: JSON.stringify(data),
        findings_json: JSON.stringify(evaluation.findings),
        summary_json: JSON.stringify(evaluation.summary),
        version: 1,
        created_by: member.userId,
        installer_id: installerId,
        created_at: now,
        updated_at: now,
      })
      .returning("id");
    const inspectionId = insertedId(inserted);
    await trx("inspections").where({ id: inspectionId }).update({ root_inspection_id: inspectionId });
    await trx("jobs").where({ id: args.jobId, company_id: member.companyId, status: "scheduled" }).update({ status: "in_progress", updated_at: now });
    await recordAudit(trx, {
      companyId: member.companyId,
      actor: actorOf(member),
      action: "inspection.created",
      entityType: "job",
      entityId: args.jobId,
      summary: `Started inspection #${inspectionId} against ${version.rulebookName} version ${version.versionNumber}`,
    });
    return inspectionId;
  });
  return { id };
}

/**
 * Saves the draft if the caller saw its latest version (else 409), re-runs the engine on the
 * server and stores the result. Audit: one "draft saved" event per member and inspection per
 * 10 minutes, so autosave does not flood the trail while every save is still traced.
 */
export async function saveDraft(args: { member: Member; id: number; version: number; data: InspectionData }) {
  const { member } = args;
  const access = await getInspectionAccess({ companyId: member.companyId, inspectionId: args.id });
  assertEditable(access, member);
  const pinned = await getDb()("inspections").where({ id: args.id, company_id: member.companyId }).first("rulebook_version_id", "job_id");
  const evaluation = await evaluateStored(member.companyId, pinned.rulebook_version_id, args.data);
  const result = await getDb().transaction(async (trx) => {
    const now = nowIso();
    const updated = await trx("inspections")
      .where({ id: args.id, company_id: member.companyId, version: args.version })
      .whereIn("status", ["draft", "returned"])
      .update({
        data_json: JSON.stringify(args.data),
        findings_json: JSON.stringify(evaluation.findings),
        summary_json: JSON.stringify(evaluation.summary),
        version: args.version + 1,
        updated_at: now,
      });
    if (updated !== 1) {
      const current = await trx("inspections").where({ id: args.id, company_id: member.companyId }).first("version", "status", "updated_at");
      throw new AppError(
        "conflict",
        current && current.status !== "draft" && current.status !== "returned"
          ? "This inspection was submitted or locked while you edited it. Reload to see it."
          : "Someone else saved this inspection since you opened it. Reload to see their changes; your own entries are kept on this device.",
      );
    }
    const recent = await trx("audit_events")
      .where({ company_id: member.companyId, entity_type: "inspection", entity_id: args.id, action: "inspection.draft_saved", actor_user_id: member.userId })
      .andWhere("created_at", ">", new Date(Date.now() - 10 * 60 * 1000).toISOString())
      .orderBy("id", "desc")
      .first("id");
    const summary = `Draft saved (version ${args.version + 1}): ${evaluation.summary.counts.fail} fail, ${evaluation.summary.counts["needs-info"]} needs info, ${evaluation.summary.counts.warn} warn, ${evaluation.summary.counts.pass} pass, ${evaluation.summary.counts["not-applicable"]} not applicable`;
    if (recent) await trx("audit_events").where({ id: recent.id }).update({ summary, created_at: now });
    else await recordAudit(trx, { companyId: member.companyId, actor: actorOf(member), action: "inspection.draft_saved", entityType: "inspection", entityId: args.id, summary });
    return { version: args.version + 1, updatedAt: now };
  });
  return { ...result, findings: evaluation.findings, summary: evaluation.summary };
}

/** Re-pins a draft to another version of the company's rulebooks (supervisor or admin). */
export async function repinInspection(args: { member: Member; id: number; rulebookVersionId: number }) {
  const { member } = args;
  const access = await getInspectionAccess({ companyId: member.companyId, inspectionId: args.id });
  if (access.status !== "draft" && access.status !== "returned") throw new AppError("unprocessable", "Only a draft can be re-pinned to another rulebook version.");
  const version = await getRulebookVersionById({ companyId: member.companyId, versionId: args.rulebookVersionId });
  const detail = await getInspection({ companyId: member.companyId, id: args.id });
  const evaluation = evaluateInspectionData(detail.data, preparedFor(version), await listSiteCheckItems({ companyId: member.companyId }));
  await getDb().transaction(async (trx) => {
    await trx("inspections")
      .where({ id: args.id, company_id: member.companyId })
      .update({ rulebook_version_id: version.id, findings_json: JSON.stringify(evaluation.findings), summary_json: JSON.stringify(evaluation.summary), version: detail.version + 1, updated_at: nowIso() });
    await recordAudit(trx, {
      companyId: member.companyId,
      actor: actorOf(member),
      action: "inspection.repinned",
      entityType: "inspection",
      entityId: args.id,
      summary: `Re-pinned from ${detail.rulebookVersion.name} version ${detail.rulebookVersion.versionNumber} to ${version.rulebookName} version ${version.versionNumber}`,
    });
  });
  return getInspection({ companyId: member.companyId, id: args.id });
}

/** Submits for review: the server re-evaluates; every remaining fail or needs-info must carry a justification. */
export async function submitInspection(args: { member: Member; id: number; version: number; typedName: string; signaturePng: string }) {
  const { member } = args;
  const access = await getInspectionAccess({ companyId: member.companyId, inspectionId: args.id });
  assertEditable(access, member);
  const detail = await getInspection({ companyId: member.companyId, id: args.id });
  if (detail.version !== args.version) throw new AppError("conflict", "The inspection changed since you opened the submit step. Review the findings again, then submit.");
  const evaluation = await evaluateStored(member.companyId, detail.rulebookVersion.id, detail.data);
  const blockers = submissionBlockers(evaluation.findings, detail.data.justifications);
  if (blockers.length > 0) {
    throw new AppError("unprocessable", `${blockers.length} finding${blockers.length === 1 ? "" : "s"} must be fixed or justified before submitting: ${blockers.slice(0, 5).map((b) => b.title).join(", ")}${blockers.length > 5 ? "…" : ""}.`);
  }
  await getDb().transaction(async (trx) => {
    const now = nowIso();
    const updated = await trx("inspections")
      .where({ id: args.id, company_id: member.companyId, version: args.version })
      .whereIn("status", ["draft", "returned"])
      .update({
        status: "submitted",
        findings_json: JSON.stringify(evaluation.findings),
        summary_json: JSON.stringify(evaluation.summary),
        installer_id: member.userId,
        installer_signed_name: args.typedName,
        installer_signature_png: args.signaturePng,
        submitted_at: now,
        version: args.version + 1,
        updated_at: now,
      });
    if (updated !== 1) throw new AppError("conflict", "The inspection changed while you submitted. Reload and try again.");
    await trx("jobs").where({ id: detail.jobId, company_id: member.companyId }).whereNotIn("status", ["completed", "cancelled"]).update({ status: "awaiting_review", updated_at: now });
    await recordAudit(trx, {
      companyId: member.companyId,
      actor: actorOf(member),
      action: "inspection.submitted",
      entityType: "inspection",
      entityId: args.id,
      summary: `Submitted for review, signed "${args.typedName}": ${evaluation.summary.counts.fail} fail (justified), ${evaluation.summary.counts.pass} pass`,
    });
  });
  return getInspection({ companyId: member.companyId, id: args.id });
}

export async function addComments(trx: Knex.Transaction, args: { member: Member; id: number; kind: "comment" | "return"; comments: { section: ReviewSection; body: string }[] }) {
  const now = nowIso();
  await trx("inspection_comments").insert(
    args.comments.map((c) => ({ company_id: args.member.companyId, inspection_id: args.id, section: c.section, kind: args.kind, body: c.body, author_id: args.member.userId, author_name: args.member.name, created_at: now })),
  );
}

export async function commentOnInspection(args: { member: Member; id: number; section: ReviewSection; body: string }) {
  await getInspectionAccess({ companyId: args.member.companyId, inspectionId: args.id });
  await getDb().transaction(async (trx) => {
    await addComments(trx, { member: args.member, id: args.id, kind: "comment", comments: [{ section: args.section, body: args.body }] });
    await recordAudit(trx, { companyId: args.member.companyId, actor: actorOf(args.member), action: "inspection.commented", entityType: "inspection", entityId: args.id, summary: `Comment on ${args.section}: ${args.body.slice(0, 200)}` });
  });
  return getInspection({ companyId: args.member.companyId, id: args.id });
}

/** Returns a submitted inspection to the installer with comments; it becomes editable again. */
export async function returnInspection(args: { member: Member; id: number; comments: { section: ReviewSection; body: string }[] }) {
  const { member } = args;
  const access = await getInspectionAccess({ companyId: member.companyId, inspectionId: args.id });
  if (access.status !== "submitted") throw new AppError("unprocessable", "Only a submitted inspection can be returned.");
  await getDb().transaction(async (trx) => {
    const now = nowIso();
    const updated = await trx("inspections").where({ id: args.id, company_id: member.companyId, status: "submitted" }).update({ status: "returned", version: trx.raw("version + 1"), updated_at: now });
    if (updated !== 1) throw new AppError("conflict", "Someone else acted on this inspection just now. Reload to see it.");
    await addComments(trx, { member, id: args.id, kind: "return", comments: args.comments });
    await trx("jobs").where({ id: access.jobId, company_id: member.companyId, status: "awaiting_review" }).update({ status: "in_progress", updated_at: now });
    await recordAudit(trx, {
      companyId: member.companyId,
      actor: actorOf(member),
      action: "inspection.returned",
      entityType: "inspection",
      entityId: args.id,
      summary: `Returned to the installer with ${args.comments.length} comment${args.comments.length === 1 ? "" : "s"}: ${args.comments[0]?.body.slice(0, 150) ?? ""}`,
    });
  });
  return getInspection({ companyId: member.companyId, id: args.id });
}

/**
 * Approves and signs. The conditional update on status makes a double approval succeed once;
 * approval locks the inspection, and approving a revision supersedes the earlier approved one.
 */
export async function approveInspection(args: { member: Member; id: number; typedName: string; signaturePng: string; baseUrl: string }) {
  const { member } = args;
  const access = await getInspectionAccess({ companyId: member.companyId, inspectionId: args.id });
  if (access.status !== "submitted") {
    throw new AppError(access.status === "approved" ? "conflict" : "unprocessable", access.status === "approved" ? "This inspection is already approved." : "Only a submitted inspection can be approved.");
  }
  const approvedAt = nowIso();
  // The record is rendered and stored first; the transaction below only flips the status and
  // inserts the record row, so an approval never exists without its record.
  const prepared = await prepareRecord({
    companyId: member.companyId,
    inspectionId: args.id,
    baseUrl: args.baseUrl,
    approval: { signedName: args.typedName, signaturePng: args.signaturePng, approvedAt },
  });
  try {
    await getDb().transaction(async (trx) => {
      const updated = await trx("inspections")
        .where({ id: args.id, company_id: member.companyId, status: "submitted", version: prepared.inspectionVersion })
        .update({ status: "approved", approved_by: member.userId, supervisor_signed_name: args.typedName, supervisor_signature_png: args.signaturePng, approved_at: approvedAt, version: prepared.inspectionVersion + 1, updated_at: approvedAt });
      if (updated !== 1) throw new AppError("conflict", "This inspection was approved or returned by someone else just now. Reload to see it.");
      const row = await trx("inspections").where({ id: args.id }).first("root_inspection_id", "revision", "job_id");
      await trx("inspections")
        .where({ company_id: member.companyId, root_inspection_id: row.root_inspection_id, status: "approved" })
        .andWhere("revision", "<", row.revision)
        .update({ status: "superseded", superseded_at: approvedAt, updated_at: approvedAt });
      await trx("jobs").where({ id: row.job_id, company_id: member.companyId }).whereNot({ status: "cancelled" }).update({ status: "completed", updated_at: approvedAt });
      await recordAudit(trx, {
        companyId: member.companyId,
        actor: actorOf(member),
        action: "inspection.approved",
        entityType: "inspection",
        entityId: args.id,
        summary: `Approved and signed "${args.typedName}" (revision ${row.revision})`,
      });
      await insertRecord(trx, { companyId: member.companyId, inspectionId: args.id, actor: actorOf(member), prepared });
    });
  } catch (error) {
    await discardPreparedRecord(prepared);
    throw error;
  }
  return getInspection({ companyId: member.companyId, id: args.id });
}

/** Opens a correction of an approved inspection as the next revision; the approved one stays as it was. */
export async function reviseInspection(args: { member: Member; id: number }): Promise<{ id: number }> {
  const { member } = args;
  const detail = await getInspection({ companyId: member.companyId, id: args.id });
  if (detail.status !== "approved") throw new AppError("unprocessable", "Only an approved inspection can be corrected with a new revision.");
  const openRevision = await getDb()("inspections")
    .where({ company_id: member.companyId, root_inspection_id: detail.rootInspectionId })
    .whereIn("status", ["draft", "submitted", "returned"])
    .first("id");
  if (openRevision) throw new AppError("conflict", `Revision in progress already: inspection #${openRevision.id}.`);
  const nextRevision = Math.max(...detail.revisions.map((r) => r.revision)) + 1;
  const id = await getDb().transaction(async (trx) => {
    const now = nowIso();
    const [inserted] = await trx("inspections")
      .insert({
        company_id: member.companyId,
        job_id: detail.jobId,
        status: "draft",
        revision: nextRevision,
        root_inspection_id: detail.rootInspectionId,
        previous_inspection_id: detail.id,
        rulebook_version_id: detail.rulebookVersion.id,
        data_json: JSON.stringify(detail.data),
        findings_json: JSON.stringify(detail.findings),
        summary_json: JSON.stringify(detail.summary ?? {}),
        version: 1,
        created_by: member.userId,
        installer_id: detail.installerId,
        created_at: now,
        updated_at: now,
      })
      .returning("id");
    const newId = insertedId(inserted);
    // The correction starts with the same photos; the stored images are shared, not copied.
    const photos = await trx("photos").where({ company_id: member.companyId, inspection_id: detail.id }).whereNull("deleted_at").select("*");
    if (photos.length) {
      await trx("photos").insert(photos.map(({ id: _id, inspection_id: _i, ...photo }) => ({ ...photo, inspection_id: newId })));
    }
    await recordAudit(trx, {
      companyId: member.companyId,
      actor: actorOf(member),
      action: "inspection.revision_opened",
      entityType: "inspection",
      entityId: detail.id,
      summary: `Opened revision ${nextRevision} (#${newId}) to correct revision ${detail.revision}`,
    });
    return newId;
  });
  return { id };
}
