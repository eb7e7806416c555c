// s3rver 3.7 ships no type declarations; this covers the part of its API we use.
declare module 's3rver' {
  export type S3rverBucket = { name: string; configs?: Array<string | Buffer> };
  export type S3rverOptions = {
    address?: string;
    port?: number;
    directory?: string;
    silent?: boolean;
    resetOnClose?: boolean;
    allowMismatchedSignatures?: boolean;
    vhostBuckets?: boolean;
    configureBuckets?: S3rverBucket[];
  };
  export default class S3rver {
    constructor(options?: S3rverOptions);
    run(): Promise<{ address: string; port: number; family: string }>;
    close(): Promise<void>;
  }
}
