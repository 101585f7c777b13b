import type { AppContext } from "../context";
import type { BlobStorage } from "./blob-storage";
import { createDiskStorage } from "./disk-storage";

const storages = new WeakMap<AppContext, BlobStorage>();

/** Where uploads (plan images, finding photos) live: the context's storage, else the uploads folder on disk. */
export function uploadsStorage(ctx: AppContext): BlobStorage {
  if (ctx.storage) return ctx.storage;
  let s = storages.get(ctx);
  if (!s) storages.set(ctx, (s = createDiskStorage(ctx.config.uploadsDir)));
  return s;
}
