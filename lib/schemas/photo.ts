import { z } from "zod";
import { MAX_CAPTION_LENGTH, PHOTO_MESSAGES, PHOTO_TAGS } from "./photo-values";

/**
 * Photo request schemas for the handlers on the server; the limits and messages they use live in
 * ./photo-values, which the uploader in the browser imports, so both give the same answer with the
 * same words.
 */
export {
  MAX_CAPTION_LENGTH,
  MAX_PHOTO_BYTES,
  MAX_PHOTO_MEGAPIXELS,
  MAX_PHOTO_REQUEST_BYTES,
  PHOTO_MESSAGES,
  PHOTO_TAGS,
  PHOTO_TAG_LABELS,
  attachmentValue,
  formatMegabytes,
  parseAttachmentValue,
  photoUrls,
  type PhotoJson,
  type PhotoTag,
} from "./photo-values";


const emptyToUndefined = (value: unknown) => (value === "" || value === null ? undefined : value);
const emptyToNull = (value: unknown) => (value === "" ? null : value);

export const photoCaptionSchema = z.string({ error: "Enter the caption as text." }).trim().max(MAX_CAPTION_LENGTH, PHOTO_MESSAGES.captionTooLong);
export const photoTagSchema = z.enum(PHOTO_TAGS, { error: "Choose before, after or no tag." });
/** A segment id or site-check key as the inspection editor names them (e.g. `seg-1`, `joints_fastened`). */
export const attachmentKeySchema = z
  .string({ error: PHOTO_MESSAGES.badAttachment })
  .trim()
  .regex(/^[A-Za-z0-9][A-Za-z0-9_.:-]{0,99}$/, PHOTO_MESSAGES.badAttachment);

function notBoth(value: { segmentId?: string | null; siteCheckKey?: string | null }): boolean {
  return !(value.segmentId && value.siteCheckKey);
}

/** The text fields that travel with an uploaded file (multipart form fields, all optional). */
export const photoUploadFieldsSchema = z
  .object({
    caption: z.preprocess(emptyToUndefined, photoCaptionSchema.default("")),
    tag: z.preprocess(emptyToUndefined, photoTagSchema.default("none")),
    segmentId: z.preprocess(emptyToUndefined, attachmentKeySchema.optional()).transform((v) => v ?? null),
    siteCheckKey: z.preprocess(emptyToUndefined, attachmentKeySchema.optional()).transform((v) => v ?? null),
  })
  .refine(notBoth, { message: PHOTO_MESSAGES.bothAttachments, path: ["siteCheckKey"] });
export type PhotoUploadFields = z.infer<typeof photoUploadFieldsSchema>;

/**
 * PATCH body: any of caption, tag and attachment. Setting one attachment clears the other;
 * null (or "") detaches.
 */
export const photoUpdateSchema = z
  .object({
    caption: photoCaptionSchema.optional(),
    tag: photoTagSchema.optional(),
    segmentId: z.preprocess(emptyToNull, attachmentKeySchema.nullable()).optional(),
    siteCheckKey: z.preprocess(emptyToNull, attachmentKeySchema.nullable()).optional(),
  })
  .strict()
  .refine(notBoth, { message: PHOTO_MESSAGES.bothAttachments, path: ["siteCheckKey"] })
  .refine((v) => Object.values(v).some((x) => x !== undefined), { message: "Send a caption, tag or attachment to change.", path: ["_"] });
export type PhotoUpdateValues = z.infer<typeof photoUpdateSchema>;

export const photoImageQuerySchema = z.object({ size: z.enum(["full", "thumb"], { error: "size is full or thumb." }).default("full") });
