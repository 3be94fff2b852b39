/**
 * Online backup of the SQLite database and the uploads folder, safe while the app runs:
 *   npx tsx scripts/backup.ts [--db <file>] [--uploads <dir>] [--out <backups folder>]
 * Defaults: FLUEWARD_DB_FILE or data/flueward.sqlite, FLUEWARD_UPLOADS_DIR or data/uploads,
 * backups/. Writes backups/<timestamp>/{flueward.sqlite, uploads/, manifest.json}. With
 * STORAGE_DRIVER=s3 (and no --uploads), every photo and record PDF the database names is fetched
 * from the bucket into uploads/.
 */
import path from "node:path";
import { POSTGRES_MESSAGE, createBackup, usesPostgres } from "../lib/ops/backup";
import { createS3Storage, s3OptionsFromEnv } from "../lib/storage/s3";

function option(args: string[], name: string): string | undefined {
  const index = args.indexOf(name);
  if (index === -1) return undefined;
  const value = args[index + 1];
  if (!value || value.startsWith("--")) throw new Error(`${name} needs a value.`);
  return value;
}

async function main(): Promise<number> {
  const args = process.argv.slice(2);
  if (args.includes("--help") || args.includes("-h")) {
    console.log("usage: tsx scripts/backup.ts [--db <file>] [--uploads <dir>] [--out <backups folder>]");
    return 0;
  }
  if (usesPostgres()) {
    console.error(POSTGRES_MESSAGE);
    return 2;
  }
  const cwd = process.cwd();
  const dbFile = option(args, "--db") ?? process.env.FLUEWARD_DB_FILE ?? path.join(cwd, "data", "flueward.sqlite");
  const driver = (process.env.STORAGE_DRIVER ?? "disk").toLowerCase();
  const uploadsDir = option(args, "--uploads") ?? (driver === "disk" ? (process.env.FLUEWARD_UPLOADS_DIR ?? path.join(cwd, "data", "uploads")) : null);
  let blobSource: { storage: ReturnType<typeof createS3Storage>; description: string } | undefined;
  if (!uploadsDir) {
    if (driver !== "s3") throw new Error(`STORAGE_DRIVER=${driver} keeps no blobs a backup can read: use disk or s3.`);
    const s3 = s3OptionsFromEnv(process.env);
    blobSource = { storage: createS3Storage(s3), description: `s3://${s3.bucket}` };
    console.log(`[backup] fetching every photo and record PDF the database names from ${blobSource.description}`);
  }
  const backupsRoot = option(args, "--out") ?? path.join(cwd, "backups");

  const { dir, manifest } = await createBackup({ dbFile, uploadsDir, blobSource, backupsRoot });
  const mb = (bytes: number) => `${(bytes / 1_000_000).toFixed(2)} MB`;
  console.log(`[backup] ${dir}`);
  console.log(`[backup] database ${mb(manifest.database.bytes)}, sha256 ${manifest.database.sha256}, integrity_check ${manifest.database.integrityCheck}`);
  console.log(`[backup] uploads ${manifest.uploads.fileCount} files, ${mb(manifest.uploads.bytes)} (${manifest.uploads.skippedTempFiles} temp files skipped)`);
  console.log(`[backup] ${manifest.blobCheck.photosChecked} photo rows and ${manifest.blobCheck.recordsChecked} record rows checked against their files, ${manifest.blobCheck.problems.length} problems; ${manifest.durationMs} ms`);
  for (const problem of manifest.blobCheck.problems.slice(0, 20)) console.error(`[backup] problem: ${problem}`);
  return manifest.database.integrityCheck === "ok" && manifest.blobCheck.problems.length === 0 ? 0 : 1;
}

main().then(
  (code) => process.exit(code),
  (error: unknown) => {
    console.error(`[backup] failed: ${error instanceof Error ? error.message : String(error)}`);
    process.exit(1);
  },
);
