import { describe, expect, test } from "vitest";
import { fakeS3Client as fakeClient } from "../../fixtures/fake-s3";
import { createS3Storage } from "@/lib/storage/s3";

describe("S3 storage", () => {
  test("put, get and delete go to the bucket with the content type", async () => {
    const fake = fakeClient();
    const storage = createS3Storage({ bucket: "demo-bucket", region: "us-east-1", client: fake.client });
    await storage.put("photos/c1/a.jpg", new Uint8Array([1, 2, 3]), "image/jpeg");
    expect(fake.objects.get("photos/c1/a.jpg")?.contentType).toBe("image/jpeg");
    expect(await storage.get("photos/c1/a.jpg")).toEqual(new Uint8Array([1, 2, 3]));
    await storage.delete("photos/c1/a.jpg");
    expect(await storage.get("photos/c1/a.jpg")).toBeNull();
    expect(fake.sent[0]).toBe("PutObjectCommand demo-bucket/photos/c1/a.jpg");
  });

  test("refuses invalid keys before calling S3", async () => {
    const fake = fakeClient();
    const storage = createS3Storage({ bucket: "demo-bucket", region: "us-east-1", client: fake.client });
    await expect(storage.put("../a", new Uint8Array([1]), "image/jpeg")).rejects.toThrow(/Storage keys/);
    expect(fake.sent).toEqual([]);
  });
});
