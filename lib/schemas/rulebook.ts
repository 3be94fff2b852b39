import { z } from "zod";
import { rulebookContentSchema } from "@/lib/venting";
import { idSchema } from "./common";

const name = z.string({ error: "Enter a name for the rulebook." }).trim().min(1, "Enter a name for the rulebook.").max(200, "The name can be at most 200 characters.");
const description = z.string().trim().max(1000, "The description can be at most 1,000 characters.").default("");

/** Create a rulebook, either from full content or as a copy of another rulebook's latest version. */
export const rulebookCreateSchema = z
  .object({
    name,
    description,
    copyFromRulebookId: idSchema.optional(),
    content: z.unknown().optional(),
  })
  .refine((v) => v.copyFromRulebookId !== undefined || v.content !== undefined, {
    message: "Send either copyFromRulebookId or content.",
    path: ["content"],
  });
export type RulebookCreateInput = z.input<typeof rulebookCreateSchema>;

export const rulebookUpdateSchema = z
  .object({
    name: name.optional(),
    description: z.string().trim().max(1000, "The description can be at most 1,000 characters.").optional(),
    status: z.enum(["active", "archived"], { error: "Status is active or archived." }).optional(),
    makeDefault: z.literal(true).optional(),
  })
  .refine((v) => Object.values(v).some((x) => x !== undefined), { message: "Send at least one field to change." });
export type RulebookUpdateInput = z.input<typeof rulebookUpdateSchema>;

/** A new version: the whole content, the version it was edited from, and a note on what changed. */
export const rulebookVersionCreateSchema = z.object({
  baseVersionNumber: z.number({ error: "Send the version you edited (baseVersionNumber)." }).int().positive(),
  changeNote: z.string().trim().min(1, "Say briefly what changed and why (e.g. 'Clearance for single-wall per adopted 2021 edition').").max(500, "Keep the note under 500 characters."),
  content: z.unknown(),
});
export type RulebookVersionCreateInput = z.input<typeof rulebookVersionCreateSchema>;

export const rulebookVersionParamsSchema = z.object({ id: idSchema, version: idSchema });

export { rulebookContentSchema };
