import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterEach, beforeEach, describe, expect, test } from "vitest";
import { createDiskStorage, sweepTempFiles, TEMP_PREFIX } from "@/lib/storage/disk";
import { createStorageFromEnv, defaultUploadsDir, isValidBlobKey, newBlobKey } from "@/lib/storage";

function allFiles(dir: string): string[] {
  if (!fs.existsSync(dir)) return [];
  return fs.readdirSync(dir, { recursive: true, withFileTypes: true }).filter((e) => e.isFile()).map((e) => path.join(e.parentPath, e.name));
}

describe("disk storage", () => {
  // The root sits inside a folder of its own, so a check for files escaping it reads that folder
  // alone, not the whole system temp folder.
  let root: string;
  beforeEach(() => {
    root = path.join(fs.mkdtempSync(path.join(os.tmpdir(), "flueward-disk-")), "uploads");
    fs.mkdirSync(root);
  });
  afterEach(() => fs.rmSync(path.dirname(root), { recursive: true, force: true }));

  test("put, get and delete round-trip the bytes", async () => {
    const storage = createDiskStorage({ rootDir: root });
    const key = newBlobKey("photos/c1", ".jpg");
    const bytes = new Uint8Array([0xff, 0xd8, 0xff, 1, 2, 3]);
    await storage.put(key, bytes, "image/jpeg");
    expect(await storage.get(key)).toEqual(bytes);
    expect(fs.existsSync(path.join(root, ...key.split("/")))).toBe(true);
    await storage.delete(key);
    expect(await storage.get(key)).toBeNull();
    await expect(storage.delete(key)).resolves.toBeUndefined();
  });

  test("a second put replaces the whole object", async () => {
    const storage = createDiskStorage({ rootDir: root });
    await storage.put("photos/c1/a.jpg", new Uint8Array(1000).fill(1), "image/jpeg");
    await storage.put("photos/c1/a.jpg", new Uint8Array([9]), "image/jpeg");
    expect(await storage.get("photos/c1/a.jpg")).toEqual(new Uint8Array([9]));
  });

  test("a missing key reads as null", async () => {
    expect(await createDiskStorage({ rootDir: root }).get("photos/c1/nothing.jpg")).toBeNull();
  });

  test.each([
    "../escape.jpg",
    "photos/../../escape.jpg",
    "/etc/passwd",
    "photos/c1/..",
    "photos\\..\\x",
    ".tmp-abc",
    "photos/c1/.hidden",
    "Photos/Upper.jpg",
    "photos//double.jpg",
    "photos/c1/name with space.jpg",
    "a/b/c/d/e.jpg",
    "",
    "x".repeat(201),
  ])("key %j is refused before touching the disk", async (key) => {
    const storage = createDiskStorage({ rootDir: root });
    expect(isValidBlobKey(key)).toBe(false);
    await expect(storage.put(key, new Uint8Array([1]), "image/jpeg")).rejects.toThrow(/Storage keys/);
    await expect(storage.get(key)).rejects.toThrow(/Storage keys/);
    await expect(storage.delete(key)).rejects.toThrow(/Storage keys/);
    expect(allFiles(path.dirname(root)).filter((f) => f.endsWith("escape.jpg"))).toEqual([]);
  });

  test("resolved paths always stay inside the root", () => {
    const storage = createDiskStorage({ rootDir: root });
    for (let i = 0; i < 50; i += 1) {
      const full = storage.resolve(newBlobKey(`photos/c${i}`, "-thumb.jpg"));
      expect(path.relative(root, full).startsWith("..")).toBe(false);
    }
  });

  test("writes go through a temp file that never stays behind", async () => {
    const storage = createDiskStorage({ rootDir: root });
    await Promise.all(Array.from({ length: 20 }, (_, i) => storage.put(`photos/c1/p${i}.jpg`, new Uint8Array(50_000).fill(i), "image/jpeg")));
    const files = allFiles(root);
    expect(files).toHaveLength(20);
    expect(files.filter((f) => path.basename(f).startsWith(TEMP_PREFIX))).toEqual([]);
    for (let i = 0; i < 20; i += 1) expect((await storage.get(`photos/c1/p${i}.jpg`))?.[0]).toBe(i);
  });

  test("a failed write leaves neither the target nor a temp file", async () => {
    const storage = createDiskStorage({ rootDir: root });
    // A directory where the file should go makes the rename fail after the temp file was written.
    fs.mkdirSync(path.join(root, "photos", "c1", "taken.jpg"), { recursive: true });
    fs.writeFileSync(path.join(root, "photos", "c1", "taken.jpg", "keep"), "x");
    await expect(storage.put("photos/c1/taken.jpg", new Uint8Array([1, 2, 3]), "image/jpeg")).rejects.toThrow();
    expect(fs.readdirSync(path.join(root, "photos", "c1"))).toEqual(["taken.jpg"]);
  });

  test("temp files left by a crash are invisible and can be swept", async () => {
    const storage = createDiskStorage({ rootDir: root });
    await storage.put("photos/c1/real.jpg", new Uint8Array([1]), "image/jpeg");
    const orphan = path.join(root, "photos", "c1", `${TEMP_PREFIX}deadbeef`);
    fs.writeFileSync(orphan, "half a photo");
    const old = new Date(Date.now() - 2 * 60 * 60 * 1000);
    fs.utimesSync(orphan, old, old);
    expect(await sweepTempFiles(root)).toBe(1);
    expect(fs.existsSync(orphan)).toBe(false);
    expect(await storage.get("photos/c1/real.jpg")).toEqual(new Uint8Array([1]));
  });

  test("new keys are random, valid and never contain a user's file name", () => {
    const keys = new Set(Array.from({ length: 200 }, () => newBlobKey("photos/c7", ".jpg")));
    expect(keys.size).toBe(200);
    for (const key of keys) expect(key).toMatch(/^photos\/c7\/[0-9a-f]{32}\.jpg$/);
  });

  test("the environment chooses the driver and the folder", () => {
    expect(defaultUploadsDir({})).toBe(path.join(process.cwd(), "data", "uploads"));
    expect(defaultUploadsDir({ FLUEWARD_UPLOADS_DIR: root })).toBe(root);
    expect(createStorageFromEnv({ FLUEWARD_UPLOADS_DIR: root }).driver).toBe("disk");
    expect(createStorageFromEnv({ STORAGE_DRIVER: "memory" }).driver).toBe("memory");
    expect(createStorageFromEnv({ STORAGE_DRIVER: "s3", S3_BUCKET: "demo-bucket", S3_ENDPOINT: "http://127.0.0.1:9" }).driver).toBe("s3");
    expect(() => createStorageFromEnv({ STORAGE_DRIVER: "s3" })).toThrow(/S3_BUCKET/);
    expect(() => createStorageFromEnv({ STORAGE_DRIVER: "ftp" })).toThrow(/Unknown STORAGE_DRIVER/);
  });
});
