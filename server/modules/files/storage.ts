/**
 * Where uploaded files' bytes live, behind one small interface: a folder under the data folder
 * (the default; random names, outside the web root) or S3-compatible object storage (when
 * `S3_BUCKET` is set; several instances cannot share a local folder). Keys are made here, random
 * and meaningless; nothing about a job or a file name reaches the storage.
 */
import fs from 'node:fs';
import fsp from 'node:fs/promises';
import path from 'node:path';
import { randomBytes } from 'node:crypto';
import { Readable } from 'node:stream';
import {
  DeleteObjectCommand,
  GetObjectCommand,
  HeadObjectCommand,
  PutObjectCommand,
  S3Client,
  type S3ClientConfig,
} from '@aws-sdk/client-s3';

export interface FileStorage {
  /** 'folder' or 's3', for the start-up line and the tests. */
  readonly kind: 'folder' | 's3';
  put(key: string, data: Buffer, contentType: string): Promise<void>;
  /** The whole object; rejects with `StorageNotFound` when there is none. */
  get(key: string): Promise<Buffer>;
  /** The object as a stream; rejects with `StorageNotFound` when there is none. */
  stream(key: string): Promise<Readable>;
  /** Removes the object; no error when it is already gone. */
  delete(key: string): Promise<void>;
  exists(key: string): Promise<boolean>;
}

export class StorageNotFound extends Error {
  constructor(key: string) {
    super(`No stored object ${key}.`);
    this.name = 'StorageNotFound';
  }
}

/** A new random key: 128 bits, two hex characters of fan-out then the rest (`3f/9a0c…`). */
export function newStorageKey(): string {
  const hex = randomBytes(16).toString('hex');
  return `${hex.slice(0, 2)}/${hex.slice(2)}`;
}

const KEY = /^[0-9a-f]{2}\/[0-9a-f]{30}$/;
function checkKey(key: string): string {
  // Keys come from newStorageKey only; anything else (a path with "..", an absolute path) is a bug.
  if (!KEY.test(key)) throw new Error('Not a storage key.');
  return key;
}

/** Files in a folder: written to a temporary name and renamed, so a reader never sees half a file. */
export function folderStorage(root: string): FileStorage {
  const full = (key: string) => path.join(root, checkKey(key));
  const missing = (e: unknown) => (e as NodeJS.ErrnoException).code === 'ENOENT';
  return {
    kind: 'folder',
    async put(key, data) {
      const file = full(key);
      await fsp.mkdir(path.dirname(file), { recursive: true, mode: 0o700 });
      const tmp = `${file}.${randomBytes(6).toString('hex')}.part`;
      try {
        await fsp.writeFile(tmp, data, { mode: 0o600, flag: 'wx' });
        await fsp.rename(tmp, file);
      } catch (e) {
        await fsp.rm(tmp, { force: true });
        throw e;
      }
    },
    async get(key) {
      try {
        return await fsp.readFile(full(key));
      } catch (e) {
        throw missing(e) ? new StorageNotFound(key) : e;
      }
    },
    async stream(key) {
      try {
        const handle = await fsp.open(full(key), 'r');
        return handle.createReadStream();
      } catch (e) {
        throw missing(e) ? new StorageNotFound(key) : e;
      }
    },
    async delete(key) {
      await fsp.rm(full(key), { force: true });
    },
    async exists(key) {
      return fs.existsSync(full(key));
    },
  };
}

export interface S3Settings {
  bucket: string;
  /** Prefix for every key in the bucket, e.g. "sightfan/". */
  prefix: string;
  /** An S3-compatible service's address (MinIO, Ceph, another cloud); unset: AWS. */
  endpoint?: string;
  region: string;
  /** Unset: the AWS SDK's usual chain (environment, profile, instance role). */
  accessKeyId?: string;
  secretAccessKey?: string;
  /** Path-style addresses (`endpoint/bucket/key`), which most S3-compatible services need. */
  forcePathStyle: boolean;
}

/** S3-compatible object storage through the AWS SDK. */
export function s3Storage(s: S3Settings): FileStorage & { client: S3Client } {
  const config: S3ClientConfig = { region: s.region, forcePathStyle: s.forcePathStyle };
  if (s.endpoint) config.endpoint = s.endpoint;
  if (s.accessKeyId && s.secretAccessKey) config.credentials = { accessKeyId: s.accessKeyId, secretAccessKey: s.secretAccessKey };
  const client = new S3Client(config);
  const Key = (key: string) => `${s.prefix}${checkKey(key)}`;
  const notFound = (e: unknown) => {
    const err = e as { name?: string; $metadata?: { httpStatusCode?: number } };
    return err.name === 'NoSuchKey' || err.name === 'NotFound' || err.$metadata?.httpStatusCode === 404;
  };
  async function body(key: string) {
    try {
      const out = await client.send(new GetObjectCommand({ Bucket: s.bucket, Key: Key(key) }));
      if (!out.Body) throw new StorageNotFound(key);
      return out.Body;
    } catch (e) {
      throw notFound(e) ? new StorageNotFound(key) : e;
    }
  }
  return {
    kind: 's3',
    client,
    async put(key, data, contentType) {
      await client.send(new PutObjectCommand({ Bucket: s.bucket, Key: Key(key), Body: data, ContentType: contentType }));
    },
    async get(key) {
      return Buffer.from(await (await body(key)).transformToByteArray());
    },
    async stream(key) {
      const b = await body(key);
      return b instanceof Readable ? b : Readable.from(Buffer.from(await b.transformToByteArray()));
    },
    async delete(key) {
      await client.send(new DeleteObjectCommand({ Bucket: s.bucket, Key: Key(key) }));
    },
    async exists(key) {
      try {
        await client.send(new HeadObjectCommand({ Bucket: s.bucket, Key: Key(key) }));
        return true;
      } catch (e) {
        if (notFound(e)) return false;
        throw e;
      }
    },
  };
}

export type StorageSettings = { kind: 'folder'; dir: string } | ({ kind: 's3' } & S3Settings);

export function createStorage(settings: StorageSettings): FileStorage {
  return settings.kind === 's3' ? s3Storage(settings) : folderStorage(settings.dir);
}
