import fs from 'node:fs';
import fsp from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { DiskStorage } from './disk-storage';
import type { StoredObject } from './object-storage';

let base: string;
let root: string;
let outside: string;
let storage: DiskStorage;

beforeEach(() => {
  base = fs.mkdtempSync(path.join(os.tmpdir(), 'slantwise-disk-'));
  root = path.join(base, 'uploads');
  outside = path.join(base, 'outside');
  fs.mkdirSync(root);
  fs.mkdirSync(path.join(outside, 'setups'), { recursive: true });
  fs.writeFileSync(path.join(outside, 'secret'), 'not an upload');
  fs.writeFileSync(path.join(outside, 'setups', 'abc'), 'not an upload either');
  storage = new DiskStorage(root);
});
afterEach(() => fs.rmSync(base, { recursive: true, force: true }));

const keys = (list: StoredObject[]) => list.map((o) => o.key).sort();
const write = (rel: string, text = 'x') => {
  fs.mkdirSync(path.dirname(path.join(root, rel)), { recursive: true });
  fs.writeFileSync(path.join(root, rel), text);
};

describe('DiskStorage.list', () => {
  it('gives nested keys with "/" separators and each file\'s modification time', async () => {
    await storage.put('teams/1/setups/2/aaa', Buffer.from('one'));
    await storage.put('teams/1/setups/2/aaa-thumb', Buffer.from('thumb'));
    await storage.put('teams/12/setups/30/bbb', Buffer.from('two'));
    await storage.put('top', Buffer.from('three'));
    const old = new Date('2026-01-02T03:04:05Z');
    fs.utimesSync(path.join(root, 'teams', '12', 'setups', '30', 'bbb'), old, old);

    const list = await storage.list('');
    expect(keys(list)).toEqual(['teams/1/setups/2/aaa', 'teams/1/setups/2/aaa-thumb', 'teams/12/setups/30/bbb', 'top']);
    expect(list.find((o) => o.key === 'teams/12/setups/30/bbb')?.lastModified.toISOString()).toBe('2026-01-02T03:04:05.000Z');
    expect(list.every((o) => Number.isFinite(o.lastModified.getTime()) && o.temp === undefined)).toBe(true);
    // Every listed key works with the other methods.
    for (const o of list) expect(await storage.exists(o.key)).toBe(true);
  });

  it('keeps only keys that start with the prefix, whole folder or part of a name', async () => {
    for (const key of ['teams/1/setups/2/aaa', 'teams/1/setups/3/bbb', 'teams/12/setups/4/ccc', 'teams/2/setups/5/ddd']) await storage.put(key, Buffer.from(key));
    expect(keys(await storage.list('teams/1/'))).toEqual(['teams/1/setups/2/aaa', 'teams/1/setups/3/bbb']);
    expect(keys(await storage.list('teams/1'))).toEqual(['teams/1/setups/2/aaa', 'teams/1/setups/3/bbb', 'teams/12/setups/4/ccc']);
    expect(keys(await storage.list('teams/1/setups/3/b'))).toEqual(['teams/1/setups/3/bbb']);
    expect(await storage.list('teams/9/')).toEqual([]);
  });

  it('reports a temp file left by an interrupted write, and delete removes it', async () => {
    await storage.put('teams/1/setups/2/aaa', Buffer.from('whole'));
    // put() leaves no temp file behind when it completes.
    expect(keys(await storage.list(''))).toEqual(['teams/1/setups/2/aaa']);
    write('teams/1/setups/2/bbb.0123456789ab.part', 'half');
    const list = await storage.list('teams/1/');
    expect(list.find((o) => o.key === 'teams/1/setups/2/bbb.0123456789ab.part')).toMatchObject({ temp: true });
    expect(list.find((o) => o.key === 'teams/1/setups/2/aaa')?.temp).toBeUndefined();

    await storage.delete('teams/1/setups/2/bbb.0123456789ab.part');
    expect(fs.existsSync(path.join(root, 'teams/1/setups/2/bbb.0123456789ab.part'))).toBe(false);
    expect(keys(await storage.list(''))).toEqual(['teams/1/setups/2/aaa']);
    // A temp name is never served as an object.
    await expect(storage.get('teams/1/setups/2/bbb.0123456789ab.part')).rejects.toThrow(/refused key/);
  });

  it('skips files the server could not have made', async () => {
    write('README.txt');
    write('.hidden');
    write('teams/1/Upper');
    write('teams/1/setups/2/file.pdf');
    write('teams/1/setups/2/aaa.part');
    write('teams/1/setups/2/aaa.xyz.part');
    write('a/b/c/d/e/f/x/y');
    write('a/b/c/d/e/f/g');
    expect(keys(await storage.list(''))).toEqual(['a/b/c/d/e/f/g']);
  });

  it('never follows a symbolic link out of the upload folder, and delete does not reach through one', async () => {
    await storage.put('teams/1/setups/2/aaa', Buffer.from('mine'));
    fs.symlinkSync(outside, path.join(root, 'teams', '9'), 'dir');
    fs.symlinkSync(path.join(outside, 'secret'), path.join(root, 'teams', '1', 'setups', '2', 'linked'));
    fs.writeFileSync(path.join(outside, 'setups', 'abc.0123456789ab.part'), 'outside temp');
    expect(keys(await storage.list(''))).toEqual(['teams/1/setups/2/aaa']);
    expect(await storage.list('teams/9/')).toEqual([]);

    await storage.delete('teams/9/setups/abc.0123456789ab.part');
    expect(fs.readFileSync(path.join(outside, 'setups', 'abc.0123456789ab.part'), 'utf8')).toBe('outside temp');
    expect(fs.readFileSync(path.join(outside, 'secret'), 'utf8')).toBe('not an upload');
  });

  it('gives an empty list before the upload folder exists, and refuses keys that leave it', async () => {
    expect(await new DiskStorage(path.join(base, 'not-yet')).list('')).toEqual([]);
    await expect(storage.delete('../outside/secret')).rejects.toThrow(/refused key/);
    await expect(storage.delete('../outside/secret.0123456789ab.part')).rejects.toThrow(/refused key/);
    expect(fs.existsSync(path.join(outside, 'secret'))).toBe(true);
  });
});

