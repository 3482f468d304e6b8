/**
 * The two storage backends pass the same tests: the folder under the data folder, and S3 through
 * the AWS SDK against s3rver (a local S3 fake this file starts on a port the OS picks).
 */
import path from 'node:path';
import { text } from 'node:stream/consumers';
import { folderStorage, newStorageKey, s3Storage, StorageNotFound, type FileStorage } from '../../server/modules/files/storage';
import { startFakeS3ForFile } from './fake-s3';

const BUCKET = 'sightfan-test';
const s3 = startFakeS3ForFile(BUCKET);

const backends: [string, () => FileStorage][] = [
  ['the folder', () => folderStorage(path.join(s3.dir, 'uploads'))],
  [
    'S3 (s3rver)',
    () =>
      s3Storage({
        bucket: BUCKET,
        prefix: 'sightfan/',
        endpoint: s3.endpoint,
        region: 'us-east-1',
        // s3rver's own fixed test credentials.
        accessKeyId: 'S3RVER',
        secretAccessKey: 'S3RVER',
        forcePathStyle: true,
      }),
  ],
];

describe.each(backends)('%s', (_name, make) => {
  let storage: FileStorage;
  beforeAll(() => {
    storage = make();
  });

  it('gives back exactly the bytes it was given, whole and as a stream', async () => {
    const key = newStorageKey();
    const bytes = Buffer.from(Array.from({ length: 70_000 }, (_, i) => (i * 31) % 256));
    await storage.put(key, bytes, 'image/png');
    expect(await storage.exists(key)).toBe(true);
    expect((await storage.get(key)).equals(bytes)).toBe(true);
    const streamed: Buffer[] = [];
    for await (const chunk of await storage.stream(key)) streamed.push(Buffer.from(chunk));
    expect(Buffer.concat(streamed).equals(bytes)).toBe(true);
  });

  it('forgets a deleted object, and deleting it twice is no error', async () => {
    const key = newStorageKey();
    await storage.put(key, Buffer.from('x'), 'image/jpeg');
    await storage.delete(key);
    expect(await storage.exists(key)).toBe(false);
    await expect(storage.delete(key)).resolves.toBeUndefined();
  });

  it('says "not found" for a key it never had, for a whole read and a stream', async () => {
    const key = newStorageKey();
    expect(await storage.exists(key)).toBe(false);
    await expect(storage.get(key)).rejects.toBeInstanceOf(StorageNotFound);
    await expect(storage.stream(key)).rejects.toBeInstanceOf(StorageNotFound);
  });

  it('replaces an object written again under its key', async () => {
    const key = newStorageKey();
    await storage.put(key, Buffer.from('first'), 'image/png');
    await storage.put(key, Buffer.from('second'), 'image/png');
    expect(await text(await storage.stream(key))).toBe('second');
  });

  it('refuses a key it did not make (a path that climbs out of the storage)', async () => {
    await expect(storage.put('../../etc/passwd', Buffer.from('x'), 'image/png')).rejects.toThrow('Not a storage key.');
    await expect(storage.get('ab/../../x')).rejects.toThrow('Not a storage key.');
  });
});

describe('keys', () => {
  it('are random: 10 000 of them never repeat and all have the one shape', () => {
    const keys = new Set(Array.from({ length: 10_000 }, newStorageKey));
    expect(keys.size).toBe(10_000);
    for (const k of keys) expect(k).toMatch(/^[0-9a-f]{2}\/[0-9a-f]{30}$/);
  });
});
