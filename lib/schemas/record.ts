import { z } from "zod";
import { emailSchema } from "./common";

export const shareLinkCreateSchema = z.object({
  audience: z.enum(["homeowner", "inspector"], { error: "Choose who the link is for: homeowner or inspector." }),
  expiresInDays: z.number({ error: "Choose how many days the link stays open." }).int().min(1, "A link stays open at least 1 day.").max(90, "A link stays open at most 90 days."),
  label: z.string().trim().max(200, "Keep the label under 200 characters.").default(""),
});

export const recordRevokeSchema = z.object({
  reason: z.string().trim().min(5, "Say why the record is revoked (at least 5 characters).").max(300, "Keep the reason under 300 characters."),
});

export const recordEmailSchema = z.object({
  to: emailSchema,
  audience: z.enum(["homeowner", "inspector"]).default("homeowner"),
  expiresInDays: z.number().int().min(1).max(90).default(30),
  attachPdf: z.boolean().default(false),
  /** One key per press of "Send": the same key twice sends one e-mail. */
  idempotencyKey: z.string().trim().min(8, "The request key is missing; reload the page.").max(100),
});

export const verifyCodeSchema = z.object({
  code: z.string().trim().min(4, "Enter the verification code printed on the record.").max(40, "That code is too long; it looks like K7QM-2XDP-9HRA."),
});
