import "server-only";
import { AppError } from "@/lib/errors";
import { verifyPassword } from "./passwords";
import type { Member } from "./session";
import { attemptSucceeded, reserveAttempt, type AttemptLimits } from "./attempt-limits";
import { findPasswordHash } from "@/lib/data/users";
import { auditFailedPasswordReentry, type AttemptSubject } from "@/lib/data/login-attempts";

/**
 * Failures of password re-entry allowed within the window (lib/auth/attempt-limits.ts), per member
 * and per client address, like sign-in's. Counted apart from sign-ins: a stranger locking the
 * account at the sign-in page does not stop a signed-in supervisor from approving.
 */
export const REAUTH_MAX_FAILURES_PER_MEMBER = 5;
export const REAUTH_MAX_FAILURES_PER_CLIENT = 20;
const REAUTH_LIMITS: AttemptLimits = { account: REAUTH_MAX_FAILURES_PER_MEMBER, client: REAUTH_MAX_FAILURES_PER_CLIENT, device: REAUTH_MAX_FAILURES_PER_MEMBER };

/** What the password is typed again for, in the words the audit trail uses. */
export type ReentryPurpose = { kind: "approve"; inspectionId: number } | { kind: "change_password" };

function describePurpose(purpose: ReentryPurpose): string {
  return purpose.kind === "approve" ? `approving inspection ${purpose.inspectionId}` : "changing their password";
}

/**
 * Checks the signed-in member's own password, typed again to confirm an action. Limited like
 * sign-in (429 with Retry-After once past the limit, before any hashing); each wrong password is
 * audited and answered as a field error on `field`.
 */
export async function confirmOwnPassword(args: {
  member: Member;
  password: string;
  client: string;
  purpose: ReentryPurpose;
  field: string;
  wrongMessage: string;
}): Promise<void> {
  const { member } = args;
  const subject: AttemptSubject = { purpose: "reauth", email: member.email, client: args.client, device: null };
  const attemptId = await reserveAttempt({
    subject,
    limits: REAUTH_LIMITS,
    refusal: (wait) => `Too many wrong passwords. Wait ${wait} and try again.`,
  });
  const hash = await findPasswordHash({ companyId: member.companyId, userId: member.userId });
  if (!(await verifyPassword(args.password, hash))) {
    await auditFailedPasswordReentry({
      companyId: member.companyId,
      userId: member.userId,
      name: member.name,
      summary: `${member.name} typed a wrong password when ${describePurpose(args.purpose)}`,
      client: args.client,
    });
    throw new AppError("validation_failed", undefined, { fields: { [args.field]: args.wrongMessage } });
  }
  await attemptSucceeded(attemptId, subject);
}
