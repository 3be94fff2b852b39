import "server-only";
import type { Knex } from "knex";
import { getDb } from "@/db/knex";
import { nowIso } from "./clock";

/** Failed attempts since a moment, for one account and for one client address, with the oldest time of each. */
export async function recentFailures(args: { email: string; client: string; sinceIso: string }, db: Knex | Knex.Transaction = getDb()) {
  const [byEmail, byClient] = await Promise.all([
    db("login_attempts").where({ email: args.email, succeeded: false }).andWhere("created_at", ">", args.sinceIso).orderBy("created_at", "asc").select("created_at"),
    db("login_attempts").where({ client: args.client, succeeded: false }).andWhere("created_at", ">", args.sinceIso).orderBy("created_at", "asc").select("created_at"),
  ]);
  return {
    emailFailures: byEmail.map((r) => r.created_at as string),
    clientFailures: byClient.map((r) => r.created_at as string),
  };
}

/**
 * Checks the limits and, when the attempt may go ahead, records it as a failure in the same
 * transaction, before any hashing. Attempts still being hashed then count against the limits, so
 * a burst of concurrent attempts cannot queue more password comparisons than the limits allow.
 * Returns the failures seen (for the caller's wait) and, when allowed, the new attempt's id.
 */
export async function reserveLoginAttempt(
  args: { email: string; client: string; sinceIso: string },
  mayProceed: (failures: { emailFailures: string[]; clientFailures: string[] }) => boolean,
): Promise<{ failures: { emailFailures: string[]; clientFailures: string[] }; attemptId: number | null }> {
  return getDb().transaction(async (trx) => {
    const failures = await recentFailures(args, trx);
    if (!mayProceed(failures)) return { failures, attemptId: null };
    const [inserted] = await trx("login_attempts")
      .insert({ email: args.email, client: args.client.slice(0, 100), succeeded: false, created_at: nowIso() })
      .returning("id");
    const attemptId = typeof inserted === "object" && inserted !== null ? (inserted as { id: number }).id : (inserted as number);
    return { failures, attemptId };
  });
}

/** Marks a reserved attempt as the successful sign-in it turned out to be. */
export async function markLoginAttemptSucceeded(attemptId: number): Promise<void> {
  await getDb()("login_attempts").where({ id: attemptId }).update({ succeeded: true });
}

export async function clearFailuresForEmail(email: string): Promise<void> {
  await getDb()("login_attempts").where({ email, succeeded: false }).delete();
}
