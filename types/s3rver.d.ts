// s3rver ships no types; the little of it the local fake uses.
declare module 's3rver' {
  type Options = {
    address?: string;
    port?: number;
    silent?: boolean;
    directory?: string;
    resetOnClose?: boolean;
    configureBuckets?: { name: string; configs: unknown[] }[];
  };
  export default class S3rver {
    constructor(options: Options);
    run(): Promise<unknown>;
    close(): Promise<void>;
  }
}
