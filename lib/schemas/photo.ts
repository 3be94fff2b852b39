import { z } from "zod";

/**
 * Photo limits and request schemas, shared by the uploader in the browser and the handlers on
 * the server so both give the same answer with the same words.
 */
export const MAX_PHOTO_BYTES = 15 * 1024 * 1024;
/** The multipart body may carry a little more than the file: boundaries and the text fields. */
export const MAX_PHOTO_REQUEST_BYTES = 16 * 1024 * 1024;
export const MAX_PHOTO_MEGAPIXELS = 50;
export const MAX_CAPTION_LENGTH = 300;

export const PHOTO_TAGS = ["before", "after", "none"] as const;
export type PhotoTag = (typeof PHOTO_TAGS)[number];
export const PHOTO_TAG_LABELS = { before: "Before", after: "After", none: "No tag" } as const satisfies Record<PhotoTag, string>;

export function formatMegabytes(bytes: number): string {
  return `${(bytes / (1024 * 1024)).toFixed(1)} MB`;
}

export const PHOTO_MESSAGES = {
  notAPhoto: "That file is not a photo (JPEG, PNG, WebP or HEIC); a renamed text file or PDF is refused.",
  tooLarge: (bytes: number) => `That photo is ${formatMegabytes(bytes)}; the limit is ${MAX_PHOTO_BYTES / (1024 * 1024)} MB per photo.`,
  requestTooLarge: `The upload is larger than ${MAX_PHOTO_REQUEST_BYTES / (1024 * 1024)} MB; send one photo of at most ${MAX_PHOTO_BYTES / (1024 * 1024)} MB per request.`,
  tooManyPixels: (megapixels: number | null) =>
    `${megapixels === null ? "That photo has too many pixels" : `That photo is ${megapixels.toFixed(0)} megapixels`}; the limit is ${MAX_PHOTO_MEGAPIXELS} megapixels. Take it at a lower resolution or shrink it first.`,
  unreadable: "That photo could not be read: the file looks damaged or incomplete. Take or export it again.",
  heicUnsupported:
    "This HEIC photo cannot be read on this server. Set the camera to “Most Compatible” (JPEG) or share the photo as JPEG, then upload it again.",
  empty: "That file is empty.",
  missingFile: "Choose a photo to upload.",
  oneFile: "Send one photo per request.",
  captionTooLong: `Keep the caption to ${MAX_CAPTION_LENGTH} characters or fewer.`,
  bothAttachments: "Attach a photo to a segment or to a site check, not both.",
  badAttachment: "Choose a segment or site check from the list.",
} as const;

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

/** A photo as the API returns it. */
export interface PhotoJson {
  id: number;
  inspectionId: number;
  urls: { full: string; thumb: string };
  caption: string;
  tag: PhotoTag;
  segmentId: string | null;
  siteCheckKey: string | null;
  width: number;
  height: number;
  bytes: number;
  sha256: string;
  createdAt: string;
  createdByName: string | null;
}

export function photoUrls(photoId: number): PhotoJson["urls"] {
  return { full: `/api/photos/${photoId}`, thumb: `/api/photos/${photoId}?size=thumb` };
}

/** The uploader's attach-to select value: `segment:<id>`, `check:<key>` or "" for none. */
export function attachmentValue(photo: { segmentId: string | null; siteCheckKey: string | null }): string {
  if (photo.segmentId) return `segment:${photo.segmentId}`;
  if (photo.siteCheckKey) return `check:${photo.siteCheckKey}`;
  return "";
}

export function parseAttachmentValue(value: string): { segmentId: string | null; siteCheckKey: string | null } {
  if (value.startsWith("segment:")) return { segmentId: value.slice("segment:".length), siteCheckKey: null };
  if (value.startsWith("check:")) return { segmentId: null, siteCheckKey: value.slice("check:".length) };
  return { segmentId: null, siteCheckKey: null };
}
