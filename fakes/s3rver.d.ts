// s3rver ships no types: the part of its API the local stack and the tests use.
declare module "s3rver" {
  import type { AddressInfo } from "node:net";

  interface S3rverOptions {
    port?: number;
    address?: string;
    silent?: boolean;
    /** Where buckets and objects are kept on disk. */
    directory: string;
  }

  export default class S3rver {
    constructor(options: S3rverOptions);
    run(): Promise<AddressInfo>;
    close(): Promise<void>;
  }
}
