/**
 * Restores a backup made by scripts/backup.ts into a data folder:
 *   npx tsx scripts/restore.ts <backupDir> [--to <dataDir>] [--force] [--put-blobs]
 * Default target: data/. A non-empty target is refused unless --force, which moves its contents
 * to <dataDir>.pre-restore-<timestamp>/ first (stop the app before restoring over its folder).
 * Then start the app with FLUEWARD_DB_FILE=<dataDir>/flueward.sqlite FLUEWARD_UPLOADS_DIR=<dataDir>/uploads.
 * With --put-blobs and STORAGE_DRIVER=s3, every restored photo and record PDF is also put into the
 * bucket (S3_BUCKET…), for an app that keeps its blobs there.
 */
import path from "node:path";
import { POSTGRES_MESSAGE, putRestoredBlobs, restoreBackup, usesPostgres } from "../lib/ops/backup";
import { createS3Storage, s3OptionsFromEnv } from "../lib/storage/s3";

async function main(): Promise<number> {
  const args = process.argv.slice(2);
  const toIndex = args.indexOf("--to");
  const to = toIndex === -1 ? undefined : args[toIndex + 1];
  const positional = args.filter((a, i) => !a.startsWith("--") && (toIndex === -1 || i !== toIndex + 1));
  if (args.includes("--help") || args.includes("-h") || positional.length !== 1 || (toIndex !== -1 && (!to || to.startsWith("--")))) {
    console.log("usage: tsx scripts/restore.ts <backupDir> [--to <dataDir>] [--force] [--put-blobs]");
    return args.includes("--help") || args.includes("-h") ? 0 : 2;
  }
  if (usesPostgres()) {
    console.error(POSTGRES_MESSAGE);
    return 2;
  }
  const putBlobs = args.includes("--put-blobs");
  if (putBlobs && (process.env.STORAGE_DRIVER ?? "disk").toLowerCase() !== "s3") {
    console.error("[restore] --put-blobs puts the blobs into the S3 bucket: set STORAGE_DRIVER=s3 and S3_BUCKET (and its endpoint and keys).");
    return 2;
  }
  const bucket = putBlobs ? s3OptionsFromEnv(process.env) : null;
  const dataDir = to ?? path.join(process.cwd(), "data");
  const result = await restoreBackup({ backupDir: positional[0]!, dataDir, force: args.includes("--force") });
  if (result.movedAside) console.log(`[restore] the folder's earlier contents are in ${result.movedAside}`);
  console.log(`[restore] database ${result.dbFile}: integrity_check ${result.integrityCheck}`);
  console.log(`[restore] ${result.filesRestored} files in ${result.uploadsDir}`);
  console.log(`[restore] ${result.blobCheck.photosChecked} photo rows and ${result.blobCheck.recordsChecked} record rows checked against their files, ${result.blobCheck.problems.length} problems`);
  for (const problem of result.blobCheck.problems.slice(0, 20)) console.error(`[restore] problem: ${problem}`);
  const ok = result.integrityCheck === "ok" && result.blobCheck.problems.length === 0;
  if (!ok) return 1;
  if (bucket) {
    const pushed = await putRestoredBlobs({ dbFile: result.dbFile, uploadsDir: result.uploadsDir, storage: createS3Storage(bucket) });
    console.log(`[restore] ${pushed.put} blobs put into s3://${bucket.bucket}, ${pushed.problems.length} problems`);
    for (const problem of pushed.problems.slice(0, 20)) console.error(`[restore] problem: ${problem}`);
    if (pushed.problems.length > 0) return 1;
    console.log(`[restore] start the app with FLUEWARD_DB_FILE=${result.dbFile} STORAGE_DRIVER=s3 S3_BUCKET=${bucket.bucket}`);
    return 0;
  }
  console.log(`[restore] start the app with FLUEWARD_DB_FILE=${result.dbFile} FLUEWARD_UPLOADS_DIR=${result.uploadsDir}`);
  return 0;
}

main().then(
  (code) => process.exit(code),
  (error: unknown) => {
    console.error(`[restore] failed: ${error instanceof Error ? error.message : String(error)}`);
    process.exit(1);
  },
);
