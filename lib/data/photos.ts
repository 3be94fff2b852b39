import "server-only";
import type { Knex } from "knex";
import { getDb } from "@/db/knex";
import { AppError } from "@/lib/errors";
import type { ProcessedPhoto } from "@/lib/photos/process";
import { photoUrls, type PhotoJson, type PhotoTag, type PhotoUpdateValues, type PhotoUploadFields } from "@/lib/schemas/photo";
import { getStorage, newBlobKey, type BlobStorage } from "@/lib/storage";
import { recordAudit, type AuditActor } from "./audit";
import { nowIso } from "./clock";
import { EDITABLE_STATUSES, type InspectionStatus } from "./inspection-access";

export type Photo = PhotoJson;

const PHOTO_COLUMNS = [
  "p.id",
  "p.inspection_id",
  "p.caption",
  "p.tag",
  "p.segment_id",
  "p.site_check_key",
  "p.width",
  "p.height",
  "p.bytes",
  "p.sha256",
  "p.created_at",
  "u.name as created_by_name",
];

type PhotoRow = Record<string, unknown>;

function toPhoto(row: PhotoRow): Photo {
  const id = row.id as number;
  return {
    id,
    inspectionId: row.inspection_id as number,
    urls: photoUrls(id),
    caption: row.caption as string,
    tag: row.tag as PhotoTag,
    segmentId: (row.segment_id as string | null) ?? null,
    siteCheckKey: (row.site_check_key as string | null) ?? null,
    width: row.width as number,
    height: row.height as number,
    bytes: row.bytes as number,
    sha256: row.sha256 as string,
    createdAt: row.created_at as string,
    createdByName: (row.created_by_name as string | null) ?? null,
  };
}

/** Live (not deleted) photos of the company; storage keys stay inside this module. */
function livePhotos(db: Knex | Knex.Transaction, companyId: number) {
  return db("photos as p").leftJoin("users as u", "u.id", "p.created_by").where("p.company_id", companyId).whereNull("p.deleted_at");
}

function describe(photo: { id: number; caption: string }): string {
  return photo.caption ? `photo '${photo.caption.length > 80 ? `${photo.caption.slice(0, 79)}…` : photo.caption}'` : `photo #${photo.id}`;
}

/**
 * Re-checks, inside the write transaction, that the inspection still takes changes: the caller
 * checked with assertEditable, but a submit could have landed in between.
 */
async function assertStillEditable(trx: Knex.Transaction, companyId: number, inspectionId: number): Promise<void> {
  const row = await trx("inspections").where({ id: inspectionId, company_id: companyId }).first("status");
  if (!row) throw new AppError("not_found", "No such inspection in your company.");
  if (!EDITABLE_STATUSES.includes(row.status as InspectionStatus)) {
    throw new AppError("unprocessable", "This inspection is no longer a draft, so its photos cannot be changed.");
  }
}

/** The inspection's photos, oldest first. */
export async function listPhotos(args: { companyId: number; inspectionId: number }): Promise<Photo[]> {
  const rows = await livePhotos(getDb(), args.companyId).andWhere("p.inspection_id", args.inspectionId).orderBy([{ column: "p.created_at" }, { column: "p.id" }]).select(PHOTO_COLUMNS);
  return rows.map(toPhoto);
}

/** One photo of the company, or not_found (also for another company's or a deleted photo). */
export async function getPhoto(args: { companyId: number; photoId: number }): Promise<Photo> {
  const row = await livePhotos(getDb(), args.companyId).andWhere("p.id", args.photoId).first(PHOTO_COLUMNS);
  if (!row) throw new AppError("not_found", "No such photo in your company.");
  return toPhoto(row);
}

/**
 * The stored JPEG of a photo (or its thumbnail). Used by the image route and by record
 * rendering; the bytes were re-encoded at upload, so they are always image/jpeg.
 */
export async function readPhotoBytes(args: { companyId: number; photoId: number; size?: "full" | "thumb"; storage?: BlobStorage }): Promise<{ photo: Photo; bytes: Uint8Array }> {
  const row = await livePhotos(getDb(), args.companyId).andWhere("p.id", args.photoId).first([...PHOTO_COLUMNS, "p.storage_key", "p.thumb_key"]);
  if (!row) throw new AppError("not_found", "No such photo in your company.");
  const key = (args.size === "thumb" ? row.thumb_key : row.storage_key) as string;
  const bytes = await (args.storage ?? getStorage()).get(key);
  if (!bytes) {
    console.error(`[photos] blob missing for photo ${args.photoId} (${args.size ?? "full"})`);
    throw new AppError("not_found", "The file of this photo is missing.");
  }
  return { photo: toPhoto(row), bytes };
}

/**
 * Stores a processed photo and records it. The bytes are written first, so a row never points
 * at a file that is not there; if the row cannot be written, the files are removed again.
 */
