/**
 * Decoding uploaded images (plans, finding photos) on the CPU pool, one at a time by default: a
 * 40-megapixel image is 160 MB of RGBA while it is decoded and resized, so the number decoded at
 * once bounds the memory uploads can take. Uploads wait for a place in a bounded queue (their bytes
 * stay in the temporary file meanwhile); a full queue, or a wait past maxWaitMs, is a 503 with Retry-After.
 * docs/decisions/0081-bounded-uploads.md
 */
import type { DecodedImage, DecodeRequest } from "../../jobs/image-decode.worker";
import { cpuPool, CpuTimeoutError, JobError } from "../../jobs/cpu-pool";
import { createGate } from "../../lib/gate";
import { HttpError } from "../../lib/http-error";

export type DecodedPlanImage = DecodedImage;

export class ImageDecodeError extends Error {}

export interface DecodeQueueLimits {
  /** Images decoded at once in this process. */
  concurrency: number;
  /** Uploads waiting for a place at most; one more is answered 503. */
  queueMax: number;
  /** An upload that has waited this long for a place is answered 503 instead of waiting on. */
  maxWaitMs: number;
}

export const DEFAULT_DECODE_QUEUE: DecodeQueueLimits = { concurrency: 1, queueMax: 16, maxWaitMs: 60_000 };

const tooBig = () =>
  new HttpError(
    413,
    "image_too_large_to_decode",
    "The image needs more memory or time to decode than the server allows. Export it at a lower resolution and try again.",
  );

export function createImageDecoder(limits: DecodeQueueLimits = DEFAULT_DECODE_QUEUE) {
  const gate = createGate(
    limits,
    () =>
      new HttpError(
        503,
        "busy",
        "Other uploads are being processed right now; please try again in a few seconds.",
        undefined,
        { retryAfterSeconds: 5 },
      ),
  );
  return {
    gate,
    /** Runs `work` (read the upload, check it, decode it, store it) once a decoding place is free. */
    withSlot<R>(work: () => Promise<R>): Promise<R> {
      return gate.run(work);
    },
    async decode(input: DecodeRequest): Promise<DecodedPlanImage> {
      // A copy to move to the worker: the caller keeps its bytes (the original is stored as uploaded).
      const data = new Uint8Array(input.data);
      try {
        return await cpuPool().run<DecodeRequest, DecodedImage>(
          "image-decode",
          { ...input, data },
          { transfer: [data.buffer] },
        );
      } catch (err) {
        if (err instanceof JobError) throw new ImageDecodeError(err.message);
        if (err instanceof CpuTimeoutError) throw tooBig();
        // The worker hit its heap cap (piscina resourceLimits) and was replaced.
        if ((err as NodeJS.ErrnoException)?.code === "ERR_WORKER_OUT_OF_MEMORY") throw tooBig();
        throw err;
      }
    },
  };
}

export type ImageDecoder = ReturnType<typeof createImageDecoder>;
