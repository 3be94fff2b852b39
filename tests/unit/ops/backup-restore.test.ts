import crypto from "node:crypto";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import Database from "better-sqlite3";
import type { Knex } from "knex";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { createTestDatabase } from "../../fixtures/test-db";
import { buildInspectionWorld, exampleInspectionData } from "../../fixtures/inspection-world";
import { signaturePng } from "../../e2e/support/signature";
import { inspectionDataSchema } from "@/lib/inspections/data";
import { findingKey, submissionBlockers } from "@/lib/inspections/evaluate";
import { BACKUP_DB_NAME, checkBlobReferences, createBackup, listTables, putRestoredBlobs, readManifest, referencedBlobs, restoreBackup, type ReferencedBlob } from "@/lib/ops/backup";
import { createS3Storage } from "@/lib/storage/s3";
import { fakeS3Client } from "../../fixtures/fake-s3";
import { TEMP_PREFIX } from "@/lib/storage/disk";

type Inspections = typeof import("@/lib/data/inspections");
type Photos = typeof import("@/lib/data/photos");

const sha = (bytes: Uint8Array) => crypto.createHash("sha256").update(bytes).digest("hex");

function filesUnder(dir: string): string[] {
  if (!fs.existsSync(dir)) return [];
  return fs
    .readdirSync(dir, { recursive: true, withFileTypes: true })
    .filter((e) => e.isFile())
    .map((e) => path.relative(dir, path.join(e.parentPath, e.name)).split(path.sep).join("/"))
    .sort();
}

function allRows(file: string): Record<string, unknown[]> {
  const db = new Database(file, { readonly: true, fileMustExist: true });
  try {
    return Object.fromEntries(listTables(db).map((t) => [t, db.prepare(`select * from "${t}" order by rowid`).all()]));
  } finally {
    db.close();
  }
}

let db: Knex;
let dbFile: string;
let cleanup: () => Promise<void>;
let work: string;
let uploadsDir: string;
let inspections: Inspections;
let photos: Photos;
let world: Awaited<ReturnType<typeof buildInspectionWorld>>;
let approvedId: number;

beforeAll(async () => {
  const t = await createTestDatabase();
  db = t.db;
  dbFile = t.file;
  cleanup = t.cleanup;
  work = fs.mkdtempSync(path.join(os.tmpdir(), "flueward-backup-"));
  uploadsDir = path.join(path.dirname(t.file), "uploads");
  process.env.FLUEWARD_DB_FILE = t.file;
  process.env.FLUEWARD_UPLOADS_DIR = uploadsDir;
  process.env.STORAGE_DRIVER = "disk";
  inspections = await import("@/lib/data/inspections");
  photos = await import("@/lib/data/photos");
  const { processPhoto } = await import("@/lib/photos/process");
  world = await buildInspectionWorld(db);
  const signature = await signaturePng();
  const jpeg = new Uint8Array(fs.readFileSync(path.join(process.cwd(), "tests/fixtures/photos/flue-collar.jpg")));
  const processed = await processPhoto(jpeg);
  const { installer, supervisor } = world.a;

  // One inspection goes all the way to an approved record (a PDF with two photos in it)…
  const { id } = await inspections.createInspection({ member: installer, jobId: world.a.jobId });
  const data = inspectionDataSchema.parse(exampleInspectionData());
  let saved = await inspections.saveDraft({ member: installer, id, version: 1, data });
  const justifications = Object.fromEntries(
    submissionBlockers(saved.findings, {}).map((f) => [findingKey(f), { text: "Allowed by the manufacturer's instructions, page 12.", reference: "p. 12" }]),
  );
  saved = await inspections.saveDraft({ member: installer, id, version: saved.version, data: { ...data, justifications } });
  for (const caption of ["Flue collar", "Draft hood"]) {
    await photos.addPhoto({ companyId: world.a.companyId, inspectionId: id, actor: { userId: installer.userId, name: installer.name }, processed, values: { caption, tag: "none", segmentId: null, siteCheckKey: null } });
  }
  await inspections.submitInspection({ member: installer, id, version: saved.version, typedName: "Installer One", signaturePng: signature });
  await inspections.approveInspection({ member: supervisor, id, typedName: "Supervisor One", signaturePng: signature, baseUrl: "http://flueward.test" });
  approvedId = id;

  // …another company's draft has a photo of its own.
  const other = await inspections.createInspection({ member: world.b.installer, jobId: world.b.jobId });
  await photos.addPhoto({ companyId: world.b.companyId, inspectionId: other.id, actor: { userId: world.b.installer.userId, name: world.b.installer.name }, processed, values: { caption: "Vent cap", tag: "none", segmentId: null, siteCheckKey: null } });

  // A crash mid-write leaves a temp file behind: a backup must not carry it.
  fs.writeFileSync(path.join(uploadsDir, "photos", `${TEMP_PREFIX}deadbeef`), "half a photo");
}, 60_000);

