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

/** A tap as the demo and benchmark sweeps list them: `t` seconds into the walk. */
export interface DeviceTap {
  x: number;
  y: number;
  t: number;
  ppm: number;
  atLeast: boolean;
}

/**
 * Writes taps straight into the device's IndexedDB for a sweep, queued for upload as the keypad
 * leaves them, in one transaction (quicker than tapping hundreds). Each is taken `t` seconds after
 * the sweep's start plus `offsetMs`. The page must be reloaded to show them.
 */
export async function queueTapsOnDevice(page: Page, sweepId: string, taps: readonly DeviceTap[], offsetMs = 0) {
  await page.evaluate(
    async ({ sweepId, taps, offsetMs }) => {
      const db: IDBDatabase = await new Promise((resolve, reject) => {
        const r = indexedDB.open("plumeline-walk");
        r.onsuccess = () => resolve(r.result);
        r.onerror = () => reject(r.error);
      });
      const sweep: { startedAt: string } = await new Promise((resolve) => {
        const g = db.transaction("sweeps").objectStore("sweeps").get(sweepId);
        g.onsuccess = () => resolve(g.result);
      });
      const t0 = Date.parse(sweep.startedAt) + offsetMs;
      const tx = db.transaction(["readings", "meta"], "readwrite");
      taps.forEach((tap, i) =>
        tx.objectStore("readings").put({
          id: crypto.randomUUID(),
          sweepId,
          seq: 1000 + i,
          x: tap.x,
          y: tap.y,
          takenAt: new Date(t0 + Math.round(tap.t * 1000)).toISOString(),
          ppm: tap.ppm,
          atLeast: tap.atLeast,
          samplePoint: "grille",
          note: "",
          sync: { kind: "queued-new" },
        }),
      );
      tx.objectStore("meta").put(5000, "seq");
      await new Promise((resolve, reject) => {
        tx.oncomplete = resolve;
        tx.onerror = () => reject(tx.error);
      });
      db.close();
    },
    { sweepId, taps, offsetMs },
  );
}
