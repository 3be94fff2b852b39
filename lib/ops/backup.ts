import crypto from "node:crypto";
import fs from "node:fs";
import fsp from "node:fs/promises";
import path from "node:path";
import Database from "better-sqlite3";
import { TEMP_PREFIX } from "../storage/disk";
import { isValidBlobKey } from "../storage/keys";

/**
 * Online backup and restore of an SQLite installation: the database file and its blobs (photos
 * and record PDFs), copied from the disk driver's uploads folder, or fetched one by one from any
 * other storage (an S3 bucket) for every blob the database snapshot names. Used by
 * scripts/backup.ts and scripts/restore.ts, and by the tests. Plain Node (no Next, no Knex), so it
 * runs from tsx beside a live server.
 *
 * A backup folder holds `flueward.sqlite` (a self-contained copy in rollback-journal mode),
 * `uploads/` (the blob files) and `manifest.json`. It is written under a dot-name and renamed
 * into place at the end, so a folder without the dot is always complete.
 */

export const BACKUP_DB_NAME = "flueward.sqlite";
export const BACKUP_UPLOADS_NAME = "uploads";
export const MANIFEST_NAME = "manifest.json";
export const MANIFEST_FORMAT = 1;

export interface BackupFileEntry {
  /** Path under uploads/, always with forward slashes (the blob key). */
  path: string;
  bytes: number;
  sha256: string;
}

export interface BlobCheck {
  photosChecked: number;
  recordsChecked: number;
  /** One line per missing, unreadable or mismatched blob; empty when every reference holds. */
  problems: string[];
}

export interface BackupManifest {
  format: typeof MANIFEST_FORMAT;
  createdAt: string;
  durationMs: number;
  database: {
    file: typeof BACKUP_DB_NAME;
    source: string;
    bytes: number;
    sha256: string;
    integrityCheck: string;
    rowCounts: Record<string, number>;
  };
  uploads: {
    dir: typeof BACKUP_UPLOADS_NAME;
    source: string | null;
    fileCount: number;
    bytes: number;
    skippedTempFiles: number;
    files: BackupFileEntry[];
  };
  blobCheck: BlobCheck;
}

/** What the backup needs of a storage driver (lib/storage's BlobStorage has it). */
export interface BlobReader {
  get(key: string): Promise<Uint8Array | null>;
}
/** What pushing a restore into a bucket needs of a storage driver. */
export interface BlobWriter {
  put(key: string, bytes: Uint8Array, contentType: string): Promise<void>;
}

/** One blob a database row names, and what its file must be to count as intact. */
export interface ReferencedBlob {
  key: string;
  /** The row, for messages: "photo 3", "photo 3 thumbnail", "record 1". */
  what: string;
  kind: "photo" | "thumbnail" | "record";
  contentType: string;
  /** The row's sha256 and size of the bytes, where the row keeps them (not for thumbnails). */
  expected: { sha256: string; bytes: number } | null;
}

/**
 * Every blob the database's rows name (photos, their thumbnails, record PDFs), row by row in a
 * stable order: the one list the blob check, the S3 backup and the bucket restore all read. A key
 * appears once per row that names it (a correction shares its photos' files).
 */
export function referencedBlobs(db: Database.Database): ReferencedBlob[] {
  const tables = new Set(listTables(db));
  const blobs: ReferencedBlob[] = [];
  if (tables.has("photos")) {
    for (const row of db.prepare("select id, storage_key, thumb_key, content_type, sha256, bytes from photos order by id").iterate() as Iterable<{ id: number; storage_key: string; thumb_key: string; content_type: string; sha256: string; bytes: number }>) {
      blobs.push({ key: row.storage_key, what: `photo ${row.id}`, kind: "photo", contentType: row.content_type, expected: { sha256: row.sha256, bytes: row.bytes } });
      blobs.push({ key: row.thumb_key, what: `photo ${row.id} thumbnail`, kind: "thumbnail", contentType: row.content_type, expected: null });
    }
  }
  if (tables.has("records")) {
    for (const row of db.prepare("select id, pdf_key, sha256, pdf_bytes from records order by id").iterate() as Iterable<{ id: number; pdf_key: string; sha256: string; pdf_bytes: number }>) {
      blobs.push({ key: row.pdf_key, what: `record ${row.id}`, kind: "record", contentType: "application/pdf", expected: { sha256: row.sha256, bytes: row.pdf_bytes } });
    }
  }
  return blobs;
}

