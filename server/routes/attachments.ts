import { randomUUID } from 'node:crypto';
import { Router, type Request } from 'express';
import type { Sequelize, Transaction } from 'sequelize';
import type { FieldChange } from '../../shared/api/setup';
import { currentUser } from '../middleware/auth';
import { HttpError } from '../middleware/http-error';
import { parseId } from '../middleware/validate';
import { Attachment } from '../models/attachment';
import { Setup } from '../models/setup';
import { User } from '../models/user';
import { canChangeSetup, findVisibleSetup } from '../services/setup-access';
import { recordRevision } from '../services/setup-history';
import { ObjectNotFound, type ObjectStorage } from '../services/storage/object-storage';
import { checkUpload, singleUpload } from '../services/upload-check';

/** What the attachment routes need. */
export interface AttachmentDeps {
  readonly sequelize: Sequelize;
  readonly storage: ObjectStorage;
  readonly maxBytes: number;
}

/**
 * A user's file name made safe to show and to offer on download: no folders, no control
 * characters, at most 200 characters. It is only ever stored in the database.
 */
export function displayName(original: string | undefined, fallback: string): string {
  const base = (original ?? '').split(/[\\/]/).pop() ?? '';
  // eslint-disable-next-line no-control-regex
  const clean = base.replace(/[\u0000-\u001f\u007f]/g, '').trim().slice(-200);
  return clean || fallback;
}

/** The endings each kind of file is known by; the first is the one added. */
const TYPE_ENDINGS: Readonly<Record<string, readonly string[]>> = {
  'image/png': ['.png'],
  'image/jpeg': ['.jpg', '.jpeg', '.jpe'],
  'application/pdf': ['.pdf'],
};

/**
 * The name with an ending that says what the file is: "x.exe" holding a PDF is kept as
 * "x.exe.pdf", so a download opens in the program for its content, never as what the name claimed.
 */
export function withTypeEnding(name: string, contentType: string): string {
  const endings = TYPE_ENDINGS[contentType];
  if (!endings || endings.some((e) => name.toLowerCase().endsWith(e))) return name;
  const ending = endings[0]!;
  // Like the name itself (its last 200 characters), the end is kept: the ending it claimed stays readable.
  return `${name.slice(-(200 - ending.length))}${ending}`;
}

/** multer reads part headers as Latin-1; browsers send UTF-8 file names. */
function utf8Name(name: string): string {
  const bytes = Buffer.from(name, 'latin1');
  const decoded = bytes.toString('utf8');
  return decoded.includes('\uFFFD') ? name : decoded;
}

/** Longest list of file names a history entry keeps (then "and N more"). */
const MAX_FILE_LIST = 600;

const WITH_UPLOADER = [{ model: User, as: 'uploadedBy', attributes: ['id', 'name'] }];

/**
 * Records a file attached to or removed from a set-up. The files are part of what a lead released
 * (the sheet prints the drawings), so a released set-up becomes a draft again, with a new version,
 * for a lead to release — as an edit of its inputs does. The set-up row is locked for the change,
 * so an edit at the same moment waits and then finds the new version.
 */
async function recordFileChange(setupId: number, action: 'attached' | 'detached', user: User, file: { id: number; fileName: string }, transaction: Transaction): Promise<void> {
  const setup = await Setup.findByPk(setupId, { transaction, lock: transaction.LOCK.UPDATE });
  if (!setup) throw new HttpError(404, 'No set-up with that id.');
  // The files before and after, so each version's entry says which files it had, not only the one.
  const now = await Attachment.findAll({ where: { setupId }, attributes: ['id', 'fileName'], order: [['id', 'ASC']], transaction });
  const before = action === 'attached' ? now.filter((a) => a.id !== file.id) : [...now, file].sort((a, b) => a.id - b.id);
  const names = (list: ReadonlyArray<{ fileName: string }>): string => {
    let text = '';
    for (const [i, a] of list.entries()) {
      const next = text ? `${text}, ${a.fileName}` : a.fileName;
      if (next.length > MAX_FILE_LIST) return `${text} and ${list.length - i} more`;
      text = next;
    }
    return text;
  };
  const changes: FieldChange[] = [{ field: 'attachments', from: names(before), to: names(now) }];
  if (setup.status === 'released') {
    changes.push({ field: 'status', from: 'released', to: 'draft' });
    await setup.update({ status: 'draft', releasedAt: null, releasedById: null, version: setup.version + 1 }, { transaction });
  }
  await recordRevision(setup, action, user, changes, transaction);
}

