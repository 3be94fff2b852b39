import "server-only";
import crypto from "node:crypto";
import type { Knex } from "knex";
import { compiledRead } from "@/db/compiled-read";
import { getDb } from "@/db/knex";
import { AppError } from "@/lib/errors";
import { rulebookContentSchema, validateRulebookContent, type RulebookContent, type RulebookIssue } from "@/lib/venting";
import { recordAudit, type AuditActor } from "./audit";
import { nowIso } from "./clock";

export interface RulebookSummary {
  id: number;
  name: string;
  description: string;
  status: "active" | "archived";
  latestVersionNumber: number;
  isDefault: boolean;
  updatedAt: string;
}

export interface RulebookVersionSummary {
  id: number;
  versionNumber: number;
  changeNote: string;
  createdByName: string | null;
  createdAt: string;
  contentSha256: string;
}

export interface RulebookVersion extends RulebookVersionSummary {
  rulebookId: number;
  rulebookName: string;
  content: RulebookContent;
}

export interface RulebookDetail extends RulebookSummary {
  versions: RulebookVersionSummary[];
}

/** Stored content in today's shape: a version saved before a table existed gets that table empty. */
function storedContent(json: string): RulebookContent {
  const content = JSON.parse(json) as RulebookContent;
  return content.returnAirSpaces ? content : { ...content, returnAirSpaces: [] };
}

function canonicalJson(content: RulebookContent): string {
  return JSON.stringify(content);
}

function sha256(text: string): string {
  return crypto.createHash("sha256").update(text).digest("hex");
}

/**
 * Checks rulebook content: structural problems and rule problems (rows out of order, a max
 * below a min, a missing citation...) become field errors keyed `table.row.column`. Returns the
 * parsed content and the warnings that do not block saving.
 */
export function assertValidContent(content: unknown): { content: RulebookContent; warnings: RulebookIssue[] } {
  const issues = validateRulebookContent(content);
  const errors = issues.filter((i) => i.severity === "error");
  if (errors.length > 0) {
    const fields: Record<string, string> = {};
    for (const issue of errors) {
      const key = [issue.table ?? "rulebook", issue.rowIndex ?? "", issue.column ?? ""].filter((p) => p !== "").join(".");
      if (!(key in fields)) fields[key] = issue.message;
    }
    throw new AppError("validation_failed", `The rulebook has ${errors.length} problem${errors.length === 1 ? "" : "s"} to fix before it can be saved.`, { fields });
  }
  const parsed = rulebookContentSchema.parse(content);
  return { content: parsed, warnings: issues.filter((i) => i.severity === "warning") };
}

async function defaultRulebookId(db: Knex | Knex.Transaction, companyId: number): Promise<number | null> {
  const row = await db("companies").where({ id: companyId }).first("default_rulebook_id");
  return row?.default_rulebook_id ?? null;
}

function toSummary(row: Record<string, unknown>, defaultId: number | null): RulebookSummary {
  return {
    id: row.id as number,
    name: row.name as string,
    description: row.description as string,
    status: row.status as "active" | "archived",
    latestVersionNumber: row.latest_version_number as number,
    isDefault: row.id === defaultId,
    updatedAt: row.updated_at as string,
  };
}

export async function listRulebooks(args: { companyId: number; includeArchived?: boolean }): Promise<RulebookSummary[]> {
  const db = getDb();
  const q = db("rulebooks").where({ company_id: args.companyId }).orderBy([{ column: "status", order: "asc" }, { column: "name", order: "asc" }]);
  if (!args.includeArchived) q.andWhere({ status: "active" });
  const [rows, defaultId] = await Promise.all([q.select("*"), defaultRulebookId(db, args.companyId)]);
  return rows.map((row) => toSummary(row, defaultId));
}

async function findRulebookRow(db: Knex | Knex.Transaction, companyId: number, id: number) {
  const row = await db("rulebooks").where({ company_id: companyId, id }).first("*");
  if (!row) throw new AppError("not_found", "No such rulebook in your company.");
  return row;
}

