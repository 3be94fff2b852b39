import "server-only";
import crypto from "node:crypto";
import type { Knex } from "knex";
import { getDb } from "@/db/knex";
import { AppError } from "@/lib/errors";
import { getStorage, newBlobKey } from "@/lib/storage";
import { renderRecordPdf } from "@/lib/records/render-pdf";
import type { RecordInput } from "@/lib/records/record-input";
import { inspectionDataSchema } from "@/lib/inspections/data";
import { evaluateInspectionData, findingKey, type InspectionFinding } from "@/lib/inspections/evaluate";
import { preparedFor } from "@/lib/checks/run-check";
import { recordAudit, type AuditActor } from "./audit";
import { nowIso, isoPlus } from "./clock";
import { getRulebookVersionById } from "./rulebooks";
import { listSiteCheckItems } from "./site-checks";
import { listPhotos, readPhotoBytes } from "./photos";
import { applicableItems } from "@/lib/site-checks";

export type RecordStatus = "valid" | "superseded" | "revoked";

export interface RecordSummary {
  id: number;
  recordNumber: string;
  inspectionId: number;
  revision: number;
  verificationCode: string;
  sha256: string;
  pdfBytes: number;
  status: RecordStatus;
  supersededByRevision: number | null;
  revokedAt: string | null;
  revokedReason: string | null;
  installerName: string;
  supervisorName: string;
  submittedAt: string;
  approvedAt: string;
  createdAt: string;
}

/** 60 random bits in a readable alphabet (no 0/O, 1/I/L), grouped for reading aloud: K7QM-2XDP-9HRA. */
export function newVerificationCode(): string {
  const alphabet = "23456789ABCDEFGHJKMNPQRSTUVWXYZ";
  const bytes = crypto.randomBytes(12);
  const chars = [...bytes].map((b) => alphabet[b % alphabet.length]).join("");
  return `${chars.slice(0, 4)}-${chars.slice(4, 8)}-${chars.slice(8, 12)}`;
}

export function normaliseVerificationCode(code: string): string {
  const compact = code.toUpperCase().replace(/[^0-9A-Z]/g, "");
  return compact.length === 12 ? `${compact.slice(0, 4)}-${compact.slice(4, 8)}-${compact.slice(8, 12)}` : code.trim().toUpperCase();
}

/** The record's printed number: the inspection it started as, and the revision (R-000042-2). */
export function recordNumber(rootInspectionId: number, revision: number): string {
  return `R-${String(rootInspectionId).padStart(6, "0")}-${revision}`;
}

export function sha256Hex(bytes: Uint8Array): string {
  return crypto.createHash("sha256").update(bytes).digest("hex");
}

const RECORD_COLUMNS = ["r.*", "nxt.revision as superseded_by_revision"];

function toSummary(row: Record<string, unknown>): RecordSummary {
  return {
    id: row.id as number,
    recordNumber: recordNumber(row.root_inspection_id as number, row.revision as number),
    inspectionId: row.inspection_id as number,
    revision: row.revision as number,
    verificationCode: row.verification_code as string,
    sha256: row.sha256 as string,
    pdfBytes: row.pdf_bytes as number,
    status: row.status as RecordStatus,
    supersededByRevision: (row.superseded_by_revision as number | null) ?? null,
    revokedAt: (row.revoked_at as string | null) ?? null,
    revokedReason: (row.revoked_reason as string | null) ?? null,
    installerName: row.installer_name as string,
    supervisorName: row.supervisor_name as string,
    submittedAt: row.submitted_at as string,
    approvedAt: row.approved_at as string,
    createdAt: row.created_at as string,
  };
}

function recordQuery(db: Knex | Knex.Transaction) {
  return db("records as r").leftJoin("records as nxt", "nxt.id", "r.superseded_by_record_id").select(RECORD_COLUMNS);
}

export interface Approval {
  signedName: string;
  signaturePng: string;
  approvedAt: string;
}