/** /api/setups/:id/attachments: drawings and photos of a set-up, with the set-up's access rules. */
export function createAttachmentsRouter({ sequelize, storage, maxBytes }: AttachmentDeps): Router {
  const router = Router({ mergeParams: true });

  const setupOf = (req: Request) => findVisibleSetup(parseId((req.params as Record<string, string>)['id']), currentUser(req));

  async function attachmentOf(req: Request): Promise<{ setup: Setup; attachment: Attachment }> {
    const setup = await setupOf(req);
    const attachment = await Attachment.findOne({ where: { id: parseId(req.params['attachmentId'], 'attachment'), setupId: setup.id, teamId: setup.teamId }, include: WITH_UPLOADER });
    if (!attachment) throw new HttpError(404, 'No attachment with that id on this set-up.');
    return { setup, attachment };
  }

  router.get('/', async (req, res) => {
    const setup = await setupOf(req);
    const rows = await Attachment.findAll({ where: { setupId: setup.id }, include: WITH_UPLOADER, order: [['id', 'ASC']] });
    res.json({ attachments: rows.map((a) => a.toDto()) });
  });

  // Access is checked before the body is read, so a refused upload costs nothing.
  const mayUpload: Router = Router({ mergeParams: true });
  mayUpload.use(async (req, _res, next) => {
    const user = currentUser(req);
    const setup = await setupOf(req);
    if (!canChangeSetup(user, setup)) throw new HttpError(403, 'You may only attach files to set-ups you may change.');
    if (setup.status === 'archived') throw new HttpError(409, 'This set-up is archived and read-only.');
    next();
  });

  router.post('/', mayUpload, singleUpload(maxBytes), async (req, res) => {
    const user = currentUser(req);
    const setup = await setupOf(req);
    const file = req.file;
    if (!file) throw new HttpError(400, 'Send the file as multipart/form-data in the field named "file".', { file: 'Choose a file to upload.' });
    const checked = await checkUpload(file.buffer);
    const key = `teams/${setup.teamId}/setups/${setup.id}/${randomUUID()}`;
    const thumbKey = checked.thumbnail ? `${key}-thumb` : null;
    await storage.put(key, file.buffer, checked.contentType);
    if (thumbKey && checked.thumbnail) await storage.put(thumbKey, checked.thumbnail, 'image/jpeg');
    const fileName = withTypeEnding(displayName(utf8Name(file.originalname), `upload.${checked.contentType.split('/')[1]}`), checked.contentType);
    let id: number;
    try {
      id = await sequelize.transaction(async (transaction) => {
        const row = await Attachment.create(
          { teamId: setup.teamId, setupId: setup.id, storageKey: key, thumbnailKey: thumbKey, fileName, contentType: checked.contentType, size: checked.size, sha256: checked.sha256, width: checked.width, height: checked.height, uploadedById: user.id },
          { transaction },
        );
        await recordFileChange(setup.id, 'attached', user, { id: row.id, fileName }, transaction);
        return row.id;
      });
    } catch (err) {
      // No row, no file: remove what was stored.
      await storage.delete(key);
      if (thumbKey) await storage.delete(thumbKey);
      throw err;
    }
    const saved = await Attachment.findByPk(id, { include: WITH_UPLOADER });
    res.status(201).location(`/api/setups/${setup.id}/attachments/${id}`).json(saved?.toDto());
  });

  router.get('/:attachmentId', async (req, res) => {
    const { attachment } = await attachmentOf(req);
    let bytes: Buffer;
    try {
      bytes = await storage.get(attachment.storageKey);
    } catch (err) {
      if (err instanceof ObjectNotFound) throw new HttpError(404, 'The file of this attachment is missing from storage.');
      throw err;
    }
    const inline = req.query['inline'] === '1';
    res.setHeader('Content-Type', attachment.contentType);
    res.setHeader('Cache-Control', 'private, no-store');
    res.setHeader('X-Content-Type-Options', 'nosniff');
    if (inline) res.setHeader('Content-Security-Policy', "default-src 'none'; img-src 'self'; style-src 'unsafe-inline'; sandbox");
    res.setHeader('ETag', `"${attachment.sha256}"`);
    res.attachment(attachment.fileName);
    if (inline) res.setHeader('Content-Disposition', (res.getHeader('Content-Disposition') as string).replace(/^attachment/, 'inline'));
    res.type(attachment.contentType).send(bytes);
  });

  router.get('/:attachmentId/thumbnail', async (req, res) => {
    const { attachment } = await attachmentOf(req);
    if (!attachment.thumbnailKey) throw new HttpError(404, 'This attachment has no thumbnail (only images have one).');
    const bytes = await storage.get(attachment.thumbnailKey).catch((err: unknown) => {
      if (err instanceof ObjectNotFound) throw new HttpError(404, 'The thumbnail is missing from storage.');
      throw err;
    });
    res.setHeader('Cache-Control', 'private, max-age=3600');
    res.type('image/jpeg').send(bytes);
  });

  router.delete('/:attachmentId', async (req, res) => {
    const user = currentUser(req);
    const { setup, attachment } = await attachmentOf(req);
    if (!canChangeSetup(user, setup)) throw new HttpError(403, 'You may only remove files from set-ups you may change.');
    if (setup.status === 'archived') throw new HttpError(409, 'This set-up is archived and read-only.');
    await sequelize.transaction(async (transaction) => {
      await attachment.destroy({ transaction });
      await recordFileChange(setup.id, 'detached', user, attachment, transaction);
    });
    await storage.delete(attachment.storageKey);
    if (attachment.thumbnailKey) await storage.delete(attachment.thumbnailKey);
    res.status(204).end();
  });

  return router;
}
