import "server-only";
import { AppError } from "@/lib/errors";
import { markLoginAttemptSucceeded, recentFailures, reserveLoginAttempt, type AttemptSubject, type RecentFailures } from "@/lib/data/login-attempts";

/**
 * Limits on typing a password: signing in, and re-entering it while signed in. Failures are
 * counted within a window; past a counter's limit each attempt must wait, and each further
 * failure doubles the wait (30 s, 60 s, 120 s …) until it spans the whole window: the attempts
 * slow down, then stop. Which counters judge an attempt is the subject's business
 * (lib/data/login-attempts.ts): a known device only by its own count, anyone else by the
 * account's and the client's.
 */
export const ATTEMPT_WINDOW_MS = 15 * 60 * 1000;

export interface AttemptLimits {
  /** Failures of one account from unknown clients (for re-entry: of one member). */
  account: number;
  /** Failures from one client address, over every account. */
  client: number;
  /** Failures on one known device (a valid device cookie for the account). */
  device: number;
}

/**
 * Seconds to wait before the next attempt. Once past the limit, each further failure in the
 * window doubles the wait (30 s, 60 s, 120 s … up to the window).
 */
export function retryAfterSeconds(failures: string[], limit: number, nowMs: number): number {
  if (failures.length < limit) return 0;
  const over = failures.length - limit;
  const lastMs = Date.parse(failures[failures.length - 1] ?? new Date(nowMs).toISOString());
  const waitMs = Math.min(ATTEMPT_WINDOW_MS, 30_000 * 2 ** over);
  return Math.max(0, Math.ceil((lastMs + waitMs - nowMs) / 1000));
}

/**
 * A refused attempt is answered after this pause. Waiting costs no CPU, and it caps what each
 * connection of a flood can take from the one event loop (about 2 refusals a second instead of
 * hundreds), so other users' requests keep their share while the limits hold.
 */
export const REFUSAL_DELAY_MS = 500;

/**
 * Until when (ms) a counter must wait, as last read from the database. Failures only accumulate
 * within a wait, so the wait read stays valid until it ends; the database stays the truth
 * (another server process reads it for itself).
 */
const blockedUntilMs = new Map<string, number>();
const MAX_REMEMBERED_BLOCKS = 10_000;

function rememberBlock(key: string, waitSeconds: number, nowMs: number): void {
  if (waitSeconds <= 0) return;
  if (blockedUntilMs.size >= MAX_REMEMBERED_BLOCKS) {
    for (const [k, until] of blockedUntilMs) if (until <= nowMs) blockedUntilMs.delete(k);
    if (blockedUntilMs.size >= MAX_REMEMBERED_BLOCKS) blockedUntilMs.clear();
  }
  blockedUntilMs.set(key, nowMs + waitSeconds * 1000);
}

/** The counters that judge the subject, each with its memory key and limit. */
function counters(subject: AttemptSubject, limits: AttemptLimits) {
  const prefix = subject.purpose;
  if (subject.device !== null) return [{ key: `${prefix}|d|${subject.device}`, pick: (f: RecentFailures) => f.device, limit: limits.device }];
  return [
    { key: `${prefix}|a|${subject.email}`, pick: (f: RecentFailures) => f.account, limit: limits.account },
    { key: `${prefix}|c|${subject.client}`, pick: (f: RecentFailures) => f.client, limit: limits.client },
  ];
}

export function formatWait(seconds: number): string {
  if (seconds < 90) return `${seconds} seconds`;
  return `${Math.ceil(seconds / 60)} minutes`;
}

/**
 * Lets an attempt go ahead, recorded as a failure until `attemptSucceeded`, or refuses it with
 * 429 and Retry-After (after REFUSAL_DELAY_MS). A counter already known to be waiting is refused
 * from memory, so a flood costs no query at all.
 */
export async function reserveAttempt(args: {
  subject: AttemptSubject;
  limits: AttemptLimits;
  refusal: (waitText: string) => string;
}): Promise<number> {
  const nowMs = Date.now();
  const since = new Date(nowMs - ATTEMPT_WINDOW_MS).toISOString();
  const judged = counters(args.subject, args.limits);
  const refuse = async (waitSeconds: number): Promise<never> => {
    await new Promise((resolve) => setTimeout(resolve, REFUSAL_DELAY_MS));
    throw new AppError("rate_limited", args.refusal(formatWait(waitSeconds)), { headers: { "Retry-After": String(waitSeconds) } });
  };
  const known = Math.max(...judged.map((c) => Math.ceil(((blockedUntilMs.get(c.key) ?? 0) - nowMs) / 1000)));
  if (known > 0) return refuse(known);
  const waitFor = (failures: RecentFailures) => {
    let wait = 0;
    for (const counter of judged) {
      const seconds = retryAfterSeconds(counter.pick(failures), counter.limit, nowMs);
      rememberBlock(counter.key, seconds, nowMs);
      wait = Math.max(wait, seconds);
    }
    return wait;
  };
  const wait = waitFor(await recentFailures(args.subject, since));
  if (wait > 0) return refuse(wait);
  const { failures, attemptId } = await reserveLoginAttempt(args.subject, since, (seen) => waitFor(seen) === 0);
  if (attemptId === null) return refuse(waitFor(failures));
  return attemptId;
}

/** The reserved attempt turned out right: it stops counting, and so do its counter's failures. */
export async function attemptSucceeded(attemptId: number, subject: AttemptSubject): Promise<void> {
  await markLoginAttemptSucceeded(attemptId, subject);
}
