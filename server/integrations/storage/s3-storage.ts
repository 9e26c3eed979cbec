import { DeleteObjectCommand, GetObjectCommand, NoSuchKey, PutObjectCommand, S3Client } from '@aws-sdk/client-s3';
import type { FileStorage } from './storage';

export interface S3StorageOptions {
  bucket: string;
  region: string;
  /** An S3-compatible endpoint (self-hosted or a local stand-in); unset for the provider's own. */
  endpoint?: string;
  accessKeyId: string;
  secretAccessKey: string;
  /** Bucket in the path rather than the host name, as most S3-compatible servers expect. */
  forcePathStyle?: boolean;
  prefix?: string;
}

/** Photos in S3-compatible object storage, behind the same interface as the disk. */
export function s3Storage(options: S3StorageOptions): FileStorage {
  const client = new S3Client({
    region: options.region,
    endpoint: options.endpoint,
    forcePathStyle: options.forcePathStyle ?? Boolean(options.endpoint),
    credentials: { accessKeyId: options.accessKeyId, secretAccessKey: options.secretAccessKey },
  });
  const key = (k: string) => `${options.prefix ?? ''}${k}`;
  return {
    async put(k, bytes, contentType) {
      await client.send(new PutObjectCommand({ Bucket: options.bucket, Key: key(k), Body: bytes, ContentType: contentType }));
    },
    async get(k) {
      try {
        const out = await client.send(new GetObjectCommand({ Bucket: options.bucket, Key: key(k) }));
        return out.Body ? Buffer.from(await out.Body.transformToByteArray()) : null;
      } catch (err) {
        if (err instanceof NoSuchKey || (err as { name?: string }).name === 'NoSuchKey') return null;
        throw err;
      }
    },
    async delete(k) {
      await client.send(new DeleteObjectCommand({ Bucket: options.bucket, Key: key(k) }));
    },
  };
}
