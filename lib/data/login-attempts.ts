import "server-only";
import { getDb } from "@/db/knex";
import { nowIso } from "./clock";

export async function recordLoginAttempt(args: { email: string; client: string; succeeded: boolean }): Promise<void> {
  await getDb()("login_attempts").insert({ email: args.email, client: args.client.slice(0, 100), succeeded: args.succeeded, created_at: nowIso() });
}

/** Failed attempts since a moment, for one account and for one client address, with the oldest time of each. */
export async function recentFailures(args: { email: string; client: string; sinceIso: string }) {
  const db = getDb();
  const [byEmail, byClient] = await Promise.all([
    db("login_attempts").where({ email: args.email, succeeded: false }).andWhere("created_at", ">", args.sinceIso).orderBy("created_at", "asc").select("created_at"),
    db("login_attempts").where({ client: args.client, succeeded: false }).andWhere("created_at", ">", args.sinceIso).orderBy("created_at", "asc").select("created_at"),
  ]);
  return {
    emailFailures: byEmail.map((r) => r.created_at as string),
    clientFailures: byClient.map((r) => r.created_at as string),
  };
}

export async function clearFailuresForEmail(email: string): Promise<void> {
  await getDb()("login_attempts").where({ email, succeeded: false }).delete();
}
