// The unit and client projects reuse a worker from file to file (`isolate: false`, vitest.config.ts,
// decision 0083): starting a worker (and a jsdom) for each file took most of their time. Every
// module of ours is still evaluated afresh for each file, as in a new worker, so no module-level
// state (the CSRF token in src/lib/api-client.ts, the Walk sync loop) passes from one file to the
// next. Listed first in setupFiles, so the other setup files and the test file import fresh copies.
import { vi } from "vitest";

vi.resetModules();
