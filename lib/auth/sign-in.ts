import "server-only";
import { cookies } from "next/headers";
import { AppError } from "@/lib/errors";
import { verifyPassword } from "./passwords";
import { getCookieSession } from "./session";
import { clientAddress } from "./client-address";
import { deviceCookieName, deviceCookieOptions, issueDeviceCookie, readDeviceCookie } from "./device-cookie";
import { ATTEMPT_WINDOW_MS, attemptSucceeded, reserveAttempt, retryAfterSeconds, type AttemptLimits } from "./attempt-limits";
import { findCredentialsByEmail, type UserCredentials } from "@/lib/data/users";
import { createSession, revokeSession, hashSessionId } from "@/lib/data/sessions";
import type { AttemptSubject } from "@/lib/data/login-attempts";
import { recordAudit } from "@/lib/data/audit";
import { getDb } from "@/db/knex";

/**
 * Failures allowed within the window before sign-in slows down (lib/auth/attempt-limits.ts): per
 * account from unknown clients, per client address, and per known device. A device that signed
 * in to the account before (a valid device cookie for it) is judged only by its own count, so a
 * stranger who locks the account for unknown clients does not lock the member out of that device.
 */
export const SIGN_IN_WINDOW_MS = ATTEMPT_WINDOW_MS;
export const SIGN_IN_MAX_FAILURES_PER_ACCOUNT = 5;
export const SIGN_IN_MAX_FAILURES_PER_CLIENT = 20;
export const SIGN_IN_MAX_FAILURES_PER_DEVICE = 5;
const SIGN_IN_LIMITS: AttemptLimits = {
  account: SIGN_IN_MAX_FAILURES_PER_ACCOUNT,
  client: SIGN_IN_MAX_FAILURES_PER_CLIENT,
  device: SIGN_IN_MAX_FAILURES_PER_DEVICE,
};

export const SIGN_IN_FAILED_MESSAGE = "That e-mail and password do not match an active account.";

export { retryAfterSeconds };

export async function signIn(args: { email: string; password: string; client: string; userAgent: string }): Promise<{ mustChangePassword: boolean }> {
  const jar = await cookies();
  const presented = readDeviceCookie(jar.get(deviceCookieName())?.value);
  // A device cookie counts only for the account it was issued to. Looking the account up first
  // costs one indexed read, and only for requests that carry a validly signed cookie.
  let credentials: UserCredentials | null | undefined;
  let device: string | null = null;
  if (presented) {
    credentials = await findCredentialsByEmail(args.email);
    if (credentials && credentials.id === presented.memberId) device = presented.deviceId;
  }
  // Rate limiting comes before hashing: the attempt is recorded as a failure before the hash
  // worker sees it (and flipped on success), so concurrent attempts count while they wait.
  const subject: AttemptSubject = { purpose: "sign_in", email: args.email, client: args.client, device };
  const attemptId = await reserveAttempt({
    subject,
    limits: SIGN_IN_LIMITS,
    refusal: (wait) =>
      device !== null
        ? `Too many failed sign-ins on this device. Wait ${wait} and try again.`
        : `Too many failed sign-ins. Wait ${wait} and try again, or sign in on a device you have signed in on before.`,
  });

  if (credentials === undefined) credentials = await findCredentialsByEmail(args.email);
  // Always compare (against a dummy hash for unknown e-mails) so both failures take the same time.
  const matches = await verifyPassword(args.password, credentials?.passwordHash);
  if (!credentials || !matches || !credentials.active) {
    throw new AppError("unauthenticated", SIGN_IN_FAILED_MESSAGE);
  }

  await attemptSucceeded(attemptId, subject);

  const session = await getCookieSession();
  // A new session id at every sign-in: an id planted before sign-in is never promoted.
  if (session.sid) await revokeSession(hashSessionId(session.sid), "sign_out");
  session.sid = await createSession({ userId: credentials.id, companyId: credentials.companyId, userAgent: args.userAgent });
  await session.save();
  // A fresh device cookie at every sign-in: this browser is now a known device of this member.
  jar.set(deviceCookieName(), issueDeviceCookie(credentials.id).value, deviceCookieOptions());

  const user = await getDb()("users").where({ id: credentials.id }).first("name", "must_change_password");
  await recordAudit(getDb(), {
    companyId: credentials.companyId,
    actor: { userId: credentials.id, name: user?.name ?? "" },
    action: "session.sign_in",
    entityType: "user",
    entityId: credentials.id,
    summary: device !== null ? "Signed in on a known device" : "Signed in",
  });
  return { mustChangePassword: Boolean(user?.must_change_password) };
}

export async function signOut(): Promise<void> {
  const session = await getCookieSession();
  if (session.sid) await revokeSession(hashSessionId(session.sid), "sign_out");
  session.destroy();
}

/** The client address for the limits: see lib/auth/client-address.ts (TRUSTED_PROXY_COUNT). */
export { clientAddress };
