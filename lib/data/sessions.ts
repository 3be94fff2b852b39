import "server-only";
import crypto from "node:crypto";
import { compiledRead } from "@/db/compiled-read";
import { getDb } from "@/db/knex";
import { isRole, type Role } from "@/lib/auth/roles";
import { isoPlus, nowIso } from "./clock";

/** How long a session lives without use, and at the most. */
export const SESSION_IDLE_TIMEOUT_MS = 12 * 60 * 60 * 1000;
export const SESSION_ABSOLUTE_LIFETIME_MS = 7 * 24 * 60 * 60 * 1000;
/** last_seen_at is written at most this often, so reads stay reads. */
const TOUCH_INTERVAL_MS = 60 * 1000;

export type SessionEndReason = "sign_out" | "deactivated" | "password_changed" | "role_changed" | "expired";

export interface SessionMember {
  sessionIdHash: string;
  userId: number;
  companyId: number;
  companyName: string;
  role: Role;
  name: string;
  email: string;
  mustChangePassword: boolean;
}

export function hashSessionId(sessionId: string): string {
  return crypto.createHash("sha256").update(sessionId).digest("hex");
}

/** Opens a server-side session and returns the random id that goes (sealed) into the cookie. */
export async function createSession(args: { userId: number; companyId: number; userAgent: string }): Promise<string> {
  const sessionId = crypto.randomBytes(32).toString("base64url");
  const now = nowIso();
  await getDb()("sessions").insert({
    id_hash: hashSessionId(sessionId),
    user_id: args.userId,
    company_id: args.companyId,
    created_at: now,
    last_seen_at: now,
    expires_at: isoPlus(SESSION_ABSOLUTE_LIFETIME_MS),
    user_agent: args.userAgent.slice(0, 300),
  });
  return sessionId;
}

interface SessionMemberRow {
  id_hash: string;
  user_id: number;
  company_id: number;
  last_seen_at: string;
  expires_at: string;
  revoked_at: string | null;
  role: string;
  name: string;
  email: string;
  active: number | boolean;
  user_company_id: number;
  must_change_password: number | boolean;
  company_name: string;
}

/** Read on every signed-in request: compiled once (db/compiled-read.ts). */
const sessionMemberRow = compiledRead("first", (db, p: { idHash: string }) =>
  db("sessions as s")
    .join("users as u", "u.id", "s.user_id")
    .join("companies as c", "c.id", "s.company_id")
    .where("s.id_hash", p.idHash)
    .first(
      "s.id_hash",
      "s.user_id",
      "s.company_id",
      "s.last_seen_at",
      "s.expires_at",
      "s.revoked_at",
      "u.role",
      "u.name",
      "u.email",
      "u.active",
      "u.company_id as user_company_id",
      "u.must_change_password",
      "c.name as company_name",
    ),
);

/**
 * The member behind a session id, or null when the session is unknown, revoked, past its
 * absolute lifetime, idle too long, or its user has been deactivated.
 */
export async function findSessionMember(sessionId: string): Promise<SessionMember | null> {
  const idHash = hashSessionId(sessionId);
  const row = (await sessionMemberRow(getDb(), { idHash })) as SessionMemberRow | undefined;
  if (!row || row.revoked_at) return null;
  const now = Date.now();
  if (Date.parse(row.expires_at) <= now) return null;
  if (Date.parse(row.last_seen_at) + SESSION_IDLE_TIMEOUT_MS <= now) return null;
  if (!row.active || row.user_company_id !== row.company_id || !isRole(row.role)) return null;
  if (Date.parse(row.last_seen_at) + TOUCH_INTERVAL_MS <= now) {
    await getDb()("sessions").where({ id_hash: idHash }).update({ last_seen_at: nowIso() });
  }
  return {
    sessionIdHash: idHash,
    userId: row.user_id,
    companyId: row.company_id,
    companyName: row.company_name,
    role: row.role,
    name: row.name,
    email: row.email,
    mustChangePassword: Boolean(row.must_change_password),
  };
}

export async function revokeSession(sessionIdHash: string, reason: SessionEndReason): Promise<void> {
  await getDb()("sessions").where({ id_hash: sessionIdHash }).whereNull("revoked_at").update({ revoked_at: nowIso(), revoked_reason: reason });
}

/** Ends every live session of a user, optionally keeping the one making the request. */
export async function revokeUserSessions(args: { userId: number; reason: SessionEndReason; keepSessionIdHash?: string }): Promise<void> {
  const query = getDb()("sessions").where({ user_id: args.userId }).whereNull("revoked_at");
  if (args.keepSessionIdHash) query.whereNot({ id_hash: args.keepSessionIdHash });
  await query.update({ revoked_at: nowIso(), revoked_reason: args.reason });
}