afterAll(async () => {
  const { getDb } = await import("@/db/knex");
  await getDb().destroy();
  await cleanup();
  fs.rmSync(work, { recursive: true, force: true });
});

/**
 * A stand-in for the live bucket of an S3 install: it holds the blobs the disk driver holds here,
 * under the same keys — those `keep` accepts.
 */
async function liveBucketHolding(keep: (blob: ReferencedBlob) => boolean) {
  const live = fakeS3Client();
  const liveBucket = createS3Storage({ bucket: "live-bucket", region: "us-east-1", client: live.client });
  const snapshotDb = new Database(dbFile, { readonly: true });
  const named = referencedBlobs(snapshotDb);
  snapshotDb.close();
  for (const blob of named.filter(keep)) await liveBucket.put(blob.key, new Uint8Array(fs.readFileSync(path.join(uploadsDir, blob.key))), blob.contentType);
  return { live, liveBucket, named };
}

describe("backup and restore", () => {
  test("a backup taken while the app's connection is open restores every row, photo and record intact", async () => {
    const record = await db("records").where({ inspection_id: approvedId }).first();
    expect(record).toBeTruthy();
    const { getDb } = await import("@/db/knex");
    await getDb().raw("select 1"); // the app's own connection stays open through the backup

    const { dir, manifest } = await createBackup({ dbFile, uploadsDir, backupsRoot: path.join(work, "backups") });
    expect(path.basename(dir)).toMatch(/^\d{4}-\d{2}-\d{2}T/);
    expect(manifest.database.integrityCheck).toBe("ok");
    expect(manifest.database.sha256).toBe(sha(fs.readFileSync(path.join(dir, BACKUP_DB_NAME))));
    expect(manifest.database.rowCounts.records).toBe(1);
    expect(manifest.database.rowCounts.photos).toBe(3);
    expect(manifest.uploads.skippedTempFiles).toBe(1);
    expect(manifest.uploads.fileCount).toBe(3 * 2 + 1); // each photo and its thumbnail, and the PDF
    expect(manifest.blobCheck).toEqual({ photosChecked: 3, recordsChecked: 1, problems: [] });
    expect(readManifest(dir)).toEqual(manifest);

    const target = path.join(work, "restored");
    const result = await restoreBackup({ backupDir: dir, dataDir: target });
    expect(result.integrityCheck).toBe("ok");
    expect(result.blobCheck.problems).toEqual([]);

    // Every table's rows are identical.
    const before = allRows(dbFile);
    const after = allRows(result.dbFile);
    expect(Object.keys(after)).toEqual(Object.keys(before));
    for (const table of Object.keys(before)) expect({ table, rows: after[table] }).toEqual({ table, rows: before[table] });

    // Every blob is there with the same bytes, and no temp file came along.
    const sourceFiles = filesUnder(uploadsDir).filter((f) => !path.basename(f).startsWith(TEMP_PREFIX));
    expect(filesUnder(result.uploadsDir)).toEqual(sourceFiles);
    for (const file of sourceFiles) expect(sha(fs.readFileSync(path.join(result.uploadsDir, file)))).toBe(sha(fs.readFileSync(path.join(uploadsDir, file))));

    // Every stored record PDF and photo still verifies against its row's hash.
    const restored = new Database(result.dbFile, { readonly: true });
    try {
      const records = restored.prepare("select pdf_key, sha256, pdf_bytes from records").all() as { pdf_key: string; sha256: string; pdf_bytes: number }[];
      expect(records).toHaveLength(1);
      for (const r of records) {
        const bytes = fs.readFileSync(path.join(result.uploadsDir, r.pdf_key));
        expect(bytes.subarray(0, 5).toString()).toBe("%PDF-");
        expect(bytes.byteLength).toBe(r.pdf_bytes);
        expect(sha(bytes)).toBe(r.sha256);
      }
      const photoRows = restored.prepare("select storage_key, thumb_key, sha256 from photos").all() as { storage_key: string; thumb_key: string; sha256: string }[];
      for (const p of photoRows) {
        expect(sha(fs.readFileSync(path.join(result.uploadsDir, p.storage_key)))).toBe(p.sha256);
        expect(fs.existsSync(path.join(result.uploadsDir, p.thumb_key))).toBe(true);
      }
    } finally {
      restored.close();
    }
  });

  test("with the blobs in a bucket, the backup fetches every one the database names, and a restore can put them into a new bucket", async () => {
    const { live, liveBucket, named } = await liveBucketHolding(() => true);
    expect(named).toHaveLength(3 * 2 + 1);

    const { dir, manifest } = await createBackup({ dbFile, uploadsDir: null, blobSource: { storage: liveBucket, description: "s3://live-bucket" }, backupsRoot: path.join(work, "backups-s3") });
    expect(manifest.uploads.source).toBe("s3://live-bucket");
    expect(manifest.uploads.fileCount).toBe(named.length);
    expect(manifest.blobCheck).toEqual({ photosChecked: 3, recordsChecked: 1, problems: [] });
    expect(live.sent.filter((s) => s.startsWith("GetObjectCommand"))).toHaveLength(named.length);

    const result = await restoreBackup({ backupDir: dir, dataDir: path.join(work, "restored-s3") });
    expect(result.blobCheck.problems).toEqual([]);
    const fresh = fakeS3Client();
    const pushed = await putRestoredBlobs({ dbFile: result.dbFile, uploadsDir: result.uploadsDir, storage: createS3Storage({ bucket: "new-bucket", region: "us-east-1", client: fresh.client }) });
    expect(pushed).toEqual({ put: named.length, problems: [] });
    expect([...fresh.objects.keys()].sort()).toEqual(named.map((b) => b.key).sort());
    for (const [key, object] of fresh.objects) {
      expect(sha(object.body)).toBe(sha(live.objects.get(key)!.body));
      expect(object.contentType).toBe(live.objects.get(key)!.contentType);
    }
    expect(fresh.objects.get(named.find((b) => b.what.startsWith("record"))!.key)?.contentType).toBe("application/pdf");
  });

  test("the blob check names a photo, a thumbnail and a PDF whose files were changed", async () => {
    const { dir } = await createBackup({ dbFile, uploadsDir, backupsRoot: path.join(work, "backups-tampered") });
    const result = await restoreBackup({ backupDir: dir, dataDir: path.join(work, "restored-tampered") });
    expect(result.blobCheck.problems).toEqual([]);
    const restored = new Database(result.dbFile, { readonly: true });
    const named = referencedBlobs(restored);
    const photo = named.find((b) => b.kind === "photo")!;
    const thumbnail = named.find((b) => b.kind === "thumbnail" && b.key !== photo.key)!;
    const record = named.find((b) => b.kind === "record")!;
    fs.appendFileSync(path.join(result.uploadsDir, photo.key), "x");
    fs.writeFileSync(path.join(result.uploadsDir, thumbnail.key), "");
    fs.writeFileSync(path.join(result.uploadsDir, record.key), "%PDF-1.7 not the signed one");
    const check = checkBlobReferences(restored, result.uploadsDir);
    restored.close();
    expect(check.problems).toEqual(
      expect.arrayContaining([
        `${photo.what}: blob ${photo.key} does not match the row's sha256 or size`,
        `${thumbnail.what.replace(/ thumbnail$/, "")}: thumbnail ${thumbnail.key} is empty`,
        `${record.what}: PDF ${record.key} does not match the row's sha256 or size`,
      ]),
    );
  });

  test("a blob missing from the bucket is named in the backup's blob check", async () => {
    const { liveBucket, named } = await liveBucketHolding((blob) => !blob.what.startsWith("record"));
    const record = named.find((b) => b.what.startsWith("record"))!;
    const { manifest } = await createBackup({ dbFile, uploadsDir: null, blobSource: { storage: liveBucket, description: "s3://live-bucket" }, backupsRoot: path.join(work, "backups-s3-missing") });
    expect(manifest.uploads.fileCount).toBe(named.length - 1);
    expect(manifest.blobCheck.problems).toEqual([`${record.what}: blob ${record.key} is missing`]);
  });

  test("a restore refuses a non-empty folder, and with force moves its contents aside instead of deleting them", async () => {
    const { dir } = await createBackup({ dbFile, uploadsDir, backupsRoot: path.join(work, "backups-2") });
    const target = path.join(work, "busy");
    fs.mkdirSync(target);
    fs.writeFileSync(path.join(target, "keep.txt"), "mine");
    await expect(restoreBackup({ backupDir: dir, dataDir: target })).rejects.toThrow(/not empty/);
    const result = await restoreBackup({ backupDir: dir, dataDir: target, force: true });
    expect(result.integrityCheck).toBe("ok");
    expect(result.movedAside).not.toBeNull();
    expect(fs.readFileSync(path.join(result.movedAside!, "keep.txt"), "utf8")).toBe("mine");
  });

  test("a damaged backup is refused before anything is written", async () => {
    const { dir } = await createBackup({ dbFile, uploadsDir, backupsRoot: path.join(work, "backups-3") });
    const copy = path.join(dir, BACKUP_DB_NAME);
    const bytes = fs.readFileSync(copy);
    bytes.writeUInt8(bytes.readUInt8(bytes.length - 100) ^ 0xff, bytes.length - 100);
    fs.writeFileSync(copy, bytes);
    const target = path.join(work, "from-damaged");
    await expect(restoreBackup({ backupDir: dir, dataDir: target })).rejects.toThrow(/does not match its manifest/);
    expect(fs.existsSync(target)).toBe(false);
  });

  test("a backup during a burst of autosaves is a consistent snapshot", async () => {
    const { installer } = world.a;
    const { id } = await inspections.createInspection({ member: installer, jobId: world.a.jobId });
    const data = inspectionDataSchema.parse(exampleInspectionData());
    let version = 1;
    const writes = (async () => {
      for (let i = 0; i < 40; i += 1) version = (await inspections.saveDraft({ member: installer, id, version, data: { ...data, notes: `save ${i}` } })).version;
    })();
    const { dir, manifest } = await createBackup({ dbFile, uploadsDir, backupsRoot: path.join(work, "backups-4") });
    await writes;
    expect(manifest.database.integrityCheck).toBe("ok");
    const result = await restoreBackup({ backupDir: dir, dataDir: path.join(work, "burst") });
    expect(result.integrityCheck).toBe("ok");
    const copy = new Database(result.dbFile, { readonly: true });
    try {
      const row = copy.prepare("select version, data_json from inspections where id = ?").get(id) as { version: number; data_json: string } | undefined;
      // Whatever moment it caught, the row is whole: its data is the save its version says.
      if (row && row.version > 1) expect(JSON.parse(row.data_json).notes).toBe(`save ${row.version - 2}`);
    } finally {
      copy.close();
    }
  });
});
