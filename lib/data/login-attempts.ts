import "server-only";
import type { Knex } from "knex";
import { getDb } from "@/db/knex";
import { nowIso } from "./clock";
import { recordAudit } from "./audit";

/** What a password was typed for: signing in, or re-entering it while signed in (approving, changing it). */
export type AttemptPurpose = "sign_in" | "reauth";

/**
 * Whom an attempt counts against. With a device (the id from a valid device cookie for this
 * account) the attempt is counted only for that device; without one, for the account and for the
 * client address, the counts that lock out unknown clients.
 */
export interface AttemptSubject {
  purpose: AttemptPurpose;
  email: string;
  client: string;
  device: string | null;
}

/** Times (ISO) of the failures within the window, oldest first, per counter the subject is judged by. */
export interface RecentFailures {
  account: string[];
  client: string[];
  device: string[];
}

const times = (rows: Array<{ created_at: string }>) => rows.map((r) => r.created_at);

/** Failed attempts since a moment, for each counter the subject is judged by (the others are empty). */
export async function recentFailures(subject: AttemptSubject, sinceIso: string, db: Knex | Knex.Transaction = getDb()): Promise<RecentFailures> {
  const failures = () => db("login_attempts").where({ purpose: subject.purpose, succeeded: false }).andWhere("created_at", ">", sinceIso).orderBy("created_at", "asc").select("created_at");
  if (subject.device !== null) {
    return { account: [], client: [], device: times(await failures().andWhere({ device: subject.device })) };
  }
  const [account, client] = await Promise.all([
    failures().andWhere({ email: subject.email }).whereNull("device"),
    failures().andWhere({ client: subject.client }).whereNull("device"),
  ]);
  return { account: times(account), client: times(client), device: [] };
}

/**
 * Checks the limits and, when the attempt may go ahead, records it as a failure in the same
 * transaction, before any hashing. Attempts still being hashed then count against the limits, so
 * a burst of concurrent attempts cannot queue more password comparisons than the limits allow.
 * Returns the failures seen (for the caller's wait) and, when allowed, the new attempt's id.
 */
export async function reserveLoginAttempt(
  subject: AttemptSubject,
  sinceIso: string,
  mayProceed: (failures: RecentFailures) => boolean,
): Promise<{ failures: RecentFailures; attemptId: number | null }> {
  return getDb().transaction(async (trx) => {
    const failures = await recentFailures(subject, sinceIso, trx);
    if (!mayProceed(failures)) return { failures, attemptId: null };
    const [inserted] = await trx("login_attempts")
      .insert({ email: subject.email, client: subject.client.slice(0, 100), device: subject.device, purpose: subject.purpose, succeeded: false, created_at: nowIso() })
      .returning("id");
    const attemptId = typeof inserted === "object" && inserted !== null ? (inserted as { id: number }).id : (inserted as number);
    return { failures, attemptId };
  });
}

/**
 * Marks a reserved attempt as the success it turned out to be and forgets the failures of the
 * counter that judged it: the device's own, or (without a device) the account's. A success on a
 * known device leaves the account's count for unknown clients alone, so it never lifts a lock a
 * stranger earned.
 */
export async function markLoginAttemptSucceeded(attemptId: number, subject: AttemptSubject): Promise<void> {
  await getDb().transaction(async (trx) => {
    await trx("login_attempts").where({ id: attemptId }).update({ succeeded: true });
    const failures = trx("login_attempts").where({ purpose: subject.purpose, succeeded: false });
    if (subject.device !== null) await failures.andWhere({ device: subject.device }).delete();
    else await failures.andWhere({ email: subject.email }).whereNull("device").delete();
  });
}

/** A wrong password typed again while signed in, kept in the company's audit trail. */
export async function auditFailedPasswordReentry(args: { companyId: number; userId: number; name: string; summary: string; client: string }): Promise<void> {
  await recordAudit(getDb(), {
    companyId: args.companyId,
    actor: { userId: args.userId, name: args.name },
    action: "session.password_reentry_failed",
    entityType: "user",
    entityId: args.userId,
    summary: args.summary,
    after: { client: args.client },
  });
}
