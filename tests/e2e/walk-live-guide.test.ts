import path from "node:path";
import { mkdirSync } from "node:fs";
import { expect, it } from "vitest";
import { newContext } from "../helpers/browser";
import { signInThroughForm } from "../helpers/e2e-session";
import { walkSuite } from "../helpers/walk-suite";
import { PASSWORD } from "../helpers/fixtures";
import { latestDemoTaps } from "../helpers/demo-sweep-taps";
import { queueTapsOnDevice, waitForServiceWorker, waitForSteadyPlan } from "../helpers/walk-e2e";

const suite = walkSuite("Ashgrove Pantry");
const SCREENS = path.resolve(import.meta.dirname, "../../test-results/screens");
mkdirSync(SCREENS, { recursive: true });

it("on a phone, offline, after the demo sweep's readings: live suspects and next probe points on the plan, and a tapped probe point opens the keypad there", async () => {
  const context = await newContext(suite.browser, {
    viewport: { width: 390, height: 844 },
    hasTouch: true,
    isMobile: true,
    deviceScaleFactor: 2,
  });
  const page = await context.newPage();
  page.setDefaultTimeout(30_000);
  const failures: string[] = [];
  page.on("pageerror", (e) => failures.push(String(e)));
  const requests: string[] = [];
  page.on("request", (r) => {
    if (r.url().includes("/api/")) requests.push(r.url());
  });

  await signInThroughForm(page, suite.server.url, suite.co.people.technician.email, PASSWORD);
  await page.goto(`${suite.server.url}/stores/${suite.co.store.id}/walk`);
  await page.getByRole("button", { name: "Start the sweep" }).tap();
  await page.getByTestId("walk-plan").waitFor();
  await waitForServiceWorker(page);
  const sweepId = page.url().split("/").pop()!;
  await page.locator('[data-testid="sync-banner"][data-waiting="0"]').waitFor();

  // No signal from here on: the readings stay on the device and the estimate is made there.
  await context.setOffline(true);
  const taps = latestDemoTaps();
  await queueTapsOnDevice(
    page,
    sweepId,
    taps.map((t) => ({
      ...t,
      x: Math.min(59.95, Math.max(0.05, t.x)),
      y: Math.min(35.95, Math.max(0.05, t.y)),
    })),
  );
  // Reloaded offline: the service worker serves the app shell and the worker script from its cache.
  await page.reload();
  await page
    .getByTestId("walk-count")
    .filter({ hasText: `${taps.length} readings` })
    .waitFor();
  await waitForSteadyPlan(page);
  const apiBefore = requests.length;

  const guide = page.getByTestId("live-guide");
  await page.locator('[data-testid="live-guide"]:not([data-suspects="0"]):not([data-probes="0"])').waitFor();
  // Folded to one line over the plan's bottom edge at first; opened, it lists the probe points.
  await expect(page.getByTestId("live-folded").textContent()).resolves.toMatch(/probe point/);
  await page.screenshot({ path: path.join(SCREENS, "walk-live-guide-folded.png") });
  await page.getByRole("button", { name: "Show guide" }).tap();
  const first = await page.getByTestId("live-first").textContent();
  // The demo's latest leak is a brazed joint behind Dairy 3 (server/db/seed/demo-story.ts).
  expect(first).toMatch(/^Suspect 1: Dairy 3, within /);
  await expect(guide.textContent()).resolves.toMatch(/the full analysis after submit is the reference/);
  const probes = page.getByRole("list", { name: "Where to probe next" }).getByRole("button");
  const count = await probes.count();
  expect(count).toBeGreaterThanOrEqual(1);
  expect(count).toBeLessThanOrEqual(3);
  for (let i = 0; i < count; i++)
    await expect(probes.nth(i).textContent()).resolves.toMatch(/^\d+Probe \d+: .+ away(Tells|Narrows)/);
  await page.screenshot({ path: path.join(SCREENS, "walk-live-guide-phone-offline.png") });

  const [px, py] = (await probes.first().getAttribute("data-at"))!.split(" ").map(Number);
  const estimates = async () => Number(await guide.getAttribute("data-estimates"));
  let counted = await estimates();
  await probes.first().tap();
  await page.getByRole("heading", { name: `#${taps.length + 1}`, exact: true }).waitFor();
  await page.getByRole("button", { name: "0 ppm — save" }).waitFor();
  // The keypad's reading sits where the probe point is.
  const open = await page.evaluate(async () => {
    const db: IDBDatabase = await new Promise((resolve, reject) => {
      const r = indexedDB.open("plumeline-walk");
      r.onsuccess = () => resolve(r.result);
      r.onerror = () => reject(r.error);
    });
    const all: { x: number; y: number; sync: { kind: string } }[] = await new Promise((resolve) => {
      const g = db.transaction("readings").objectStore("readings").getAll();
      g.onsuccess = () => resolve(g.result);
    });
    db.close();
    return all.filter((r) => r.sync.kind === "draft");
  });
  expect(open).toHaveLength(1);
  expect(open[0].x).toBeCloseTo(px, 6);
  expect(open[0].y).toBeCloseTo(py, 6);
  await page.screenshot({ path: path.join(SCREENS, "walk-live-guide-probe-keypad.png") });

  // Two more readings at the next probe points: the first suspect holds, and the screen asks for the
  // supply-air check, which opens the keypad on the suspect with the sample point set to supply air.
  // Each save is answered before the next (the panel is away while the keypad is open), so every
  // estimate counts toward the settling.
  const settled = page.getByTestId("supply-ask");
  for (let i = 0; i < 6; i++) {
    if (i > 0) {
      await page.locator('[data-testid="live-guide"]:not([data-probes="0"])').waitFor();
      counted = await estimates();
      await probes.first().tap();
      await page.getByRole("heading", { name: `#${taps.length + 1 + i}`, exact: true }).waitFor();
    }
    await page.getByRole("button", { name: "3", exact: true }).tap();
    await page.getByRole("button", { name: "Save", exact: true }).tap();
    await page
      .getByTestId("walk-count")
      .filter({ hasText: `${taps.length + 1 + i} readings` })
      .waitFor();
    await page.waitForFunction(
      (n) => Number(document.querySelector('[data-testid="live-guide"]')?.getAttribute("data-estimates")) > n,
      counted,
    );
    if (await settled.isVisible()) break;
  }
  await settled.waitFor();
  await page.screenshot({ path: path.join(SCREENS, "walk-live-guide-supply-ask.png") });
  await page.getByRole("button", { name: "Read the supply air here" }).tap();
  await page.getByRole("button", { name: /Sample point: Supply air/ }).waitFor();
  await page.getByRole("button", { name: "9", exact: true }).tap();
  await page.getByRole("button", { name: "Save", exact: true }).tap();
  await expect(page.getByTestId("supply-read").textContent()).resolves.toMatch(/Supply air read at suspect 1: 9 ppm/);

  // Nothing asked the network for the estimate.
  expect(requests.slice(apiBefore).filter((u) => /analysis/.test(u))).toEqual([]);
  expect(failures).toEqual([]);
  await context.close();
});
