// s3rver 3.7 ships no types; only what scripts/s3-fake.ts uses.
declare module 's3rver' {
  import type { AddressInfo } from 'node:net';

  interface S3rverOptions {
    address?: string;
    port?: number;
    silent?: boolean;
    directory?: string;
    resetOnClose?: boolean;
    allowMismatchedSignatures?: boolean;
    vhostBuckets?: boolean;
    serviceEndpoint?: string;
    configureBuckets?: { name: string; configs?: (string | Buffer)[] }[];
  }

  class S3rver {
    constructor(options?: S3rverOptions);
    run(): Promise<AddressInfo>;
    close(): Promise<void>;
  }

  export = S3rver;
}
