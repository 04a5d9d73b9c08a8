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
  /**
   * Removes the object (or a leftover temp file that {@link list} reported with `temp: true`);
   * removing a missing key is not an error.
   */
  delete(key: string): Promise<void>;
  /**
   * Every object whose key starts with `prefix` ('' = all), in no particular order. Only names the
   * server could have made are listed (anything else in the folder or bucket is left alone).
   */
  list(prefix: string): Promise<StoredObject[]>;
}

/** One entry of {@link ObjectStorage.list}. */
export interface StoredObject {
  readonly key: string;
  readonly lastModified: Date;
  /** A partial write left by a crash (disk only): never served, only ever removed. */
  readonly temp?: boolean;
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

/** A disk write in progress or left by a crash: `<key>.<12 hex digits>.part`. */
export const TEMP_KEY = /^[a-z0-9-]{1,64}(\/[a-z0-9-]{1,64}){0,6}\.[0-9a-f]{12}\.part$/;

/** Throws when a key is not one the server makes (defence against path tricks). */
export function assertKey(key: string): void {
  if (!STORAGE_KEY.test(key)) throw new Error(`Storage: refused key "${key}" (only a-z, 0-9, "-" and "/").`);
}
