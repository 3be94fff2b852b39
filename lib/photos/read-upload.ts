import { AppError } from "@/lib/errors";
import { MAX_PHOTO_BYTES, MAX_PHOTO_REQUEST_BYTES, PHOTO_MESSAGES } from "@/lib/schemas/photo";

/**
 * Reads a multipart photo upload without trusting the client about its size: a declared
 * Content-Length over the limit is refused before any byte is read, and the bytes are counted
 * while reading (a chunked body declares nothing). Only then is the form parsed.
 */
export async function readPhotoUpload(request: Request, limitBytes = MAX_PHOTO_REQUEST_BYTES): Promise<{ file: File; fields: Record<string, string> }> {
  const contentType = request.headers.get("content-type") ?? "";
  if (!contentType.toLowerCase().startsWith("multipart/form-data")) {
    throw new AppError("unsupported_media_type", "Send the photo as multipart/form-data with a `file` field.");
  }
  const declared = request.headers.get("content-length");
  if (declared !== null && Number(declared) > limitBytes) throw new AppError("payload_too_large", PHOTO_MESSAGES.requestTooLarge);

  const body = await readCounted(request, limitBytes);
  let form: FormData;
  try {
    form = await new Response(body, { headers: { "content-type": contentType } }).formData();
  } catch {
    throw new AppError("bad_request", "The upload could not be read as a form. Try again.");
  }

  const files = form.getAll("file");
  if (files.length > 1) throw new AppError("validation_failed", PHOTO_MESSAGES.oneFile, { fields: { file: PHOTO_MESSAGES.oneFile } });
  const file = files[0];
  if (!(file instanceof File)) throw new AppError("validation_failed", PHOTO_MESSAGES.missingFile, { fields: { file: PHOTO_MESSAGES.missingFile } });
  if (file.size > MAX_PHOTO_BYTES) throw new AppError("payload_too_large", PHOTO_MESSAGES.tooLarge(file.size), { fields: { file: PHOTO_MESSAGES.tooLarge(file.size) } });

  const fields: Record<string, string> = {};
  for (const [name, value] of form.entries()) {
    if (name !== "file" && typeof value === "string" && !(name in fields)) fields[name] = value;
  }
  return { file, fields };
}

async function readCounted(request: Request, limitBytes: number): Promise<Uint8Array<ArrayBuffer>> {
  if (!request.body) return new Uint8Array(0);
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > limitBytes) {
      await reader.cancel().catch(() => undefined);
      throw new AppError("payload_too_large", PHOTO_MESSAGES.requestTooLarge);
    }
    chunks.push(value);
  }
  const out = new Uint8Array(total);
  let offset = 0;
  for (const chunk of chunks) {
    out.set(chunk, offset);
    offset += chunk.byteLength;
  }
  return out;
}