/** Gathers what the PDF shows, from the submitted inspection and the approval about to be made. */
async function buildRecordInput(args: { companyId: number; inspectionId: number; code: string; baseUrl: string; approval: Approval }): Promise<{ input: RecordInput; version: number }> {
  const db = getDb();
  const row = await db("inspections as i")
    .join("jobs as j", "j.id", "i.job_id")
    .join("companies as c", "c.id", "i.company_id")
    .where({ "i.id": args.inspectionId, "i.company_id": args.companyId })
    .first("i.*", "j.reference", "j.customer_name", "j.site_street", "j.site_city", "j.site_region", "j.site_postal_code", "c.name as company_name", "c.licence_number", "c.phone", "c.email", "c.address");
  if (!row) throw new AppError("not_found", "No such inspection in your company.");
  const data = inspectionDataSchema.parse(JSON.parse(row.data_json));
  const version = await getRulebookVersionById({ companyId: args.companyId, versionId: row.rulebook_version_id });
  const items = await listSiteCheckItems({ companyId: args.companyId });
  const evaluation = evaluateInspectionData(data, preparedFor(version), items);
  const findings: InspectionFinding[] = evaluation.findings;
  const byKey = new Map(findings.map((f) => [findingKey(f), f]));
  const photos = await listPhotos({ companyId: args.companyId, inspectionId: args.inspectionId });
  const photoInputs: RecordInput["photos"] = [];
  for (const photo of photos) {
    const { bytes } = await readPhotoBytes({ companyId: args.companyId, photoId: photo.id });
    const segmentIndex = photo.segmentId ? (data.ventRun?.segments.findIndex((s) => s.id === photo.segmentId) ?? -1) : -1;
    const attachedTo = segmentIndex >= 0 ? `Segment ${segmentIndex + 1}` : photo.siteCheckKey ? (items.find((i) => i.key === photo.siteCheckKey)?.label ?? photo.siteCheckKey) : null;
    photoInputs.push({ caption: photo.caption, tag: photo.tag, attachedTo, width: photo.width, height: photo.height, jpegBytes: bytes });
  }
  const previous = row.previous_inspection_id ? await db("inspections").where({ id: row.previous_inspection_id, company_id: args.companyId }).first("revision") : null;
  const site = [row.site_street, row.site_city, row.site_region, row.site_postal_code].filter((p: string) => p && p.trim()).join(", ");
  const input: RecordInput = {
    recordNumber: recordNumber(row.root_inspection_id ?? row.id, row.revision),
    revision: row.revision,
    verificationCode: args.code,
    verifyUrl: `${args.baseUrl.replace(/\/$/, "")}/verify?code=${encodeURIComponent(args.code)}`,
    generatedAt: args.approval.approvedAt,
    supersedesRevision: previous?.revision ?? null,
    company: { name: row.company_name, licenceNumber: row.licence_number, phone: row.phone, email: row.email, address: row.address },
    job: { reference: row.reference, customerName: row.customer_name, siteAddress: site },
    inspection: { id: row.id, submittedAt: row.submitted_at, approvedAt: args.approval.approvedAt, notes: data.notes },
    appliances: data.appliances,
    data,
    findings,
    summary: evaluation.summary,
    sizing: evaluation.sizing,
    rulebook: {
      name: version.rulebookName,
      versionNumber: version.versionNumber,
      edition: version.content.edition,
      demoDataNote: version.content.demoDataNote ?? null,
      contentSha256: version.contentSha256,
    },
    siteChecks: applicableItems(items, data.appliances).map((item) => ({ key: item.key, label: item.label, answer: data.siteChecks[item.key]?.answer ?? null, note: data.siteChecks[item.key]?.note ?? "" })),
    justifications: Object.entries(data.justifications)
      .filter(([, j]) => j.text.trim())
      .map(([key, j]) => ({ title: byKey.get(key)?.title ?? key, code: byKey.get(key)?.code ?? key.split("@")[0] ?? key, text: j.text, reference: j.reference })),
    photos: photoInputs,
    installer: { signedName: row.installer_signed_name ?? "", signaturePng: row.installer_signature_png ?? null, signedAt: row.submitted_at ?? "" },
    supervisor: { signedName: args.approval.signedName, signaturePng: args.approval.signaturePng, signedAt: args.approval.approvedAt },
  };
  return { input, version: row.version };
}

export interface PreparedRecord {
  code: string;
  pdfKey: string;
  pdfBytes: number;
  sha256: string;
  /** The inspection's version the record was rendered from: the approval must still find it. */
  inspectionVersion: number;
}

/**
 * Renders the record of an inspection about to be approved and stores its bytes, before the
 * approval's transaction (which then only inserts the row). If the approval does not happen,
 * the caller discards the stored file with {@link discardPreparedRecord}.
 */
