import path from "node:path";
import { mkdirSync } from "node:fs";
import { expect, it } from "vitest";
import { asc, eq } from "drizzle-orm";
import type { Page } from "playwright-core";
import { readings, sweepPasses, sweeps } from "../../server/db/schema/index";
import { newContext } from "../helpers/browser";
import { signInThroughForm } from "../helpers/e2e-session";
import { walkSuite } from "../helpers/walk-suite";
import { PASSWORD } from "../helpers/fixtures";
import {
  planShare,
  planToScreen,
  shownInFull,
  waitForServiceWorker,
  until,
  waitForSteadyPlan,
} from "../helpers/walk-e2e";

const suite = walkSuite("Corrie Lane Foods");
const SCREENS = path.resolve(import.meta.dirname, "../../test-results/screens");
mkdirSync(SCREENS, { recursive: true });
const PHONE = { viewport: { width: 390, height: 844 }, hasTouch: true, isMobile: true, deviceScaleFactor: 2 };

// The demo plan's Dairy 1 (x 2–5.66 m, front at y = 9.5 m, fans): taps 0.2 m in front of it, 0.7 m
// apart, and three across the aisle. Along the case the taps are 7 s apart on the page's clock, a re-check's pace: the
// detector's air (5 s delay + 1.5 s time constant) then comes from the tap before, on the same front.
const AISLE = [
  { x: 12, y: 11.5 },
  { x: 16, y: 11.5 },
  { x: 20, y: 11.5 },
];
const FRONT = [2.3, 3.0, 3.7, 4.4, 5.1].map((x) => ({ x, y: 9.7 }));
const PACE_MS = 7000;

/** A screenshot for a person, and the plan keeps about half the phone's height (docs/decisions/0140). */
async function look(page: Page, name: string) {
  await page.screenshot({ path: path.join(SCREENS, `${name}.png`) });
  const share = await planShare(page);
  console.log(`${name}: the plan keeps ${(share * 100).toFixed(0)} % of the screen's height`);
  expect(share, name).toBeGreaterThanOrEqual(0.45);
}

async function record(page: Page, spot: { x: number; y: number }, value: string, n: number) {
  await waitForSteadyPlan(page);
  const p = await planToScreen(page, spot.x, spot.y);
  await page.touchscreen.tap(p.x, p.y);
  await page.getByRole("heading", { name: `#${n}`, exact: true }).waitFor();
  if (value === "0") await page.getByRole("button", { name: "0 ppm — save" }).tap();
  else {
    for (const k of value) await page.getByRole("button", { name: k, exact: true }).tap();
    await page.getByRole("button", { name: "Save", exact: true }).tap();
  }
  await page.getByRole("heading", { name: `#${n}`, exact: true }).waitFor({ state: "detached" });
}

