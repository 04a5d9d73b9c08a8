import { createHash } from 'node:crypto';
import type { RequestHandler } from 'express';
import multer from 'multer';
import sharp from 'sharp';
import type { AttachmentDto } from '../../shared/api/setup';
import { HttpError } from '../middleware/http-error';

/** The file types a set-up may carry, told apart by their first bytes. */
export type UploadType = AttachmentDto['contentType'];

const PNG = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
const JPEG = Buffer.from([0xff, 0xd8, 0xff]);
const PDF = Buffer.from('%PDF-', 'latin1');

/** The type a file's content shows (not its name or declared type), or null when it is none we take. */
export function sniffType(bytes: Buffer): UploadType | null {
  if (bytes.subarray(0, PNG.length).equals(PNG)) return 'image/png';
  if (bytes.subarray(0, JPEG.length).equals(JPEG)) return 'image/jpeg';
  if (bytes.subarray(0, PDF.length).equals(PDF)) return 'application/pdf';
  return null;
}

/** Human-readable size: "20 MB", "512 KB". */
export function sizeText(bytes: number): string {
  if (bytes >= 1024 * 1024) return `${+(bytes / (1024 * 1024)).toFixed(1)} MB`;
  if (bytes >= 1024) return `${+(bytes / 1024).toFixed(1)} KB`;
  return `${bytes} bytes`;
}

/** A checked upload, ready to store. */
export interface CheckedUpload {
  contentType: UploadType;
  sha256: string;
  size: number;
  width: number | null;
  height: number | null;
  /** A small JPEG preview for images, or null. */
  thumbnail: Buffer | null;
}

/** Longest side of a thumbnail, in pixels. */
export const THUMBNAIL_PX = 320;

/**
 * Checks an uploaded file by its content: PDF, PNG or JPEG only (415 otherwise, whatever its name
 * says); images must decode, PDFs must end with an end-of-file marker. Computes the SHA-256 and,
 * for images, the size in pixels and a thumbnail.
 */
export async function checkUpload(bytes: Buffer): Promise<CheckedUpload> {
  if (bytes.length === 0) throw new HttpError(400, 'The file is empty.', { file: 'The file is empty.' });
  const contentType = sniffType(bytes);
  if (!contentType) {
    throw new HttpError(415, 'Only PDF, PNG and JPEG files can be attached; this file\'s content is none of them (whatever its name says).', { file: 'Choose a PDF, PNG or JPEG file.' });
  }
  const sha256 = createHash('sha256').update(bytes).digest('hex');
  if (contentType === 'application/pdf') {
    if (!bytes.subarray(Math.max(0, bytes.length - 1024)).includes('%%EOF')) {
      throw new HttpError(415, 'The PDF is incomplete (no end-of-file marker); save it again and upload the new copy.', { file: 'The PDF is incomplete.' });
    }
    return { contentType, sha256, size: bytes.length, width: null, height: null, thumbnail: null };
  }
  try {
    const meta = await sharp(bytes).metadata();
    const expected = contentType === 'image/png' ? 'png' : 'jpeg';
    if (meta.format !== expected) throw new Error(`decoded as ${meta.format}`);
    const thumbnail = await sharp(bytes).rotate().resize({ width: THUMBNAIL_PX, height: THUMBNAIL_PX, fit: 'inside', withoutEnlargement: true }).jpeg({ quality: 78 }).toBuffer();
    return { contentType, sha256, size: bytes.length, width: meta.width ?? null, height: meta.height ?? null, thumbnail };
  } catch {
    throw new HttpError(415, `The file starts like a ${contentType === 'image/png' ? 'PNG' : 'JPEG'} image but cannot be read as one.`, { file: 'The image is damaged or not really an image.' });
  }
}

/**
 * multer for one file in the field `file`, kept in memory (at most `maxBytes`), with its errors
 * turned into clear JSON answers: 413 for a file over the limit, 400 for a wrong form.
 */
export function singleUpload(maxBytes: number): RequestHandler {
  const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: maxBytes, files: 1, fields: 4, parts: 6, fieldSize: 2_000 } }).single('file');
  return (req, res, next) => {
    upload(req, res, (err: unknown) => {
      if (!err) return next();
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') {
          return next(new HttpError(413, `The file is larger than the ${sizeText(maxBytes)} limit.`, { file: `At most ${sizeText(maxBytes)}.` }));
        }
        if (err.code === 'LIMIT_UNEXPECTED_FILE' || err.code === 'LIMIT_FILE_COUNT') {
          return next(new HttpError(400, 'Send exactly one file, in the form field named "file".', { file: 'Send one file in the field "file".' }));
        }
        return next(new HttpError(400, `The upload form is not valid (${err.message}).`));
      }
      // Anything else the form parser throws is a malformed request (bad part header, cut-off body), not a server fault.
      const message = err instanceof Error ? err.message : String(err);
      next(new HttpError(400, `The upload form could not be read (${message}).`, { file: 'Send one file as multipart/form-data in the field "file".' }));
    });
  };
}
