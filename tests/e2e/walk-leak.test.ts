import { expect, it } from "vitest";
import { asc, eq } from "drizzle-orm";
import { findingPhotos, findings, readings } from "../../server/db/schema/index";
import { newContext } from "../helpers/browser";
import { signInThroughForm } from "../helpers/e2e-session";
import { walkSuite } from "../helpers/walk-suite";
import { PASSWORD } from "../helpers/fixtures";
import { makeJpeg } from "../helpers/plan-images";
import { planToScreen, until, waitForServiceWorker, waitForSteadyPlan } from "../helpers/walk-e2e";

const suite = walkSuite("Fallowfield Foods");
/** How long a background upload may take: a bound for a stuck queue, well inside the test's 120 s. */
const UPLOAD_WAIT_MS = 60_000;

it("on a tablet with a mouse, walks the dairy case line one click per reading, imports the detector's log, then marks a pinpointed leak with a photo while offline", async () => {
  const context = await newContext(suite.browser, { viewport: { width: 1024, height: 768 } });
  const page = await context.newPage();
  page.setDefaultTimeout(15_000);
  const failures: string[] = [];
  page.on("pageerror", (e) => failures.push(String(e)));
  page.on("console", (m) => {
    if (m.type() === "error") failures.push(m.text());
  });

  await signInThroughForm(page, suite.server.url, suite.co.people.technician.email, PASSWORD);
  await page.goto(`${suite.server.url}/walk`);
  await page.getByRole("link", { name: suite.co.store.name }).click();
  await page.getByRole("button", { name: "Start the sweep" }).click();
  await page.getByTestId("walk-plan").waitFor();
  await waitForSteadyPlan(page);
  await waitForServiceWorker(page);
  const sweepId = page.url().split("/").pop()!;

  // Dairy cases run from x 2 m to 24 m with their fronts at y 9.5 m; walk 0.5 m in front of them.
  // A click on the next spot saves the keypad's value (0 unless typed), so zeros cost one click each.
  const xs = [3, 5, 7, 9, 11, 13, 15];
  let clicks = 0;
  for (const [i, x] of xs.entries()) {
    await waitForSteadyPlan(page);
    const p = await planToScreen(page, x, 10);
    await page.mouse.click(p.x, p.y);
    clicks++;
    // Aim the next click only once this one has landed: the reading is counted from its click, and
    // on the keypad. (Aimed sooner, it can meet a plan that is about to refit under it and open an
    // earlier reading instead of taking a new one.)
    await page
      .getByTestId("walk-count")
      .filter({ hasText: new RegExp(`^${i + 1} readings?`) })
      .waitFor();
    await page.getByRole("heading", { name: `#${i + 1}`, exact: true }).waitFor();
    // The click after the 4 ppm reading commits it: the alarm hint grows the header and refits the plan.
    if (i === 5) await page.getByTestId("lag-hint").waitFor();
    if (i === 4) {
      await page.getByRole("button", { name: "4", exact: true }).click();
      clicks++;
    }
  }
  await page.getByRole("button", { name: "Save", exact: true }).click();
  clicks++;
  await page
    .getByTestId("walk-count")
    .filter({ hasText: `${xs.length} readings` })
    .waitFor();
  expect(clicks).toBe(xs.length + 2); // one per reading, one digit, one final save
  // The device uploads in the background; waited for as long as the test may run, not a fixed 20 s.
  const stored = await until(
    "the readings on the server",
    () =>
      suite.server.ctx.db.select().from(readings).where(eq(readings.sweepId, sweepId)).orderBy(asc(readings.takenAt)),
    (r) => r.length === xs.length,
    UPLOAD_WAIT_MS,
  );
  expect(stored.map((r) => r.ppm)).toEqual([0, 0, 0, 0, 4, 0, 0]);

  // The 4 ppm reading is at the alarm level (2 ppm); taps came seconds apart, under one delay.
  await expect(page.getByTestId("lag-hint").textContent()).resolves.toMatch(/Alarm: 4 ppm/);

  // The detector's own log, lined up by time with the taps; a garbled row is reported by line.
  const t0 = stored[0].takenAt.getTime();
  const t1 = stored[stored.length - 1].takenAt.getTime();
  const csv = [
    "Time,Gas (ppm)",
    `${new Date(t0 + 100).toISOString()},0.2`,
    `${new Date(t1 - 100).toISOString()},3.5`,
    "garbled,7",
    `${new Date(t1 + 60_000).toISOString()},1`,
  ].join("\n");
  await page.getByRole("button", { name: "Import log" }).click();
  const importer = page.getByRole("dialog", { name: "Import the detector's log" });
  await importer
    .getByLabel("CSV file")
    .setInputFiles({ name: "log.csv", mimeType: "text/csv", buffer: Buffer.from(csv) });
  await expect(importer.getByTestId("import-counts").textContent()).resolves.toBe("2 rows can be placed; 2 cannot.");
  await expect(importer.getByText('Line 4: Time "garbled" is not a time').isVisible()).resolves.toBe(true);
  await expect(
    importer.getByText("Line 5: at this clock offset its time falls after the last tapped position").isVisible(),
  ).resolves.toBe(true);
  await importer.getByRole("button", { name: "Add 2 readings" }).click();
  await page
    .getByTestId("walk-count")
    .filter({ hasText: `${xs.length + 2} readings` })
    .waitFor();
  await until(
    "the imported readings on the server",
    () => suite.server.ctx.db.select().from(readings).where(eq(readings.sweepId, sweepId)),
    (r) => r.length === xs.length + 2,
    UPLOAD_WAIT_MS,
  );

  // The leak is marked with the connection gone (a walk-in's back corner, a basement machine room):
  // it waits on the device with its photo, survives a reload, and goes up once the network is back.
  await page.locator('[data-testid="sync-banner"][data-waiting="0"]').waitFor();
  await context.setOffline(true);
  // The banner's new words can change the header's height, and the placing prompt too: aim once
  // each has shown and the plan is still.
  await page
    .getByTestId("sync-banner")
    .filter({ hasText: /^Offline/ })
    .waitFor();
  await page.getByRole("button", { name: "Leak here" }).click();
  await waitForSteadyPlan(page);
  const spot = await planToScreen(page, 10, 9.8); // the front of Dairy 3 (x 9.32–12.98 m)
  await page.mouse.click(spot.x, spot.y);
  const dialog = page.getByRole("dialog", { name: "Leak found here" });
  await dialog.waitFor();
  await expect(dialog.getByLabel("Fixture").inputValue()).resolves.not.toBe("");
  await dialog.getByLabel("Component").selectOption("brazed-joint");
  await dialog
    .getByLabel("Photo")
    .setInputFiles({ name: "joint.jpg", mimeType: "image/jpeg", buffer: await makeJpeg(640, 480) });
  await dialog.getByLabel("Note").fill("Bubbles at the suction line elbow behind the kick plate");
  await dialog.getByRole("button", { name: "Save finding" }).click();
  await page.getByText("Finding saved.").waitFor();
  await page.locator('[data-testid="sync-banner"][data-waiting="1"]').waitFor();
  await page.reload();
  await page.getByTestId("walk-plan").waitFor();
  await page.locator('[data-testid="sync-banner"][data-waiting="1"]').waitFor();
  expect(await suite.server.ctx.db.select().from(findings).where(eq(findings.sweepId, sweepId))).toEqual([]);

  await context.setOffline(false);
  // The finding and its photo go up on the next sync pass (the "online" event, or the 4 s timer);
  // a loaded machine once took more than 20 s over it.
  await page.locator('[data-testid="sync-banner"][data-waiting="0"]').waitFor({ timeout: UPLOAD_WAIT_MS });
  const made = await suite.server.ctx.db.select().from(findings).where(eq(findings.sweepId, sweepId));
  expect(made).toHaveLength(1);
  const [f] = made;
  expect(f).toMatchObject({
    status: "confirmed",
    component: "brazed-joint",
    source: "walk",
    storeId: suite.co.store.id,
  });
  expect(f.clientId).not.toBeNull();
  expect(f.x).toBeCloseTo(10, 0);
  expect(f.y).toBeCloseTo(9.8, 0);
  expect(f.fixtureId).not.toBeNull();
  expect(await suite.server.ctx.db.select().from(findingPhotos).where(eq(findingPhotos.findingId, f.id))).toHaveLength(
    1,
  );
  // Offline, the browser reports the failed API calls as console errors: only those are expected.
  failures.splice(
    0,
    failures.length,
    ...failures.filter((m) => !/Failed to load resource|ERR_INTERNET_DISCONNECTED/.test(m)),
  );
  expect(failures).toEqual([]);
  await context.close();
});