export async function getRulebook(args: { companyId: number; id: number }): Promise<RulebookDetail> {
  const db = getDb();
  const row = await findRulebookRow(db, args.companyId, args.id);
  const versions = await db("rulebook_versions as v")
    .leftJoin("users as u", "u.id", "v.created_by")
    .where({ "v.company_id": args.companyId, "v.rulebook_id": args.id })
    .orderBy("v.version_number", "desc")
    .select("v.id", "v.version_number", "v.change_note", "v.created_at", "v.content_sha256", "u.name as created_by_name");
  return {
    ...toSummary(row, await defaultRulebookId(db, args.companyId)),
    versions: versions.map((v) => ({
      id: v.id,
      versionNumber: v.version_number,
      changeNote: v.change_note,
      createdByName: v.created_by_name ?? null,
      createdAt: v.created_at,
      contentSha256: v.content_sha256,
    })),
  };
}

function toVersion(row: Record<string, unknown>): RulebookVersion {
  return {
    id: row.id as number,
    rulebookId: row.rulebook_id as number,
    rulebookName: row.rulebook_name as string,
    versionNumber: row.version_number as number,
    changeNote: row.change_note as string,
    createdByName: (row.created_by_name as string | null) ?? null,
    createdAt: row.created_at as string,
    contentSha256: row.content_sha256 as string,
    content: storedContent(row.content_json as string),
  };
}

function versionQuery(db: Knex | Knex.Transaction, companyId: number) {
  return db("rulebook_versions as v")
    .join("rulebooks as r", "r.id", "v.rulebook_id")
    .leftJoin("users as u", "u.id", "v.created_by")
    .where("v.company_id", companyId)
    .select("v.*", "r.name as rulebook_name", "u.name as created_by_name");
}

/** One version of a rulebook by its number ("latest" when omitted). */
export async function getRulebookVersion(args: { companyId: number; rulebookId: number; versionNumber?: number }): Promise<RulebookVersion> {
  const db = getDb();
  const rulebook = await findRulebookRow(db, args.companyId, args.rulebookId);
  const versionNumber = args.versionNumber ?? rulebook.latest_version_number;
  const row = await versionQuery(db, args.companyId).andWhere({ "v.rulebook_id": args.rulebookId, "v.version_number": versionNumber }).first();
  if (!row) throw new AppError("not_found", `This rulebook has no version ${versionNumber}.`);
  return toVersion(row);
}

/** A version without its content: enough to name it and to find its prepared form by id. */
export interface RulebookVersionRef {
  id: number;
  rulebookId: number;
  rulebookName: string;
  versionNumber: number;
  contentSha256: string;
}

const VERSION_REF_COLUMNS = ["v.id", "v.rulebook_id", "r.name as rulebook_name", "v.version_number", "v.content_sha256"];

const versionRefById = compiledRead("first", (db, p: { companyId: number; versionId: number }) =>
  db("rulebook_versions as v").join("rulebooks as r", "r.id", "v.rulebook_id").where("v.company_id", p.companyId).andWhere("v.id", p.versionId).first(VERSION_REF_COLUMNS),
);

// The latest version of the company's default rulebook, in one statement.
const currentVersionRef = compiledRead("first", (db, p: { companyId: number }) =>
  db("companies as c")
    .join("rulebooks as r", (on) => on.on("r.id", "c.default_rulebook_id").andOn("r.company_id", "c.id"))
    .join("rulebook_versions as v", (on) => on.on("v.rulebook_id", "r.id").andOn("v.version_number", "r.latest_version_number").andOn("v.company_id", "c.id"))
    .where("c.id", p.companyId)
    .first(VERSION_REF_COLUMNS),
);

const versionContent = compiledRead("first", (db, p: { companyId: number; versionId: number }) =>
  db("rulebook_versions").where({ company_id: p.companyId, id: p.versionId }).first("content_json"),
);

const toRef = (row: Record<string, unknown>): RulebookVersionRef => ({
  id: row.id as number,
  rulebookId: row.rulebook_id as number,
  rulebookName: row.rulebook_name as string,
  versionNumber: row.version_number as number,
  contentSha256: row.content_sha256 as string,
});

