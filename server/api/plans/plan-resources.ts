import type { AppContext, PlanImageLimits } from "../../context";
import { createImageDecoder, type ImageDecoder } from "./image-decoder";

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

// One decoder worker per process: decoding is CPU-bound and the machine has two cores.
let decoder: ImageDecoder | null = null;
export function planImageDecoder(): ImageDecoder {
  return (decoder ??= createImageDecoder());
}
