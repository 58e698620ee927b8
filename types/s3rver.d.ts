// s3rver 3.7.1 ships no types; the part scripts/fake-s3.ts and the storage tests use.
declare module "s3rver" {
  import type { IncomingMessage, ServerResponse } from "node:http";
  import type { AddressInfo } from "node:net";
  type Options = { directory: string; silent?: boolean; port?: number; address?: string; configureBuckets?: { name: string; configs: (string | Buffer)[] }[] };
  export default class S3rver {
    constructor(options: Options);
    callback(): (req: IncomingMessage, res: ServerResponse) => void;
    configureBuckets(): Promise<void>;
    run(): Promise<AddressInfo>;
    close(): Promise<void>;
  }
}
