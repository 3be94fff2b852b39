import type { BlobStorage } from "./index";
import { assertValidBlobKey } from "./keys";

export interface MemoryStorage extends BlobStorage {
  readonly driver: "memory";
  /** The stored keys, sorted (for assertions). */
  keys(): string[];
  /** The content type stored with a key. */
  contentTypeOf(key: string): string | undefined;
}

/** Keeps objects in a Map: for tests, and for nothing that must survive a restart. */
export function createMemoryStorage(): MemoryStorage {
  const objects = new Map<string, { bytes: Uint8Array; contentType: string }>();
  return {
    driver: "memory",
    async put(key, bytes, contentType) {
      assertValidBlobKey(key);
      // Copies, so a caller reusing its buffer cannot change what was stored.
      objects.set(key, { bytes: new Uint8Array(bytes), contentType });
    },
    async get(key) {
      assertValidBlobKey(key);
      const entry = objects.get(key);
      return entry ? new Uint8Array(entry.bytes) : null;
    },
    async delete(key) {
      assertValidBlobKey(key);
      objects.delete(key);
    },
    keys: () => [...objects.keys()].sort(),
    contentTypeOf: (key) => objects.get(key)?.contentType,
  };
}