describe('DiskStorage.delete', () => {
  it('removes the folders a deleted key leaves empty, up to the upload folder, and no others', async () => {
    await storage.put('teams/1/setups/2/aaa', Buffer.from('a'));
    await storage.put('teams/1/setups/2/bbb', Buffer.from('b'));
    await storage.put('teams/1/setups/3/ccc', Buffer.from('c'));
    await storage.delete('teams/1/setups/2/aaa');
    expect(fs.existsSync(path.join(root, 'teams/1/setups/2'))).toBe(true); // bbb is still in it
    await storage.delete('teams/1/setups/2/bbb');
    expect(fs.existsSync(path.join(root, 'teams/1/setups/2'))).toBe(false);
    expect(fs.existsSync(path.join(root, 'teams/1/setups/3/ccc'))).toBe(true);
    await storage.delete('teams/1/setups/3/ccc');
    expect(fs.readdirSync(root)).toEqual([]); // teams/1/setups/3, teams/1/setups, teams/1 and teams went
    expect(fs.existsSync(root)).toBe(true);
    // A left-over temp file's folder goes the same way; a missing key is still not an error.
    write('teams/4/setups/5/ddd.0123456789ab.part', 'half');
    await storage.delete('teams/4/setups/5/ddd.0123456789ab.part');
    expect(fs.readdirSync(root)).toEqual([]);
    await expect(storage.delete('teams/4/setups/5/ddd')).resolves.toBeUndefined();
  });

  it('keeps a folder with anything else in it, and removes nothing through a symbolic link', async () => {
    write('teams/1/setups/2/notes.txt', 'not ours, but in the folder');
    await storage.put('teams/1/setups/2/aaa', Buffer.from('a'));
    await storage.delete('teams/1/setups/2/aaa');
    expect(fs.existsSync(path.join(root, 'teams/1/setups/2/notes.txt'))).toBe(true);

    // teams/9 links to a folder outside: neither the file nor the empty folders there are touched.
    fs.symlinkSync(outside, path.join(root, 'teams', '9'), 'dir');
    fs.mkdirSync(path.join(outside, 'setups', 'empty'));
    fs.writeFileSync(path.join(outside, 'setups', 'empty-key'), 'outside');
    await storage.delete('teams/9/setups/empty-key');
    await storage.delete('teams/9/setups/empty/zzz');
    expect(fs.readFileSync(path.join(outside, 'setups', 'empty-key'), 'utf8')).toBe('outside');
    expect(fs.existsSync(path.join(outside, 'setups', 'empty'))).toBe(true);
    expect(fs.lstatSync(path.join(root, 'teams', '9')).isSymbolicLink()).toBe(true);
  });

  it('lets an upload land in a folder that a delete removed between making it and writing into it', async () => {
    await storage.put('teams/1/setups/2/old', Buffer.from('old'));
    // The delete of the folder's last file runs exactly between put's mkdir and its write.
    const original = fsp.writeFile;
    const spy = jest.spyOn(fsp, 'writeFile').mockImplementationOnce(async (...args: Parameters<typeof fsp.writeFile>) => {
      await storage.delete('teams/1/setups/2/old');
      expect(fs.existsSync(path.join(root, 'teams'))).toBe(false);
      return original(...args);
    });
    try {
      await storage.put('teams/1/setups/2/new', Buffer.from('new'));
      expect(spy).toHaveBeenCalledTimes(2); // the first write found no folder; the second made it again
    } finally {
      spy.mockRestore();
    }
    expect(fs.readFileSync(path.join(root, 'teams/1/setups/2/new'), 'utf8')).toBe('new');
    expect(keys(await storage.list(''))).toEqual(['teams/1/setups/2/new']);
  });
});

