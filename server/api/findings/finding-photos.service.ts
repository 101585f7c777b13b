import { randomUUID } from "node:crypto";
import { readFile } from "node:fs/promises";
import { and, eq } from "drizzle-orm";
import type { AppContext } from "../../context";
import { findingPhotos } from "../../db/schema/index";
import { HttpError } from "../../lib/http-error";
import { checkPlanImageHeader } from "../plans/image-intake";
import { ImageDecodeError, type ImageDecoder } from "../plans/image-decoder";
import { planImageDecoder } from "../plans/plan-resources";
import { uploadsStorage } from "../../storage/uploads-storage";
import type { Viewer } from "../../access/store-access";
import { loadFindingRow } from "./findings.service";

/** Phone photos are a few MB; the pixel budget guards against decompression bombs as for plans. */
export const PHOTO_LIMITS = {
  maxBytes: 15 * 1024 * 1024,
  maxPixels: 40_000_000,
  displayMaxSide: 2048,
  thumbMaxSide: 320,
};
const EXT = { "image/png": "png", "image/jpeg": "jpg" } as const;

/**
 * Once a decoding place is free (bounded queue), checks the photo by its content (PNG/JPEG magic
 * bytes, then the header's size), makes a display copy and a thumbnail on the CPU pool, and stores
 * both through the blob storage.
 */
export async function addFindingPhoto(
  ctx: AppContext,
  viewer: Viewer,
  userId: string,
  findingId: string,
  file: Express.Multer.File | undefined,
) {
  const { row } = await loadFindingRow(ctx, viewer, findingId);
  if (!file)
    throw new HttpError(400, "validation_failed", 'Attach the photo in the form field "photo".', {
      photo: "is required (a PNG or JPEG file)",
    });
  const decoder = planImageDecoder(ctx);
  return decoder.withSlot(async () => storePhoto(ctx, viewer, userId, row.id, await readFile(file.path), decoder));
}

async function storePhoto(
  ctx: AppContext,
  viewer: Viewer,
  userId: string,
  findingId: string,
  data: Buffer,
  decoder: ImageDecoder,
): Promise<string> {
  let header;
  try {
    header = checkPlanImageHeader(data, PHOTO_LIMITS.maxPixels);
  } catch (err) {
    if (err instanceof HttpError && err.code === "unsupported_image") {
      throw new HttpError(
        415,
        "unsupported_image",
        "The photo is not a PNG or JPEG image (its content was checked, not its name).",
        { photo: "must be a PNG or JPEG image" },
      );
    }
    throw err;
  }
  let decoded;
  try {
    decoded = await decoder.decode({
      data,
      mime: header.mime,
      displayMaxSide: PHOTO_LIMITS.displayMaxSide,
      thumbMaxSide: PHOTO_LIMITS.thumbMaxSide,
    });
  } catch (err) {
    if (err instanceof ImageDecodeError)
      throw new HttpError(
        422,
        "unreadable_image",
        `The photo could not be decoded: the file is damaged or incomplete (${err.message}).`,
        { photo: "could not be decoded" },
      );
    throw err;
  }
  const id = randomUUID();
  const prefix = `findings/${viewer.companyId}/${findingId}/${id}`;
  const key = `${prefix}/photo.${EXT[header.mime]}`;
  const thumbKey = `${prefix}/thumb.${EXT[header.mime]}`;
  const storage = uploadsStorage(ctx);
  await storage.put(key, Buffer.from(decoded.display));
  await storage.put(thumbKey, Buffer.from(decoded.thumb));
  try {
    await ctx.db
      .insert(findingPhotos)
      .values({ id, findingId, companyId: viewer.companyId, key, thumbKey, mime: header.mime, byId: userId });
  } catch (err) {
    await Promise.allSettled([storage.delete(key), storage.delete(thumbKey)]);
    throw err;
  }
  return id;
}

export async function readFindingPhoto(
  ctx: AppContext,
  viewer: Viewer,
  findingId: string,
  photoId: string,
  variant: "photo" | "thumb",
) {
  const { row } = await loadFindingRow(ctx, viewer, findingId);
  const [p] = await ctx.db
    .select()
    .from(findingPhotos)
    .where(and(eq(findingPhotos.id, photoId), eq(findingPhotos.findingId, row.id)));
  if (!p) throw new HttpError(404, "not_found", "That photo was not found.");
  const data = await uploadsStorage(ctx).get(variant === "thumb" ? p.thumbKey : p.key);
  if (!data) throw new HttpError(404, "not_found", "That photo's file is missing.");
  return { mime: p.mime, data };
}
