import { expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { sweeps } from "../../server/db/schema/index";
import { newContext } from "../helpers/browser";
import { signInThroughForm } from "../helpers/e2e-session";
import { walkSuite } from "../helpers/walk-suite";
import { PASSWORD } from "../helpers/fixtures";
import { planToScreen, waitForServiceWorker, storedReadings, until, waitForSteadyPlan } from "../helpers/walk-e2e";

const suite = walkSuite("Thornbury Grocers");

const onServer = (sweepId: string) => storedReadings(suite.server.ctx, sweepId);

it("a technician on a phone taps ten readings with the network cut halfway, reloads offline, and all ten reach the server in order", async () => {
  const context = await newContext(suite.browser, {
    viewport: { width: 390, height: 844 },
    hasTouch: true,
    isMobile: true,
    deviceScaleFactor: 2,
  });
  const page = await context.newPage();
  page.setDefaultTimeout(15_000);
  const failures: string[] = [];
  page.on("pageerror", (e) => failures.push(String(e)));

  await signInThroughForm(page, suite.server.url, suite.co.people.technician.email, PASSWORD);
  await page.goto(`${suite.server.url}/stores/${suite.co.store.id}/walk`);
  await page.getByRole("button", { name: "Start the sweep" }).tap();
  await page.getByTestId("walk-plan").waitFor();
  await waitForSteadyPlan(page);
  await waitForServiceWorker(page);
  const sweepId = page.url().split("/").pop()!;
  // The sweep was made on the device first, then uploaded.
  await until(
    "the sweep on the server",
    () => suite.server.ctx.db.select().from(sweeps).where(eq(sweeps.id, sweepId)),
    (r) => r.length === 1,
  );

  // Along the front of the case line in the sales floor, left to right, 2 m apart.
  const spots = Array.from({ length: 10 }, (_, i) => ({ x: 20 + 2 * i, y: 22 }));
  const values = [0, 1.5, 0, 0, 3, 0, 0.5, 0, 12, 0];
  let taps = 0;
  async function record(i: number) {
    const p = await planToScreen(page, spots[i].x, spots[i].y);
    await page.touchscreen.tap(p.x, p.y);
    taps++;
    await page.getByRole("button", { name: "0 ppm — save" }).waitFor();
    if (values[i] === 0) {
      await page.getByRole("button", { name: "0 ppm — save" }).tap();
    } else {
      for (const k of String(values[i]))
        await page.getByRole("button", { name: k === "." ? "Decimal point" : k, exact: true }).tap();
      await page.getByRole("button", { name: "Save", exact: true }).tap();
    }
    await page
      .getByTestId("walk-count")
      .filter({ hasText: new RegExp(`^${i + 1} readings?`) })
      .waitFor();
  }

  for (let i = 0; i < 5; i++) await record(i);
  await until(
    "five readings on the server",
    () => onServer(sweepId),
    (r) => r.length === 5,
  );
  await page.locator('[data-testid="sync-banner"][data-waiting="0"]').waitFor();

  await context.setOffline(true);
  for (let i = 5; i < 10; i++) await record(i);
  await page.locator('[data-testid="sync-banner"][data-waiting="5"]').waitFor();
  await expect(page.getByTestId("sync-banner").textContent()).resolves.toMatch(/offline/);
  // An alarm (12 ppm ≥ 2 ppm) shows where the air was really sampled.
  await expect(page.getByTestId("lag-hint").textContent()).resolves.toMatch(/Alarm: 12 ppm/);
  expect((await onServer(sweepId)).length).toBe(5);

  // Reload with no connection: the service worker serves the app shell, IndexedDB the readings.
  await page.reload();
  await page.getByTestId("walk-count").filter({ hasText: "10 readings" }).waitFor();
  await page.locator('[data-testid="sync-banner"][data-waiting="5"]').waitFor();
  // The queue did try after the reload, and the cut connection stopped it.
  await page.locator('[data-testid="sync-banner"]:not([data-stopped-by=""])').waitFor();
  expect((await onServer(sweepId)).length).toBe(5);

  await context.setOffline(false);
  const stored = await until(
    "ten readings on the server",
    () => onServer(sweepId),
    (r) => r.length === 10,
  );
  expect(stored.map((r) => r.x)).toEqual(stored.map((r) => r.x).sort((a, b) => a - b)); // tap order = time order
  stored.forEach((r, i) => {
    expect(r.x).toBeCloseTo(spots[i].x, 0);
    expect(r.y).toBeCloseTo(spots[i].y, 0);
    expect(r.ppm).toBe(values[i]);
  });
  await page.locator('[data-testid="sync-banner"][data-waiting="0"]').waitFor();
  expect(taps).toBe(10);
  expect(failures).toEqual([]);
  await context.close();
});
