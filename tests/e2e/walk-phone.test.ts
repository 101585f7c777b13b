import path from "node:path";
import { mkdirSync } from "node:fs";
import { expect, it } from "vitest";
import { eq } from "drizzle-orm";
import type { BrowserContext, Page } from "playwright-core";
import { companies, sweeps } from "../../server/db/schema/index";
import { demoFixtures } from "../../server/db/seed/demo-layout";
import { newContext } from "../helpers/browser";
import { signInThroughForm } from "../helpers/e2e-session";
import { walkSuite } from "../helpers/walk-suite";
import { PASSWORD } from "../helpers/fixtures";
import { planToScreen, waitForServiceWorker, storedReadings, until, waitForSteadyPlan } from "../helpers/walk-e2e";

const suite = walkSuite("Wrenfield Market");
const SCREENS = path.resolve(import.meta.dirname, "../../test-results/screens");
mkdirSync(SCREENS, { recursive: true });
const PHONE = { viewport: { width: 390, height: 844 }, hasTouch: true, isMobile: true, deviceScaleFactor: 2 };

/** Spots 0.4 m in front of the demo plan's dairy cases, 1.3 m apart (common practice, no published source). */
function dairySpots(): { x: number; y: number }[] {
  const cases = demoFixtures({ "rack-mt": "a", "rack-lt": "b", "walk-ins": "c" }).filter(
    (f) => f.kind === "open-case" && f.label.startsWith("Dairy"),
  );
  const poly = cases.flatMap((f) => ("polygon" in f ? f.polygon : []));
  const west = Math.min(...poly.map((p) => p[0]));
  const front = Math.max(...poly.map((p) => p[1]));
  return Array.from({ length: 8 }, (_, i) => ({ x: west + 0.5 + 1.3 * i, y: front + 0.4 }));
}

async function phonePage(): Promise<{ context: BrowserContext; page: Page; failures: string[] }> {
  const context = await newContext(suite.browser, PHONE);
  const page = await context.newPage();
  page.setDefaultTimeout(15_000);
  const failures: string[] = [];
  page.on("pageerror", (e) => failures.push(String(e)));
  return { context, page, failures };
}

/** Taps counted per action, for the record of what one reading costs a gloved hand. */
function tapCounter(page: Page) {
  let n = 0;
  return {
    async tap(target: { tap(): Promise<void> } | { x: number; y: number }) {
      n++;
      if ("tap" in target) await target.tap();
      else await page.touchscreen.tap(target.x, target.y);
    },
    take() {
      const k = n;
      n = 0;
      return k;
    },
  };
}

async function startSweep(page: Page): Promise<string> {
  await page.goto(`${suite.server.url}/walk`);
  await page.getByRole("link", { name: suite.co.store.name, exact: true }).tap();
  await page.getByRole("button", { name: "Start the sweep" }).tap();
  await page.getByTestId("walk-plan").waitFor();
  await waitForSteadyPlan(page);
  await waitForServiceWorker(page);
  return page.url().split("/").pop()!;
}

