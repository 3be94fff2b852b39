import crypto from "node:crypto";
import sharp, { type Metadata } from "sharp";
import { fileTypeFromBuffer } from "file-type";
import { AppError, type ErrorCode } from "@/lib/errors";
import { MAX_PHOTO_BYTES, MAX_PHOTO_MEGAPIXELS, PHOTO_MESSAGES } from "@/lib/schemas/photo";

/**
 * The upload pipeline: decide by content (never by name or declared type) whether the bytes
 * are a photo, then decode and re-encode them as a plain JPEG. Re-encoding is the safety
 * property: whatever rode along in the original (EXIF with GPS, scripts in a polyglot file,
 * odd colour profiles) does not survive, and what we store and serve is always image/jpeg.
 */
export const MAX_INPUT_PIXELS = MAX_PHOTO_MEGAPIXELS * 1_000_000;
export const LONG_EDGE_PX = 2000;
export const THUMB_LONG_EDGE_PX = 320;
export const JPEG_QUALITY = 82;
export const THUMB_JPEG_QUALITY = 76;
export const OUTPUT_CONTENT_TYPE = "image/jpeg";

const ACCEPTED_MIME = new Set(["image/jpeg", "image/png", "image/webp", "image/heic", "image/heif", "image/heic-sequence", "image/heif-sequence"]);
const HEIF_MIME = new Set(["image/heic", "image/heif", "image/heic-sequence", "image/heif-sequence"]);

export type PhotoRejection = "empty" | "too_large" | "not_a_photo" | "heic_unsupported" | "too_many_pixels" | "unreadable";

const REJECTION_CODE = {
  empty: "unprocessable",
  too_large: "payload_too_large",
  not_a_photo: "unsupported_media_type",
  heic_unsupported: "unsupported_media_type",
  too_many_pixels: "payload_too_large",
  unreadable: "unprocessable",
} as const satisfies Record<PhotoRejection, ErrorCode>;

/** An upload refused for what it is; its message is written for the person who chose the file. */
export class PhotoRejectedError extends AppError {
  readonly reason: PhotoRejection;
  constructor(reason: PhotoRejection, message: string) {
    super(REJECTION_CODE[reason], message, { fields: { file: message } });
    this.name = "PhotoRejectedError";
    this.reason = reason;
  }
}

export interface ProcessedPhoto {
  /** The re-encoded JPEG: upright, at most LONG_EDGE_PX on its long edge, no metadata. */
  bytes: Uint8Array;
  /** A JPEG at most THUMB_LONG_EDGE_PX on its long edge. */
  thumbBytes: Uint8Array;
  width: number;
  height: number;
  /** Hex SHA-256 of `bytes`, the stored photo. */
  sha256: string;
  contentType: typeof OUTPUT_CONTENT_TYPE;
  /** What the upload was, by its content (e.g. image/png). */
  sourceType: string;
}

/**
 * Checks and re-encodes one uploaded photo. Throws PhotoRejectedError (an AppError carrying
 * the status and a clear message) for anything that is not a readable photo within the limits.
 */
export async function processPhoto(input: Uint8Array): Promise<ProcessedPhoto> {
  if (input.byteLength === 0) throw new PhotoRejectedError("empty", PHOTO_MESSAGES.empty);
  if (input.byteLength > MAX_PHOTO_BYTES) throw new PhotoRejectedError("too_large", PHOTO_MESSAGES.tooLarge(input.byteLength));
  const buffer = Buffer.from(input.buffer, input.byteOffset, input.byteLength);

  const detected = await fileTypeFromBuffer(buffer);
  if (!detected || !ACCEPTED_MIME.has(detected.mime)) throw new PhotoRejectedError("not_a_photo", PHOTO_MESSAGES.notAPhoto);
  const isHeif = HEIF_MIME.has(detected.mime);

  // The header alone gives the size, so an oversized image is refused before any decoding.
  let header: Metadata;
  try {
    header = await sharp(buffer, { limitInputPixels: false }).metadata();
  } catch {
    throw isHeif ? new PhotoRejectedError("heic_unsupported", PHOTO_MESSAGES.heicUnsupported) : new PhotoRejectedError("unreadable", PHOTO_MESSAGES.unreadable);
  }
  if (header.width && header.height && header.width * header.height > MAX_INPUT_PIXELS) {
    throw new PhotoRejectedError("too_many_pixels", PHOTO_MESSAGES.tooManyPixels((header.width * header.height) / 1_000_000));
  }

  try {
    // failOn "error" refuses truncated and corrupt pixel data but lets through the harmless
    // warnings many phone cameras produce. limitInputPixels holds even if the header lied.
    const main = await sharp(buffer, { limitInputPixels: MAX_INPUT_PIXELS, failOn: "error", pages: 1 })
      .rotate()
      .resize({ width: LONG_EDGE_PX, height: LONG_EDGE_PX, fit: "inside", withoutEnlargement: true })
      .flatten({ background: "#ffffff" })
      .jpeg({ quality: JPEG_QUALITY, mozjpeg: true })
      .toBuffer({ resolveWithObject: true });
    const thumb = await sharp(main.data)
      .resize({ width: THUMB_LONG_EDGE_PX, height: THUMB_LONG_EDGE_PX, fit: "inside", withoutEnlargement: true })
      .jpeg({ quality: THUMB_JPEG_QUALITY, mozjpeg: true })
      .toBuffer();
    return {
      bytes: new Uint8Array(main.data),
      thumbBytes: new Uint8Array(thumb),
      width: main.info.width,
      height: main.info.height,
      sha256: crypto.createHash("sha256").update(main.data).digest("hex"),
      contentType: OUTPUT_CONTENT_TYPE,
      sourceType: detected.mime,
    };
  } catch (error) {
    const message = error instanceof Error ? error.message : "";
    if (/pixel limit/i.test(message)) throw new PhotoRejectedError("too_many_pixels", PHOTO_MESSAGES.tooManyPixels(null));
    if (isHeif) throw new PhotoRejectedError("heic_unsupported", PHOTO_MESSAGES.heicUnsupported);
    throw new PhotoRejectedError("unreadable", PHOTO_MESSAGES.unreadable);
  }
}
