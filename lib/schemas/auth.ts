import { z } from "zod";
import { emailSchema } from "./common";
import { CHANGE_PASSWORD_MESSAGES, PASSWORD_MESSAGES, SIGN_IN_PASSWORD_MAX_LENGTH } from "./auth-messages";
import { PASSWORD_MAX_BYTES } from "@/lib/auth/password-policy";

export const signInSchema = z.object({
  email: emailSchema,
  password: z.string({ error: PASSWORD_MESSAGES.missing }).min(1, PASSWORD_MESSAGES.missing).max(SIGN_IN_PASSWORD_MAX_LENGTH, PASSWORD_MESSAGES.tooLong),
});
export type SignInInput = z.infer<typeof signInSchema>;

export const changePasswordSchema = z
  .object({
    currentPassword: z.string().min(1, CHANGE_PASSWORD_MESSAGES.currentMissing).max(1000),
    newPassword: z.string().min(1, CHANGE_PASSWORD_MESSAGES.newMissing).max(1000),
    confirmPassword: z.string().min(1, CHANGE_PASSWORD_MESSAGES.confirmMissing).max(1000),
  })
  .refine((v) => v.newPassword === v.confirmPassword, { path: ["confirmPassword"], message: CHANGE_PASSWORD_MESSAGES.differ })
  .refine((v) => new TextEncoder().encode(v.newPassword).length <= PASSWORD_MAX_BYTES, {
    path: ["newPassword"],
    message: `Use at most ${PASSWORD_MAX_BYTES} bytes.`,
  });
export type ChangePasswordInput = z.infer<typeof changePasswordSchema>;