/** Each key of the list once, for copying: rows that share a file need it copied only once. */
function distinctKeys(blobs: readonly ReferencedBlob[]): ReferencedBlob[] {
  const seen = new Set<string>();
  return blobs.filter((blob) => !seen.has(blob.key) && Boolean(seen.add(blob.key)));
}

export function sha256OfBytes(bytes: Uint8Array): string {
  return crypto.createHash("sha256").update(bytes).digest("hex");
}

export async function sha256OfFile(file: string): Promise<string> {
  const hash = crypto.createHash("sha256");
  for await (const chunk of fs.createReadStream(file)) hash.update(chunk as Buffer);
  return hash.digest("hex");
}

/** A folder name that sorts by time and is safe on every file system: 2026-12-01T09-30-00-123Z. */
export function backupStamp(date = new Date()): string {
  return date.toISOString().replace(/[:.]/g, "-");
}

/** `PRAGMA integrity_check` of a database file: "ok", or the problems it lists joined by "; ". */
export function integrityCheck(dbFile: string): string {
  const db = new Database(dbFile, { readonly: true, fileMustExist: true });
  try {
    const rows = db.pragma("integrity_check") as { integrity_check: string }[];
    return rows.map((r) => r.integrity_check).join("; ");
  } finally {
    db.close();
  }
}

/** The user tables of a database, sorted (SQLite's own and none of knex's lock table). */
export function listTables(db: Database.Database): string[] {
  const rows = db.prepare("select name from sqlite_master where type = 'table' and name not like 'sqlite_%' order by name").all() as { name: string }[];
  return rows.map((r) => r.name);
}

function rowCounts(db: Database.Database): Record<string, number> {
  return Object.fromEntries(listTables(db).map((t) => [t, (db.prepare(`select count(*) as n from "${t.replace(/"/g, '""')}"`).get() as { n: number }).n]));
}

/** The uploads file of a blob key, or null when the key is not one the server could have made. */
export function blobPath(uploadsDir: string, key: string): string | null {
  return isValidBlobKey(key) ? path.join(uploadsDir, ...key.split("/")) : null;
}

/**
 * Checks every blob the database points at: each photo's image and thumbnail exist (and the
 * image's bytes match the row's sha256), and each record's PDF exists with the row's sha256.
 * A temp file can never be referenced: keys cannot start with a dot.
 */
export function checkBlobReferences(db: Database.Database, uploadsDir: string): BlobCheck {
  const problems: string[] = [];
  let photosChecked = 0;
  let recordsChecked = 0;
  for (const blob of referencedBlobs(db)) {
    if (blob.kind === "photo") photosChecked += 1;
    if (blob.kind === "record") recordsChecked += 1;
    const file = blobPath(uploadsDir, blob.key);
    if (!file) {
      problems.push(`${blob.what}: key ${JSON.stringify(blob.key)} is not a valid blob key`);
      continue;
    }
    let bytes: Buffer;
    try {
      bytes = fs.readFileSync(file);
    } catch {
      problems.push(`${blob.what}: blob ${blob.key} is missing`);
      continue;
    }
    if (blob.kind === "thumbnail" && bytes.byteLength === 0) problems.push(`${blob.what.replace(/ thumbnail$/, "")}: thumbnail ${blob.key} is empty`);
    if (blob.expected && (sha256OfBytes(bytes) !== blob.expected.sha256 || bytes.byteLength !== blob.expected.bytes)) {
      problems.push(`${blob.what}: ${blob.kind === "record" ? "PDF" : "blob"} ${blob.key} does not match the row's sha256 or size`);
    }
  }
  return { photosChecked, recordsChecked, problems };
}

async function fsyncPath(target: string): Promise<void> {
  let handle: fsp.FileHandle | undefined;
  try {
    handle = await fsp.open(target, "r");
    await handle.sync();
  } catch {
    // Some file systems refuse to fsync a directory; the data itself was synced.
  } finally {
    await handle?.close();
  }
}

