import { z } from "zod";
import { idSchema } from "./common";
import { inspectionDataSchema } from "@/lib/inspections/data";
import { signatureSchema } from "@/lib/schemas/signature";
import { INSPECTION_QUEUE_SORTS, REVIEW_SECTIONS } from "./inspection-values";

export { INSPECTION_QUEUE_SORTS, REVIEW_SECTIONS, REVIEW_SECTION_LABELS, type ReviewSection } from "./inspection-values";

export const inspectionCreateSchema = z.object({
  /** Copy the appliances of this earlier inspection of the same job. */
  copyAppliancesFrom: idSchema.optional(),
});

export const draftSaveSchema = z.object({
  version: z.number({ error: "The draft's version is missing; reload the page." }).int().positive(),
  data: inspectionDataSchema,
});
export type DraftSaveInput = z.input<typeof draftSaveSchema>;

export const repinSchema = z.object({ rulebookVersionId: idSchema });

export const submitSchema = z.object({
  version: z.number().int().positive(),
  signature: signatureSchema,
});

export const commentSchema = z.object({
  section: z.enum(REVIEW_SECTIONS, { error: "Choose the section the comment is about." }),
  body: z.string().trim().min(1, "Write the comment.").max(2000, "Keep the comment under 2,000 characters."),
});

export const returnSchema = z.object({
  comments: z.array(commentSchema).min(1, "Add at least one comment saying what the installer must fix.").max(30),
});

export const approveSchema = z.object({
  signature: signatureSchema,
  password: z.string().min(1, "Enter your password to confirm the approval.").max(1000),
});

export const inspectionListQuerySchema = z.object({
  status: z.enum(["submitted", "returned", "draft", "approved", "all"], { error: "The status must be one of submitted, returned, draft, approved or all." }).default("submitted"),
  q: z.string().trim().max(100, "Search for at most 100 characters.").default(""),
  sort: z.enum(INSPECTION_QUEUE_SORTS, { error: `The sort must be one of ${INSPECTION_QUEUE_SORTS.join(", ")}.` }).default("submitted_asc"),
  page: z.coerce.number({ error: "The page must be a whole number from 1." }).int("The page must be a whole number from 1.").min(1, "The page must be a whole number from 1.").max(100_000, "The page can be at most 100,000.").default(1),
  pageSize: z.coerce.number({ error: "The page size must be a whole number from 1 to 100." }).int("The page size must be a whole number from 1 to 100.").min(1, "The page size must be a whole number from 1 to 100.").max(100, "The page size must be a whole number from 1 to 100.").default(20),
});
export type InspectionListQuery = z.output<typeof inspectionListQuerySchema>;
