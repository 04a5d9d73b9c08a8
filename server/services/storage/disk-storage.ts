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
    // Write then rename, so a reader never sees half a file.
    const temp = `${target}.${randomBytes(6).toString('hex')}.part`;
    // A delete elsewhere may remove the folder (once empty) between making it and writing into it:
    // then the folder is made again. Once the temp file is in it, the folder is not empty any more.
    for (let attempt = 1; ; attempt += 1) {
      await fs.mkdir(path.dirname(target), { recursive: true });
      try {
        await fs.writeFile(temp, body, { mode: 0o640 });
        break;
      } catch (err) {
        if ((err as NodeJS.ErrnoException).code !== 'ENOENT' || attempt >= 5) throw err;
      }
    }
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

  /**
   * Also removes a leftover temp file (`<key>.<hex>.part`) that {@link list} reported. Folders the
   * key's removal leaves empty are removed too, up to (not including) the upload folder. Nothing is
   * removed through a symbolic link: the key's folder must really be inside the upload folder.
   */
  async delete(key: string): Promise<void> {
    const full = TEMP_KEY.test(key) ? this.inside(key) : this.file(key);
    if (!(await this.isOwnFolder(path.dirname(full)))) return;
    const stat = await fs.lstat(full).catch(() => null);
    // A plain file (or a link itself, never what it points to: rm does not follow the last name).
    if (stat && (stat.isFile() || stat.isSymbolicLink())) await fs.rm(full, { force: true });
    await this.pruneEmptyFolders(key);
  }

  /** Whether `dir` exists and is reached from the upload folder without any symbolic link. */
  private async isOwnFolder(dir: string): Promise<boolean> {
    const [realRoot, realDir] = await Promise.all([fs.realpath(this.root).catch(() => null), fs.realpath(dir).catch(() => null)]);
    if (realRoot === null || realDir === null) return false;
    return realDir === path.join(realRoot, path.relative(this.root, dir));
  }

  /**
   * Removes the key's folders from the deepest up while they are empty. `rmdir` removes only an
   * empty folder, so a folder another upload is writing into stays; {@link put} makes its folder
   * again if it went just before its write.
   */
  private async pruneEmptyFolders(key: string): Promise<void> {
    const parts = key.split('/').slice(0, -1);
    while (parts.length > 0) {
      const dir = this.inside(parts.join('/'));
      if (!(await this.isOwnFolder(dir))) return;
      try {
        await fs.rmdir(dir);
      } catch {
        return; // not empty, or already gone: the folders above are not empty either
      }
      parts.pop();
    }
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
