import "server-only";
import { AppError } from "@/lib/errors";
import { hashPassword } from "./passwords";
import { confirmOwnPassword } from "./reauthenticate";
import { passwordProblem } from "./password-policy";
import { commonPasswords } from "./common-passwords";
import type { Member } from "./session";
import { setOwnPassword } from "@/lib/data/members";

/** Changes the member's own password after checking the current one (limited and audited: reauthenticate.ts); other sessions end. */
export async function changeOwnPassword(args: { member: Member; currentPassword: string; newPassword: string; client: string }): Promise<void> {
  const { member } = args;
  await confirmOwnPassword({
    member,
    password: args.currentPassword,
    client: args.client,
    purpose: { kind: "change_password" },
    field: "currentPassword",
    wrongMessage: "That is not your current password.",
  });
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
