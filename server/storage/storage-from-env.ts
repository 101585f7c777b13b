import type { Env } from "../env";
import type { BlobStorage } from "./blob-storage";
import { createDiskStorage } from "./disk-storage";
import { createS3Storage } from "./s3-storage";

/** The uploads storage the configuration asks for: the local disk, or an S3-compatible object store. */
export function storageFromEnv(env: Env): { kind: "disk" | "s3"; storage: BlobStorage; close(): void } {
  if (env.STORAGE === "s3") {
    const s3 = createS3Storage({
      bucket: env.S3_BUCKET!,
      endpoint: env.S3_ENDPOINT,
      region: env.S3_REGION,
      accessKeyId: env.S3_ACCESS_KEY_ID,
      secretAccessKey: env.S3_SECRET_ACCESS_KEY,
      forcePathStyle: env.S3_FORCE_PATH_STYLE === "true",
      prefix: env.S3_PREFIX,
    });
    return { kind: "s3", storage: s3, close: () => s3.destroy() };
  }
  return { kind: "disk", storage: createDiskStorage(env.UPLOADS_DIR), close: () => {} };
}
