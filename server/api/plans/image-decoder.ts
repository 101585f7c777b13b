import { Worker } from "node:worker_threads";
import { COMPILED, serverModule } from "../../paths";
import type { DecodeRequest, DecodeResponse } from "./image-decode.worker";

export type DecodedPlanImage = Extract<DecodeResponse, { ok: true }>;

export class ImageDecodeError extends Error {}

// From source the worker registers tsx first (the .mjs entry); the compiled module starts as it is.
const ENTRY = COMPILED
  ? serverModule("api/plans/image-decode.worker")
  : new URL("./image-decode.worker-entry.mjs", import.meta.url);

/**
 * One long-lived worker thread that decodes and resizes plan images, started on first use.
 * Requests queue in the worker (uploads are rare); a crashed worker fails its pending requests
 * and is replaced on the next call.
 */
export function createImageDecoder() {
  let worker: Worker | null = null;
  let nextId = 1;
  const pending = new Map<number, { resolve(r: DecodedPlanImage): void; reject(e: Error): void }>();

  const failAll = (from: Worker, err: Error) => {
    if (worker !== from) return;
    for (const p of pending.values()) p.reject(err);
    pending.clear();
    worker = null;
  };

  const start = () => {
    const w = new Worker(ENTRY);
    w.unref(); // an idle decoder must not keep the process (or a test run) alive
    w.on("message", (res: DecodeResponse) => {
      const p = pending.get(res.id);
      if (!p) return;
      pending.delete(res.id);
      if (res.ok) p.resolve(res);
      else p.reject(new ImageDecodeError(res.message));
    });
    w.on("error", (err) => failAll(w, err));
    w.on("exit", (code) => failAll(w, new Error(`the image worker stopped (exit code ${code})`)));
    return w;
  };

  return {
    decode(input: Omit<DecodeRequest, "id">): Promise<DecodedPlanImage> {
      worker ??= start();
      const id = nextId++;
      const w = worker;
      return new Promise((resolve, reject) => {
        pending.set(id, { resolve, reject });
        // Copy into a transferable buffer: the request's Buffer may share a pooled ArrayBuffer.
        const data = new Uint8Array(input.data);
        w.postMessage({ ...input, id, data } satisfies DecodeRequest, [data.buffer]);
      });
    },
    async close() {
      const w = worker;
      worker = null;
      if (w) await w.terminate();
    },
  };
}

export type ImageDecoder = ReturnType<typeof createImageDecoder>;