export async function prepareRecord(args: { companyId: number; inspectionId: number; baseUrl: string; approval: Approval }): Promise<PreparedRecord> {
  let code = newVerificationCode();
  while (await getDb()("records").where({ verification_code: code }).first("id")) code = newVerificationCode();
  const { input, version } = await buildRecordInput({ ...args, code });
  const pdf = await renderRecordPdf(input);
  const key = newBlobKey(`records/c${args.companyId}`, ".pdf");
  await getStorage().put(key, pdf, "application/pdf");
  return { code, pdfKey: key, pdfBytes: pdf.byteLength, sha256: sha256Hex(pdf), inspectionVersion: version };
}

export async function discardPreparedRecord(prepared: PreparedRecord): Promise<void> {
  await getStorage().delete(prepared.pdfKey).catch(() => undefined);
}

/** Inserts the record row of an approval (inside its transaction) and supersedes the previous revision's record. */
export async function insertRecord(trx: Knex.Transaction, args: { companyId: number; inspectionId: number; actor: AuditActor; prepared: PreparedRecord }): Promise<number> {
  const inspection = await trx("inspections").where({ id: args.inspectionId, company_id: args.companyId }).first("id", "root_inspection_id", "revision", "submitted_at", "approved_at", "installer_signed_name", "supervisor_signed_name");
  const rootId = inspection.root_inspection_id ?? inspection.id;
  const [inserted] = await trx("records")
    .insert({
      company_id: args.companyId,
      inspection_id: args.inspectionId,
      root_inspection_id: rootId,
      revision: inspection.revision,
      verification_code: args.prepared.code,
      pdf_key: args.prepared.pdfKey,
      pdf_bytes: args.prepared.pdfBytes,
      sha256: args.prepared.sha256,
      status: "valid",
      installer_name: inspection.installer_signed_name ?? "",
      supervisor_name: inspection.supervisor_signed_name ?? "",
      submitted_at: inspection.submitted_at,
      approved_at: inspection.approved_at,
      created_at: nowIso(),
    })
    .returning("id");
  const recordId = typeof inserted === "object" ? (inserted as { id: number }).id : (inserted as number);
  await trx("records").where({ company_id: args.companyId, root_inspection_id: rootId, status: "valid" }).whereNot({ id: recordId }).update({ status: "superseded", superseded_by_record_id: recordId });
  await recordAudit(trx, {
    companyId: args.companyId,
    actor: args.actor,
    action: "record.issued",
    entityType: "inspection",
    entityId: args.inspectionId,
    summary: `Issued record ${recordNumber(rootId, inspection.revision)}, verification code ${args.prepared.code}, SHA-256 ${args.prepared.sha256.slice(0, 16)}…`,
  });
  return recordId;
}

export async function getRecord(args: { companyId: number; recordId: number }): Promise<RecordSummary> {
  const row = await recordQuery(getDb()).where({ "r.id": args.recordId, "r.company_id": args.companyId }).first();
  if (!row) throw new AppError("not_found", "No such record in your company.");
  return toSummary(row);
}

/** Every record of an inspection's revision chain, newest first. */
export async function listRecordsForInspection(args: { companyId: number; inspectionId: number }): Promise<RecordSummary[]> {
  const inspection = await getDb()("inspections").where({ id: args.inspectionId, company_id: args.companyId }).first("root_inspection_id", "id");
  if (!inspection) throw new AppError("not_found", "No such inspection in your company.");
  const rows = await recordQuery(getDb())
    .where({ "r.company_id": args.companyId, "r.root_inspection_id": inspection.root_inspection_id ?? inspection.id })
    .orderBy("r.revision", "desc");
  return rows.map(toSummary);
}

/** The stored PDF bytes, checked against their hash on every read. */
export async function readRecordPdf(args: { companyId: number; recordId: number }): Promise<{ record: RecordSummary; bytes: Uint8Array }> {
  const row = await getDb()("records").where({ id: args.recordId, company_id: args.companyId }).first("*");
  if (!row) throw new AppError("not_found", "No such record in your company.");
  const bytes = await getStorage().get(row.pdf_key);
  if (!bytes || sha256Hex(bytes) !== row.sha256) {
    console.error(`[records] stored PDF of record ${row.id} is missing or does not match its hash`);
    throw new AppError("internal_error", "The stored record file could not be read intact. Nothing was changed; contact your admin.");
  }
  return { record: await getRecord(args), bytes };
}

