/**
 * On a phone (390 × 844, touch) the Walk screen's zoom buttons and Key button never cover the
 * fitted plan: at the first fit, with the keypad open (the plan's box shrinks and it fits again)
 * and after "All". The plan's box on screen comes from the view the plan reports and the invented
 * demo store's size (60 m × 36 m). Screenshots go to test-results/screens/.
 */
import path from "node:path";
import { mkdirSync } from "node:fs";
import { expect, it } from "vitest";
import type { Page } from "playwright-core";
import { newContext } from "../helpers/browser";
import { signInThroughForm } from "../helpers/e2e-session";
import { walkSuite } from "../helpers/walk-suite";
import { PASSWORD } from "../helpers/fixtures";
import { planToScreen, waitForSteadyPlan } from "../helpers/walk-e2e";

const suite = walkSuite("Tansy Row Market");
const SCREENS = path.resolve(import.meta.dirname, "../../test-results/screens");
mkdirSync(SCREENS, { recursive: true });
const PHONE = { viewport: { width: 390, height: 844 }, hasTouch: true, isMobile: true, deviceScaleFactor: 2 };
/** The demo layout's plan (tests/helpers/walk-e2e.ts). */
const PLAN = { widthM: 60, heightM: 36 };

type Box = { x: number; y: number; width: number; height: number };

const overlap = (a: Box, b: Box) =>
  a.x < b.x + b.width && b.x < a.x + a.width && a.y < b.y + b.height && b.y < a.y + a.height;

/** The fitted plan's bounding box on screen, from the view the plan reports. */
async function planBox(page: Page): Promise<Box> {
  const tl = await planToScreen(page, 0, 0);
  const br = await planToScreen(page, PLAN.widthM, PLAN.heightM);
  return { x: tl.x, y: tl.y, width: br.x - tl.x, height: br.y - tl.y };
}

/** Every button over the plan: zoom in, zoom out, the whole plan, the key. */
async function buttonBoxes(page: Page): Promise<[string, Box][]> {
  const names = ["Zoom in", "Zoom out", "Show the whole plan", "Key"];
  return Promise.all(
    names.map(
      async (name) => [name, (await page.getByRole("button", { name, exact: true }).boundingBox())!] as [string, Box],
    ),
  );
}

async function expectClear(page: Page, when: string) {
  await waitForSteadyPlan(page);
  const plan = await planBox(page);
  // The plan is shown, not shrunk to nothing.
  expect(plan.width, when).toBeGreaterThan(200);
  for (const [name, box] of await buttonBoxes(page))
    expect(overlap(plan, box), `${name} over the plan ${when}`).toBe(false);
  return plan;
}

it("on a phone the zoom buttons and the key never cover the fitted plan, with the keypad closed or open", async () => {
  const context = await newContext(suite.browser, PHONE);
  const page = await context.newPage();
  page.setDefaultTimeout(15_000);
  const failures: string[] = [];
  page.on("pageerror", (e) => failures.push(String(e)));
  await signInThroughForm(page, suite.server.url, suite.co.people.technician.email, PASSWORD);
  await page.goto(`${suite.server.url}/walk`);
  await page.getByRole("link", { name: suite.co.store.name, exact: true }).tap();
  await page.getByRole("button", { name: "Start the sweep" }).tap();
  await page.getByTestId("walk-plan").waitFor();

  const first = await expectClear(page, "at the first fit");
  await page.screenshot({ path: path.join(SCREENS, "walk-zoom-clear-phone.png") });
  // The zoom buttons are one row: the plan's right edge is in reach of a thumb, not under them.
  const viewport = page.viewportSize()!;
  expect(first.x + first.width).toBeGreaterThan(viewport.width - 24);

  // A reading's keypad shrinks the plan's box; the plan fits again, still clear of the buttons.
  const spot = await planToScreen(page, 5, 30);
  await page.touchscreen.tap(spot.x, spot.y);
  await page.getByRole("heading", { name: "#1", exact: true }).waitFor();
  await expectClear(page, "with the keypad open");
  await page.screenshot({ path: path.join(SCREENS, "walk-zoom-clear-keypad-phone.png") });

  // Zoomed in by hand, then back to the whole plan with "All".
  await page.getByRole("button", { name: "Zoom in", exact: true }).tap();
  await waitForSteadyPlan(page);
  await page.getByRole("button", { name: "Show the whole plan", exact: true }).tap();
  await expectClear(page, "after All");
  expect(failures).toEqual([]);
  await context.close();
});
