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
 * the sweep's start plus `offsetMs`; their numbers on the device start at `firstSeq` (a second batch
 * goes after the first). The page must be reloaded to show them.
 */
export async function queueTapsOnDevice(
  page: Page,
  sweepId: string,
  taps: readonly DeviceTap[],
  offsetMs = 0,
  firstSeq = 1000,
) {
  await page.evaluate(
    async ({ sweepId, taps, offsetMs, firstSeq }) => {
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
          seq: firstSeq + i,
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
      tx.objectStore("meta").put(firstSeq + 4000, "seq");
      await new Promise((resolve, reject) => {
        tx.oncomplete = resolve;
        tx.onerror = () => reject(tx.error);
      });
      db.close();
    },
    { sweepId, taps, offsetMs, firstSeq },
  );
}

/**
 * The share of the screen's height the Walk plan keeps for itself: the plan's box less the part the
 * live guide's panel covers (it lies over the plan's bottom edge), over the viewport's height.
 */
export async function planShare(page: Page): Promise<number> {
  return page.evaluate(() => {
    const plan = document.querySelector('[data-testid="walk-plan"]')!.getBoundingClientRect();
    const guide = document.querySelector('[data-testid="live-guide"]')?.getBoundingClientRect();
    const covered = guide ? Math.max(0, Math.min(plan.bottom, guide.bottom) - Math.max(plan.top, guide.top)) : 0;
    return (plan.height - covered) / window.innerHeight;
  });
}

/** Whether the element lies wholly within the viewport (shown in full, nothing to scroll to). */
export async function shownInFull(page: Page, selector: string): Promise<boolean> {
  return page.evaluate((sel) => {
    const box = document.querySelector(sel)?.getBoundingClientRect();
    return !!box && box.height > 0 && box.top >= 0 && box.bottom <= window.innerHeight;
  }, selector);
}

/**
 * How many pixels of the Walk plan's canvases within `radiusPx` of a screen point are drawn in `rgb`
 * (each channel within 40): proof that a mark of that colour is drawn there, not only listed in words.
 */
export async function inkNear(
  page: Page,
  at: { x: number; y: number },
  radiusPx: number,
  rgb: [number, number, number],
) {
  return page.evaluate(
    ({ at, radiusPx, rgb }) => {
      let count = 0;
      for (const canvas of document.querySelectorAll<HTMLCanvasElement>('[data-testid="walk-plan"] canvas')) {
        const box = canvas.getBoundingClientRect();
        const sx = canvas.width / box.width;
        const sy = canvas.height / box.height;
        const x0 = Math.max(0, Math.floor((at.x - radiusPx - box.left) * sx));
        const y0 = Math.max(0, Math.floor((at.y - radiusPx - box.top) * sy));
        const w = Math.min(canvas.width - x0, Math.ceil(2 * radiusPx * sx));
        const h = Math.min(canvas.height - y0, Math.ceil(2 * radiusPx * sy));
        if (w <= 0 || h <= 0) continue;
        const data = canvas.getContext("2d")!.getImageData(x0, y0, w, h).data;
        for (let i = 0; i < data.length; i += 4)
          if (
            data[i + 3] > 128 &&
            Math.abs(data[i] - rgb[0]) <= 40 &&
            Math.abs(data[i + 1] - rgb[1]) <= 40 &&
            Math.abs(data[i + 2] - rgb[2]) <= 40
          )
            count++;
      }
      return count;
    },
    { at, radiusPx, rgb },
  );
}
