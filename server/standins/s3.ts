// Local stand-in for S3-style object storage (s3rver) on loopback, keeping objects under the instance's
// data folder; the video bucket is created on start.
import S3rver from 's3rver';
import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import type { StandIn } from './index';

export interface S3StandInOptions {
  port: number;
  host?: string;
  directory: string;
  bucket: string;
}

export async function startS3StandInAt(opts: S3StandInOptions): Promise<StandIn & { port: number }> {
  mkdirSync(opts.directory, { recursive: true });
  const server = new S3rver({
    address: opts.host ?? '127.0.0.1',
    port: opts.port,
    directory: opts.directory,
    silent: true,
    configureBuckets: [{ name: opts.bucket, configs: [] }],
  });
  const address = await server.run();
  return {
    name: `s3 (127.0.0.1:${address.port}, bucket ${opts.bucket})`,
    port: address.port,
    stop: () => server.close(),
  };
}

/** Starts the stand-in where S3_ENDPOINT points, storing under STANDIN_DATA_DIR/s3. */
export async function startS3StandIn(env: NodeJS.ProcessEnv): Promise<StandIn> {
  const endpoint = env.S3_ENDPOINT;
  if (!endpoint) throw new Error('S3_ENDPOINT is not set: the S3 stand-in needs a port');
  const url = new URL(endpoint);
  return startS3StandInAt({
    host: url.hostname,
    port: Number(url.port),
    directory: join(env.STANDIN_DATA_DIR ?? join(process.cwd(), '.data', 'standins'), 's3'),
    bucket: env.S3_BUCKET ?? 'rackturn-videos',
  });
}