export async function revokeRecord(args: { companyId: number; actor: AuditActor; recordId: number; reason: string }): Promise<RecordSummary> {
  await getDb().transaction(async (trx) => {
    const updated = await trx("records").where({ id: args.recordId, company_id: args.companyId }).whereNot({ status: "revoked" }).update({ status: "revoked", revoked_at: nowIso(), revoked_reason: args.reason });
    if (updated !== 1) {
      const exists = await trx("records").where({ id: args.recordId, company_id: args.companyId }).first("id");
      throw exists ? new AppError("unprocessable", "This record is already revoked.") : new AppError("not_found", "No such record in your company.");
    }
    const record = await trx("records").where({ id: args.recordId }).first("inspection_id", "root_inspection_id", "revision");
    await recordAudit(trx, { companyId: args.companyId, actor: args.actor, action: "record.revoked", entityType: "inspection", entityId: record.inspection_id, summary: `Revoked record ${recordNumber(record.root_inspection_id, record.revision)}: ${args.reason}` });
  });
  return getRecord(args);
}

/* ---------- share links ---------- */

export const SHARE_AUDIENCES = ["homeowner", "inspector"] as const;
export type ShareAudience = (typeof SHARE_AUDIENCES)[number];

export interface ShareLinkSummary {
  id: number;
  recordId: number;
  audience: ShareAudience;
  label: string;
  expiresAt: string;
  revokedAt: string | null;
  createdAt: string;
  createdByName: string | null;
  accessCount: number;
  lastAccessAt: string | null;
  state: "active" | "expired" | "revoked";
}

function tokenHash(token: string): string {
  return crypto.createHash("sha256").update(token).digest("hex");
}

/** A new link: 256 random bits; only the hash is kept, so the link is shown to its creator once. */
export async function createShareLink(args: { companyId: number; actor: AuditActor; recordId: number; audience: ShareAudience; expiresInDays: number; label: string; baseUrl: string; trx?: Knex.Transaction }) {
  const db = args.trx ?? getDb();
  const record = await db("records").where({ id: args.recordId, company_id: args.companyId }).first("id", "status", "inspection_id", "root_inspection_id", "revision");
  if (!record) throw new AppError("not_found", "No such record in your company.");
  if (record.status === "revoked") throw new AppError("unprocessable", "This record is revoked; share its corrected revision instead.");
  const token = crypto.randomBytes(32).toString("base64url");
  const expiresAt = isoPlus(args.expiresInDays * 86_400_000);
  const [inserted] = await db("share_links")
    .insert({ company_id: args.companyId, record_id: args.recordId, token_hash: tokenHash(token), audience: args.audience, label: args.label, expires_at: expiresAt, created_by: args.actor.userId, created_at: nowIso() })
    .returning("id");
  const id = typeof inserted === "object" ? (inserted as { id: number }).id : (inserted as number);
  await recordAudit(db, {
    companyId: args.companyId,
    actor: args.actor,
    action: "share_link.created",
    entityType: "inspection",
    entityId: record.inspection_id,
    summary: `Share link for the ${args.audience}${args.label ? ` (${args.label})` : ""} on record ${recordNumber(record.root_inspection_id, record.revision)}, expires ${expiresAt.slice(0, 10)}`,
  });
  return { id, token, url: `${args.baseUrl.replace(/\/$/, "")}/share/${token}`, expiresAt };
}

export async function listShareLinks(args: { companyId: number; recordIds: number[] }): Promise<ShareLinkSummary[]> {
  if (args.recordIds.length === 0) return [];
  const rows = await getDb()("share_links as s")
    .leftJoin("users as u", "u.id", "s.created_by")
    .where("s.company_id", args.companyId)
    .whereIn("s.record_id", args.recordIds)
    .orderBy("s.id", "desc")
    .select("s.*", "u.name as created_by_name")
    .select(getDb().raw("(select count(*) from share_link_accesses a where a.share_link_id = s.id and a.action in ('view', 'download')) as access_count"))
    .select(getDb().raw("(select max(created_at) from share_link_accesses a where a.share_link_id = s.id) as last_access_at"));
  const now = Date.now();
  return rows.map((r) => ({
    id: r.id,
    recordId: r.record_id,
    audience: r.audience,
    label: r.label,
    expiresAt: r.expires_at,
    revokedAt: r.revoked_at ?? null,
    createdAt: r.created_at,
    createdByName: r.created_by_name ?? null,
    accessCount: Number(r.access_count ?? 0),
    lastAccessAt: r.last_access_at ?? null,
    state: r.revoked_at ? "revoked" : Date.parse(r.expires_at) <= now ? "expired" : "active",
  }));
}

