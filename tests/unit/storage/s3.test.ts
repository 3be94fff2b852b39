import { describe, expect, test } from "vitest";
import type { S3Client } from "@aws-sdk/client-s3";
import { createS3Storage } from "@/lib/storage/s3";

/** A stand-in for S3Client.send that keeps objects in a Map and answers like S3 does. */
function fakeClient() {
  const objects = new Map<string, { body: Uint8Array; contentType?: string }>();
  const sent: string[] = [];
  const client = {
    async send(command: { constructor: { name: string }; input: { Bucket: string; Key: string; Body?: Uint8Array; ContentType?: string } }) {
      const name = command.constructor.name;
      sent.push(`${name} ${command.input.Bucket}/${command.input.Key}`);
      if (name === "PutObjectCommand") {
        objects.set(command.input.Key, { body: command.input.Body!, contentType: command.input.ContentType });
        return {};
      }
      if (name === "GetObjectCommand") {
        const object = objects.get(command.input.Key);
        if (!object) throw Object.assign(new Error("The specified key does not exist."), { name: "NoSuchKey", $metadata: { httpStatusCode: 404 } });
        return { Body: { transformToByteArray: async () => new Uint8Array(object.body) } };
      }
      if (name === "DeleteObjectCommand") {
        objects.delete(command.input.Key);
        return {};
      }
      throw new Error(`unexpected ${name}`);
    },
  };
  return { client: client as unknown as S3Client, objects, sent };
}

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
