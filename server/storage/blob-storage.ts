/**
 * Where uploaded files live. Plans keep their images behind this small interface so object
 * storage can replace the disk later without touching the plan code.
 */
export interface BlobStorage {
  /** Stores the bytes under `key`, all or nothing: a failed put leaves no file behind. */
  put(key: string, data: Buffer): Promise<void>;
  /** The bytes, or null when there is no such key. */
  get(key: string): Promise<Buffer | null>;
  /** Removes the key; removing a missing key is not an error. */
  delete(key: string): Promise<void>;
}

/** Keys are slash-separated segments of letters, digits, dot, dash and underscore; never "..". */
const SEGMENT = /^[A-Za-z0-9_-][A-Za-z0-9._-]*$/;

export function assertValidKey(key: string): void {
  const parts = key.split("/");
  if (!key || parts.some((p) => !SEGMENT.test(p) || p === "." || p === "..")) {
    throw new Error(`invalid storage key ${JSON.stringify(key)}`);
  }
}
