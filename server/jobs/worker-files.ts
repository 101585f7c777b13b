/**
 * Where the CPU pool finds its files: the one place that knows them. A worker thread starts without
 * the parent's TypeScript loader, so the pool loads the plain-JavaScript `pool-entry.mjs`, which
 * registers tsx (only for a `.ts` module) and imports the task's `*.worker.ts` module. In the
 * production build the task modules are the compiled `dist/server/jobs/*.worker.js` (server/paths.ts,
 * docs/decisions/0086); the entry stays the source `.mjs`, which needs no compiling.
 */
import path from "node:path";
import { APP_ROOT, serverModule } from "../paths";

export type WorkerTaskName = "analysis" | "report" | "image-decode" | "password";

const MODULES: Record<WorkerTaskName, URL> = {
  analysis: serverModule("jobs/analysis.worker"),
  report: serverModule("jobs/report.worker"),
  "image-decode": serverModule("jobs/image-decode.worker"),
  password: serverModule("jobs/password.worker"),
};

/** The file piscina starts each worker thread with (a path, as piscina wants). */
export const POOL_ENTRY = path.join(APP_ROOT, "server/jobs/pool-entry.mjs");

/** The module (file URL) whose default export runs a task of this kind inside a worker. */
export function workerModule(task: WorkerTaskName): string {
  return MODULES[task].href;
}
