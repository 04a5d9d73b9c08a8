import { randomBytes } from 'node:crypto';
import fs from 'node:fs/promises';
import path from 'node:path';
import { assertKey, ObjectNotFound, type ObjectStorage } from './object-storage';

/** Files on the local disk under one folder: the default for a single machine. */
export class DiskStorage implements ObjectStorage {
  private readonly root: string;

  constructor(root: string) {
    this.root = path.resolve(root);
  }

  private file(key: string): string {
    assertKey(key);
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

  async delete(key: string): Promise<void> {
    await fs.rm(this.file(key), { force: true });
  }
}