it("on a phone with touch: level readings along a case advise stopping its fans; a still-air pass is recorded with its conditions, its reminder survives a reload, and the server's analysis fits both passes", async () => {
  const context = await newContext(suite.browser, PHONE);
  const page = await context.newPage();
  page.setDefaultTimeout(15_000);
  const failures: string[] = [];
  page.on("pageerror", (e) => failures.push(String(e)));
  // the page's clock runs on and jumps over the stops along the case (no real waiting)
  await context.clock.install();
  await signInThroughForm(page, suite.server.url, suite.co.people.technician.email, PASSWORD);
  await page.goto(`${suite.server.url}/stores/${suite.co.store.id}/walk`);
  await page.getByRole("button", { name: "Start the sweep" }).tap();
  await page.getByTestId("walk-plan").waitFor();
  await waitForSteadyPlan(page);
  await waitForServiceWorker(page);
  const sweepId = page.url().split("/").pop()!;

  // First pass, fans running: nothing across the aisle, then level at 6–7 ppm all along Dairy 1.
  let n = 0;
  for (const s of AISLE) await record(page, s, "0", ++n);
  for (const [i, s] of FRONT.entries()) {
    await context.clock.fastForward(PACE_MS);
    await record(page, s, ["6", "7", "6", "7", "6"][i], ++n);
  }
  const advice = page.getByTestId("mixing-advice");
  await expect(advice.textContent()).resolves.toMatch(/across Dairy 1: its fans are mixing the gas/);
  await look(page, "walk-pinpoint-advice");

  // The still-air pass: the cautions first (product temperature, the refrigerant's, local codes). The
  // advice is one line of the folded banners: a tap shows it in full.
  await advice.tap();
  await advice.getByRole("button", { name: "Still-air pass…" }).tap();
  const dialog = page.getByRole("dialog", { name: "Still-air pass at Dairy 1" });
  await expect(dialog.textContent()).resolves.toMatch(/product warms up/);
  await expect(dialog.textContent()).resolves.toMatch(/local codes/);
  // they come first and show in full on the phone as the pass starts
  expect(await shownInFull(page, '[data-testid="start-pass-cautions"]')).toBe(true);
  await dialog.getByRole("button", { name: "5 minutes more" }).tap();
  await expect.poll(() => dialog.getByTestId("pass-minutes").textContent()).toBe("25 min");
  await page.screenshot({ path: path.join(SCREENS, "walk-pinpoint-start.png") });
  await dialog.getByRole("button", { name: "Start still-air pass" }).tap();
  const banner = page.getByTestId("pass-banner");
  await expect(banner.textContent()).resolves.toMatch(
    /Pass 2: fans stopped at Dairy 1\. Restore the fans in 2[45]:\d\d/,
  );
  // the running pass keeps its cautions at most two taps away: its line (when the banners are folded),
  // then its cautions, which open over the whole screen and read in full on the phone without scrolling
  // a box inside the page (a tap on the open banner could land on its end-pass button)
  if ((await page.getByTestId("notice-strip").getAttribute("data-open")) !== "yes") await banner.tap();
  await look(page, "walk-pinpoint-pass-open");
  await banner.getByRole("button", { name: /Cautions while the air is still/ }).tap();
  await expect(page.getByTestId("pass-cautions").textContent()).resolves.toMatch(/product warms up.*local codes/);
  expect(await shownInFull(page, '[data-testid="pass-cautions"]')).toBe(true);
  await page.screenshot({ path: path.join(SCREENS, "walk-pinpoint-pass-cautions.png") });
  await page.getByRole("button", { name: "Back to the pass" }).tap();
  await page.getByTestId("pass-cautions").waitFor({ state: "detached" });

  // Readings in still air peak at the leak, about the third tap.
  for (const [i, s] of FRONT.entries()) {
    await context.clock.fastForward(PACE_MS);
    await record(page, s, ["3", "9", "20", "12", "4"][i], ++n);
  }
  await look(page, "walk-pinpoint-pass-timer");

  // The reminder lives on the device: a reload brings the pass and its clock back.
  await page.reload();
  await page
    .getByTestId("walk-count")
    .filter({ hasText: new RegExp(`^${n} readings`) })
    .waitFor();
  await expect(page.getByTestId("pass-banner").textContent()).resolves.toMatch(/Restore the fans in 2[345]:\d\d/);

  await page.getByRole("button", { name: "Show the notices in full" }).tap();
  await page.getByTestId("pass-banner").getByRole("button", { name: "Fans back on — end pass" }).tap();
  await page.getByTestId("pass-banner").waitFor({ state: "detached" });
  await page.getByRole("navigation", { name: "Sweep tools" }).getByRole("button", { name: "Submit" }).tap();
  await page.getByRole("button", { name: "Submit sweep" }).tap();
  await until(
    "the sweep submitted",
    () => suite.server.ctx.db.select().from(sweeps).where(eq(sweeps.id, sweepId)),
    (r) => r[0]?.status === "submitted",
  );
  await page.screenshot({ path: path.join(SCREENS, "walk-pinpoint-submitted.png") });

  // On the server: one pass with its conditions and its end, the thirteen readings in their passes.
  const [pass] = await until(
    "the pass ended on the server",
    () => suite.server.ctx.db.select().from(sweepPasses).where(eq(sweepPasses.sweepId, sweepId)),
    (r) => r.length === 1 && r[0].endedAt !== null,
  );
  expect(pass).toMatchObject({ fans: "stopped", defrost: false });
  const stored = await suite.server.ctx.db
    .select({ ppm: readings.ppm, passId: readings.passId })
    .from(readings)
    .where(eq(readings.sweepId, sweepId))
    .orderBy(asc(readings.takenAt));
  expect(stored.map((r) => r.passId)).toEqual([...Array(8).fill(null), ...Array(5).fill(pass.id)]);

  // The analysis fits both passes: the mixing is read from the first, the spot from the second.
  const res = await page.request.get(`${suite.server.url}/api/sweeps/${sweepId}/analysis?wait=true`);
  expect(res.status()).toBe(200);
  const body = await res.json();
  const seen = JSON.stringify({ diagnostics: body.diagnostics, spots: body.candidates.slice(0, 3) });
  expect(
    body.diagnostics.map((d: { kind: string }) => d.kind),
    seen,
  ).toContain("fans-mixing");
  expect(body.readings).toHaveLength(13);
  const top = body.candidates[0];
  expect(top, seen).toBeDefined();
  // the still-air readings peak on Dairy 1 (x 2–5.66 m, y 8.4–9.5 m)
  expect(top.x).toBeGreaterThan(2);
  expect(top.x).toBeLessThan(5.7);
  expect(top.y).toBeGreaterThan(8);

  // The field map says which taps were in which pass (squares for the pinpoint pass).
  await page.goto(`${suite.server.url}/stores/${suite.co.store.id}/sweeps/${sweepId}/map`);
  const key = page.getByTestId("pass-key");
  // (the fixtures' names arrive with the plan's layout, after the sweep)
  await key
    .filter({ hasText: /Pass 1 \(circles\): fans running.*Pass 2 \(squares\): fans stopped at Dairy 1/ })
    .waitFor();
  await page.getByLabel(/Field map with \d+ numbered suspect spots/).waitFor();
  await page.screenshot({ path: path.join(SCREENS, "walk-pinpoint-field-map.png"), fullPage: true });
  expect(failures).toEqual([]);
  await context.close();
});
