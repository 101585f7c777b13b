import { expect, it } from "vitest";
import { eq } from "drizzle-orm";
import type { Page } from "playwright-core";
import { readingAudit, sweeps } from "../../server/db/schema/index";
import { demoFixtures } from "../../server/db/seed/demo-layout";
import { newContext } from "../helpers/browser";
import { signInThroughForm } from "../helpers/e2e-session";
import { walkSuite } from "../helpers/walk-suite";
import { PASSWORD } from "../helpers/fixtures";
import { planToScreen, waitForServiceWorker, storedReadings, until, waitForSteadyPlan } from "../helpers/walk-e2e";

const suite = walkSuite("Holloway Provisions");

const onServer = (sweepId: string) => storedReadings(suite.server.ctx, sweepId);

/**
 * The demo plan's dairy lineup (the open cases along the back-room partition), walked 0.4 m in front
 * of the case fronts with a tap every 1.3 m: about one reading per 4 ft of case, a close sniffing
 * spacing along a case line (common practice, no published source).
 */
function dairyLineSpots(): { x: number; y: number }[] {
  const cases = demoFixtures({ "rack-mt": "a", "rack-lt": "b", "walk-ins": "c" }).filter(
    (f) => f.kind === "open-case" && f.label.startsWith("Dairy"),
  );
  const poly = cases.flatMap((f) => ("polygon" in f ? f.polygon : []));
  const west = Math.min(...poly.map((p) => p[0]));
  const east = Math.max(...poly.map((p) => p[0]));
  const front = Math.max(...poly.map((p) => p[1]));
  const spots: { x: number; y: number }[] = [];
  for (let x = west + 0.5; x <= east - 0.3; x += 1.3) spots.push({ x, y: front + 0.4 });
  return spots;
}

async function openWalk(page: Page) {
  await signInThroughForm(page, suite.server.url, suite.co.people.technician.email, PASSWORD);
  await page.goto(`${suite.server.url}/stores/${suite.co.store.id}/walk`);
  await page.getByRole("button", { name: "Start the sweep" }).tap();
  await page.getByTestId("walk-plan").waitFor();
  await waitForSteadyPlan(page);
  await waitForServiceWorker(page);
  const sweepId = page.url().split("/").pop()!;
  await until(
    "the sweep on the server",
    () => suite.server.ctx.db.select().from(sweeps).where(eq(sweeps.id, sweepId)),
    (r) => r.length === 1,
  );
  return sweepId;
}

it("on a phone with touch, a sweep of the demo store's dairy line takes one tap per reading plus Submit and its confirm, through a cut network and an offline reload", async () => {
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
  const sweepId = await openWalk(page);

  const spots = dairyLineSpots();
  expect(spots.length).toBe(17); // 21.96 m of cases (six 3.66 m cases)
  let positionTaps = 0;
  let otherTaps = 0;
  async function tapSpot(i: number) {
    // The banner's text can wrap (e.g. going offline) and refit the plan: aim once it is still.
    await waitForSteadyPlan(page);
    const p = await planToScreen(page, spots[i].x, spots[i].y);
    await page.touchscreen.tap(p.x, p.y);
    positionTaps++;
    // The reading exists from its tap: counted at once, and on the keypad.
    await page
      .getByTestId("walk-count")
      .filter({ hasText: new RegExp(`^${i + 1} readings?`) })
      .waitFor();
    await page.getByRole("heading", { name: `#${i + 1}`, exact: true }).waitFor();
  }

  const half = Math.floor(spots.length / 2);
  for (let i = 0; i < half; i++) await tapSpot(i);
  // All but the reading on the keypad are uploaded; the open one is not.
  await until(
    `${half - 1} readings on the server`,
    () => onServer(sweepId),
    (r) => r.length === half - 1,
  );

  await context.setOffline(true);
  for (let i = half; i < half + 4; i++) await tapSpot(i);
  await page.locator('[data-testid="sync-banner"][data-waiting="4"]').waitFor();

  // Reload with no connection: the app shell from the service worker, the readings from IndexedDB,
  // and the open reading back on the keypad.
  await page.reload();
  await page
    .getByTestId("walk-count")
    .filter({ hasText: new RegExp(`^${half + 4} readings`) })
    .waitFor();
  await page.getByRole("heading", { name: `#${half + 4}`, exact: true }).waitFor();
  await waitForSteadyPlan(page);
  expect((await onServer(sweepId)).length).toBe(half - 1);

  await context.setOffline(false);
  for (let i = half + 4; i < spots.length; i++) await tapSpot(i);
  // Submit is in the toolbar while the keypad is open; it commits the last reading.
  await page.getByRole("navigation", { name: "Sweep tools" }).getByRole("button", { name: "Submit" }).tap();
  otherTaps++;
  await expect(page.getByTestId("summary-readings").textContent()).resolves.toBe(String(spots.length));
  await page.getByRole("button", { name: "Submit sweep" }).tap();
  otherTaps++;

  const [done] = await until(
    "the sweep submitted",
    () => suite.server.ctx.db.select().from(sweeps).where(eq(sweeps.id, sweepId)),
    (r) => r[0]?.status === "submitted",
  );
  const stored = await onServer(sweepId);
  expect(stored).toHaveLength(spots.length);
  stored.forEach((r, i) => {
    expect(r.x).toBeCloseTo(spots[i].x, 0);
    expect(r.y).toBeCloseTo(spots[i].y, 0);
    expect(r.ppm).toBe(0);
  });
  // Every reading reached the server in its final value at once: nothing was edited afterwards.
  expect(await suite.server.ctx.db.select().from(readingAudit).where(eq(readingAudit.sweepId, sweepId))).toEqual([]);
  expect(done.submittedAt).not.toBeNull();
  expect(positionTaps).toBe(stored.length);
  expect(otherTaps).toBe(2);
  await page.locator('[data-testid="sync-banner"][data-waiting="0"]').waitFor();
  expect(failures).toEqual([]);
  await context.close();
});

