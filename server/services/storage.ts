// Object storage for uploaded videos through the AWS SDK: the hosted service in production, the local
// S3 stand-in in development, the demo and the tests.
import {
  DeleteObjectCommand,
  GetObjectCommand,
  HeadObjectCommand,
  PutObjectCommand,
  S3Client,
} from '@aws-sdk/client-s3';
import type { Readable } from 'node:stream';
import type { Env } from '../config/env';

export interface StoredObject {
  body: Readable;
  /** Bytes in this answer (the range's length for a range). */
  length: number;
  contentType: string | undefined;
}

export interface Storage {
  put(key: string, body: Readable | Buffer, opts: { length: number; contentType: string }): Promise<void>;
  /** The object, or the inclusive byte range of it. */
  get(key: string, range?: { start: number; end: number }): Promise<StoredObject>;
  exists(key: string): Promise<boolean>;
  delete(key: string): Promise<void>;
  close(): void;
}

export function createStorage(env: Env): Storage {
  const client = new S3Client({
    region: env.S3_REGION,
    ...(env.S3_ENDPOINT ? { endpoint: env.S3_ENDPOINT } : {}),
    ...(env.S3_ACCESS_KEY_ID
      ? { credentials: { accessKeyId: env.S3_ACCESS_KEY_ID, secretAccessKey: env.S3_SECRET_ACCESS_KEY } }
      : {}),
    // Path-style addressing for the stand-in; checksums only when required, or streamed uploads are
    // stored with the chunk framing inside the object.
    forcePathStyle: true,
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
  });
  const Bucket = env.S3_BUCKET;
  return {
    async put(key, body, { length, contentType }) {
      await client.send(
        new PutObjectCommand({ Bucket, Key: key, Body: body, ContentLength: length, ContentType: contentType }),
      );
    },
    async get(key, range) {
      const out = await client.send(
        new GetObjectCommand({ Bucket, Key: key, ...(range ? { Range: `bytes=${range.start}-${range.end}` } : {}) }),
      );
      return { body: out.Body as Readable, length: Number(out.ContentLength ?? 0), contentType: out.ContentType };
    },
    async exists(key) {
      try {
        await client.send(new HeadObjectCommand({ Bucket, Key: key }));
        return true;
      } catch (err) {
        if ((err as { name?: string }).name === 'NotFound') return false;
        throw err;
      }
    },
    async delete(key) {
      await client.send(new DeleteObjectCommand({ Bucket, Key: key }));
    },
    close() {
      client.destroy();
    },
  };
}
