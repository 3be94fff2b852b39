import type { S3Client } from "@aws-sdk/client-s3";
import type { BlobStorage } from "./index";
import { assertValidBlobKey } from "./keys";

export interface S3StorageOptions {
  bucket: string;
  region: string;
  /** An S3-compatible endpoint (MinIO, R2, Ceph…); addressed path-style. Omit for AWS itself. */
  endpoint?: string;
  /** Omit both to use the SDK's default credential chain (instance role, env, profile). */
  accessKeyId?: string;
  secretAccessKey?: string;
  /** Tests inject a client; otherwise one is built on first use. */
  client?: S3Client;
}

/** The S3 driver's settings from the environment (STORAGE_DRIVER=s3), or an error naming what is missing. */
export function s3OptionsFromEnv(env: Record<string, string | undefined>): S3StorageOptions {
  const bucket = env.S3_BUCKET;
  if (!bucket) throw new Error("STORAGE_DRIVER=s3 needs S3_BUCKET to be set.");
  return {
    bucket,
    region: env.S3_REGION || "us-east-1",
    endpoint: env.S3_ENDPOINT || undefined,
    accessKeyId: env.S3_ACCESS_KEY_ID || undefined,
    secretAccessKey: env.S3_SECRET_ACCESS_KEY || undefined,
  };
}

function isMissing(error: unknown): boolean {
  const e = error as { name?: string; $metadata?: { httpStatusCode?: number } } | null;
  return e?.name === "NoSuchKey" || e?.name === "NotFound" || e?.$metadata?.httpStatusCode === 404;
}

/**
 * Objects in an S3 bucket. A PUT is atomic on S3: readers see the old object, or none, until the
 * whole new one is stored. The SDK is loaded on first use, so disk-only installs never load it.
 */
export function createS3Storage(options: S3StorageOptions): BlobStorage {
  let clientPromise: Promise<{ client: S3Client; sdk: typeof import("@aws-sdk/client-s3") }> | undefined;

  function connect() {
    clientPromise ??= import("@aws-sdk/client-s3").then((sdk) => {
      const client =
        options.client ??
        new sdk.S3Client({
          region: options.region,
          endpoint: options.endpoint,
          forcePathStyle: Boolean(options.endpoint),
          credentials:
            options.accessKeyId && options.secretAccessKey
              ? { accessKeyId: options.accessKeyId, secretAccessKey: options.secretAccessKey }
              : undefined,
        });
      return { client, sdk };
    });
    return clientPromise;
  }

  return {
    driver: "s3",
    async put(key, bytes, contentType) {
      assertValidBlobKey(key);
      const { client, sdk } = await connect();
      await client.send(
        new sdk.PutObjectCommand({ Bucket: options.bucket, Key: key, Body: bytes, ContentType: contentType, ContentLength: bytes.byteLength }),
      );
    },
    async get(key) {
      assertValidBlobKey(key);
      const { client, sdk } = await connect();
      try {
        const result = await client.send(new sdk.GetObjectCommand({ Bucket: options.bucket, Key: key }));
        if (!result.Body) return null;
        return await result.Body.transformToByteArray();
      } catch (error) {
        if (isMissing(error)) return null;
        throw error;
      }
    },
    async delete(key) {
      assertValidBlobKey(key);
      const { client, sdk } = await connect();
      try {
        await client.send(new sdk.DeleteObjectCommand({ Bucket: options.bucket, Key: key }));
      } catch (error) {
        if (!isMissing(error)) throw error;
      }
    },
  };
}
