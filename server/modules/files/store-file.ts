/**
 * Keeping a processed file: the one path every stored plan or photo takes (the upload route and the
 * demo seeder). The objects are written first, then the row in a transaction that locks the job's
 * row and checks its caps again (so uploads racing each other, on any instance, cannot pass a cap
 * together); on any failure the objects written are deleted, so nothing is left behind.
 */
import { randomBytes } from 'node:crypto';
import { LockMode } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/knex';
import { FILE_LIMITS, FILE_MESSAGES, type FileKind } from '../../../shared/schemas/files';
import { HttpError } from '../../http-error';
import { removeObjects } from './file-objects';
import type { ProcessedUpload } from './process-upload';
import { newStorageKey, type FileStorage } from './storage';
import { StoredFile } from './stored-file.entity';
import { Project } from '../projects/project.entity';

/** 144 random bits, URL-safe: not guessable, and no order to walk. */
export const newFileId = () => randomBytes(18).toString('base64url');

const full = (sentence: string) => new HttpError(413, sentence, { file: sentence });

/** How many files and bytes the job keeps now. */
async function usage(em: EntityManager, projectId: number): Promise<{ count: number; bytes: number }> {
  const rows: { n: number | string; b: number | string | null }[] = await em
    .getConnection()
    // Inside a transaction the query must run on its connection (SQLite has one; another would wait forever).
    .execute('select count(*) as n, sum(bytes) as b from stored_file where project_id = ?', [projectId], 'all', em.getTransactionContext());
  return { count: Number(rows[0]?.n ?? 0), bytes: Number(rows[0]?.b ?? 0) };
}

/** 413 with a sentence when the job cannot take `adding` more bytes (or one more file). */
export async function checkRoom(em: EntityManager, projectId: number, adding: number): Promise<void> {
  const now = await usage(em, projectId);
  if (now.count >= FILE_LIMITS.filesPerJob) throw full(FILE_MESSAGES.tooMany);
  if (now.bytes + adding > FILE_LIMITS.jobBytes || (adding === 0 && now.bytes >= FILE_LIMITS.jobBytes)) throw full(FILE_MESSAGES.jobFull);
}

export async function storeProcessedFile(
  em: EntityManager,
  storage: FileStorage,
  file: {
    projectId: number;
    kind: FileKind;
    processed: ProcessedUpload;
    /** The name to show, already cleaned (`cleanName`). */
    name: string;
    placementId: number | null;
    createdBy: number | null;
  },
  onOrphan: (e: unknown) => void,
): Promise<StoredFile> {
  const { processed } = file;
  const storageKey = newStorageKey();
  const thumbnailKey = newStorageKey();
  const written: string[] = [];
  try {
    written.push(storageKey);
    await storage.put(storageKey, processed.data, processed.contentType);
    written.push(thumbnailKey);
    await storage.put(thumbnailKey, processed.thumbnail, 'image/jpeg');
    return await em.transactional(async (tx) => {
      // The check and the insert are one step: the job's row stays locked until this commits, so a
      // rival upload (here or on another instance) counts after this row is in. PostgreSQL takes a
      // row lock (FOR UPDATE); SQLite has one connection, so its transactions take turns anyway.
      await tx.lock(tx.getReference(Project, file.projectId), LockMode.PESSIMISTIC_WRITE);
      await checkRoom(tx, file.projectId, processed.data.length);
      return tx.create(StoredFile, {
        id: newFileId(),
        project: file.projectId,
        kind: file.kind,
        contentType: processed.contentType,
        bytes: processed.data.length,
        name: file.name,
        widthPx: processed.widthPx,
        heightPx: processed.heightPx,
        placement: file.placementId,
        sourcePage: processed.sourcePage,
        sourcePages: processed.sourcePages,
        storageKey,
        thumbnailKey,
        createdBy: file.createdBy,
      });
    });
  } catch (e) {
    await removeObjects(storage, written, onOrphan);
    throw e;
  }
}
