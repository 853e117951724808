/** The part of s3rver (a local S3 stand-in used by the storage tests) that the tests use; the package ships no types. */
declare module "s3rver" {
  interface S3rverOptions {
    address?: string;
    port?: number;
    silent?: boolean;
    directory?: string;
    resetOnClose?: boolean;
    configureBuckets?: { name: string }[];
  }
  class S3rver {
    constructor(options: S3rverOptions);
    run(): Promise<{ address: string; port: number }>;
    close(): Promise<void>;
  }
  export default S3rver;
}