/**
 * A version of the company's by id, or the current one (the default rulebook's latest) when no id
 * is given — without its content (64 KB of JSON for the starter rulebook), which a caller that
 * already holds the version's prepared form does not need. Null when there is no current one.
 */
export async function getRulebookVersionRef(args: { companyId: number; versionId?: number }): Promise<RulebookVersionRef | null> {
  if (args.versionId === undefined) {
    const row = await currentVersionRef(getDb(), { companyId: args.companyId });
    return row ? toRef(row) : null;
  }
  const row = await versionRefById(getDb(), { companyId: args.companyId, versionId: args.versionId });
  if (!row) throw new AppError("not_found", "No such rulebook version in your company.");
  return toRef(row);
}

/** A version's content, for the company's own version ids. */
export async function getRulebookVersionContent(args: { companyId: number; versionId: number }): Promise<RulebookContent> {
  const row = await versionContent(getDb(), { companyId: args.companyId, versionId: args.versionId });
  if (!row) throw new AppError("not_found", "No such rulebook version in your company.");
  return storedContent(row.content_json as string);
}

/** One version by its own id, as an inspection or a check pins it. */
export async function getRulebookVersionById(args: { companyId: number; versionId: number }): Promise<RulebookVersion> {
  const row = await versionQuery(getDb(), args.companyId).andWhere("v.id", args.versionId).first();
  if (!row) throw new AppError("not_found", "No such rulebook version in your company.");
  return toVersion(row);
}

/** The latest version of the company's default rulebook: what a new inspection is checked against. */
export async function getCurrentRulebookVersion(args: { companyId: number }): Promise<RulebookVersion | null> {
  const id = await defaultRulebookId(getDb(), args.companyId);
  if (id === null) return null;
  return getRulebookVersion({ companyId: args.companyId, rulebookId: id });
}

async function insertVersion(trx: Knex.Transaction, args: { companyId: number; rulebookId: number; versionNumber: number; content: RulebookContent; changeNote: string; actor: AuditActor }) {
  const json = canonicalJson(args.content);
  const [inserted] = await trx("rulebook_versions")
    .insert({
      company_id: args.companyId,
      rulebook_id: args.rulebookId,
      version_number: args.versionNumber,
      change_note: args.changeNote,
      content_json: json,
      content_sha256: sha256(json),
      created_by: args.actor.userId,
      created_at: nowIso(),
    })
    .returning("id");
  return typeof inserted === "object" ? (inserted as { id: number }).id : (inserted as number);
}

export async function createRulebook(args: { companyId: number; actor: AuditActor; name: string; description: string; content?: unknown; copyFromRulebookId?: number }): Promise<{ rulebook: RulebookDetail; warnings: RulebookIssue[] }> {
  let source: unknown = args.content;
  let note = "Created";
  if (args.copyFromRulebookId !== undefined) {
    const from = await getRulebookVersion({ companyId: args.companyId, rulebookId: args.copyFromRulebookId });
    source = from.content;
    note = `Copied from ${from.rulebookName} version ${from.versionNumber}`;
  }
  const { content, warnings } = assertValidContent(source);
  const id = await getDb().transaction(async (trx) => {
    const now = nowIso();
    const [inserted] = await trx("rulebooks")
      .insert({ company_id: args.companyId, name: args.name, description: args.description, status: "active", latest_version_number: 1, created_by: args.actor.userId, created_at: now, updated_at: now })
      .returning("id");
    const rulebookId = typeof inserted === "object" ? (inserted as { id: number }).id : (inserted as number);
    await insertVersion(trx, { companyId: args.companyId, rulebookId, versionNumber: 1, content, changeNote: note, actor: args.actor });
    if ((await defaultRulebookId(trx, args.companyId)) === null) {
      await trx("companies").where({ id: args.companyId }).update({ default_rulebook_id: rulebookId });
    }
    await recordAudit(trx, { companyId: args.companyId, actor: args.actor, action: "rulebook.created", entityType: "rulebook", entityId: rulebookId, summary: `${note}: ${args.name}` });
    return rulebookId;
  });
  return { rulebook: await getRulebook({ companyId: args.companyId, id }), warnings };
}