export async function addPhoto(args: {
  companyId: number;
  inspectionId: number;
  actor: AuditActor;
  processed: ProcessedPhoto;
  values: PhotoUploadFields;
  storage?: BlobStorage;
}): Promise<Photo> {
  const storage = args.storage ?? getStorage();
  const prefix = `photos/c${args.companyId}`;
  const storageKey = newBlobKey(prefix, ".jpg");
  const thumbKey = storageKey.replace(/\.jpg$/, "-thumb.jpg");
  await storage.put(storageKey, args.processed.bytes, args.processed.contentType);
  let id: number;
  try {
    await storage.put(thumbKey, args.processed.thumbBytes, args.processed.contentType);
    id = await getDb().transaction(async (trx) => {
      await assertStillEditable(trx, args.companyId, args.inspectionId);
      const [inserted] = await trx("photos")
        .insert({
          company_id: args.companyId,
          inspection_id: args.inspectionId,
          storage_key: storageKey,
          thumb_key: thumbKey,
          content_type: args.processed.contentType,
          width: args.processed.width,
          height: args.processed.height,
          bytes: args.processed.bytes.byteLength,
          sha256: args.processed.sha256,
          caption: args.values.caption,
          tag: args.values.tag,
          segment_id: args.values.segmentId,
          site_check_key: args.values.siteCheckKey,
          created_by: args.actor.userId,
          created_at: nowIso(),
        })
        .returning("id");
      const photoId = typeof inserted === "object" ? (inserted as { id: number }).id : (inserted as number);
      await recordAudit(trx, {
        companyId: args.companyId,
        actor: args.actor,
        action: "photo.added",
        entityType: "inspection",
        entityId: args.inspectionId,
        summary: `Added ${describe({ id: photoId, caption: args.values.caption })}`,
        after: { photoId, ...args.values, width: args.processed.width, height: args.processed.height, sha256: args.processed.sha256 },
      });
      return photoId;
    });
  } catch (error) {
    await Promise.all([storage.delete(storageKey), storage.delete(thumbKey)]).catch((cleanupError) =>
      console.error("[photos] could not remove the files of a photo that was not recorded", cleanupError),
    );
    throw error;
  }
  return getPhoto({ companyId: args.companyId, photoId: id });
}

/** Changes caption, tag or attachment. Setting a segment clears a site check and vice versa. */
export async function updatePhoto(args: { companyId: number; photoId: number; actor: AuditActor; values: PhotoUpdateValues }): Promise<Photo> {
  await getDb().transaction(async (trx) => {
    const row = await livePhotos(trx, args.companyId).andWhere("p.id", args.photoId).first(PHOTO_COLUMNS);
    if (!row) throw new AppError("not_found", "No such photo in your company.");
    const before = toPhoto(row);
    await assertStillEditable(trx, args.companyId, before.inspectionId);

    const next = { caption: before.caption, tag: before.tag, segmentId: before.segmentId, siteCheckKey: before.siteCheckKey };
    const { caption, tag, segmentId, siteCheckKey } = args.values;
    if (caption !== undefined) next.caption = caption;
    if (tag !== undefined) next.tag = tag;
    if (segmentId !== undefined) {
      next.segmentId = segmentId;
      if (segmentId && siteCheckKey === undefined) next.siteCheckKey = null;
    }
    if (siteCheckKey !== undefined) {
      next.siteCheckKey = siteCheckKey;
      if (siteCheckKey && segmentId === undefined) next.segmentId = null;
    }
    const changedKeys = (Object.keys(next) as (keyof typeof next)[]).filter((key) => next[key] !== before[key]);
    if (changedKeys.length === 0) return;

    await trx("photos")
      .where({ id: args.photoId, company_id: args.companyId })
      .update({ caption: next.caption, tag: next.tag, segment_id: next.segmentId, site_check_key: next.siteCheckKey });
    await recordAudit(trx, {
      companyId: args.companyId,
      actor: args.actor,
      action: "photo.updated",
      entityType: "inspection",
      entityId: before.inspectionId,
      summary: `Updated ${changedKeys.join(", ")} of ${describe(next.caption ? { id: before.id, caption: next.caption } : before)}`,
      before: { photoId: before.id, ...Object.fromEntries(changedKeys.map((key) => [key, before[key]])) },
      after: { photoId: before.id, ...Object.fromEntries(changedKeys.map((key) => [key, next[key]])) },
    });
  });
  return getPhoto({ companyId: args.companyId, photoId: args.photoId });
}

/**
 * Hides a photo (soft delete). Its files stay in storage, so the audit trail and any record
 * that already included it keep their evidence.
 */
export async function deletePhoto(args: { companyId: number; photoId: number; actor: AuditActor }): Promise<void> {
  await getDb().transaction(async (trx) => {
    const row = await livePhotos(trx, args.companyId).andWhere("p.id", args.photoId).first(PHOTO_COLUMNS);
    if (!row) throw new AppError("not_found", "No such photo in your company.");
    const photo = toPhoto(row);
    await assertStillEditable(trx, args.companyId, photo.inspectionId);
    await trx("photos").where({ id: args.photoId, company_id: args.companyId }).whereNull("deleted_at").update({ deleted_at: nowIso() });
    await recordAudit(trx, {
      companyId: args.companyId,
      actor: args.actor,
      action: "photo.deleted",
      entityType: "inspection",
      entityId: photo.inspectionId,
      summary: `Deleted ${describe(photo)}`,
      before: { photoId: photo.id, caption: photo.caption, tag: photo.tag, sha256: photo.sha256 },
    });
  });
}
