import { z } from "zod";
import { SITE_CHECK_ANSWERS, SITE_CHECK_APPLIES_TO } from "@/lib/site-checks";
import { idSchema } from "./common";

const label = z
  .string({ error: "Write what the installer confirms." })
  .trim()
  .min(3, "Write what the installer confirms (at least 3 characters).")
  .max(300, "Keep the item to 300 characters or fewer.");
const help = z.string({ error: "The help text must be text." }).trim().max(1000, "Keep the help text to 1000 characters or fewer.");
const appliesTo = z.enum(SITE_CHECK_APPLIES_TO, { error: "Choose which jobs the item applies to." });

/** Adding an item to the company's list (the admin form and POST /api/site-checks). */
export const siteCheckItemCreateSchema = z.object({
  label,
  help: help.default(""),
  appliesTo: appliesTo.default("all"),
});
export type SiteCheckItemCreateInput = z.input<typeof siteCheckItemCreateSchema>;
export type SiteCheckItemCreateData = z.output<typeof siteCheckItemCreateSchema>;

/** Editing one item (inline edit on the admin screen and PATCH /api/site-checks/:id). */
export const siteCheckItemUpdateSchema = z
  .object({
    label: label.optional(),
    help: help.optional(),
    appliesTo: appliesTo.optional(),
    active: z.boolean({ error: "Active must be true or false." }).optional(),
    sortOrder: z.number({ error: "The position must be a number." }).int("The position must be a whole number.").min(0).max(100_000).optional(),
  })
  .refine((v) => Object.values(v).some((value) => value !== undefined), { message: "Send at least one field to change." });
export type SiteCheckItemUpdateInput = z.infer<typeof siteCheckItemUpdateSchema>;

/** The inline edit form: the editable text of one item. */
export const siteCheckItemEditSchema = z.object({ label, help, appliesTo });
export type SiteCheckItemEditInput = z.input<typeof siteCheckItemEditSchema>;

/** The whole list's new order (PUT /api/site-checks/order): every item id of the company, once. */
export const siteCheckReorderSchema = z.object({
  ids: z
    .array(idSchema, { error: "Send the item ids in their new order." })
    .min(1, "Send the item ids in their new order.")
    .max(500, "The list is too long.")
    .refine((ids) => new Set(ids).size === ids.length, { message: "Each item may appear only once." }),
});
export type SiteCheckReorderInput = z.infer<typeof siteCheckReorderSchema>;

export const siteCheckListQuerySchema = z.object({
  includeInactive: z.enum(["0", "1", "true", "false"]).optional(),
});

/** The installer's answers in an inspection: item key → answer and note. */
export const siteCheckAnswersSchema = z.record(
  z.string().regex(/^[a-z0-9_]{1,100}$/, "Unknown site-check item."),
  z.object({
    answer: z.enum(SITE_CHECK_ANSWERS, { error: "Answer yes, no or not applicable." }).nullable(),
    note: z.string().trim().max(2000, "Keep the note to 2000 characters or fewer.").default(""),
  }),
);
export type SiteCheckAnswersInput = z.input<typeof siteCheckAnswersSchema>;
