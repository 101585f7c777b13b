/**
 * Where the CPU pool finds its files: the one place that knows them. A worker thread starts without
 * the parent's TypeScript loader, so the pool loads the plain-JavaScript `pool-entry.mjs`, which
 * registers tsx (only for a `.ts` module) and imports the task's `*.worker.ts` module. A production
 * build that compiles these files points POOL_ENTRY and the modules below at its `.js` output.
 */
import { fileURLToPath } from "node:url";

export type WorkerTaskName = "analysis" | "report" | "image-decode" | "password";

const MODULES: Record<WorkerTaskName, URL> = {
  analysis: new URL("./analysis.worker.ts", import.meta.url),
  report: new URL("./report.worker.ts", import.meta.url),
  "image-decode": new URL("./image-decode.worker.ts", import.meta.url),
  password: new URL("./password.worker.ts", import.meta.url),
};

/** The file piscina starts each worker thread with (a path, as piscina wants). */
export const POOL_ENTRY = fileURLToPath(new URL("./pool-entry.mjs", import.meta.url));

/** The module (file URL) whose default export runs a task of this kind inside a worker. */
export function workerModule(task: WorkerTaskName): string {
  return MODULES[task].href;
}
