import type { Page } from "playwright-core";
import { asc, eq } from "drizzle-orm";
import { detectors, readings } from "../../server/db/schema/index";
import type { AppContext } from "../../server/context";
import { seedDemoLayout } from "../../server/db/seed/demo-store-map";

/** Maps the invented test store with the demo layout (60 m × 36 m, 42 fixtures) and adds a detector. */
export async function mapStoreForWalk(
  ctx: AppContext,
  ids: { companyId: string; storeId: string; createdById: string },
) {
  await ctx.db.transaction((tx) => seedDemoLayout(ctx, tx, ids));
  const today = new Date().toISOString().slice(0, 10);
  // 5 s transport delay and 2 ppm alarm: common practice, no published source.
  await ctx.db.insert(detectors).values({
    companyId: ids.companyId,
    name: "Test diode sniffer",
    principle: "heated-diode",
    transportDelayS: 5,
    timeConstantS: 1.5,
    alarmPpm: 2,
    lastCheckedOn: today,
  });
}

/** Screen point of plan metres (x, y) on the Walk screen, from the view the plan reports. */
export async function planToScreen(page: Page, x: number, y: number) {
  const plan = page.getByTestId("walk-plan");
  const box = (await plan.boundingBox())!;
  const [scale, panX, panY] = (await plan.getAttribute("data-view"))!.split(" ").map(Number);
  return { x: box.x + panX + x * scale, y: box.y + panY + y * scale };
}

/**
 * Resolves once the plan has stopped moving (the first fit runs after the stage measures itself):
 * a tap aimed with planToScreen before that can land in another fixture, such as a walk-in.
 */
export async function waitForSteadyPlan(page: Page) {
  const plan = page.getByTestId("walk-plan");
  const look = async () => JSON.stringify([await plan.boundingBox(), await plan.getAttribute("data-view")]);
  let last = await look();
  for (let i = 0; i < 50; i++) {
    await page.waitForTimeout(150);
    const now = await look();
    if (now === last) return;
    last = now;
  }
  throw new Error("the plan never stopped moving");
}

/** Resolves once a service worker controls the page (the app shell is then cached). */
export async function waitForServiceWorker(page: Page) {
  await page.waitForFunction(() => navigator.serviceWorker?.controller !== null, undefined, { timeout: 15_000 });
  await page.evaluate(async () => {
    await navigator.serviceWorker.ready;
    if (!navigator.serviceWorker.controller) {
      await new Promise((resolve) =>
        navigator.serviceWorker.addEventListener("controllerchange", resolve, { once: true }),
      );
    }
  });
}

/** A sweep's readings on the server, in the order they were taken. */
export function storedReadings(ctx: AppContext, sweepId: string) {
  return ctx.db.select().from(readings).where(eq(readings.sweepId, sweepId)).orderBy(asc(readings.takenAt));
}

/** Polls `read` until `ok` holds (the client syncs in the background), naming what it waited for. */
export async function until<T>(what: string, read: () => Promise<T>, ok: (v: T) => boolean, ms = 20_000): Promise<T> {
  const end = Date.now() + ms;
  for (;;) {
    const v = await read();
    if (ok(v)) return v;
    if (Date.now() > end) throw new Error(`timed out waiting for ${what}; last value ${JSON.stringify(v)}`);
    await new Promise((r) => setTimeout(r, 200));
  }
}
