/**
 * Uploads (plans and photos of a job) and their bytes, under the job's access rules
 * (`findVisibleProject`): whoever may read the job reads its files; only who may edit the job
 * (its installer) uploads and deletes. The contract is shared/schemas/files.ts.
 *
 * An upload is checked and processed whole before anything is kept; then the objects are written,
 * then the row in a transaction that locks the job's row and checks its caps again (so uploads
 * racing each other, on any instance, cannot pass a cap together). On any failure the objects written are deleted again, so a failed
 * upload leaves neither an object nor a row.
 */
import { pipeline } from 'node:stream/promises';
import { Router, type Request, type Response } from 'express';
import multer from 'multer';
import { create as createDisposition, encodeExtended } from 'content-disposition';
import { z } from 'zod';
import type { EntityManager } from '@mikro-orm/knex';
import { FILE_LIMITS, FILE_MESSAGES, uploadFields } from '../../../shared/schemas/files';
import { HttpError } from '../../http-error';
import { requireUser } from '../../middleware/auth';
import { requestEm } from '../../middleware/request-context';
import { parseOr400 } from '../../middleware/validate';
import type { Logger } from '../../logger';
import type { PdfWork } from '../../workers/pdf-pool';
import { Placement } from '../projects/placement.entity';
import { assertCanEdit, findVisibleProject } from '../projects/project-access';
import type { User } from '../users/user.entity';
import { toFileDto } from './files.dto';
import { removeObjects } from './file-objects';
import { cleanName, processUpload } from './process-upload';
import { StorageNotFound, type FileStorage } from './storage';
import { checkRoom, storeProcessedFile } from './store-file';
import { StoredFile } from './stored-file.entity';

export interface FilesDeps {
  storage: FileStorage;
  pdf: PdfWork;
  log: Logger;
}

const fileId = z.string().regex(/^[A-Za-z0-9_-]{16,32}$/);
const notFound = () => new HttpError(404, FILE_MESSAGES.notFound);
const full = (sentence: string) => new HttpError(413, sentence, { file: sentence });

/** One file per request, held in memory (at most `FILE_LIMITS.fileBytes`), and a few short fields. */
const upload = multer({
  storage: multer.memoryStorage(),
  defParamCharset: 'utf8',
  limits: { fileSize: FILE_LIMITS.fileBytes, files: 1, fields: 8, fieldSize: 1024, parts: 10, headerPairs: 100 },
}).single('file');

/** Runs multer; its limits become sentences. */
function receive(req: Request, res: Response): Promise<void> {
  return new Promise((resolve, reject) => {
    upload(req, res, (err: unknown) => {
      if (!err) return resolve();
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') return reject(full(FILE_MESSAGES.tooLarge));
        if (err.code === 'LIMIT_UNEXPECTED_FILE' || err.code === 'LIMIT_FILE_COUNT')
          return reject(
            new HttpError(400, 'Send one file, in the form field "file".', { file: 'Send one file, in the form field "file".' }),
          );
        return reject(new HttpError(400, 'The upload form has too many or too long fields.'));
      }
      // Everything else multer (busboy) reports is about the body as sent: no boundary, a broken
      // part header, or a body that ended early (a dropped connection on a phone).
      const e = err as { message?: string };
      if (/boundary|multipart|content-type/i.test(e.message ?? ''))
        return reject(new HttpError(400, 'Send the file as multipart/form-data with the field "file".'));
      reject(new HttpError(400, 'The upload was cut off before the whole file arrived. Try again.'));
    });
  });
}

/** The file with this id, if the person may read its job; otherwise 404 (never 403: ids are not confirmed). */
async function findVisibleFile(em: EntityManager, user: User, rawId: unknown): Promise<StoredFile> {
  const id = fileId.safeParse(rawId);
  if (!id.success) throw notFound();
  const file = await em.findOne(StoredFile, { id: id.data });
  if (!file) throw notFound();
  try {
    await findVisibleProject(em, user, String(file.project.id));
  } catch (e) {
    if (e instanceof HttpError && e.status === 404) throw notFound();
    throw e;
  }
  return file;
}

/** The name a download is saved under: the uploaded name with the stored type's extension. */
function servedName(f: StoredFile, thumbnail: boolean): string {
  const stem = f.name.replace(/\.[A-Za-z0-9]{1,5}$/, '') || 'file';
  const page = f.sourcePage != null ? `-page-${f.sourcePage}` : '';
  if (thumbnail) return `${stem}${page}-thumbnail.jpg`;
  return `${stem}${page}.${f.contentType === 'image/png' ? 'png' : 'jpg'}`;
}

