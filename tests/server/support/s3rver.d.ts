/** The little of s3rver (a local S3 API for tests) that the storage test uses; it ships no types. */
declare module 's3rver' {
  import type { AddressInfo } from 'node:net';
  interface S3rverOptions {
    address?: string;
    port?: number;
    silent?: boolean;
    directory: string;
    resetOnClose?: boolean;
    configureBuckets?: { name: string; configs: string[] }[];
  }
  export default class S3rver {
    constructor(options: S3rverOptions);
    run(): Promise<AddressInfo>;
    close(): Promise<void>;
  }
}
