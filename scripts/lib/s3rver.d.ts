declare module "s3rver" {
  interface S3rverOptions {
    port?: number;
    address?: string;
    silent?: boolean;
    directory: string;
    configureBuckets?: { name: string; configs: (string | Buffer)[] }[];
  }
  export default class S3rver {
    constructor(options: S3rverOptions);
    run(): Promise<{ address: string; port: number }>;
    close(): Promise<void>;
    /** Koa's middleware list (s3rver extends Koa); composed when the server starts. */
    middleware: ((ctx: never, next: () => Promise<unknown>) => unknown)[];
    store: { getResourcePath(bucket: string, key: string | undefined, resource: string): string };
  }
}
