import { randomUUID } from "node:crypto";
import { readFile } from "node:fs/promises";
import type { AppContext } from "../../context";
import type { BlankPlanInput, Plan } from "#core/contracts/plans";
import { METRES_PER_FOOT } from "#core/analysis/geometry/units";
import { badRequest, HttpError } from "../../lib/http-error";
import { loadVisibleStore, type Viewer } from "../../access/store-access";
import { BLANK_PLAN_MAX_M } from "#core/contracts/plans";
import { checkPlanImageHeader } from "./image-intake";
import { ImageDecodeError, type ImageDecoder } from "./image-decoder";
import { fixtureCounts } from "../../access/plan-access";
import { planImageDecoder, planImageLimits } from "./plan-resources";
import { uploadsStorage } from "../../storage/uploads-storage";
import { toPlan } from "../../db/plans/plan-rows";
import { addPlanVersion } from "../../db/plans/plan-versions";

/** The upload as multer left it: a temporary file, removed once the request is answered. */
export interface UploadedFile {
  path: string;
  originalname: string;
}

const EXT = { "image/png": "png", "image/jpeg": "jpg" } as const;

/**
 * A new plan version from an uploaded drawing. Order matters: the upload waits for a decoding place
 * (bounded queue), the header is checked before any decoding (type by content, pixel budget),
 * decoding runs on the CPU pool, and the three files are written before the row; if anything fails,
 * every file written so far is removed again.
 */
export async function createImagePlan(
  ctx: AppContext,
  viewer: Viewer,
  userId: string,
  storeId: string,
  file: UploadedFile | undefined,
): Promise<Plan> {
  await loadVisibleStore(ctx, viewer, storeId);
  if (!file)
    throw badRequest('Please attach the floor plan image in the form field "image".', {
      image: "is required: a PNG or JPEG file",
    });
  const decoder = planImageDecoder(ctx);
  return decoder.withSlot(async () => {
    const data = await readFile(file.path);
    return storeImagePlan(ctx, viewer, userId, storeId, data, decoder);
  });
}

async function storeImagePlan(
  ctx: AppContext,
  viewer: Viewer,
  userId: string,
  storeId: string,
  data: Buffer,
  decoder: ImageDecoder,
): Promise<Plan> {
  const limits = planImageLimits(ctx);
  const header = checkPlanImageHeader(data, limits.maxPixels);

  let decoded;
  try {
    decoded = await decoder.decode({
      data,
      mime: header.mime,
      displayMaxSide: limits.displayMaxSide,
      thumbMaxSide: limits.thumbMaxSide,
    });
  } catch (err) {
    if (err instanceof ImageDecodeError) {
      throw new HttpError(
        422,
        "unreadable_image",
        `The image could not be decoded: the file is damaged or incomplete (${err.message}). Export it again and retry.`,
      );
    }
    throw err;
  }

  const planId = randomUUID();
  const ext = EXT[header.mime];
  const prefix = `plans/${viewer.companyId}/${planId}`;
  const keys = {
    original: `${prefix}/original.${ext}`,
    display: `${prefix}/display.${ext}`,
    thumb: `${prefix}/thumb.${ext}`,
  };
  const storage = uploadsStorage(ctx);
  const written: string[] = [];
  try {
    for (const [key, bytes] of [
      [keys.original, data],
      [keys.display, decoded.display],
      [keys.thumb, decoded.thumb],
    ] as const) {
      await storage.put(key, Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength));
      written.push(key);
    }
    const row = await ctx.db.transaction((tx) =>
      addPlanVersion(
        tx,
        {
          companyId: viewer.companyId,
          storeId,
          source: "image",
          originalKey: keys.original,
          displayKey: keys.display,
          thumbKey: keys.thumb,
          originalMime: header.mime,
          originalWidthPx: decoded.width,
          originalHeightPx: decoded.height,
          imageWidthPx: decoded.displayWidth,
          imageHeightPx: decoded.displayHeight,
          createdById: userId,
        },
        { id: planId },
      ),
    );
    const counts = await fixtureCounts(ctx.db, [row.id]);
    return toPlan(row, counts.get(row.id) ?? 0);
  } catch (err) {
    await Promise.allSettled(written.map((k) => storage.delete(k)));
    throw err;
  }
}

/** A plan with no drawing, sized in metres from the start (so it needs no calibration). */
export async function createBlankPlan(
  ctx: AppContext,
  viewer: Viewer,
  userId: string,
  storeId: string,
  input: BlankPlanInput,
): Promise<Plan> {
  await loadVisibleStore(ctx, viewer, storeId);
  const factor = input.unit === "ft" ? METRES_PER_FOOT : 1; // 0.3048 m/ft exactly, NIST SP 811
  const widthM = input.width * factor;
  const heightM = input.depth * factor;
  const fields: Record<string, string> = {};
  if (widthM > BLANK_PLAN_MAX_M) fields.width = `must be at most ${BLANK_PLAN_MAX_M} m`;
  if (heightM > BLANK_PLAN_MAX_M) fields.depth = `must be at most ${BLANK_PLAN_MAX_M} m`;
  if (Object.keys(fields).length)
    throw badRequest(`Please check: a plan side may be at most ${BLANK_PLAN_MAX_M} m.`, fields);
  const row = await ctx.db.transaction((tx) =>
    addPlanVersion(tx, { companyId: viewer.companyId, storeId, source: "blank", widthM, heightM, createdById: userId }),
  );
  const counts = await fixtureCounts(ctx.db, [row.id]);
  return toPlan(row, counts.get(row.id) ?? 0);
}
