import { relative } from "node:path";
import { defineConfig } from "vitest/config";
import { BaseSequencer, type TestSpecification } from "vitest/node";
import react from "@vitejs/plugin-react";

/**
 * The order the workers take test files in. Vitest's own order runs one project after another;
 * here the browser and server files (the slow ones, each mostly waiting on Chromium or PostgreSQL,
 * which run in processes of their own) are dealt out turn about by their last run's time, longest
 * first, so the two workers mostly run one of each and the longest files never start last. The
 * client files follow as one block, then the pure unit files.
 */
class SuiteOrder extends BaseSequencer {
  override async sort(files: TestSpecification[]): Promise<TestSpecification[]> {
    // Vitest's order within a project: failed last time first, then longest first (or largest file).
    const sorted = await super.sort(files);
    const of = (name: string) => sorted.filter((f) => f.project.name === name);
    const seconds = (f: TestSpecification) => {
      const last = this.ctx.cache.getFileTestResults(`${f.project.name}:${relative(this.ctx.config.root, f.moduleId)}`);
      return last ? last.duration / 1000 : 1; // a file never run here counts as one second
    };
    const slow: TestSpecification[] = [];
    const [browser, server] = [of("browser"), of("server")];
    let [dealtBrowser, dealtServer] = [0, 0];
    while (browser.length || server.length) {
      // The next file comes from whichever project has had less time dealt so far.
      const fromBrowser = browser.length > 0 && (server.length === 0 || dealtBrowser <= dealtServer);
      const file = (fromBrowser ? browser : server).shift()!;
      if (fromBrowser) dealtBrowser += seconds(file);
      else dealtServer += seconds(file);
      slow.push(file);
    }
    // The rest (client, then unit: Vitest orders projects by name) as they come.
    return [...slow, ...sorted.filter((f) => f.project.name !== "browser" && f.project.name !== "server")];
  }
}

// Four suites, one run: pure tests and API tests in Node, component tests in jsdom (one DOM
// implementation only), and browser tests that drive Debian's Chromium through playwright-core.
export default defineConfig({
  plugins: [react()],
  test: {
    // Vitest's default is one worker fewer than the cores: one worker on this 2-core machine, so every
    // file ran after the other. Most of a server or browser file's time is spent waiting on
    // PostgreSQL or Chromium (processes of their own), so two workers keep both cores busy.
    maxWorkers: 2,
    sequence: { sequencer: SuiteOrder },
    projects: [
      {
        extends: true,
        test: {
          // Pure suites: no PostgreSQL, Chromium or client build (`npm run test:unit`).
          name: "unit",
          environment: "node",
          include: ["core/**/*.test.ts", "scripts/**/*.test.ts", "tests/walls/**/*.test.ts"],
          // One worker serves many files in turn; our modules are evaluated afresh for each file.
          isolate: false,
          setupFiles: ["tests/helpers/fresh-modules.ts"],
          testTimeout: 30_000,
        },
      },
      {
        extends: true,
        test: {
          name: "server",
          environment: "node",
          include: ["server/**/*.test.ts", "tests/api/**/*.test.ts", "tests/faults/**/*.test.ts"],
          globalSetup: ["tests/helpers/global-setup.ts"],
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
      {
        extends: true,
        test: {
          name: "client",
          environment: "jsdom",
          include: ["src/**/*.test.{ts,tsx}"],
          // One worker and one jsdom serve many files in turn; our modules are still evaluated
          // afresh for each file (tests/helpers/fresh-modules.ts, decision 0083).
          isolate: false,
          setupFiles: ["tests/helpers/fresh-modules.ts", "tests/helpers/client-setup.ts"],
          testTimeout: 20_000,
          // jsdom start-up under a loaded machine can outlast findBy* timeouts; one more try.
          retry: 1,
        },
      },
      {
        extends: true,
        test: {
          name: "browser",
          environment: "node",
          include: ["tests/e2e/**/*.test.ts"],
          globalSetup: ["tests/helpers/global-setup.ts"],
          // Each file has its own app on port 0, its own database and its own Chromium, so browser
          // files run beside other files (SuiteOrder above pairs them with server files; decision 0083).
          // A safety net, not a fix: the intermittent sign-out after sign-in (about one run in six)
          // was the service worker's asset fetches resetting the cookie (decision 0121). A retried
          // pass still prints "(retry xN)" and is a bug to find.
          retry: 2,
          testTimeout: 120_000,
          hookTimeout: 120_000,
        },
      },
    ],
  },
});
