/**
 * A local S3 fake (s3rver) for the upload tests: started once per test file on a port the OS
 * chooses, with one bucket, in a temporary folder that is removed afterwards.
 */
import fs from 'node:fs';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import S3rver from 's3rver';

export interface FakeS3 {
  /** The temporary folder (the fake keeps its objects in `s3/` inside it; tests may use the rest). */
  dir: string;
  endpoint: string;
  bucket: string;
}

/** Registers beforeAll/afterAll; the returned object is filled in once the fake runs. */
export function startFakeS3ForFile(bucket: string): FakeS3 {
  const fake = { dir: '', endpoint: '', bucket };
  let server: http.Server | undefined;
  beforeAll(async () => {
    fake.dir = fs.mkdtempSync(path.join(os.tmpdir(), 'sightfan-s3-'));
    const s3 = new S3rver({ directory: path.join(fake.dir, 's3'), silent: true, configureBuckets: [{ name: bucket }] });
    await s3.configureBuckets();
    const listening = http.createServer(s3.callback());
    server = listening;
    await new Promise<void>((resolve) => listening.listen(0, '127.0.0.1', resolve));
    fake.endpoint = `http://127.0.0.1:${(listening.address() as AddressInfo).port}`;
  });
  afterAll(async () => {
    await new Promise((resolve) => (server ? server.close(resolve) : resolve(undefined)));
    if (fake.dir) fs.rmSync(fake.dir, { recursive: true, force: true });
  });
  return fake;
}