/** Copies every blob file (not the disk driver's temp files) and lists it with its hash. */
async function copyUploads(sourceDir: string, targetDir: string): Promise<{ files: BackupFileEntry[]; skippedTempFiles: number }> {
  const files: BackupFileEntry[] = [];
  let skippedTempFiles = 0;
  async function walk(relative: string): Promise<void> {
    let entries: fs.Dirent[];
    try {
      entries = await fsp.readdir(path.join(sourceDir, relative), { withFileTypes: true });
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code === "ENOENT") return;
      throw error;
    }
    entries.sort((a, b) => a.name.localeCompare(b.name));
    for (const entry of entries) {
      const rel = relative ? `${relative}/${entry.name}` : entry.name;
      if (entry.name.startsWith(TEMP_PREFIX)) {
        skippedTempFiles += 1;
        continue;
      }
      if (entry.isDirectory()) {
        await fsp.mkdir(path.join(targetDir, rel), { recursive: true });
        await walk(rel);
      } else if (entry.isFile()) {
        const from = path.join(sourceDir, rel);
        const to = path.join(targetDir, rel);
        // Blobs are written once under a fresh key, so a plain copy is a consistent one.
        await fsp.copyFile(from, to, fs.constants.COPYFILE_EXCL);
        const bytes = await fsp.readFile(to);
        files.push({ path: rel, bytes: bytes.byteLength, sha256: sha256OfBytes(bytes) });
      }
    }
  }
  await fsp.mkdir(targetDir, { recursive: true });
  await walk("");
  return { files, skippedTempFiles };
}

/**
 * Fetches every blob the snapshot names from the storage into the backup's uploads/ folder. A blob
 * the storage does not have is left out; the blob check that follows reports it.
 */
async function copyReferencedBlobs(snapshot: Database.Database, storage: BlobReader, targetDir: string): Promise<{ files: BackupFileEntry[]; skippedTempFiles: number }> {
  const files: BackupFileEntry[] = [];
  await fsp.mkdir(targetDir, { recursive: true });
  for (const { key } of distinctKeys(referencedBlobs(snapshot))) {
    const file = blobPath(targetDir, key);
    if (!file) continue; // reported by the blob check
    const bytes = await storage.get(key);
    if (!bytes) continue;
    await fsp.mkdir(path.dirname(file), { recursive: true });
    await fsp.writeFile(file, bytes, { flag: "wx" });
    files.push({ path: key, bytes: bytes.byteLength, sha256: sha256OfBytes(bytes) });
  }
  files.sort((a, b) => a.path.localeCompare(b.path));
  return { files, skippedTempFiles: 0 };
}

/**
 * Puts every restored blob file into a storage (the bucket the restored app will use), under its
 * key and with the content type its row gives. Blobs are written once under fresh keys, so putting
 * one that is already there writes the same bytes.
 */
export async function putRestoredBlobs(options: { dbFile: string; uploadsDir: string; storage: BlobWriter }): Promise<{ put: number; problems: string[] }> {
  const db = new Database(options.dbFile, { readonly: true, fileMustExist: true });
  let put = 0;
  const problems: string[] = [];
  try {
    for (const { key, what, contentType } of distinctKeys(referencedBlobs(db))) {
      const file = blobPath(options.uploadsDir, key);
      if (!file || !fs.existsSync(file)) {
        problems.push(`${what}: blob ${key} is not in the restored uploads`);
        continue;
      }
      await options.storage.put(key, new Uint8Array(await fsp.readFile(file)), contentType);
      put += 1;
    }
  } finally {
    db.close();
  }
  return { put, problems };
}

export interface CreateBackupOptions {
  /** The live SQLite file. */
  dbFile: string;
  /** The disk driver's uploads folder; null when blobs live elsewhere (S3). */
  uploadsDir: string | null;
  /**
   * Where blobs live when `uploadsDir` is null (the S3 driver): every blob the snapshot names is
   * fetched from it into the backup's uploads/. Without either, no blob is copied.
   */
  blobSource?: { storage: BlobReader; description: string };
  /** The folder under which `<timestamp>/` is created (e.g. backups/). */
  backupsRoot: string;
  now?: Date;
}

/**
 * Takes an online backup while the app may be writing. The database is copied first, in one
 * step of SQLite's backup API (a consistent snapshot under a read lock, which writers in WAL mode
 * do not wait for); the uploads are copied after it. Since the app stores a blob before it commits
 * the row that names it, every blob the snapshot references already exists when the copy runs.
 */
