/**
 * Photo limits, messages and helpers without any validation code, shared by the uploader in the browser and the handlers on
 * the server (the request schemas in ./photo build on them) so both give the same answer with the same words.
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
