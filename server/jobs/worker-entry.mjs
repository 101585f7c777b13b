// Worker threads start without the parent's TypeScript loader: register tsx here, then load the
// worker module named in workerData. Plain JavaScript on purpose, so Node runs it without a loader.
import { register } from "tsx/esm/api";
import { workerData } from "node:worker_threads";

register();
await import(workerData.module);