/** `inline` with a plain-ASCII name and always the exact name as `filename*=UTF-8''…` (RFC 6266). */
function inlineDisposition(name: string): string {
  const header = createDisposition(name, { type: 'inline' });
  return header.includes('filename*=') ? header : `${header}; filename*=${encodeExtended(name)}`;
}

/** The job's files: list and upload (mounted at /api/projects). */
export function projectFilesRoutes(deps: FilesDeps): Router {
  const r = Router();
  r.use(requireUser);

  r.get('/:id/files', async (req, res) => {
    const em = requestEm();
    const project = await findVisibleProject(em, req.user!, req.params.id);
    const files = await em.find(StoredFile, { project: project.id }, { orderBy: { createdAt: 'asc', id: 'asc' } });
    res.json({ files: files.map(toFileDto) });
  });

  r.post('/:id/files', async (req, res) => {
    const em = requestEm();
    const user = req.user!;
    // Access first: nobody's upload is read (or processed) for a job they may not change.
    const project = await findVisibleProject(em, user, req.params.id);
    assertCanEdit(user, project);
    await receive(req, res);
    const fields = parseOr400(uploadFields, req.body, 'The upload');
    if (!req.file) throw new HttpError(400, FILE_MESSAGES.noFile, { file: FILE_MESSAGES.noFile });
    if (fields.kind === 'plan' && fields.placementId != null)
      throw new HttpError(400, FILE_MESSAGES.planNoMirror, { placementId: FILE_MESSAGES.planNoMirror });
    if (fields.placementId != null && !(await em.count(Placement, { id: fields.placementId, project: project.id }))) {
      const sentence = 'Choose a mirror of this job.';
      throw new HttpError(400, `The upload has a problem: ${sentence}`, { placementId: sentence });
    }
    await checkRoom(em, project.id, 0);
    const processed = await processUpload(req.file.buffer, fields.kind, fields.page ?? 1, deps.pdf);

    const file = await storeProcessedFile(
      em,
      deps.storage,
      {
        projectId: project.id,
        kind: fields.kind,
        processed,
        name: cleanName(req.file.originalname, fields.kind === 'plan' ? 'plan' : 'photo'),
        placementId: fields.placementId ?? null,
        createdBy: user.id,
      },
      (err) => deps.log.error('An upload failed and its stored object could not be removed.', err),
    );
    res.status(201).json({ file: toFileDto(file) });
  });

  return r;
}

/** One file: its bytes, its thumbnail, and deleting it (mounted at /api/files). */
export function filesRoutes(deps: FilesDeps): Router {
  const r = Router();
  r.use(requireUser);

  async function send(req: Request, res: Response, thumbnail: boolean) {
    const file = await findVisibleFile(requestEm(), req.user!, req.params.id);
    const etag = `"${file.id}${thumbnail ? '-t' : ''}"`;
    // A file's bytes never change under its id; the browser may keep it (privately) a while.
    res.set('Cache-Control', 'private, max-age=3600');
    res.set('ETag', etag);
    res.set('X-Content-Type-Options', 'nosniff');
    if (req.get('if-none-match') === etag) {
      res.status(304).end();
      return;
    }
    let body;
    try {
      body = await deps.storage.stream(thumbnail ? file.thumbnailKey : file.storageKey);
    } catch (e) {
      if (e instanceof StorageNotFound) {
        deps.log.error(`A stored file has a row but no object in the ${deps.storage.kind} storage.`);
        throw notFound();
      }
      throw e;
    }
    res.set('Content-Type', thumbnail ? 'image/jpeg' : file.contentType);
    if (!thumbnail) res.set('Content-Length', String(file.bytes));
    res.set('Content-Disposition', inlineDisposition(servedName(file, thumbnail)));
    await pipeline(body, res);
  }

  r.get('/:id', (req, res) => send(req, res, false));
  r.get('/:id/thumbnail', (req, res) => send(req, res, true));

  r.delete('/:id', async (req, res) => {
    const em = requestEm();
    const file = await findVisibleFile(em, req.user!, req.params.id);
    const project = await findVisibleProject(em, req.user!, String(file.project.id));
    assertCanEdit(req.user!, project);
    await em.nativeDelete(StoredFile, { id: file.id });
    await removeObjects(deps.storage, [file.storageKey, file.thumbnailKey], (err) =>
      deps.log.error('A deleted file’s stored object could not be removed.', err),
    );
    res.status(204).end();
  });

  return r;
}