export async function revokeShareLink(args: { companyId: number; actor: AuditActor; shareLinkId: number }): Promise<void> {
  await getDb().transaction(async (trx) => {
    const link = await trx("share_links as s").join("records as r", "r.id", "s.record_id").where({ "s.id": args.shareLinkId, "s.company_id": args.companyId }).first("s.id", "s.revoked_at", "r.inspection_id", "s.audience");
    if (!link) throw new AppError("not_found", "No such share link in your company.");
    if (link.revoked_at) return;
    await trx("share_links").where({ id: args.shareLinkId }).update({ revoked_at: nowIso() });
    await recordAudit(trx, { companyId: args.companyId, actor: args.actor, action: "share_link.revoked", entityType: "inspection", entityId: link.inspection_id, summary: `Revoked the ${link.audience}'s share link #${args.shareLinkId}` });
  });
}

/** What a share-link holder may see: the record's summary and status, nothing else of the company. */
export interface SharedRecordView {
  companyName: string;
  siteAddress: string;
  recordNumber: string;
  revision: number;
  status: RecordStatus;
  supersededByRevision: number | null;
  approvedAt: string;
  installerName: string;
  supervisorName: string;
  verificationCode: string;
  sha256: string;
  expiresAt: string;
  audience: ShareAudience;
}

/**
 * Opens a share link: 404 for an unknown token, 410 for an expired or revoked one (logged as
 * refused), otherwise the view, with the access logged.
 */
export async function openShareLink(args: { token: string; action: "view" | "download"; client: string; userAgent: string }): Promise<{ view: SharedRecordView; recordId: number; companyId: number }> {
  if (!/^[A-Za-z0-9_-]{20,100}$/.test(args.token)) throw new AppError("not_found", "This link is not valid. Check that it was copied completely.");
  const db = getDb();
  const row = await db("share_links as s")
    .join("records as r", "r.id", "s.record_id")
    .join("inspections as i", "i.id", "r.inspection_id")
    .join("jobs as j", "j.id", "i.job_id")
    .join("companies as c", "c.id", "s.company_id")
    .leftJoin("records as nxt", "nxt.id", "r.superseded_by_record_id")
    .where("s.token_hash", tokenHash(args.token))
    .first(
      "s.id as link_id",
      "s.company_id",
      "s.expires_at",
      "s.revoked_at as link_revoked_at",
      "s.audience",
      "r.*",
      "nxt.revision as superseded_by_revision",
      "c.name as company_name",
      "j.site_street",
      "j.site_city",
      "j.site_postal_code",
    );
  if (!row) throw new AppError("not_found", "This link is not valid. Check that it was copied completely.");
  const log = (action: string) =>
    db("share_link_accesses").insert({ company_id: row.company_id, share_link_id: row.link_id, action, client: args.client.slice(0, 100), user_agent: args.userAgent.slice(0, 300), created_at: nowIso() });
  if (row.link_revoked_at) {
    await log("refused_revoked");
    throw new AppError("gone", "This link has been withdrawn by the company that shared it. Ask them for a new link.");
  }
  if (Date.parse(row.expires_at) <= Date.now()) {
    await log("refused_expired");
    throw new AppError("gone", `This link expired on ${String(row.expires_at).slice(0, 10)}. Ask the company that shared it for a new link.`);
  }
  await log(args.action);
  return {
    recordId: row.id,
    companyId: row.company_id,
    view: {
      companyName: row.company_name,
      siteAddress: [row.site_street, row.site_city, row.site_postal_code].filter(Boolean).join(", "),
      recordNumber: recordNumber(row.root_inspection_id, row.revision),
      revision: row.revision,
      status: row.status,
      supersededByRevision: row.superseded_by_revision ?? null,
      approvedAt: row.approved_at,
      installerName: row.installer_name,
      supervisorName: row.supervisor_name,
      verificationCode: row.verification_code,
      sha256: row.sha256,
      expiresAt: row.expires_at,
      audience: row.audience,
    },
  };
}

