import { apiRoute, json, parseQuery } from "@/lib/api/handler";
import { AppError } from "@/lib/errors";
import { verifyByCode, verifyUpload } from "@/lib/data/records";
import { verifyCodeSchema } from "@/lib/schemas/record";
import { readUploadedFile } from "@/lib/records/read-pdf-upload";

/** Public: is the record with this code genuine and current? */
export const GET = apiRoute(async (request) => {
  const { code } = parseQuery(request, verifyCodeSchema);
  return json({ result: await verifyByCode(code) });
});

/** Public: does this PDF file match a stored record (and the given code, when there is one)? */
export const POST = apiRoute(async (request) => {
  const { bytes, code } = await readUploadedFile(request);
  if (bytes.byteLength === 0) throw new AppError("validation_failed", undefined, { fields: { file: "Choose the PDF file to check." } });
  return json(await verifyUpload({ bytes, code: code || undefined }));
});
