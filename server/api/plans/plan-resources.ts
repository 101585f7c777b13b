import type { AppContext, PlanImageLimits } from "../../context";
import { createImageDecoder, DEFAULT_DECODE_QUEUE, type ImageDecoder } from "./image-decoder";

export const DEFAULT_PLAN_IMAGE_LIMITS: PlanImageLimits = {
  maxBytes: 25 * 1024 * 1024, // "up to 25 MB" (docs/product.md)
  // 40 MP decodes to 160 MB of RGBA in jimp: large enough for a 300-dpi A0 scan (≈ 14000 × 9900
  // would not fit, a 200-dpi one does), small enough that a bomb cannot exhaust memory.
  maxPixels: 40_000_000,
  displayMaxSide: 4096,
  thumbMaxSide: 320,
};

export function planImageLimits(ctx: AppContext): PlanImageLimits {
  return { ...DEFAULT_PLAN_IMAGE_LIMITS, ...ctx.config.planImageLimits };
}

// One decoding queue per app (so a test's app has its own); the decoding itself runs on the
// process's CPU pool.
const decoders = new WeakMap<AppContext, ImageDecoder>();
export function planImageDecoder(ctx: AppContext): ImageDecoder {
  let d = decoders.get(ctx);
  if (!d) decoders.set(ctx, (d = createImageDecoder({ ...DEFAULT_DECODE_QUEUE, ...ctx.config.decodeQueue })));
  return d;
}
