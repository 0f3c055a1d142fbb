// A local S3-compatible fake (s3rver) for development and tests; documents land in a git-ignored folder.
import S3rver from 's3rver';
import { mkdirSync } from 'node:fs';
import path from 'node:path';

/** Where npm start's fake keeps documents (git-ignored). */
export const DEFAULT_S3_DIRECTORY = path.resolve(__dirname, '../../../.data/objects');

export interface FakeS3 {
  endpoint: string;
  close(): Promise<void>;
}

export async function startFakeS3(options: { port?: number; directory: string }): Promise<FakeS3> {
  mkdirSync(options.directory, { recursive: true });
  const server = new S3rver({ address: '127.0.0.1', port: options.port ?? 0, silent: true, directory: options.directory });
  const address = await server.run();
  return {
    endpoint: `http://127.0.0.1:${address.port}`,
    close: () => server.close(),
  };
}

if (require.main === module) {
  const port = Number.parseInt(process.env.S3_PORT ?? '4569', 10);
  const directory = process.env.S3_DIRECTORY ?? DEFAULT_S3_DIRECTORY;
  startFakeS3({ port, directory })
    .then((s3) => console.log(`Fake S3 on ${s3.endpoint}, files in ${directory}`))
    .catch((error) => {
      console.error(`The fake S3 server could not start: ${error.message}`);
      process.exit(1);
    });
}