/**
 * Saves edited content as the next version. Versions are never updated: an edit made from an
 * older version than the latest is refused with a conflict, so nobody overwrites a colleague.
 */
export async function saveRulebookVersion(args: { companyId: number; actor: AuditActor; rulebookId: number; baseVersionNumber: number; changeNote: string; content: unknown }): Promise<{ version: RulebookVersion; warnings: RulebookIssue[] }> {
  const { content, warnings } = assertValidContent(args.content);
  const versionNumber = await getDb().transaction(async (trx) => {
    const rulebook = await findRulebookRow(trx, args.companyId, args.rulebookId);
    if (rulebook.status === "archived") throw new AppError("unprocessable", "This rulebook is archived. Restore it before editing, or copy it.");
    if (rulebook.latest_version_number !== args.baseVersionNumber) {
      throw new AppError("conflict", `Version ${rulebook.latest_version_number} was saved while you edited version ${args.baseVersionNumber}. Reload to see it, then make your change again.`);
    }
    const next = rulebook.latest_version_number + 1;
    await insertVersion(trx, { companyId: args.companyId, rulebookId: args.rulebookId, versionNumber: next, content, changeNote: args.changeNote, actor: args.actor });
    const updated = await trx("rulebooks")
      .where({ id: args.rulebookId, company_id: args.companyId, latest_version_number: rulebook.latest_version_number })
      .update({ latest_version_number: next, updated_at: nowIso() });
    if (updated !== 1) throw new AppError("conflict");
    await recordAudit(trx, {
      companyId: args.companyId,
      actor: args.actor,
      action: "rulebook.version_created",
      entityType: "rulebook",
      entityId: args.rulebookId,
      summary: `Version ${next} of ${rulebook.name}: ${args.changeNote}`,
    });
    return next;
  });
  return { version: await getRulebookVersion({ companyId: args.companyId, rulebookId: args.rulebookId, versionNumber }), warnings };
}

export async function updateRulebook(args: { companyId: number; actor: AuditActor; id: number; name?: string; description?: string; status?: "active" | "archived"; makeDefault?: true }): Promise<RulebookDetail> {
  await getDb().transaction(async (trx) => {
    const rulebook = await findRulebookRow(trx, args.companyId, args.id);
    const isDefault = (await defaultRulebookId(trx, args.companyId)) === args.id;
    if (args.status === "archived" && isDefault) {
      throw new AppError("unprocessable", "This is the company's current rulebook. Make another rulebook current before archiving this one.");
    }
    if (args.makeDefault && (args.status ?? rulebook.status) === "archived") {
      throw new AppError("unprocessable", "An archived rulebook cannot be the current one. Restore it first.");
    }
    const changes: Record<string, unknown> = { updated_at: nowIso() };
    if (args.name !== undefined) changes.name = args.name;
    if (args.description !== undefined) changes.description = args.description;
    if (args.status !== undefined) changes.status = args.status;
    await trx("rulebooks").where({ id: args.id, company_id: args.companyId }).update(changes);
    if (args.makeDefault) await trx("companies").where({ id: args.companyId }).update({ default_rulebook_id: args.id });
    const parts = [
      args.name !== undefined && args.name !== rulebook.name ? `renamed to ${args.name}` : null,
      args.status !== undefined && args.status !== rulebook.status ? (args.status === "archived" ? "archived" : "restored") : null,
      args.makeDefault ? "made current" : null,
      args.description !== undefined ? "description edited" : null,
    ].filter(Boolean);
    await recordAudit(trx, {
      companyId: args.companyId,
      actor: args.actor,
      action: args.status === "archived" ? "rulebook.archived" : "rulebook.updated",
      entityType: "rulebook",
      entityId: args.id,
      summary: `${rulebook.name}: ${parts.join(", ") || "no change"}`,
    });
  });
  return getRulebook({ companyId: args.companyId, id: args.id });
}
