import "server-only";
import sharp from "sharp";
import { AppError } from "@/lib/errors";
import { SIGNATURE_MESSAGES, SIGNATURE_PNG_MAX_CHARS, SIGNATURE_PNG_PREFIX } from "@/lib/schemas/signature";

const PNG_MAGIC = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
const BASE64 = /^[A-Za-z0-9+/]+={0,2}$/;
/** Guards against a tiny file that claims to be a huge image. */
const MAX_PIXELS = 4096 * 2048;

export type SignaturePngCheck =
  | { ok: true; png: Buffer; width: number; height: number }
  | { ok: false; message: string };

/**
 * Checks a drawn signature by its content: a PNG data URL within the size limit, real PNG bytes
 * that decode, and not blank (some pixel visible, and not one uniform colour).
 */
export async function checkSignaturePng(dataUrl: string): Promise<SignaturePngCheck> {
  if (!dataUrl.startsWith(SIGNATURE_PNG_PREFIX)) return { ok: false, message: SIGNATURE_MESSAGES.drawn };
  if (dataUrl.length > SIGNATURE_PNG_MAX_CHARS) return { ok: false, message: SIGNATURE_MESSAGES.tooLarge };
  const base64 = dataUrl.slice(SIGNATURE_PNG_PREFIX.length);
  if (base64.length === 0 || base64.length % 4 !== 0 || !BASE64.test(base64)) return { ok: false, message: SIGNATURE_MESSAGES.unreadable };
  const png = Buffer.from(base64, "base64");
  if (png.length < PNG_MAGIC.length || !png.subarray(0, PNG_MAGIC.length).equals(PNG_MAGIC)) return { ok: false, message: SIGNATURE_MESSAGES.unreadable };
  try {
    const image = sharp(png, { limitInputPixels: MAX_PIXELS, failOn: "error" });
    const meta = await image.metadata();
    if (meta.format !== "png" || !meta.width || !meta.height) return { ok: false, message: SIGNATURE_MESSAGES.unreadable };
    const stats = await image.stats();
    const alpha = meta.hasAlpha ? stats.channels[stats.channels.length - 1] : undefined;
    const invisible = alpha !== undefined && alpha.max === 0;
    const uniform = stats.channels.every((c) => c.min === c.max);
    if (invisible || uniform) return { ok: false, message: SIGNATURE_MESSAGES.blank };
    return { ok: true, png, width: meta.width, height: meta.height };
  } catch {
    return { ok: false, message: SIGNATURE_MESSAGES.unreadable };
  }
}

/**
 * For route handlers: refuses a signature that is not a real, non-blank PNG with
 * `validation_failed`, the message under `field` (by default `signature.signaturePng`).
 */
export async function assertDrawnSignature(dataUrl: string, field = "signature.signaturePng"): Promise<void> {
  const result = await checkSignaturePng(dataUrl);
  if (!result.ok) throw new AppError("validation_failed", result.message, { fields: { [field]: result.message } });
}