it("a half-typed value stays on the device through a reload and is uploaded once, when the technician leaves the screen", async () => {
  const context = await newContext(suite.browser, {
    viewport: { width: 390, height: 844 },
    hasTouch: true,
    isMobile: true,
    deviceScaleFactor: 2,
  });
  const page = await context.newPage();
  page.setDefaultTimeout(15_000);
  const sweepId = await openWalk(page);
  const [a, b] = dairyLineSpots();
  for (const s of [a, b]) {
    await waitForSteadyPlan(page); // the keypad opening after the first tap refits the plan
    const p = await planToScreen(page, s.x, s.y);
    await page.touchscreen.tap(p.x, p.y);
  }
  await page.getByRole("heading", { name: "#2", exact: true }).waitFor();
  await page.getByRole("button", { name: "7", exact: true }).tap();
  await page.getByRole("button", { name: "Decimal point" }).tap();
  await page.getByRole("button", { name: "5", exact: true }).tap();
  await until(
    "the first reading on the server",
    () => onServer(sweepId),
    (r) => r.length === 1,
  );
  await page.waitForTimeout(1000); // a sync pass would have had time to send the open one
  expect((await onServer(sweepId)).length).toBe(1);

  await page.reload();
  await page.getByRole("heading", { name: "#2", exact: true }).waitFor();
  await expect(page.getByLabel("Value").textContent()).resolves.toMatch(/^7\.5 ppm$/);
  await page.getByRole("button", { name: "← Leave" }).tap();
  await page.getByTestId("walk-screen").waitFor({ state: "detached" });
  const stored = await until(
    "both readings on the server",
    () => onServer(sweepId),
    (r) => r.length === 2,
  );
  expect(stored.map((r) => r.ppm)).toEqual([0, 7.5]);
  expect(await suite.server.ctx.db.select().from(readingAudit).where(eq(readingAudit.sweepId, sweepId))).toEqual([]);
  await context.close();
});

it("moves an uploaded reading from the readings list and the open one from its keypad; only the uploaded one's move is an audited edit; the zoom buttons zoom about the open reading", async () => {
  const context = await newContext(suite.browser, {
    viewport: { width: 390, height: 844 },
    hasTouch: true,
    isMobile: true,
    deviceScaleFactor: 2,
  });
  const page = await context.newPage();
  page.setDefaultTimeout(15_000);
  const sweepId = await openWalk(page);
  const [a, b, c] = dairyLineSpots();
  const tapAt = async (s: { x: number; y: number }) => {
    await waitForSteadyPlan(page);
    const p = await planToScreen(page, s.x, s.y);
    await page.touchscreen.tap(p.x, p.y);
  };
  await tapAt(a);
  await tapAt(b);
  await page.getByRole("heading", { name: "#2", exact: true }).waitFor();
  await until(
    "the first reading on the server",
    () => onServer(sweepId),
    (r) => r.length === 1,
  );

  // The first one was really taken 1 m further along the case: move it from the list.
  await page.getByRole("button", { name: "Readings" }).tap();
  const rows = page.getByTestId("reading-row");
  await rows.filter({ hasText: "#1 ·" }).getByRole("button", { name: "Move" }).tap();
  await page.getByText("Tap the plan where reading #1 was taken.").waitFor();
  await tapAt({ x: a.x + 1, y: a.y });
  await until(
    "the moved reading on the server",
    () => onServer(sweepId),
    (r) => r.length === 1 && Math.abs(r[0].x - (a.x + 1)) < 0.2,
  );
  // Gloves cannot always pinch: the zoom buttons zoom about the reading on the keypad.
  const plan = page.getByTestId("walk-plan");
  const viewOf = async () => (await plan.getAttribute("data-view"))!.split(" ").map(Number);
  const [fitScale] = await viewOf();
  const before = await planToScreen(page, b.x, b.y);
  await page.getByRole("button", { name: "Zoom in" }).tap();
  expect((await viewOf())[0]).toBeCloseTo(fitScale * 1.6, 5);
  const after = await planToScreen(page, b.x, b.y);
  expect(Math.hypot(after.x - before.x, after.y - before.y)).toBeLessThan(1);
  // The open reading #2 moves from its keypad and stays open.
  await page.getByRole("button", { name: "Move", exact: true }).tap();
  await tapAt(c);
  await page.getByRole("heading", { name: "#2", exact: true }).waitFor();
  await expect(page.getByTestId("walk-count").textContent()).resolves.toMatch(/^2 readings/);
  await page.getByRole("button", { name: "Show the whole plan" }).tap();
  expect((await viewOf())[0]).toBeCloseTo(fitScale, 5);
  await page.getByRole("button", { name: "Submit" }).tap();
  await page.getByRole("button", { name: "Submit sweep" }).tap();
  const stored = await until(
    "both readings on the server",
    () => onServer(sweepId),
    (r) => r.length === 2,
  );
  expect(stored[1].x).toBeCloseTo(c.x, 0);
  const audit = await suite.server.ctx.db.select().from(readingAudit).where(eq(readingAudit.sweepId, sweepId));
  expect(audit).toHaveLength(1);
  expect(audit[0]).toMatchObject({ readingId: stored[0].id, action: "edit" });
  expect((audit[0].before as { x: number }).x).toBeCloseTo(a.x, 1);
  expect((audit[0].after as { x: number }).x).toBeCloseTo(a.x + 1, 1);
  await context.close();
});
