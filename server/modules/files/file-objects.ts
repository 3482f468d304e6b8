/**
 * Removing stored objects after their rows are gone. Rows go first, in the caller's transaction;
 * the objects are removed once it has committed, so a row never points at a missing object. An
 * object whose removal fails is left behind (logged by kind only) rather than failing the request.
 */
import type { EntityManager } from '@mikro-orm/knex';
import type { FilterQuery } from '@mikro-orm/core';
import type { FileStorage } from './storage';
import { StoredFile } from './stored-file.entity';

/** The storage keys of the files matching `where` (file and thumbnail). */
export async function storageKeysOf(em: EntityManager, where: FilterQuery<StoredFile>): Promise<string[]> {
  const rows = await em.find(StoredFile, where, { fields: ['storageKey', 'thumbnailKey'] });
  return rows.flatMap((f) => [f.storageKey, f.thumbnailKey]);
}

export async function removeObjects(storage: FileStorage, keys: string[], onError?: (e: unknown) => void): Promise<void> {
  const results = await Promise.allSettled(keys.map((k) => storage.delete(k)));
  for (const r of results) if (r.status === 'rejected') onError?.(r.reason);
}
