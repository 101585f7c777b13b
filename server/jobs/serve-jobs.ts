/** The worker side of worker-pool.ts: answer each posted job with handle's result or its error. */
import { parentPort } from "node:worker_threads";
import type { JobReply } from "./worker-pool";

export interface JobFailure {
  message: string;
  problems?: string[];
}

export function serveJobs<T, R>(
  handle: (payload: T) => R | Promise<R>,
  options: { transferables?: (result: R) => ArrayBuffer[]; describeError?: (err: unknown) => JobFailure } = {},
): void {
  const port = parentPort;
  if (!port) throw new Error("serveJobs must run inside a worker thread");
  const describe =
    options.describeError ?? ((err: unknown) => ({ message: err instanceof Error ? err.message : String(err) }));
  port.on("message", async ({ id, payload }: { id: number; payload: T }) => {
    try {
      const result = await handle(payload);
      port.postMessage({ id, ok: true, result } satisfies JobReply<R>, options.transferables?.(result) ?? []);
    } catch (err) {
      port.postMessage({ id, ok: false, ...describe(err) } satisfies JobReply<R>);
    }
  });
}
