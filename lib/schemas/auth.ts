import { z } from "zod";
import { emailSchema } from "./common";
import { PASSWORD_MAX_BYTES } from "@/lib/auth/password-policy";

export const signInSchema = z.object({
  email: emailSchema,
  password: z.string({ error: "Enter your password." }).min(1, "Enter your password.").max(1000, "That password is too long."),
});
export type SignInInput = z.infer<typeof signInSchema>;

export const changePasswordSchema = z
  .object({
    currentPassword: z.string().min(1, "Enter your current password.").max(1000),
    newPassword: z.string().min(1, "Enter a new password.").max(1000),
    confirmPassword: z.string().min(1, "Repeat the new password.").max(1000),
  })
  .refine((v) => v.newPassword === v.confirmPassword, { path: ["confirmPassword"], message: "The two new passwords differ." })
  .refine((v) => new TextEncoder().encode(v.newPassword).length <= PASSWORD_MAX_BYTES, {
    path: ["newPassword"],
    message: `Use at most ${PASSWORD_MAX_BYTES} bytes.`,
  });
export type ChangePasswordInput = z.infer<typeof changePasswordSchema>;
