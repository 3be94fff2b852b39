import "server-only";
import crypto from "node:crypto";
import { getDb } from "@/db/knex";
import { AppError } from "@/lib/errors";
import type { Role } from "@/lib/auth/roles";
import { hashPassword } from "@/lib/auth/passwords";
import { recordAudit, type AuditActor } from "./audit";
import { nowIso } from "./clock";
import { revokeUserSessions } from "./sessions";

export interface MemberSummary {
  id: number;
  name: string;
  email: string;
  role: Role;
  active: boolean;
  mustChangePassword: boolean;
  createdAt: string;
}

function toMember(row: Record<string, unknown>): MemberSummary {
  return {
    id: row.id as number,
    name: row.name as string,
    email: row.email as string,
    role: row.role as Role,
    active: Boolean(row.active),
    mustChangePassword: Boolean(row.must_change_password),
    createdAt: row.created_at as string,
  };
}

const MEMBER_COLUMNS = ["id", "name", "email", "role", "active", "must_change_password", "created_at"];

export async function listMembers(args: { companyId: number; activeOnly?: boolean; role?: Role }): Promise<MemberSummary[]> {
  const q = getDb()("users").where({ company_id: args.companyId }).orderBy([{ column: "active", order: "desc" }, { column: "name", order: "asc" }]);
  if (args.activeOnly) q.andWhere({ active: true });
  if (args.role) q.andWhere({ role: args.role });
  return (await q.select(MEMBER_COLUMNS)).map(toMember);
}

export async function getMemberById(args: { companyId: number; id: number }): Promise<MemberSummary> {
  const row = await getDb()("users").where({ company_id: args.companyId, id: args.id }).first(MEMBER_COLUMNS);
  if (!row) throw new AppError("not_found", "No such member in your company.");
  return toMember(row);
}

/** A readable temporary password: five groups of four characters without look-alikes (about 100 bits). */
export function temporaryPassword(): string {
  const alphabet = "abcdefghjkmnpqrstuvwxyz23456789";
  const bytes = crypto.randomBytes(20);
  const chars = [...bytes].map((b) => alphabet[b % alphabet.length]);
  return [0, 4, 8, 12, 16].map((i) => chars.slice(i, i + 4).join("")).join("-");
}

/** Adds a member with a temporary password that must be changed at first sign-in. */
export async function createMember(args: { companyId: number; actor: AuditActor; name: string; email: string; role: Role }): Promise<{ member: MemberSummary; temporaryPassword: string }> {
  const existing = await getDb()("users").where({ email: args.email }).first("id");
  if (existing) throw new AppError("validation_failed", undefined, { fields: { email: "An account with this e-mail address already exists." } });
  const password = temporaryPassword();
  const passwordHash = await hashPassword(password);
  const now = nowIso();
  const id = await getDb().transaction(async (trx) => {
    const [inserted] = await trx("users")
      .insert({
        company_id: args.companyId,
        email: args.email,
        name: args.name,
        password_hash: passwordHash,
        role: args.role,
        active: true,
        must_change_password: true,
        password_changed_at: now,
        created_at: now,
        updated_at: now,
      })
      .returning("id");
    const userId = typeof inserted === "object" ? (inserted as { id: number }).id : (inserted as number);
    await recordAudit(trx, {
      companyId: args.companyId,
      actor: args.actor,
      action: "member.created",
      entityType: "user",
      entityId: userId,
      summary: `Added ${args.name} (${args.email}) as ${args.role}`,
      after: { name: args.name, email: args.email, role: args.role },
    });
    return userId;
  });
  return { member: await getMemberById({ companyId: args.companyId, id }), temporaryPassword: password };
}

/**
 * Changes a member's role or active flag. Deactivation ends the member's sessions at once.
 * An admin cannot demote or deactivate themself, so a company always keeps an admin.
 */
export async function updateMember(args: { companyId: number; actor: AuditActor; id: number; role?: Role; active?: boolean }): Promise<MemberSummary> {
  const before = await getMemberById({ companyId: args.companyId, id: args.id });
  if (args.id === args.actor.userId && ((args.role && args.role !== "admin") || args.active === false)) {
    throw new AppError("unprocessable", "You cannot remove your own admin role or deactivate yourself. Ask another admin.");
  }
  const changes: Record<string, unknown> = { updated_at: nowIso() };
  if (args.role !== undefined) changes.role = args.role;
  if (args.active !== undefined) changes.active = args.active;
  await getDb().transaction(async (trx) => {
    await trx("users").where({ company_id: args.companyId, id: args.id }).update(changes);
    const parts: string[] = [];
    if (args.role !== undefined && args.role !== before.role) parts.push(`role ${before.role} → ${args.role}`);
    if (args.active !== undefined && args.active !== before.active) parts.push(args.active ? "reactivated" : "deactivated");
    await recordAudit(trx, {
      companyId: args.companyId,
      actor: args.actor,
      action: args.active === false ? "member.deactivated" : "member.updated",
      entityType: "user",
      entityId: args.id,
      summary: `${before.name}: ${parts.join(", ") || "no change"}`,
      before: { role: before.role, active: before.active },
      after: { role: args.role ?? before.role, active: args.active ?? before.active },
    });
  });
  // The role is read afresh on every request, so a role change takes effect without ending sessions.
  if (args.active === false) await revokeUserSessions({ userId: args.id, reason: "deactivated" });
  return getMemberById({ companyId: args.companyId, id: args.id });
}

/** Sets a new password hash, clears the temporary-password flag and ends every other session. */
export async function setOwnPassword(args: { companyId: number; userId: number; actorName: string; passwordHash: string; keepSessionIdHash: string }): Promise<void> {
  const now = nowIso();
  await getDb().transaction(async (trx) => {
    await trx("users").where({ company_id: args.companyId, id: args.userId }).update({ password_hash: args.passwordHash, must_change_password: false, password_changed_at: now, updated_at: now });
    await recordAudit(trx, {
      companyId: args.companyId,
      actor: { userId: args.userId, name: args.actorName },
      action: "member.password_changed",
      entityType: "user",
      entityId: args.userId,
      summary: `${args.actorName} changed their password`,
    });
  });
  await revokeUserSessions({ userId: args.userId, reason: "password_changed", keepSessionIdHash: args.keepSessionIdHash });
}
