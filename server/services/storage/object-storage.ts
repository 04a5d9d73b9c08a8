/**
 * Where uploaded files live. Keys are made by the server only (letters, digits, dashes and
 * slashes), so a user's file name never reaches a file system or a bucket.
 */
export interface ObjectStorage {
  /** Stores bytes under a key, replacing any object already there. */
  put(key: string, body: Buffer, contentType: string): Promise<void>;
  /** The bytes under a key; rejects with {@link ObjectNotFound} when there are none. */
  get(key: string): Promise<Buffer>;
  /** Whether an object exists under the key. */
  exists(key: string): Promise<boolean>;
  /** Removes the object; removing a missing key is not an error. */
  delete(key: string): Promise<void>;
}

/** The object asked for is not in the storage. */
export class ObjectNotFound extends Error {
  constructor(readonly key: string) {
    super(`Storage: no object under "${key}".`);
    this.name = 'ObjectNotFound';
  }
}

/** Storage keys: lower-case letters, digits and dashes in slash-separated parts, no dots. */
export const STORAGE_KEY = /^[a-z0-9-]{1,64}(\/[a-z0-9-]{1,64}){0,6}$/;

/** Throws when a key is not one the server makes (defence against path tricks). */
export function assertKey(key: string): void {
  if (!STORAGE_KEY.test(key)) throw new Error(`Storage: refused key "${key}" (only a-z, 0-9, "-" and "/").`);
}
