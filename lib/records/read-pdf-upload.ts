import "server-only";
import { AppError } from "@/lib/errors";

export const MAX_VERIFY_UPLOAD_BYTES = 25 * 1024 * 1024;

/** Reads a multipart upload of one PDF (and an optional code), refusing oversize bodies before parsing. */
export async function readUploadedFile(request: Request): Promise<{ bytes: Uint8Array; code: string }> {
  const declared = Number(request.headers.get("content-length") ?? "0");
  if (declared > MAX_VERIFY_UPLOAD_BYTES) throw new AppError("payload_too_large", "The file is larger than 25 MB; a Flueward record is much smaller.");
  const type = request.headers.get("content-type") ?? "";
  if (!type.toLowerCase().startsWith("multipart/form-data")) throw new AppError("unsupported_media_type", "Upload the PDF as a file (multipart form).");
  const reader = request.body?.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  if (reader) {
    for (;;) {
      const { done, value } = await reader.read();
      if (done) break;
      total += value.byteLength;
      if (total > MAX_VERIFY_UPLOAD_BYTES) {
        await reader.cancel();
        throw new AppError("payload_too_large", "The file is larger than 25 MB; a Flueward record is much smaller.");
      }
      chunks.push(value);
    }
  }
  let form: FormData;
  try {
    form = await new Response(new Blob(chunks as BlobPart[]), { headers: { "content-type": type } }).formData();
  } catch {
    throw new AppError("bad_request", "The upload could not be read. Choose the file again.");
  }
  const file = form.get("file");
  const code = String(form.get("code") ?? "").trim().slice(0, 40);
  if (!(file instanceof File)) throw new AppError("validation_failed", undefined, { fields: { file: "Choose the PDF file to check." } });
  return { bytes: new Uint8Array(await file.arrayBuffer()), code };
}
