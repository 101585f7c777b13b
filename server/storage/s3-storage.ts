import {
  DeleteObjectCommand,
  GetObjectCommand,
  NoSuchKey,
  PutObjectCommand,
  S3Client,
  S3ServiceException,
} from "@aws-sdk/client-s3";
import { assertValidKey, type BlobStorage } from "./blob-storage";

export interface S3StorageConfig {
  bucket: string;
  /** Any S3-compatible endpoint (for example a MinIO or a cloud provider's URL); AWS when unset. */
  endpoint?: string;
  region: string;
  accessKeyId?: string;
  secretAccessKey?: string;
  /** Bucket in the path (`endpoint/bucket/key`) rather than the host name, as most non-AWS stores want. */
  forcePathStyle: boolean;
  /** Key prefix, so one bucket can hold several installations' uploads. */
  prefix?: string;
}

/**
 * Uploads in an S3-compatible object store, so every app process on every machine sees the same
 * files. A put is one PutObject: the store makes the object visible whole or not at all.
 */
export function createS3Storage(config: S3StorageConfig): BlobStorage & { destroy(): void } {
  const client = new S3Client({
    region: config.region,
    endpoint: config.endpoint,
    forcePathStyle: config.forcePathStyle,
    credentials:
      config.accessKeyId && config.secretAccessKey
        ? { accessKeyId: config.accessKeyId, secretAccessKey: config.secretAccessKey }
        : undefined,
    // Checksums only where the operation requires one: older and smaller S3-compatible servers
    // refuse the newer default trailing checksums.
    requestChecksumCalculation: "WHEN_REQUIRED",
    responseChecksumValidation: "WHEN_REQUIRED",
    // A slow store answers 503 in time rather than holding a request for minutes.
    maxAttempts: 3,
  });
  const objectKey = (key: string) => {
    assertValidKey(key);
    return config.prefix ? `${config.prefix.replace(/\/+$/, "")}/${key}` : key;
  };
  return {
    async put(key, data) {
      await client.send(new PutObjectCommand({ Bucket: config.bucket, Key: objectKey(key), Body: data }));
    },
    async get(key) {
      try {
        const out = await client.send(new GetObjectCommand({ Bucket: config.bucket, Key: objectKey(key) }));
        if (!out.Body) return null;
        return Buffer.from(await out.Body.transformToByteArray());
      } catch (err) {
        if (err instanceof NoSuchKey) return null;
        if (err instanceof S3ServiceException && err.$metadata.httpStatusCode === 404) return null;
        throw err;
      }
    },
    async delete(key) {
      // DeleteObject of a missing key succeeds in S3, as our interface asks.
      await client.send(new DeleteObjectCommand({ Bucket: config.bucket, Key: objectKey(key) }));
    },
    destroy() {
      client.destroy();
    },
  };
}
