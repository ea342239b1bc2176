import { and, desc, eq } from 'drizzle-orm';
import express, { type Request, type Response, type Router } from 'express';
import multer from 'multer';
import contentDisposition from 'content-disposition';
import { stripControlCharacters } from '@seamwright/api';
import { fileTypeFromBuffer } from 'file-type';
import type { AppContext } from '../app-context';
import { currentUser } from '../auth/sessions';
import { newId } from '../auth/tokens';
import type { Upload } from '../db/schema';
import { HttpError } from '../http/errors';
import { idSchema, parseOr400 } from '../http/validate';
import { patternOf } from '../http/pattern-access';
import { fileStoreOf } from '../storage/file-store-of';
import { sendStoredFile } from '../storage/send-stored';

/** Largest reference image accepted. */
export const MAX_UPLOAD_BYTES = 10 * 1024 * 1024;

/** Image types accepted, by the type their bytes show (not their name). */
const ACCEPTED: Record<string, string> = { 'image/png': 'png', 'image/jpeg': 'jpg', 'image/webp': 'webp' };

export function uploadJson(u: Upload) {
  return {
    id: u.id,
    fileName: u.fileName,
    mimeType: u.mimeType,
    bytes: u.bytes,
    sha256: u.sha256,
    createdAt: u.createdAt.toISOString(),
    url: `/api/patterns/${u.patternId}/uploads/${u.id}/file`,
  };
}

/**
 * A harmless version of a client's file name that keeps its text (any script, emoji): NFC, without
 * control characters (C0, DEL, C1), bidirectional overrides (which can disguise an extension), path
 * separators or leading dots, at most 120 characters. It only names the download; the file is stored
 * under its id.
 */
export const cleanFileName = (name: string) =>
  Array.from(
    stripControlCharacters(name.normalize('NFC'))
      .replace(/[\u202a-\u202e\u2066-\u2069]/g, '')
      .replace(/[/\\]/g, '_')
      .trim()
      .replace(/^\.+/, ''),
  )
    .slice(0, 120)
    .join('') || 'image';

/** `/api/patterns/:id/uploads…`: reference images to trace on the drafting board. */
export function uploadsRouter(ctx: AppContext): Router {
  const d = ctx.data;
  const { uploads } = d.t;
  const router = express.Router({ mergeParams: true });
  const files = fileStoreOf(ctx);
  const receive = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: MAX_UPLOAD_BYTES, files: 1, fields: 5, fieldSize: 1024, parts: 8 },
    // Browsers send a UTF-8 name as raw bytes in filename="…"; `filename*=UTF-8''…` (RFC 5987) is
    // decoded by its own charset either way.
    defParamCharset: 'utf8',
  }).single('file');

  const readFile = (req: Request, res: Response) =>
    new Promise<Express.Multer.File>((resolve, reject) => {
      receive(req, res, (err: unknown) => {
        if (err instanceof multer.MulterError) {
          if (err.code === 'LIMIT_FILE_SIZE') return reject(new HttpError(413, 'The image is larger than 10 MB'));
          return reject(new HttpError(400, `Bad upload: ${err.message}`, [{ path: err.field ?? 'file', message: err.code }]));
        }
        if (err) return reject(new HttpError(400, 'Bad upload: the multipart body could not be read'));
        if (!req.file) return reject(new HttpError(400, 'No file in the upload', [{ path: 'file', message: 'required' }]));
        resolve(req.file);
      });
    });

  router.post('/', async (req, res) => {
    const { pattern } = patternOf(res, 'edit');
    const user = currentUser(req);
    if (!req.is('multipart/form-data')) throw new HttpError(415, 'Send the image as multipart/form-data, field "file"');
    const file = await readFile(req, res);
    const type = await fileTypeFromBuffer(file.buffer);
    const ext = type ? ACCEPTED[type.mime] : undefined;
    if (!type || !ext) {
      throw new HttpError(415, 'Only PNG, JPEG and WebP images can be uploaded', {
        detected: type?.mime ?? 'unknown',
        accepted: Object.keys(ACCEPTED),
      });
    }
    const id = newId();
    const storagePath = `uploads/${user.id}/${id}.${ext}`;
    const stored = await files.put(storagePath, file.buffer);
    try {
      const [row] = await d.db
        .insert(uploads)
        .values({
          id,
          patternId: pattern.id,
          uploaderId: user.id,
          fileName: cleanFileName(file.originalname),
          mimeType: type.mime,
          bytes: stored.size,
          sha256: stored.sha256,
          storagePath,
          createdAt: new Date(),
        })
        .returning();
      res.status(201).json({ upload: uploadJson(row) });
    } catch (err) {
      await files.remove([storagePath]);
      throw err;
    }
  });

  router.get('/', async (req, res) => {
    const { pattern } = patternOf(res);
    const rows = await d.db.select().from(uploads).where(eq(uploads.patternId, pattern.id)).orderBy(desc(uploads.createdAt));
    res.json({ items: rows.map(uploadJson) });
  });

  const findUpload = async (patternId: string, raw: unknown) => {
    const uploadId = parseOr400(idSchema, raw, 'Invalid upload id');
    const [row] = await d.db.select().from(uploads).where(and(eq(uploads.id, uploadId), eq(uploads.patternId, patternId)));
    if (!row) throw new HttpError(404, 'Upload not found');
    return row;
  };

  router.get('/:uploadId/file', async (req, res) => {
    const { pattern } = patternOf(res);
    const row = await findUpload(pattern.id, req.params.uploadId);
    // RFC 6266: an ASCII fallback in filename= and the exact name in filename*=UTF-8''… (RFC 5987).
    res.setHeader('Content-Disposition', contentDisposition(row.fileName, { type: 'inline' }));
    res.setHeader('Cache-Control', 'private, max-age=3600');
    if (!(await sendStoredFile(req, res, files, row.storagePath, { contentType: row.mimeType, sha256: row.sha256 }))) {
      res.removeHeader('Content-Disposition');
      res.removeHeader('Cache-Control');
      throw new HttpError(404, 'Upload not found');
    }
  });

  router.delete('/:uploadId', async (req, res) => {
    const { pattern } = patternOf(res, 'edit');
    const row = await findUpload(pattern.id, req.params.uploadId);
    await d.db.delete(uploads).where(eq(uploads.id, row.id));
    await files.remove([row.storagePath]);
    res.status(204).end();
  });

  return router;
}
