// s3rver ships no types; the little the S3 storage test uses.
declare module 's3rver' {
  import type { AddressInfo } from 'node:net';
  export default class S3rver {
    constructor(options: {
      port?: number;
      address?: string;
      silent?: boolean;
      directory: string;
      configureBuckets?: { name: string }[];
    });
    run(): Promise<AddressInfo>;
    close(): Promise<void>;
  }
}
