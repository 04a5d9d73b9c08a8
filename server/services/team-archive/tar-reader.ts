/**
 * A small reader for the (gzip-compressed) ustar archives the team export writes: regular files
 * only, with PAX and GNU long names. Entry names are returned as they are; callers must never use
 * them as file-system paths (the importer only looks them up in the archive's own manifest).
 */
import { gunzipSync } from 'node:zlib';

/** One regular file of the archive. */
export interface TarEntry {
  readonly name: string;
  readonly body: Buffer;
}

/** The archive is damaged or not one this reader understands. */
export class TarFormatError extends Error {
  constructor(message: string) {
    super(`Team archive: ${message}`);
    this.name = 'TarFormatError';
  }
}

const BLOCK = 512;

function text(header: Buffer, offset: number, length: number): string {
  const field = header.subarray(offset, offset + length);
  const end = field.indexOf(0);
  return field.subarray(0, end === -1 ? field.length : end).toString('utf8');
}

function octal(header: Buffer, offset: number, length: number, what: string): number {
  const raw = text(header, offset, length).trim();
  if (!/^[0-7]{1,12}$/.test(raw)) throw new TarFormatError(`bad ${what} field "${raw}" in an entry header.`);
  return parseInt(raw, 8);
}

function checksumOk(header: Buffer): boolean {
  const stored = octal(header, 148, 8, 'checksum');
  let sum = 0;
  for (let i = 0; i < BLOCK; i++) sum += i >= 148 && i < 156 ? 0x20 : header[i]!;
  return sum === stored;
}

/** The `path` record of a PAX extended header ("<len> path=<value>\n" records). */
function paxPath(body: Buffer): string | null {
  let at = 0;
  let found: string | null = null;
  while (at < body.length) {
    const space = body.indexOf(0x20, at);
    if (space === -1) break;
    const length = Number(body.subarray(at, space).toString('ascii'));
    if (!Number.isInteger(length) || length <= 0 || at + length > body.length) throw new TarFormatError('bad PAX header record.');
    const record = body.subarray(space + 1, at + length - 1).toString('utf8');
    const eq = record.indexOf('=');
    if (eq > 0 && record.slice(0, eq) === 'path') found = record.slice(eq + 1);
    at += length;
  }
  return found;
}

/** Reads every regular file of an uncompressed tar archive, in order. */
export function readTar(tar: Buffer): TarEntry[] {
  const entries: TarEntry[] = [];
  let at = 0;
  let longName: string | null = null;
  while (at + BLOCK <= tar.length) {
    const header = tar.subarray(at, at + BLOCK);
    if (header.every((b) => b === 0)) return entries;
    if (!checksumOk(header)) throw new TarFormatError(`header checksum mismatch at byte ${at} (the file is damaged).`);
    const size = octal(header, 124, 12, 'size');
    const type = String.fromCharCode(header[156]!);
    const start = at + BLOCK;
    const end = start + size;
    if (end > tar.length) throw new TarFormatError('the archive ends in the middle of an entry (truncated download?).');
    const body = tar.subarray(start, end);
    at = start + Math.ceil(size / BLOCK) * BLOCK;
    if (type === 'x') {
      longName = paxPath(body) ?? longName;
      continue;
    }
    if (type === 'L') {
      longName = text(body, 0, body.length);
      continue;
    }
    if (type === 'g' || type === '5') continue;
    if (type !== '0' && type !== '\0') throw new TarFormatError(`entry type "${type}" is not a regular file; the export never writes one.`);
    const prefix = text(header, 345, 155);
    const name = longName ?? (prefix ? `${prefix}/${text(header, 0, 100)}` : text(header, 0, 100));
    longName = null;
    entries.push({ name, body: Buffer.from(body) });
  }
  throw new TarFormatError('the archive has no end marker (truncated download?).');
}

/** Gunzips (refusing more than `maxBytes` of output) and reads a .tar.gz archive. */
export function readTarGz(archive: Buffer, maxBytes = 2 ** 31 - 1): TarEntry[] {
  let tar: Buffer;
  try {
    tar = gunzipSync(archive, { maxOutputLength: maxBytes });
  } catch (err) {
    const code = (err as NodeJS.ErrnoException).code;
    if (code === 'ERR_BUFFER_TOO_LARGE') throw new TarFormatError(`the unpacked archive is larger than ${maxBytes} bytes.`);
    throw new TarFormatError('the file is not a gzip-compressed archive, or it is damaged or truncated.');
  }
  return readTar(tar);
}
