import "server-only";
import { AppError } from "@/lib/errors";
import { hashPassword, verifyPassword } from "./passwords";
import { passwordProblem } from "./password-policy";
import { commonPasswords } from "./common-passwords";
import type { Member } from "./session";
import { findPasswordHash } from "@/lib/data/users";
import { setOwnPassword } from "@/lib/data/members";

/** Changes the member's own password after checking the current one; other sessions end. */
export async function changeOwnPassword(args: { member: Member; currentPassword: string; newPassword: string }): Promise<void> {
  const { member } = args;
  const hash = await findPasswordHash({ companyId: member.companyId, userId: member.userId });
  if (!(await verifyPassword(args.currentPassword, hash))) {
    throw new AppError("validation_failed", undefined, { fields: { currentPassword: "That is not your current password." } });
  }
  const problem = passwordProblem(args.newPassword, { email: member.email, name: member.name, commonPasswords: await commonPasswords() });
  if (problem) throw new AppError("validation_failed", undefined, { fields: { newPassword: problem } });
  if (args.newPassword === args.currentPassword) {
    throw new AppError("validation_failed", undefined, { fields: { newPassword: "Choose a password different from the current one." } });
  }
  await setOwnPassword({
    companyId: member.companyId,
    userId: member.userId,
    actorName: member.name,
    passwordHash: await hashPassword(args.newPassword),
    keepSessionIdHash: member.sessionIdHash,
  });
}
