declare module 's3rver' {
  interface S3rverOptions {
    address?: string;
    port?: number;
    directory: string;
    silent?: boolean;
    configureBuckets?: { name: string }[];
  }
  /** The parts of s3rver 3.7 the tests use (it ships no type declarations). */
  export default class S3rver {
    constructor(options: S3rverOptions);
    run(): Promise<{ address: string; port: number }>;
    close(): Promise<void>;
  }
}
