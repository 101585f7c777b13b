/** The worker side of the CPU pool (cpu-pool.ts): a task module's default export, made with workerTask. */
import { move, transferableSymbol, valueSymbol } from "piscina";

export interface JobFailure {
  message: string;
  problems?: string[];
}

/** What a task posts back: the result, or why the input was refused (a JobError on the caller's side). */
export type TaskReply<R> = { ok: true; result: R } | ({ ok: false } & JobFailure);

/**
 * Wraps a handler so that its result comes back with its buffers moved, not copied, and an expected
 * failure comes back as a reply (with its problems) rather than as a cloned Error that loses them.
 */
export function workerTask<T, R>(
  handle: (payload: T) => R | Promise<R>,
  options: { transferables?: (result: R) => ArrayBuffer[]; describeError?: (err: unknown) => JobFailure } = {},
): (payload: T) => Promise<unknown> {
  const describe =
    options.describeError ?? ((err: unknown) => ({ message: err instanceof Error ? err.message : String(err) }));
  return async (payload) => {
    let result: R;
    try {
      result = await handle(payload);
    } catch (err) {
      return { ok: false, ...describe(err) } satisfies TaskReply<R>;
    }
    const reply: TaskReply<R> = { ok: true, result };
    const transfer = options.transferables?.(result) ?? [];
    // piscina's Transferable protocol: the list is moved, the value is what the caller receives.
    return transfer.length ? move({ [transferableSymbol]: transfer, [valueSymbol]: reply }) : reply;
  };
}
