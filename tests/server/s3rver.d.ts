// s3rver ships no types; what the storage tests use of it.
declare module 's3rver' {
  import type { IncomingMessage, ServerResponse } from 'node:http';
  interface S3rverOptions {
    directory?: string;
    silent?: boolean;
    resetOnClose?: boolean;
    configureBuckets?: { name: string; configs?: (string | Buffer)[] }[];
    vhostBuckets?: boolean;
  }
  export default class S3rver {
    constructor(options?: S3rverOptions);
    callback(): (req: IncomingMessage, res: ServerResponse) => void;
    configureBuckets(): Promise<void>;
  }
}
