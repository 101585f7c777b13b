import { afterAll, beforeAll } from "vitest";
import type { Browser } from "playwright-core";
import { launchBrowser } from "./browser";
import { startE2eServer, type E2eServer } from "./e2e-server";
import { seedCompany } from "./fixtures";
import { mapStoreForWalk } from "./walk-e2e";

export interface WalkSuite {
  server: E2eServer;
  browser: Browser;
  co: Awaited<ReturnType<typeof seedCompany>>;
}

/**
 * The hooks every Walk browser test file needs: a real app on port 0, an invented company whose
 * store carries the demo layout and a detector, and Chromium. The fields fill in before the tests run.
 */
export function walkSuite(companyName: string): WalkSuite {
  const suite = {} as WalkSuite;
  beforeAll(async () => {
    suite.server = await startE2eServer();
    suite.co = await seedCompany(suite.server.ctx, companyName);
    const { co } = suite;
    await mapStoreForWalk(suite.server.ctx, {
      companyId: co.company.id,
      storeId: co.store.id,
      createdById: co.people["lead-tech"].userId,
    });
    suite.browser = await launchBrowser();
  });
  afterAll(async () => {
    await suite.browser?.close();
    await suite.server?.close();
  });
  return suite;
}