it("on a phone: readings in 2-4 taps, the peak in the alarm banner, a plan that keeps a third of the screen with the keypad open, a key to its marks; leave, find the sweep, resume it in one tap, submit", async () => {
  const { context, page, failures } = await phonePage();
  await signInThroughForm(page, suite.server.url, suite.co.people.technician.email, PASSWORD);
  const sweepId = await startSweep(page);
  const spots = dairySpots();
  const taps = tapCounter(page);
  const tally: Record<string, number> = {};
  const key = (name: string) => page.getByRole("button", { name, exact: true });

  async function record(i: number, value: string | null) {
    await waitForSteadyPlan(page);
    await taps.tap(await planToScreen(page, spots[i].x, spots[i].y));
    await page.getByRole("heading", { name: `#${i + 1}`, exact: true }).waitFor();
    if (value === null) await taps.tap(key("0 ppm — save"));
    else {
      for (const k of value) await taps.tap(key(k));
      await taps.tap(key("Save"));
    }
    await page.getByRole("heading", { name: `#${i + 1}`, exact: true }).waitFor({ state: "detached" });
    return taps.take();
  }

  tally["a 0 ppm reading"] = await record(0, null);
  // Past the detector's transport delay and time constant (5 s + 1.5 s) after the first reading, so
  // the alarm's air is placed on the walked path.
  await page.waitForTimeout(7000);
  tally["a 30 ppm reading"] = await record(1, "30");
  tally["a 2 ppm reading"] = await record(2, "2");
  // The banner keeps the sweep's peak (30 ppm, #2), not the later 2 ppm alarm, and names the place.
  const banner = page.getByTestId("lag-hint");
  await expect(banner.textContent()).resolves.toMatch(/Alarm: 30 ppm peak so far \(#2\), sampled at Dairy/);

  // The banner arrived after the plan's first fit: the whole plan still shows, under the header.
  await waitForSteadyPlan(page);
  const plan = page.getByTestId("walk-plan");
  const box = (await plan.boundingBox())!;
  const [zoom, panX, panY] = (await plan.getAttribute("data-view"))!.split(" ").map(Number);
  const header = (await page.locator('[data-testid="walk-screen"] header').boundingBox())!;
  expect(box.y + panY).toBeGreaterThanOrEqual(header.y + header.height - 1);
  expect(panY + 36 * zoom).toBeLessThanOrEqual(box.height + 1); // the demo plan is 36 m deep
  expect(panX).toBeGreaterThanOrEqual(0);

  // A tap opens the keypad; the plan keeps a usable share of the phone's screen, the reading in it.
  await waitForSteadyPlan(page);
  await taps.tap(await planToScreen(page, spots[3].x, spots[3].y));
  await page.getByRole("heading", { name: "#4", exact: true }).waitFor();
  await waitForSteadyPlan(page);
  const open = (await plan.boundingBox())!;
  const share = open.height / PHONE.viewport.height;
  console.log(
    `walk phone: plan ${open.height.toFixed(0)} px of 844 (${(share * 100).toFixed(0)} %) with the keypad open and the alarm banner`,
  );
  expect(share).toBeGreaterThanOrEqual(0.3);
  const at = await planToScreen(page, spots[3].x, spots[3].y);
  expect(at.y).toBeGreaterThan(open.y);
  expect(at.y).toBeLessThan(open.y + open.height);
  await page.screenshot({ path: path.join(SCREENS, "walk-phone-keypad-open.png") });
  // The next tap saves the open reading as 0 ppm and opens the next one: one tap per reading.
  await waitForSteadyPlan(page);
  await taps.tap(await planToScreen(page, spots[4].x, spots[4].y));
  await page.getByRole("heading", { name: "#5", exact: true }).waitFor();
  tally["the next reading (tap saves the open one)"] = taps.take() - 1;
  await taps.tap(key("0 ppm — save"));
  taps.take();

  // The key to the plan's marks.
  await page.getByRole("button", { name: "Key", exact: true }).tap();
  const legend = page.getByTestId("plan-legend");
  for (const words of ["not sampled yet", "Risk point", "at or above the alarm", "Where the peak's air was sampled"])
    await legend.getByText(words).first().waitFor();
  await page.screenshot({ path: path.join(SCREENS, "walk-phone-plan-key.png") });
  await page.getByRole("button", { name: "Hide key" }).tap();

  // Leave with two readings still on the device only (no signal in the back room).
  await until(
    "five readings on the server",
    () => storedReadings(suite.server.ctx, sweepId),
    (r) => r.length === 5,
  );
  await context.setOffline(true);
  await record(5, null);
  await record(6, "1");
  await taps.tap(page.getByRole("button", { name: "← Leave" }));
  // The start page lists it, from the device alone: its readings and the two that wait.
  const resume = page.locator(`[data-testid="resume-sweep"][data-sweep-id="${sweepId}"]`);
  await resume.waitFor();
  await expect(resume.getByTestId("resume-counts").textContent()).resolves.toBe("7 readings · 2 waiting to upload");
  await page.screenshot({ path: path.join(SCREENS, "walk-phone-resume-offline.png"), fullPage: true });
  await context.setOffline(false);
  await until(
    "seven readings on the server",
    () => storedReadings(suite.server.ctx, sweepId),
    (r) => r.length === 7,
  );

  // Another member's sweep of the same store, on the server only, lists after the member's own.
  const [mine] = await suite.server.ctx.db.select().from(sweeps).where(eq(sweeps.id, sweepId));
  const [theirs] = await suite.server.ctx.db
    .insert(sweeps)
    .values({
      ...mine,
      id: crypto.randomUUID(),
      technicianId: suite.co.people["lead-tech"].userId,
      startedAt: new Date(),
    })
    .returning({ id: sweeps.id });

  // The Walk page lists both; the member's own first.
  taps.take();
  await page.goto(`${suite.server.url}/walk`);
  const listed = page.getByTestId("resume-sweep");
  await listed.nth(1).waitFor();
  await expect(listed.nth(0).getAttribute("data-sweep-id")).resolves.toBe(sweepId);
  await expect(listed.nth(1).getAttribute("data-sweep-id")).resolves.toBe(theirs.id);
  await expect(listed.nth(0).getByTestId("resume-counts").textContent()).resolves.toBe("7 readings · all uploaded");
  await page.screenshot({ path: path.join(SCREENS, "walk-phone-resume-list.png"), fullPage: true });
  // So does the store's page.
  await page.goto(`${suite.server.url}/stores/${suite.co.store.id}`);
  await page.locator(`[data-testid="resume-sweep"][data-sweep-id="${sweepId}"]`).waitFor();
  await page.goBack();
  await taps.tap(page.locator(`[data-testid="resume-sweep"][data-sweep-id="${sweepId}"]`));
  tally["resume a sweep from the Walk page"] = taps.take();
  await page
    .getByTestId("walk-count")
    .filter({ hasText: /^7 readings/ })
    .waitFor();

  await taps.tap(page.getByRole("navigation", { name: "Sweep tools" }).getByRole("button", { name: "Submit" }));
  await taps.tap(page.getByRole("button", { name: "Submit sweep" }));
  tally["submit"] = taps.take();
  // Once the server has the submit, the header says so (not "submitting").
  await page
    .getByTestId("walk-count")
    .filter({ hasText: /^7 readings · submitted · / })
    .waitFor();
  await page.getByText("Sweep submitted: the server has it.").waitFor();
  const [row] = await suite.server.ctx.db.select().from(sweeps).where(eq(sweeps.id, sweepId));
  expect(row.status).toBe("submitted");
  await page.screenshot({ path: path.join(SCREENS, "walk-phone-submitted.png") });

  console.log(`walk phone taps: ${JSON.stringify(tally)}`);
  expect(tally["a 0 ppm reading"]).toBe(2);
  expect(tally["a 30 ppm reading"]).toBe(4);
  expect(tally["a 2 ppm reading"]).toBe(3);
  expect(tally["the next reading (tap saves the open one)"]).toBe(1);
  expect(tally["resume a sweep from the Walk page"]).toBe(1);
  expect(tally["submit"]).toBe(2);
  expect(failures).toEqual([]);
  await context.close();
});

it("after a reload with no connection, lengths stay in the member's feet and inches (the company's default, kept in the session)", async () => {
  await suite.server.ctx.db.update(companies).set({ lengthUnit: "ft-in" }).where(eq(companies.id, suite.co.company.id));
  const { context, page, failures } = await phonePage();
  await signInThroughForm(page, suite.server.url, suite.co.people.technician.email, PASSWORD);
  await startSweep(page);
  const spots = dairySpots();
  for (const [i, value] of [
    [0, null],
    [1, "9"],
  ] as const) {
    if (i === 1) await page.waitForTimeout(7000); // past the transport delay and time constant (5 s + 1.5 s)
    await waitForSteadyPlan(page);
    const p = await planToScreen(page, spots[i].x, spots[i].y);
    await page.touchscreen.tap(p.x, p.y);
    if (value) {
      await page.getByRole("button", { name: value, exact: true }).tap();
      await page.getByRole("button", { name: "Save", exact: true }).tap();
    } else await page.getByRole("button", { name: "0 ppm — save" }).tap();
  }
  // 0.6 m re-check spacing = 23.6 in, to the inch 2 ft 0 in (1 ft = 0.3048 m exactly, NIST SP 811).
  const banner = page.getByTestId("lag-hint");
  await expect(banner.textContent()).resolves.toMatch(/2 ft 0 in spacing/);
  await page.locator('[data-testid="sync-banner"][data-waiting="0"]').waitFor();

  await context.setOffline(true);
  await page.reload();
  await page
    .getByTestId("walk-count")
    .filter({ hasText: /^2 readings/ })
    .waitFor();
  // The store's name comes from the device's copy of the store, without waiting on the network.
  await page.locator('[data-testid="walk-screen"] header').getByText(suite.co.store.name).waitFor();
  await expect(banner.textContent()).resolves.toMatch(/2 ft 0 in spacing/);
  expect(await banner.textContent()).not.toMatch(/\d m\b/);
  await page.screenshot({ path: path.join(SCREENS, "walk-phone-offline-reload-ft-in.png") });
  await context.setOffline(false);
  expect(failures).toEqual([]);
  await context.close();
});
