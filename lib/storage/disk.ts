import crypto from "node:crypto";
import fs from "node:fs/promises";
import path from "node:path";
import type { BlobStorage } from "./index";
import { assertValidBlobKey } from "./keys";

/** Temp files start with a dot, which no valid key can, so a half-written file is never served. */
export const TEMP_PREFIX = ".tmp-";

function isNotFound(error: unknown): boolean {
  return (error as NodeJS.ErrnoException | null)?.code === "ENOENT";
}

/**
 * Files under one root folder. A write goes to a temp file in the target folder, is fsynced,
 * then renamed over the final name (atomic on one file system), and the folder is fsynced so
 * the rename itself survives a power cut.
 */
export function createDiskStorage(options: { rootDir: string }): BlobStorage & { readonly rootDir: string; resolve(key: string): string } {
  const rootDir = path.resolve(options.rootDir);

  function resolve(key: string): string {
    assertValidBlobKey(key);
    const full = path.resolve(rootDir, ...key.split("/"));
    // The key pattern already rules out "..": this is the second lock on the same door.
    const relative = path.relative(rootDir, full);
    if (!relative || relative.startsWith("..") || path.isAbsolute(relative)) throw new Error("Storage key escapes the uploads folder.");
    return full;
  }

  async function fsyncDir(dir: string): Promise<void> {
    let handle: fs.FileHandle | undefined;
    try {
      handle = await fs.open(dir, "r");
      await handle.sync();
    } catch {
      // Some file systems refuse to fsync a directory; the rename is still atomic there.
    } finally {
      await handle?.close();
    }
  }

  return {
    driver: "disk",
    rootDir,
    resolve,
    async put(key, bytes) {
      const target = resolve(key);
      const dir = path.dirname(target);
      await fs.mkdir(dir, { recursive: true });
      const temp = path.join(dir, `${TEMP_PREFIX}${crypto.randomBytes(8).toString("hex")}`);
      let handle: fs.FileHandle | undefined;
      try {
        handle = await fs.open(temp, "wx", 0o640);
        await handle.writeFile(bytes);
        await handle.sync();
        await handle.close();
        handle = undefined;
        await fs.rename(temp, target);
      } catch (error) {
        await handle?.close().catch(() => undefined);
        await fs.rm(temp, { force: true }).catch(() => undefined);
        throw error;
      }
      await fsyncDir(dir);
    },
    async get(key) {
      try {
        return new Uint8Array(await fs.readFile(resolve(key)));
      } catch (error) {
        if (isNotFound(error)) return null;
        throw error;
      }
    },
    async delete(key) {
      try {
        await fs.unlink(resolve(key));
      } catch (error) {
        if (!isNotFound(error)) throw error;
      }
    },
  };
}

/**
 * Removes temp files left by a crash mid-write (older than the given age), returning how many.
 * They are invisible to readers either way; this only reclaims the space.
 */
export async function sweepTempFiles(rootDir: string, olderThanMs = 60 * 60 * 1000): Promise<number> {
  let removed = 0;
  const cutoff = Date.now() - olderThanMs;
  async function walk(dir: string): Promise<void> {
    let entries: import("node:fs").Dirent[];
    try {
      entries = await fs.readdir(dir, { withFileTypes: true });
    } catch (error) {
      if (isNotFound(error)) return;
      throw error;
    }
    for (const entry of entries) {
      const full = path.join(dir, entry.name);
      if (entry.isDirectory()) await walk(full);
      else if (entry.name.startsWith(TEMP_PREFIX)) {
        const stat = await fs.stat(full).catch(() => null);
        if (stat && stat.mtimeMs < cutoff) {
          await fs.rm(full, { force: true });
          removed += 1;
        }
      }
    }
  }
  await walk(path.resolve(rootDir));
  return removed;
}
