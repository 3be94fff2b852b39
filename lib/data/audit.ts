import "server-only";
import type { Knex } from "knex";
import { getDb } from "@/db/knex";
import { nowIso } from "./clock";

export interface AuditActor {
  userId: number | null;
  name: string;
}

export interface AuditEventInput {
  companyId: number;
  actor: AuditActor;
  action: string;
  entityType: string;
  entityId: number | null;
  summary: string;
  before?: unknown;
  after?: unknown;
}

export interface AuditEvent {
  id: number;
  action: string;
  entityType: string;
  entityId: number | null;
  actorName: string;
  summary: string;
  before: unknown;
  after: unknown;
  createdAt: string;
}

/** Writes one audit event, inside the caller's transaction when one is given. */
export async function recordAudit(db: Knex | Knex.Transaction, event: AuditEventInput): Promise<void> {
  await db("audit_events").insert({
    company_id: event.companyId,
    actor_user_id: event.actor.userId,
    actor_name: event.actor.name,
    action: event.action,
    entity_type: event.entityType,
    entity_id: event.entityId,
    summary: event.summary.slice(0, 500),
    before_json: event.before === undefined ? null : JSON.stringify(event.before),
    after_json: event.after === undefined ? null : JSON.stringify(event.after),
    created_at: nowIso(),
  });
}

function toAuditEvent(row: Record<string, unknown>): AuditEvent {
  return {
    id: row.id as number,
    action: row.action as string,
    entityType: row.entity_type as string,
    entityId: (row.entity_id as number | null) ?? null,
    actorName: row.actor_name as string,
    summary: row.summary as string,
    before: parseJson(row.before_json as string | null),
    after: parseJson(row.after_json as string | null),
    createdAt: row.created_at as string,
  };
}

function parseJson(text: string | null): unknown {
  if (text == null) return null;
  try {
    return JSON.parse(text);
  } catch {
    return null;
  }
}

/** The history of one entity, newest first, always within the caller's company. */
export async function listAuditForEntity(args: { companyId: number; entityType: string; entityId: number; limit?: number }): Promise<AuditEvent[]> {
  const rows = await getDb()("audit_events")
    .where({ company_id: args.companyId, entity_type: args.entityType, entity_id: args.entityId })
    .orderBy("id", "desc")
    .limit(args.limit ?? 100);
  return rows.map(toAuditEvent);
}

/** A job's history: its own events and those of its inspections, newest first. */
export async function listJobHistory(args: { companyId: number; jobId: number; limit?: number }): Promise<AuditEvent[]> {
  const db = getDb();
  const rows = await db("audit_events")
    .where("company_id", args.companyId)
    .andWhere((w) =>
      w
        .where({ entity_type: "job", entity_id: args.jobId })
        .orWhere((w2) => w2.where("entity_type", "inspection").whereIn("entity_id", db("inspections").select("id").where({ company_id: args.companyId, job_id: args.jobId }))),
    )
    .orderBy("id", "desc")
    .limit(args.limit ?? 100);
  return rows.map(toAuditEvent);
}
