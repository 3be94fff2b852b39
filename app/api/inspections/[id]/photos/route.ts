import { apiRoute, json, parseParams, parseWith } from "@/lib/api/handler";
import { requireMember } from "@/lib/auth/session";
import { assertEditable, getInspectionAccess } from "@/lib/data/inspection-access";
import { addPhoto, listPhotos } from "@/lib/data/photos";
import { processPhoto } from "@/lib/photos/process";
import { readPhotoUpload } from "@/lib/photos/read-upload";
import { idParamsSchema } from "@/lib/schemas/common";
import { photoUploadFieldsSchema } from "@/lib/schemas/photo";

export const runtime = "nodejs";

/** The inspection's photos; any member of its company may list them. */
export const GET = apiRoute<{ id: string }>(async (_request, context) => {
  const member = await requireMember();
  const { id } = await parseParams(context, idParamsSchema);
  await getInspectionAccess({ companyId: member.companyId, inspectionId: id });
  return json({ photos: await listPhotos({ companyId: member.companyId, inspectionId: id }) });
});

/** One photo per request (multipart: `file`, optional caption, tag, segmentId, siteCheckKey). */
export const POST = apiRoute<{ id: string }>(async (request, context) => {
  const member = await requireMember();
  const { id } = await parseParams(context, idParamsSchema);
  const access = await getInspectionAccess({ companyId: member.companyId, inspectionId: id });
  assertEditable(access, member);
  const { file, fields } = await readPhotoUpload(request);
  const values = parseWith(photoUploadFieldsSchema, fields, "Some photo details need fixing.");
  const processed = await processPhoto(new Uint8Array(await file.arrayBuffer()));
  const photo = await addPhoto({
    companyId: member.companyId,
    inspectionId: id,
    actor: { userId: member.userId, name: member.name },
    processed,
    values,
  });
  return json({ photo }, { status: 201 });
});
