import type { Page } from "playwright-core";
import { detectors } from "../../server/db/schema/index";
import type { AppContext } from "../../server/context";
import { seedDemoLayout } from "../../server/db/seed/demo-store-map";
import { DEMO_PLAN } from "../../server/db/seed/demo-layout";
import { fitView } from "../../src/features/walk/model/view";

/** Maps the invented test store with the demo layout (60 m × 36 m, 42 fixtures) and adds a detector. */
export async function mapStoreForWalk(ctx: AppContext, ids: { companyId: string; storeId: string; createdById: string }) {
  await ctx.db.transaction((tx) => seedDemoLayout(ctx, tx, ids));
  const today = new Date().toISOString().slice(0, 10);
  // 5 s transport delay and 2 ppm alarm: common practice, no published source.
  await ctx.db.insert(detectors).values({ companyId: ids.companyId, name: "Test diode sniffer", principle: "heated-diode", transportDelayS: 5, timeConstantS: 1.5, alarmPpm: 2, lastCheckedOn: today });
}

/**
 * Screen point of plan metres (x, y) on the Walk screen. The view was fitted to the plan box
 * when it first appeared, and keeps its centre when the keypad resizes the box (model/view.ts).
 */
export async function planToScreen(page: Page, x: number, y: number, firstBox: { width: number; height: number }) {
  const box = (await page.getByTestId("walk-plan").boundingBox())!;
  const view = fitView(DEMO_PLAN.widthM, DEMO_PLAN.heightM, firstBox.width, firstBox.height);
  const cx = box.x + box.width / 2;
  const cy = box.y + box.height / 2;
  return { x: cx + (x - DEMO_PLAN.widthM / 2) * view.scale, y: cy + (y - DEMO_PLAN.heightM / 2) * view.scale };
}

/** Resolves once a service worker controls the page (the app shell is then cached). */
export async function waitForServiceWorker(page: Page) {
  await page.waitForFunction(() => navigator.serviceWorker?.controller !== null, undefined, { timeout: 15_000 });
  await page.evaluate(async () => {
    await navigator.serviceWorker.ready;
    if (!navigator.serviceWorker.controller) {
      await new Promise((resolve) => navigator.serviceWorker.addEventListener("controllerchange", resolve, { once: true }));
    }
  });
}
