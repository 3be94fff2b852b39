import { apiRoute, json, parseJsonBody, parseParams, parseQuery } from "@/lib/api/handler";
import { requireMember } from "@/lib/auth/session";
import { assertEditable, getInspectionAccess } from "@/lib/data/inspection-access";
import { deletePhoto, getPhoto, readPhotoBytes, updatePhoto } from "@/lib/data/photos";
import { idParamsSchema } from "@/lib/schemas/common";
import { photoImageQuerySchema, photoUpdateSchema } from "@/lib/schemas/photo";

export const runtime = "nodejs";

/**
 * The image itself. Always served as the JPEG we re-encoded, with headers that stop a browser
 * from sniffing it into anything else or running anything inside it.
 */
export const GET = apiRoute<{ id: string }>(async (request, context) => {
  const member = await requireMember();
  const { id } = await parseParams(context, idParamsSchema);
  const { size } = parseQuery(request, photoImageQuerySchema);
  const photo = await getPhoto({ companyId: member.companyId, photoId: id });
  await getInspectionAccess({ companyId: member.companyId, inspectionId: photo.inspectionId });
  const etag = `"${photo.sha256}${size === "thumb" ? "-t" : ""}"`;
  const headers: Record<string, string> = {
    "Content-Type": "image/jpeg",
    "X-Content-Type-Options": "nosniff",
    "Content-Disposition": `inline; filename="photo-${photo.id}${size === "thumb" ? "-thumb" : ""}.jpg"`,
    "Content-Security-Policy": "default-src 'none'; sandbox",
    "Cache-Control": "private, max-age=3600",
    "Cross-Origin-Resource-Policy": "same-origin",
    ETag: etag,
  };
  if (request.headers.get("if-none-match") === etag) return new Response(null, { status: 304, headers });
  const { bytes } = await readPhotoBytes({ companyId: member.companyId, photoId: id, size });
  return new Response(new Blob([bytes as Uint8Array<ArrayBuffer>]), { status: 200, headers: { ...headers, "Content-Length": String(bytes.byteLength) } });
});

/** Caption, tag or attachment; only while the inspection is editable by the caller. */
export const PATCH = apiRoute<{ id: string }>(async (request, context) => {
  const member = await requireMember();
  const { id } = await parseParams(context, idParamsSchema);
  const current = await getPhoto({ companyId: member.companyId, photoId: id });
  const access = await getInspectionAccess({ companyId: member.companyId, inspectionId: current.inspectionId });
  assertEditable(access, member);
  const values = await parseJsonBody(request, photoUpdateSchema);
  const photo = await updatePhoto({ companyId: member.companyId, photoId: id, actor: { userId: member.userId, name: member.name }, values });
  return json({ photo });
});

/** Removes the photo from the inspection (kept in storage and in the audit trail). */
export const DELETE = apiRoute<{ id: string }>(async (_request, context) => {
  const member = await requireMember();
  const { id } = await parseParams(context, idParamsSchema);
  const current = await getPhoto({ companyId: member.companyId, photoId: id });
  const access = await getInspectionAccess({ companyId: member.companyId, inspectionId: current.inspectionId });
  assertEditable(access, member);
  await deletePhoto({ companyId: member.companyId, photoId: id, actor: { userId: member.userId, name: member.name } });
  return new Response(null, { status: 204, headers: { "Cache-Control": "no-store" } });
});
