/**
 * The layout editor as a workspace at the sizes a lead tech uses it: a laptop (1366 × 860, mouse),
 * a tablet in portrait (820 × 1180) and landscape (1180 × 820) and a phone (390 × 844), by finger.
 * The plan's box on screen is measured from the view the stage reports: the tools never cover it,
 * a portrait tablet has no empty band round the drawing, a landscape tablet shows more than 330 px
 * of plan. Duplicates get numbered labels and land beside the original, in view; a 0.6 m column,
 * selected, is dragged by a finger on its body. Screenshots go to test-results/screens/.
 */
import path from "node:path";
import { mkdir } from "node:fs/promises";
import { afterAll, beforeAll, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { eq } from "drizzle-orm";
import { launchBrowser } from "../helpers/browser";
import { startE2eServer, type E2eServer } from "../helpers/e2e-server";
import { seedCompany } from "../helpers/fixtures";
import { signIn } from "../helpers/test-app";
import { touchDrag, touchSession } from "../helpers/touch";
import { LAYOUT_STAGE, openLayoutEditor, stageSettled, storedFixtures } from "../helpers/layout-e2e";
import { mapStoreForWalk } from "../helpers/walk-e2e";
import { plans, users } from "../../server/db/schema/index";

const SCREENS = path.resolve(import.meta.dirname, "../../test-results/screens");
const STAGE = LAYOUT_STAGE;
/** fitView's margin round the drawing (src/features/layout/hooks/use-workspace-stage.ts). */
const FIT_MARGIN = 16;

let server: E2eServer;
let browser: Browser;
let co: Awaited<ReturnType<typeof seedCompany>>;
let planId = "";

beforeAll(async () => {
  server = await startE2eServer();
  co = await seedCompany(server.ctx, "Larkspur Provisions");
  // The invented demo layout: a 60 m × 36 m store with 42 fixtures.
  await mapStoreForWalk(server.ctx, {
    companyId: co.company.id,
    storeId: co.store.id,
    createdById: co.people["lead-tech"].userId,
  });
  planId = (await server.ctx.db.select().from(plans).where(eq(plans.storeId, co.store.id)))[0].id;
  // The lead tech reads lengths in feet and inches.
  await server.ctx.db.update(users).set({ lengthUnit: "ft-in" }).where(eq(users.id, co.people["lead-tech"].userId));
  // A 0.6 m × 0.6 m column between two aisles, as a lead tech would draw one.
  const lead = await signIn(server.app, co.people["lead-tech"]);
  const now = (await lead.get(`/api/plans/${planId}/fixtures`)).body;
  const column = {
    id: "0f5c3a8e-2b7d-4e61-9a40-5d2c1b6e7f80",
    kind: "column",
    label: "Column C1",
    systemId: null,
    hasFans: false,
    polygon: [
      [32, 20],
      [32.6, 20],
      [32.6, 20.6],
      [32, 20.6],
    ],
  };
  const put = await lead.put(`/api/plans/${planId}/fixtures`, {
    layoutRevision: now.layoutRevision,
    fixtures: [...now.fixtures, column],
  });
  expect(put.status).toBe(200);
  browser = await launchBrowser();
  await mkdir(SCREENS, { recursive: true });
});
afterAll(async () => {
  await browser?.close();
  await server?.close();
});

function openEditor(viewport: { width: number; height: number }, touch: boolean) {
  const at = { url: server.url, email: co.people["lead-tech"].email, storeId: co.store.id, planId };
  return openLayoutEditor(browser, at, viewport, touch);
}

/** The stage, the tools and the drawing's box on screen (CSS px), from the view the stage reports. */
async function measure(page: Page) {
  return page.evaluate((sel) => {
    const stage = document.querySelector(sel) as HTMLElement;
    // The canvas, not its framed box: the view's pan counts from the canvas's corner.
    const s = stage.querySelector("canvas")!.getBoundingClientRect();
    const bar = document.querySelector("[data-testid=editor-bar]")!.getBoundingClientRect();
    const d = stage.dataset;
    const scale = Number(d.zoom) / Number(d.mpp); // screen px per metre
    const plan = {
      left: s.left + Number(d.panX),
      top: s.top + Number(d.panY),
      right: s.left + Number(d.panX) + Number(d.planWidth) * scale,
      bottom: s.top + Number(d.panY) + Number(d.planHeight) * scale,
    };
    // What of the drawing is on screen: inside the stage and the window, below the tools.
    const top = Math.max(plan.top, s.top, bar.bottom, 0);
    const bottom = Math.min(plan.bottom, s.bottom, window.innerHeight);
    const left = Math.max(plan.left, s.left, 0);
    const right = Math.min(plan.right, s.right, window.innerWidth);
    return {
      stage: { top: s.top, bottom: s.bottom, left: s.left, right: s.right },
      bar: { top: bar.top, bottom: bar.bottom },
      plan,
      scale,
      visible: { width: right - left, height: bottom - top },
    };
  }, STAGE);
}

/** Screen point of plan metres. */
async function at(page: Page, x: number, y: number) {
  const m = await measure(page);
  return { x: m.plan.left + x * m.scale, y: m.plan.top + y * m.scale };
}

/** The stored fixtures; after `edit` has been saved when one is given. */
function stored(page: Page, edit?: () => Promise<unknown>) {
  return storedFixtures(page, server.url, planId, edit);
}

function boxOf(f: { polygon?: number[][] }) {
  const xs = f.polygon!.map((p) => p[0]);
  const ys = f.polygon!.map((p) => p[1]);
  return { minX: Math.min(...xs), maxX: Math.max(...xs), minY: Math.min(...ys), maxY: Math.max(...ys) };
}

/**
 * Duplicates the fixture labelled `label` (already selected) with the toolbar's button, and
 * checks the copy: a numbered label no other fixture has, beside the original without covering
 * it, and on screen inside the stage.
 */
async function duplicateAndCheck(page: Page, label: string, expected: string, press: () => Promise<void>) {
  const before = await stored(page);
  const after = await stored(page, press);
  expect(after).toHaveLength(before.length + 1);
  const copy = after.find((f) => !before.some((b) => b.id === f.id))!;
  expect(copy.label).toBe(expected);
  expect(after.filter((f) => f.label === copy.label)).toHaveLength(1);
  const a = boxOf(before.find((f) => f.label === label)!);
  const b = boxOf(copy);
  // Beside: the boxes touch along a side and do not overlap.
  const apart =
    a.maxX <= b.minX + 1e-9 || b.maxX <= a.minX + 1e-9 || a.maxY <= b.minY + 1e-9 || b.maxY <= a.minY + 1e-9;
  expect(apart).toBe(true);
  const gap = Math.max(b.minX - a.maxX, a.minX - b.maxX, b.minY - a.maxY, a.minY - b.maxY);
  expect(gap).toBeCloseTo(0, 9);
  // In view: the copy's box on screen lies inside the stage and the window.
  const m = await measure(page);
  const tl = await at(page, b.minX, b.minY);
  const br = await at(page, b.maxX, b.maxY);
  expect(tl.x).toBeGreaterThanOrEqual(m.stage.left);
  expect(tl.y).toBeGreaterThanOrEqual(Math.max(m.stage.top, 0));
  expect(br.x).toBeLessThanOrEqual(m.stage.right);
  expect(br.y).toBeLessThanOrEqual(Math.min(m.stage.bottom, (page.viewportSize()?.height ?? 0) + 0.5));
  return copy;
}

it("on a 1366 × 860 laptop the whole plan is on screen under the tools, the first drag lands on the plan and a duplicate is numbered beside its original", async () => {
  const { context, page, failures } = await openEditor({ width: 1366, height: 860 }, false);
  const m = await measure(page);
  await page.screenshot({ path: path.join(SCREENS, "layout-workspace-laptop.png") });
  expect(m.bar.top).toBeGreaterThanOrEqual(0);
  expect(m.bar.bottom).toBeLessThanOrEqual(m.stage.top);
  expect(m.stage.bottom).toBeLessThanOrEqual(860);
  // The whole drawing is visible: nothing of it under the tools or past the window.
  expect(m.visible.height).toBeCloseTo(m.plan.bottom - m.plan.top, 6);
  expect(m.visible.width).toBeCloseTo(m.plan.right - m.plan.left, 6);

  // The scale in the member's feet and inches, not metres.
  await page.getByRole("figure", { name: /^Scale bar: \d+ (ft|in)$/ }).waitFor();

  // The first drag, grabbed on the plan's top row: the walk-in freezer (13.5–21.5 m × 1–7 m)
  // 1 m down, where its back meets the partition (8 m).
  const freezer = (await stored(page)).find((f) => f.label === "Walk-in freezer")!;
  const from = await at(page, 19.5, 2);
  const afterDrag = await stored(page, async () => {
    await page.mouse.move(from.x, from.y);
    await page.mouse.down();
    await page.mouse.move(from.x, from.y + m.scale / 2, { steps: 4 });
    await page.mouse.move(from.x, from.y + m.scale, { steps: 4 });
    await page.mouse.up();
  });
  const moved = boxOf(afterDrag.find((f) => f.id === freezer.id)!);
  await page.screenshot({ path: path.join(SCREENS, "layout-first-drag-laptop.png") });
  expect(moved.minY).toBeCloseTo(2, 6);
  // Sideways only what snapping to a neighbour's edge takes (its right side to Aisle 1's at 22 m).
  expect(moved.minX).toBeGreaterThanOrEqual(13.5 - 1e-9);
  expect(moved.minX).toBeLessThanOrEqual(14 + 1e-9);

  // The page scrolled on (to the list below) carries the tools away with the plan: never over it.
  await page.mouse.move(1300, 300);
  const top = await page.evaluate(() => window.scrollY);
  await page.mouse.wheel(0, 250);
  // Measured once the page has moved (a fixed pause could measure it before the scroll).
  await page.waitForFunction((y) => window.scrollY > y, top);
  await stageSettled(page);
  const scrolled = await measure(page);
  expect(scrolled.bar.bottom).toBeLessThanOrEqual(scrolled.stage.top);
  await page.mouse.wheel(0, -250);
  await stageSettled(page);

  // Still selected from the drag: Duplicate names the copy "Walk-in freezer 2", to its right.
  const copy = await duplicateAndCheck(page, "Walk-in freezer", "Walk-in freezer 2", () =>
    page.getByRole("button", { name: "Duplicate", exact: true }).click(),
  );
  expect(boxOf(copy).minX).toBeCloseTo(moved.maxX, 6);
  await page.screenshot({ path: path.join(SCREENS, "layout-duplicate-laptop.png") });
  // The store page gives the drawing's scale per pixel in inches too.
  await page.goto(`${server.url}/stores/${co.store.id}`);
  await page.getByText(/Calibrated: 1 px = [\d.]+ (in|ft)$/).waitFor();
  expect(failures).toEqual([]);
  await context.close();
});

it("on a portrait tablet the plan fills the stage's width with no empty band above or below, and a duplicate by finger lands beside", async () => {
  const { context, page, failures } = await openEditor({ width: 820, height: 1180 }, true);
  const m = await measure(page);
  await page.screenshot({ path: path.join(SCREENS, "layout-workspace-tablet-portrait.png") });
  expect(m.bar.bottom).toBeLessThanOrEqual(m.stage.top);
  expect(m.stage.bottom).toBeLessThanOrEqual(1180);
  // Only the fit's margin (and a pixel of rounding) between the drawing and the stage's edges.
  for (const band of [
    m.plan.top - m.stage.top,
    m.stage.bottom - m.plan.bottom,
    m.plan.left - m.stage.left,
    m.stage.right - m.plan.right,
  ])
    expect(band).toBeLessThanOrEqual(FIT_MARGIN + 1);
  // The selection's panel rises into the room a shorter stage leaves.
  expect((await page.getByRole("complementary").boundingBox())!.y).toBeLessThan(1180);

  // Produce island 2 (6–12 m × 18–20 m): tapped, duplicated; "Produce island 3" is the next free number.
  await page.touchscreen.tap((await at(page, 9, 19)).x, (await at(page, 9, 19)).y);
  await page.getByLabel("Kind", { exact: true }).waitFor();
  await page.waitForTimeout(350);
  await duplicateAndCheck(page, "Produce island 2", "Produce island 3", () =>
    page.getByRole("button", { name: "Duplicate", exact: true }).tap(),
  );
  await page.screenshot({ path: path.join(SCREENS, "layout-duplicate-tablet-portrait.png") });
  expect(failures).toEqual([]);
  await context.close();
});

it("on a landscape tablet the plan shows more than 330 px high, and a selected 0.6 m column is dragged by a finger on its body", async () => {
  const { context, page, failures } = await openEditor({ width: 1180, height: 820 }, true);
  const cdp = await touchSession(page);
  const m = await measure(page);
  await page.screenshot({ path: path.join(SCREENS, "layout-workspace-tablet-landscape.png") });
  expect(m.bar.bottom).toBeLessThanOrEqual(m.stage.top);
  expect(m.stage.bottom).toBeLessThanOrEqual(820);
  expect(m.visible.height).toBeGreaterThan(330);

  // Zoomed in with the + button until the column is about 20 px across: smaller than one 48 px
  // finger target, where edge handles reaching 10 px in from each side would cover all of it.
  const zoomIn = page.getByRole("button", { name: "Zoom in" });
  for (let i = 0; i < 4; i++) {
    await zoomIn.tap();
    await page.waitForTimeout(120);
  }
  await stageSettled(page);
  const z = await measure(page);
  const sidePx = 0.6 * z.scale;
  expect(sidePx).toBeGreaterThan(14);
  expect(sidePx).toBeLessThan(30);
  const centre = await at(page, 32.3, 20.3);
  await page.touchscreen.tap(centre.x, centre.y);
  await page.getByLabel("Kind", { exact: true }).waitFor();
  expect(await page.getByLabel("Kind", { exact: true }).inputValue()).toBe("column");
  await page.waitForTimeout(350);
  await page.screenshot({ path: path.join(SCREENS, "layout-small-fixture-selected-tablet.png") });
  // The finger lands on the body (off its exact centre, as a finger does) and drags it 1 m right,
  // still between Aisles 3 and 4.
  const start = { x: centre.x - sidePx / 4, y: centre.y + sidePx / 4 };
  const afterDrag = await stored(page, () => touchDrag(cdp, start, { x: start.x + z.scale, y: start.y }, 12));
  const column = afterDrag.find((f) => f.label === "Column C1")!;
  const b = boxOf(column);
  // Moved, not resized: still 0.6 m square, about 1 m right (the grid or a neighbour's edge may
  // take the last few centimetres).
  expect(b.maxX - b.minX).toBeCloseTo(0.6, 6);
  expect(b.maxY - b.minY).toBeCloseTo(0.6, 6);
  expect(Math.abs(b.minX - 33)).toBeLessThan(0.15);
  expect(Math.abs(b.minY - 20)).toBeLessThan(0.15);
  await page.screenshot({ path: path.join(SCREENS, "layout-small-fixture-dragged-tablet.png") });
  expect(failures).toEqual([]);
  await context.close();
});

it("on a phone, zoomed in, a duplicate of Aisle 2 is named past the aisles already on the plan and lands beside it in view", async () => {
  const { context, page, failures } = await openEditor({ width: 390, height: 844 }, true);
  await page.screenshot({ path: path.join(SCREENS, "layout-workspace-phone.png") });
  const zoomIn = page.getByRole("button", { name: "Zoom in" });
  for (let i = 0; i < 3; i++) {
    await zoomIn.tap();
    await page.waitForTimeout(120);
  }
  await stageSettled(page);
  // Aisle 2 (26–27.2 m × 13–27 m), a gondola, tapped in its middle.
  const aisle = await at(page, 26.6, 20);
  await page.touchscreen.tap(aisle.x, aisle.y);
  await page.getByLabel("Kind", { exact: true }).waitFor();
  await page.waitForTimeout(350);
  await page.evaluate(() =>
    window.scrollTo(
      0,
      document.querySelector("[data-testid=editor-bar]")!.getBoundingClientRect().top + window.scrollY,
    ),
  );
  await duplicateAndCheck(page, "Aisle 2", "Aisle 5", () =>
    page.getByRole("button", { name: "Duplicate", exact: true }).tap(),
  );
  await page.screenshot({ path: path.join(SCREENS, "layout-duplicate-phone.png") });
  expect(failures).toEqual([]);
  await context.close();
});