export async function createBackup(options: CreateBackupOptions): Promise<{ dir: string; manifest: BackupManifest }> {
  const started = Date.now();
  const now = options.now ?? new Date();
  const sourceDb = path.resolve(options.dbFile);
  if (!fs.existsSync(sourceDb)) throw new Error(`No database file at ${sourceDb}.`);
  const root = path.resolve(options.backupsRoot);
  await fsp.mkdir(root, { recursive: true });
  const stamp = backupStamp(now);
  const finalDir = path.join(root, stamp);
  if (fs.existsSync(finalDir)) throw new Error(`A backup named ${stamp} already exists in ${root}.`);
  const workDir = path.join(root, `.partial-${stamp}-${process.pid}`);
  await fsp.rm(workDir, { recursive: true, force: true });
  await fsp.mkdir(workDir, { recursive: true });
  try {
    const copyFile = path.join(workDir, BACKUP_DB_NAME);
    const source = new Database(sourceDb, { fileMustExist: true });
    try {
      source.pragma("busy_timeout = 5000");
      // All pages in one step: a copy that restarts on every concurrent write might never end.
      await source.backup(copyFile, { progress: () => 0x7fffffff });
    } finally {
      source.close();
    }

    const copy = new Database(copyFile);
    let integrity: string;
    let counts: Record<string, number>;
    try {
      // A standalone file: no -wal beside it to lose when the folder is moved or archived.
      copy.pragma("journal_mode = DELETE");
      integrity = (copy.pragma("integrity_check") as { integrity_check: string }[]).map((r) => r.integrity_check).join("; ");
      counts = rowCounts(copy);
    } finally {
      copy.close();
    }
    await fsyncPath(copyFile);

    const uploadsTarget = path.join(workDir, BACKUP_UPLOADS_NAME);
    const checkDb = new Database(copyFile, { readonly: true, fileMustExist: true });
    let uploads: { files: BackupFileEntry[]; skippedTempFiles: number };
    let blobCheck: BlobCheck;
    try {
      if (options.uploadsDir) uploads = await copyUploads(path.resolve(options.uploadsDir), uploadsTarget);
      else if (options.blobSource) uploads = await copyReferencedBlobs(checkDb, options.blobSource.storage, uploadsTarget);
      else {
        uploads = { files: [], skippedTempFiles: 0 };
        await fsp.mkdir(uploadsTarget, { recursive: true });
      }
      blobCheck = options.uploadsDir || options.blobSource ? checkBlobReferences(checkDb, uploadsTarget) : { photosChecked: 0, recordsChecked: 0, problems: [] };
    } finally {
      checkDb.close();
    }

    const manifest: BackupManifest = {
      format: MANIFEST_FORMAT,
      createdAt: now.toISOString(),
      durationMs: Date.now() - started,
      database: {
        file: BACKUP_DB_NAME,
        source: sourceDb,
        bytes: fs.statSync(copyFile).size,
        sha256: await sha256OfFile(copyFile),
        integrityCheck: integrity,
        rowCounts: counts,
      },
      uploads: {
        dir: BACKUP_UPLOADS_NAME,
        source: options.uploadsDir ? path.resolve(options.uploadsDir) : (options.blobSource?.description ?? null),
        fileCount: uploads.files.length,
        bytes: uploads.files.reduce((sum, f) => sum + f.bytes, 0),
        skippedTempFiles: uploads.skippedTempFiles,
        files: uploads.files,
      },
      blobCheck,
    };
    const manifestFile = path.join(workDir, MANIFEST_NAME);
    await fsp.writeFile(manifestFile, `${JSON.stringify(manifest, null, 2)}\n`);
    await fsyncPath(manifestFile);
    await fsyncPath(workDir);
    await fsp.rename(workDir, finalDir);
    await fsyncPath(root);
    return { dir: finalDir, manifest };
  } catch (error) {
    await fsp.rm(workDir, { recursive: true, force: true }).catch(() => undefined);
    throw error;
  }
}

export function readManifest(backupDir: string): BackupManifest {
  const file = path.join(backupDir, MANIFEST_NAME);
  if (!fs.existsSync(file)) throw new Error(`${backupDir} is not a backup folder: it has no ${MANIFEST_NAME}.`);
  const manifest = JSON.parse(fs.readFileSync(file, "utf8")) as BackupManifest;
  if (manifest.format !== MANIFEST_FORMAT) throw new Error(`Unknown backup format ${String(manifest.format)} in ${file}.`);
  return manifest;
}

