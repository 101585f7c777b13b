import { defineConfig } from "vitest/config";
import react from "@vitejs/plugin-react";

// Four suites, one run: pure tests and API tests in Node, component tests in jsdom (one DOM
// implementation only), and browser tests that drive Debian's Chromium through playwright-core.
export default defineConfig({
  plugins: [react()],
  test: {
    projects: [
      {
        extends: true,
        test: {
          // Pure suites: no PostgreSQL, Chromium or client build (`npm run test:unit`).
          name: "unit",
          environment: "node",
          include: ["core/**/*.test.ts", "scripts/**/*.test.ts", "tests/walls/**/*.test.ts"],
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
          setupFiles: ["tests/helpers/client-setup.ts"],
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
          fileParallelism: false,
          // A known intermittent failure (elements detached mid-click after sign-in, about one run
          // in six) is under investigation; until it is found, a browser test gets two more tries.
          retry: 2,
          testTimeout: 120_000,
          hookTimeout: 120_000,
        },
      },
    ],
  },
});
