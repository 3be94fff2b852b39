import { z } from "zod";
import { ROLES } from "@/lib/auth/roles";
import { emailSchema } from "./common";

export const memberCreateSchema = z.object({
  name: z.string({ error: "Enter the member's name." }).trim().min(1, "Enter the member's name.").max(200, "The name can be at most 200 characters."),
  email: emailSchema,
  role: z.enum(ROLES, { error: "Choose a role." }),
});
export type MemberCreateInput = z.input<typeof memberCreateSchema>;

export const memberUpdateSchema = z
  .object({
    role: z.enum(ROLES, { error: "Choose a role." }).optional(),
    active: z.boolean({ error: "Active must be true or false." }).optional(),
  })
  .refine((v) => v.role !== undefined || v.active !== undefined, { message: "Send a role or an active flag to change." });
export type MemberUpdateInput = z.infer<typeof memberUpdateSchema>;
