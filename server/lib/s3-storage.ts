import { DeleteObjectCommand, GetObjectCommand, NoSuchKey, PutObjectCommand, S3Client, S3ServiceException } from '@aws-sdk/client-s3';
import { isValidStorageKey, type FileStorage } from './storage';

/** Where the S3 driver keeps files: any S3-compatible service (AWS S3, MinIO, a provider's object storage). */
export type S3StorageConfig = {
  bucket: string;
  region: string;
  /** The service address; omitted for AWS S3 itself. */
  endpoint?: string;
  /** Both or neither: neither uses the SDK's own chain (environment, instance or container role). */
  accessKeyId?: string;
  secretAccessKey?: string;
  forcePathStyle: boolean;
};

const checked = (key: string) => {
  if (!isValidStorageKey(key)) throw new Error(`invalid storage key: ${key}`);
  return key;
};

/**
 * Files as objects in one bucket of an S3-compatible service, under the same keys as on disk. A put is one PutObject,
 * which S3 stores whole or not at all. Checksums are computed and checked only where the operation requires them, as
 * many S3-compatible services (and the test's fake) do not accept the SDK's newer default checksums.
 */
export function s3Storage(config: S3StorageConfig): FileStorage {
  const client = new S3Client({
    region: config.region,
    endpoint: config.endpoint,
    forcePathStyle: config.forcePathStyle,
    credentials: config.accessKeyId && config.secretAccessKey ? { accessKeyId: config.accessKeyId, secretAccessKey: config.secretAccessKey } : undefined,
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
  });
  const Bucket = config.bucket;
  return {
    async put(key, data) {
      await client.send(new PutObjectCommand({ Bucket, Key: checked(key), Body: data, ContentLength: data.length }));
    },
    async get(key) {
      try {
        const res = await client.send(new GetObjectCommand({ Bucket, Key: checked(key) }));
        return res.Body ? Buffer.from(await res.Body.transformToByteArray()) : null;
      } catch (err) {
        // Services differ: some answer NoSuchKey, some a bare 404. A missing bucket is a configuration fault, not a missing file.
        if (err instanceof NoSuchKey) return null;
        if (err instanceof S3ServiceException && err.$metadata.httpStatusCode === 404 && err.name !== 'NoSuchBucket') return null;
        throw err;
      }
    },
    async remove(key) {
      await client.send(new DeleteObjectCommand({ Bucket, Key: checked(key) }));
    },
  };
}
