import { describe, expect, test } from "vitest";
import { createMemoryStorage } from "@/lib/storage/memory";

describe("memory storage", () => {
  test("put, get and delete", async () => {
    const storage = createMemoryStorage();
    await storage.put("photos/c1/a.jpg", new Uint8Array([1, 2]), "image/jpeg");
    expect(await storage.get("photos/c1/a.jpg")).toEqual(new Uint8Array([1, 2]));
    expect(storage.contentTypeOf("photos/c1/a.jpg")).toBe("image/jpeg");
    expect(storage.keys()).toEqual(["photos/c1/a.jpg"]);
    await storage.delete("photos/c1/a.jpg");
    expect(await storage.get("photos/c1/a.jpg")).toBeNull();
    expect(storage.keys()).toEqual([]);
  });

  test("stores a copy: changing the caller's buffer or the returned one changes nothing", async () => {
    const storage = createMemoryStorage();
    const bytes = new Uint8Array([1, 2, 3]);
    await storage.put("k.jpg", bytes, "image/jpeg");
    bytes[0] = 99;
    const read = await storage.get("k.jpg");
    read![1] = 99;
    expect(await storage.get("k.jpg")).toEqual(new Uint8Array([1, 2, 3]));
  });

  test("refuses keys the server would never generate", async () => {
    await expect(createMemoryStorage().put("../x", new Uint8Array([1]), "image/jpeg")).rejects.toThrow(/Storage keys/);
  });
});
