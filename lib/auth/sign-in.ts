import "server-only";
import { AppError } from "@/lib/errors";
import { verifyPassword } from "./passwords";
import { getCookieSession } from "./session";
import { findCredentialsByEmail } from "@/lib/data/users";
import { createSession, revokeSession, hashSessionId } from "@/lib/data/sessions";
import { clearFailuresForEmail, markLoginAttemptSucceeded, recentFailures, reserveLoginAttempt } from "@/lib/data/login-attempts";
import { recordAudit } from "@/lib/data/audit";
import { getDb } from "@/db/knex";

/** Failures allowed per account and per client address within the window before sign-in pauses. */
export const SIGN_IN_WINDOW_MS = 15 * 60 * 1000;
export const SIGN_IN_MAX_FAILURES_PER_ACCOUNT = 5;
export const SIGN_IN_MAX_FAILURES_PER_CLIENT = 20;

export const SIGN_IN_FAILED_MESSAGE = "That e-mail and password do not match an active account.";

/**
 * Seconds to wait before the next attempt. Once past the limit, each further failure in the
 * window doubles the wait (30 s, 60 s, 120 s … up to the window).
 */
export function retryAfterSeconds(failures: string[], limit: number, nowMs: number): number {
  if (failures.length < limit) return 0;
  const over = failures.length - limit;
  const lastMs = Date.parse(failures[failures.length - 1] ?? new Date(nowMs).toISOString());
  const waitMs = Math.min(SIGN_IN_WINDOW_MS, 30_000 * 2 ** over);
  return Math.max(0, Math.ceil((lastMs + waitMs - nowMs) / 1000));
}

/**
 * Until when (ms) an account (`e:`) or client address (`c:`) must wait, as last read from the
 * database. Failures only accumulate within a wait, so the wait read stays valid until it ends;
 * the database stays the truth (another server process reads it for itself).
 */
const blockedUntilMs = new Map<string, number>();
const MAX_REMEMBERED_BLOCKS = 10_000;

/**
 * A refused attempt is answered after this pause. Waiting costs no CPU, and it caps what each
 * connection of a flood can take from the one event loop (about 2 refusals a second instead of
 * hundreds), so other users' requests keep their share while the limits hold.
 */
export const SIGN_IN_REFUSAL_DELAY_MS = 500;

async function refuse(waitSeconds: number): Promise<never> {
  await new Promise((resolve) => setTimeout(resolve, SIGN_IN_REFUSAL_DELAY_MS));
  throw rateLimited(waitSeconds);
}

function rememberBlock(key: string, waitSeconds: number, nowMs: number): void {
  if (waitSeconds <= 0) return;
  if (blockedUntilMs.size >= MAX_REMEMBERED_BLOCKS) {
    for (const [k, until] of blockedUntilMs) if (until <= nowMs) blockedUntilMs.delete(k);
    if (blockedUntilMs.size >= MAX_REMEMBERED_BLOCKS) blockedUntilMs.clear();
  }
  blockedUntilMs.set(key, nowMs + waitSeconds * 1000);
}

function rateLimited(waitSeconds: number): AppError {
  return new AppError("rate_limited", `Too many failed sign-ins. Wait ${formatWait(waitSeconds)} and try again, or ask your admin to reset your password.`, {
    headers: { "Retry-After": String(waitSeconds) },
  });
}

export async function signIn(args: { email: string; password: string; client: string; userAgent: string }): Promise<{ mustChangePassword: boolean }> {
  const nowMs = Date.now();
  const since = new Date(nowMs - SIGN_IN_WINDOW_MS).toISOString();
  // Rate limiting comes before hashing. A client or account already known to be waiting is
  // refused from memory, so a flood costs no query at all; otherwise the limits are read, and an
  // attempt that may go ahead is recorded as a failure before hashing (flipped on success) in the
  // check's own transaction, so concurrent attempts count against the limits while they wait
  // for the hash worker.
  const keys = [`e:${args.email}`, `c:${args.client}`];
  const known = Math.max(...keys.map((key) => Math.ceil(((blockedUntilMs.get(key) ?? 0) - nowMs) / 1000)));
  if (known > 0) return refuse(known);
  const waitFor = (failures: { emailFailures: string[]; clientFailures: string[] }) => {
    const email = retryAfterSeconds(failures.emailFailures, SIGN_IN_MAX_FAILURES_PER_ACCOUNT, nowMs);
    const client = retryAfterSeconds(failures.clientFailures, SIGN_IN_MAX_FAILURES_PER_CLIENT, nowMs);
    rememberBlock(keys[0]!, email, nowMs);
    rememberBlock(keys[1]!, client, nowMs);
    return Math.max(email, client);
  };
  const wait = waitFor(await recentFailures({ email: args.email, client: args.client, sinceIso: since }));
  if (wait > 0) return refuse(wait);
  const { failures, attemptId } = await reserveLoginAttempt({ email: args.email, client: args.client, sinceIso: since }, (seen) => waitFor(seen) === 0);
  if (attemptId === null) return refuse(waitFor(failures));

  const credentials = await findCredentialsByEmail(args.email);
  // Always compare (against a dummy hash for unknown e-mails) so both failures take the same time.
  const matches = await verifyPassword(args.password, credentials?.passwordHash);
  if (!credentials || !matches || !credentials.active) {
    throw new AppError("unauthenticated", SIGN_IN_FAILED_MESSAGE);
  }

  await markLoginAttemptSucceeded(attemptId);
  await clearFailuresForEmail(args.email);

  const session = await getCookieSession();
  // A new session id at every sign-in: an id planted before sign-in is never promoted.
  if (session.sid) await revokeSession(hashSessionId(session.sid), "sign_out");
  session.sid = await createSession({ userId: credentials.id, companyId: credentials.companyId, userAgent: args.userAgent });
  await session.save();

  const user = await getDb()("users").where({ id: credentials.id }).first("name", "must_change_password");
  await recordAudit(getDb(), {
    companyId: credentials.companyId,
    actor: { userId: credentials.id, name: user?.name ?? "" },
    action: "session.sign_in",
    entityType: "user",
    entityId: credentials.id,
    summary: "Signed in",
  });
  return { mustChangePassword: Boolean(user?.must_change_password) };
}

export async function signOut(): Promise<void> {
  const session = await getCookieSession();
  if (session.sid) await revokeSession(hashSessionId(session.sid), "sign_out");
  session.destroy();
}

function formatWait(seconds: number): string {
  if (seconds < 90) return `${seconds} seconds`;
  return `${Math.ceil(seconds / 60)} minutes`;
}

/** The client address as the server saw it (x-forwarded-for is set by Next's own server, or a trusted proxy). */
export function clientAddress(headers: Headers): string {
  const forwarded = headers.get("x-forwarded-for");
  return (forwarded?.split(",")[0]?.trim() || headers.get("x-real-ip") || "local").slice(0, 100);
}
