import { randomBytes } from 'node:crypto';
import type { Dirent } from 'node:fs';
import fs from 'node:fs/promises';
import path from 'node:path';
import { assertKey, ObjectNotFound, STORAGE_KEY, TEMP_KEY, type ObjectStorage, type StoredObject } from './object-storage';

/** A folder name the server makes (one part of a storage key). */
const KEY_PART = /^[a-z0-9-]{1,64}$/;
/** Keys have at most seven parts: deeper folders hold nothing the server made. */
const MAX_DEPTH = 7;

/** Files on the local disk under one folder: the default for a single machine. */
export class DiskStorage implements ObjectStorage {
  private readonly root: string;

  constructor(root: string) {
    this.root = path.resolve(root);
  }

  private file(key: string): string {
    assertKey(key);
    return this.inside(key);
  }

  private inside(key: string): string {
    const full = path.resolve(this.root, ...key.split('/'));
    // The key pattern already excludes "..", this keeps it true even if the pattern changes.
    if (!full.startsWith(this.root + path.sep)) throw new Error(`Storage: key "${key}" leaves the upload folder.`);
    return full;
  }

  async put(key: string, body: Buffer): Promise<void> {
    const target = this.file(key);
    await fs.mkdir(path.dirname(target), { recursive: true });
    // Write then rename, so a reader never sees half a file.
    const temp = `${target}.${randomBytes(6).toString('hex')}.part`;
    await fs.writeFile(temp, body, { mode: 0o640 });
    await fs.rename(temp, target);
  }

  async get(key: string): Promise<Buffer> {
    try {
      return await fs.readFile(this.file(key));
    } catch (err) {
      if ((err as NodeJS.ErrnoException).code === 'ENOENT') throw new ObjectNotFound(key);
      throw err;
    }
  }

  async exists(key: string): Promise<boolean> {
    try {
      await fs.access(this.file(key));
      return true;
    } catch {
      return false;
    }
  }

  /** Also removes a leftover temp file (`<key>.<hex>.part`) that {@link list} reported. */
  async delete(key: string): Promise<void> {
    if (!TEMP_KEY.test(key)) {
      await fs.rm(this.file(key), { force: true });
      return;
    }
    const full = this.inside(key);
    // Only a plain file inside the real upload folder: never through a folder linked elsewhere.
    const [realRoot, realDir] = await Promise.all([fs.realpath(this.root), fs.realpath(path.dirname(full)).catch(() => null)]);
    if (realDir === null || (realDir !== realRoot && !realDir.startsWith(realRoot + path.sep))) return;
    const stat = await fs.lstat(full).catch(() => null);
    if (stat?.isFile()) await fs.rm(full, { force: true });
  }

  /**
   * Walks the folder (without following symbolic links) for files named like keys, and for temp
   * files left by an interrupted {@link put} (listed with `temp: true`). Other files are skipped.
   */
  async list(prefix: string): Promise<StoredObject[]> {
    const found: StoredObject[] = [];
    const walk = async (dir: string, rel: string, depth: number): Promise<void> => {
      let entries: Dirent[];
      try {
        entries = await fs.readdir(dir, { withFileTypes: true });
      } catch (err) {
        // The folder is not made until the first upload; a folder may vanish while we walk.
        if ((err as NodeJS.ErrnoException).code === 'ENOENT' || (err as NodeJS.ErrnoException).code === 'ENOTDIR') return;
        throw err;
      }
      for (const entry of entries) {
        const key = rel ? `${rel}/${entry.name}` : entry.name;
        // Dirent types come from lstat: a symbolic link is neither a directory nor a file here.
        if (entry.isDirectory()) {
          const canMatch = prefix.startsWith(`${key}/`) || `${key}/`.startsWith(prefix);
          if (KEY_PART.test(entry.name) && depth < MAX_DEPTH - 1 && canMatch) await walk(path.join(dir, entry.name), key, depth + 1);
          continue;
        }
        if (!entry.isFile() || !key.startsWith(prefix)) continue;
        const temp = TEMP_KEY.test(key);
        if (!temp && !STORAGE_KEY.test(key)) continue;
        const stat = await fs.lstat(path.join(dir, entry.name)).catch(() => null);
        if (!stat?.isFile()) continue;
        found.push(temp ? { key, lastModified: stat.mtime, temp: true } : { key, lastModified: stat.mtime });
      }
    };
    await walk(this.root, '', 0);
    return found;
  }
}