/* ---------- verification (public) ---------- */

export interface VerificationResult {
  found: boolean;
  status?: RecordStatus;
  recordNumber?: string;
  revision?: number;
  latestRevision?: number;
  supersededByRevision?: number | null;
  companyName?: string;
  siteAddress?: string;
  sha256?: string;
  installerName?: string;
  supervisorName?: string;
  submittedAt?: string;
  approvedAt?: string;
  revokedAt?: string | null;
  revokedReason?: string | null;
}

async function verificationFor(where: Record<string, string>): Promise<VerificationResult> {
  const db = getDb();
  const row = await db("records as r")
    .join("inspections as i", "i.id", "r.inspection_id")
    .join("jobs as j", "j.id", "i.job_id")
    .join("companies as c", "c.id", "r.company_id")
    .leftJoin("records as nxt", "nxt.id", "r.superseded_by_record_id")
    .where(where)
    .first("r.*", "nxt.revision as superseded_by_revision", "c.name as company_name", "j.site_street", "j.site_city", "j.site_postal_code");
  if (!row) return { found: false };
  const latest = await db("records").where({ company_id: row.company_id, root_inspection_id: row.root_inspection_id }).max<{ m: number }[]>({ m: "revision" }).first();
  return {
    found: true,
    status: row.status,
    recordNumber: recordNumber(row.root_inspection_id, row.revision),
    revision: row.revision,
    latestRevision: Number(latest?.m ?? row.revision),
    supersededByRevision: row.superseded_by_revision ?? null,
    companyName: row.company_name,
    siteAddress: [row.site_street, row.site_city, row.site_postal_code].filter(Boolean).join(", "),
    sha256: row.sha256,
    installerName: row.installer_name,
    supervisorName: row.supervisor_name,
    submittedAt: row.submitted_at,
    approvedAt: row.approved_at,
    revokedAt: row.revoked_at ?? null,
    revokedReason: row.revoked_reason ?? null,
  };
}

export function verifyByCode(code: string): Promise<VerificationResult> {
  return verificationFor({ "r.verification_code": normaliseVerificationCode(code) });
}

/** Checks uploaded PDF bytes: by their hash alone, or against the record of a given code. */
export async function verifyUpload(args: { bytes: Uint8Array; code?: string }): Promise<{ sha256: string; matches: boolean; record: VerificationResult }> {
  const sha = sha256Hex(args.bytes);
  if (args.code) {
    const record = await verifyByCode(args.code);
    return { sha256: sha, matches: record.found && record.sha256 === sha, record };
  }
  const record = await verificationFor({ "r.sha256": sha });
  return { sha256: sha, matches: record.found, record };
}

/** Company and site facts a record's e-mail names; only for the company's own record. */
export async function recordEmailFacts(args: { companyId: number; recordId: number }) {
  const row = await getDb()("records as r")
    .join("inspections as i", "i.id", "r.inspection_id")
    .join("jobs as j", "j.id", "i.job_id")
    .join("companies as c", "c.id", "r.company_id")
    .where({ "r.id": args.recordId, "r.company_id": args.companyId })
    .first("r.*", "c.name as company_name", "c.phone", "c.email", "j.site_street", "j.site_city", "j.site_postal_code", "j.customer_name");
  if (!row) throw new AppError("not_found", "No such record in your company.");
  return {
    status: row.status as RecordStatus,
    companyName: row.company_name as string,
    companyPhone: row.phone as string,
    companyEmail: row.email as string,
    siteAddress: [row.site_street, row.site_city, row.site_postal_code].filter(Boolean).join(", "),
    customerName: row.customer_name as string,
    recordNumber: recordNumber(row.root_inspection_id, row.revision),
    revision: row.revision as number,
    approvedAt: row.approved_at as string,
    verificationCode: row.verification_code as string,
  };
}

/** Whether a press of "Send" with this key was already handled (then no new share link is made). */
export async function emailKeyUsed(args: { companyId: number; idempotencyKey: string }): Promise<boolean> {
  return Boolean(await getDb()("email_sends").where({ company_id: args.companyId, idempotency_key: args.idempotencyKey }).first("id"));
}
