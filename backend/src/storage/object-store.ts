// Receipt documents in an S3-compatible object store, through the AWS SDK; PostgreSQL keeps only keys.
import { CreateBucketCommand, GetObjectCommand, HeadBucketCommand, PutObjectCommand, S3Client } from '@aws-sdk/client-s3';
import type { Readable } from 'node:stream';
import type { AppConfig } from '../config';

export interface ObjectStore {
  put(key: string, body: Buffer, contentType: string): Promise<void>;
  get(key: string): Promise<Buffer>;
  stream(key: string): Promise<{ body: Readable; contentType?: string; length?: number }>;
  ensureBucket(): Promise<void>;
  close(): void;
}

export function createObjectStore(storage: AppConfig['storage']): ObjectStore {
  const client = new S3Client({
    endpoint: storage.endpoint,
    region: storage.region,
    forcePathStyle: storage.forcePathStyle,
    credentials: { accessKeyId: storage.accessKeyId, secretAccessKey: storage.secretAccessKey },
    // Newer SDKs add checksums that simpler S3-compatible stores do not understand.
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
  });
  const Bucket = storage.bucket;

  return {
    async put(key, body, contentType) {
      await client.send(new PutObjectCommand({ Bucket, Key: key, Body: body, ContentType: contentType }));
    },
    async get(key) {
      const result = await client.send(new GetObjectCommand({ Bucket, Key: key }));
      return Buffer.from(await result.Body!.transformToByteArray());
    },
    async stream(key) {
      const result = await client.send(new GetObjectCommand({ Bucket, Key: key }));
      return { body: result.Body as Readable, contentType: result.ContentType, length: result.ContentLength };
    },
    async ensureBucket() {
      try {
        await client.send(new HeadBucketCommand({ Bucket }));
      } catch {
        await client.send(new CreateBucketCommand({ Bucket }));
      }
    },
    close() {
      client.destroy();
    },
  };
}
