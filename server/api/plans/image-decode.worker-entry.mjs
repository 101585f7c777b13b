// Worker threads start without the parent's TypeScript loader: register tsx here, then load the
// real worker. Plain JavaScript on purpose, so Node can run this file without a loader.
import { register } from "tsx/esm/api";

register();
await import("./image-decode.worker.ts");
