// The small part of s3rver's API the storage test uses (the package ships no types).
declare module 's3rver' {
  import type { AddressInfo } from 'node:net';
  interface S3rverOptions {
    port?: number;
    address?: string;
    silent?: boolean;
    directory: string;
    configureBuckets?: Array<{ name: string; configs: unknown[] }>;
  }
  export default class S3rver {
    constructor(options: S3rverOptions);
    run(): Promise<AddressInfo>;
    close(): Promise<void>;
  }
}