export interface RestoreResult {
  dataDir: string;
  dbFile: string;
  uploadsDir: string;
  integrityCheck: string;
  filesRestored: number;
  blobCheck: BlobCheck;
  /** Where the target's earlier contents were moved with --force, or null. */
  movedAside: string | null;
}

function isNonEmptyDir(dir: string): boolean {
  return fs.existsSync(dir) && fs.readdirSync(dir).length > 0;
}

/**
 * Restores a backup into a data folder (`<dataDir>/flueward.sqlite` and `<dataDir>/uploads/`).
 * Refuses a non-empty folder unless `force`; then its contents are moved aside, never deleted.
 * Checks the copy's hash against the manifest before, and integrity and every blob after.
 * Stop the app before restoring over the folder it serves.
 */
export async function restoreBackup(options: { backupDir: string; dataDir: string; force?: boolean; now?: Date }): Promise<RestoreResult> {
  const backupDir = path.resolve(options.backupDir);
  const dataDir = path.resolve(options.dataDir);
  const manifest = readManifest(backupDir);
  const sourceDb = path.join(backupDir, BACKUP_DB_NAME);
  const sha = await sha256OfFile(sourceDb);
  if (sha !== manifest.database.sha256) throw new Error(`The backup's database does not match its manifest (sha256 ${sha}, manifest ${manifest.database.sha256}). Use another backup.`);
  for (const entry of manifest.uploads.files) {
    const file = path.join(backupDir, BACKUP_UPLOADS_NAME, ...entry.path.split("/"));
    const actual = fs.existsSync(file) ? await sha256OfFile(file) : "missing";
    if (actual !== entry.sha256) throw new Error(`The backup's file uploads/${entry.path} is ${actual === "missing" ? "missing" : "changed"}. Use another backup.`);
  }

  let movedAside: string | null = null;
  if (isNonEmptyDir(dataDir)) {
    if (!options.force) throw new Error(`${dataDir} is not empty. Restore into a fresh folder (--to <dir>), or pass --force to move its contents aside first.`);
    movedAside = `${dataDir}.pre-restore-${backupStamp(options.now)}`;
    await fsp.rename(dataDir, movedAside);
  }
  await fsp.mkdir(dataDir, { recursive: true });

  const dbFile = path.join(dataDir, BACKUP_DB_NAME);
  const temp = path.join(dataDir, `${TEMP_PREFIX}${crypto.randomBytes(6).toString("hex")}.sqlite`);
  await fsp.copyFile(sourceDb, temp, fs.constants.COPYFILE_EXCL);
  await fsyncPath(temp);
  await fsp.rename(temp, dbFile);

  const uploadsDir = path.join(dataDir, BACKUP_UPLOADS_NAME);
  const copied = await copyUploads(path.join(backupDir, BACKUP_UPLOADS_NAME), uploadsDir);
  await fsyncPath(dataDir);

  const integrity = integrityCheck(dbFile);
  const db = new Database(dbFile, { readonly: true, fileMustExist: true });
  let blobCheck: BlobCheck;
  try {
    blobCheck = checkBlobReferences(db, uploadsDir);
  } finally {
    db.close();
  }
  return { dataDir, dbFile, uploadsDir, integrityCheck: integrity, filesRestored: copied.files.length, blobCheck, movedAside };
}

/** True when DATABASE_URL selects PostgreSQL, which these tools do not back up. */
export function usesPostgres(env: Record<string, string | undefined> = process.env): boolean {
  return Boolean(env.DATABASE_URL && /^postgres(ql)?:\/\//.test(env.DATABASE_URL));
}

export const POSTGRES_MESSAGE =
  "DATABASE_URL selects PostgreSQL: this command backs up the embedded SQLite database only.\n" +
  "Back up PostgreSQL with its own tools, e.g.\n" +
  '  pg_dump --format=custom --file=flueward-$(date +%F).dump "$DATABASE_URL"\n' +
  'and restore with pg_restore --clean --dbname="$DATABASE_URL" flueward-YYYY-MM-DD.dump.\n' +
  "Photos and records in an S3 bucket are kept by the bucket (turn on versioning); a disk uploads folder can be copied as it is (blobs are written once).";
