/**
 * A lead tech maps a store's fixtures on a tablet, with a finger only: uploads a drawing, pinches
 * it larger and sets its scale with two taps, draws a case (drag), a walk-in (quick corner taps, closed by a tap a
 * finger's width off the first corner, one stray corner taken back with Undo) and a line-set drop (tap); selects the drop with a tap
 * beside it, moves the case, resizes it by a handle grabbed outside its drawn square, pinches
 * with the first finger on the case, pans with one finger, makes a row of copies, undoes, redoes
 * and deletes — then checks what autosave stored, in metres, through the API. Then the same
 * editor in portrait keeps to the screen's width with its tools in view above the plan.
 */
import { afterAll, beforeAll, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { launchBrowser, newContext } from "../helpers/browser";
import { startE2eServer, type E2eServer } from "../helpers/e2e-server";
import { PASSWORD, seedCompany } from "../helpers/fixtures";
import { signInThroughForm } from "../helpers/e2e-session";
import { drawingPng, numberAttr, pickerScreen, storedFixtures } from "../helpers/layout-e2e";
import { pinch, touchDrag, touchSession } from "../helpers/touch";

let server: E2eServer;
let browser: Browser;
let co: Awaited<ReturnType<typeof seedCompany>>;
let planId = "";

beforeAll(async () => {
  server = await startE2eServer();
  co = await seedCompany(server.ctx, "Brackwater Foods");
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await server?.close();
});

// A tablet as the browser reports one: touch, mobile viewport rules, no mouse.
const TABLET = { hasTouch: true, isMobile: true, deviceScaleFactor: 2 };

const STAGE = "[data-testid=layout-stage]";

async function stageView(page: Page) {
  const [zoom, panX, panY, mpp] = await Promise.all(
    ["data-zoom", "data-pan-x", "data-pan-y", "data-mpp"].map((a) => numberAttr(page, STAGE, a)),
  );
  return { zoom, panX, panY, mpp };
}

/** Screen position of a plan point (metres). */
async function at(page: Page, xm: number, ym: number) {
  const box = (await page.locator(`${STAGE} canvas`).first().boundingBox())!;
  const v = await stageView(page);
  return { x: box.x + v.panX + (xm / v.mpp) * v.zoom, y: box.y + v.panY + (ym / v.mpp) * v.zoom };
}

/** Waits for the editor to open as a workspace: the page scrolls by itself so its tools sit at the window's top. */
async function stageUnderTools(page: Page) {
  await page.waitForFunction(
    () => Math.abs(document.querySelector("[data-testid=editor-bar]")!.getBoundingClientRect().top) < 1,
  );
  await page.waitForTimeout(100);
}

async function tap(page: Page, p: { x: number; y: number }) {
  await page.touchscreen.tap(p.x, p.y);
  await page.waitForTimeout(60);
}

/**
 * A toolbar button, tapped as a hand does: not within a few frames of lifting off the plan.
 * (Chromium's gesture detector drops the click of a synthetic tap sent ~100 ms after a drag
 * ended elsewhere; no finger gets from the plan to the toolbar that fast.)
 */
async function tapButton(page: Page, name: string) {
  await page.waitForTimeout(350);
  const button = page.getByRole("button", { name, exact: true });
  const toggles = (await button.getAttribute("aria-pressed")) !== null;
  await button.tap();
  // A tool button says it is in hand.
  if (toggles) await page.getByRole("button", { name, exact: true, pressed: true }).waitFor({ timeout: 3000 });
}

const count = (page: Page, n: number) => page.getByRole("heading", { name: `All fixtures (${n})` }).waitFor();

/** The stored fixtures; after `edit` has been saved when one is given. */
function stored(page: Page, edit?: () => Promise<unknown>) {
  return storedFixtures(page, server.url, planId, edit);
}

function boxOf(polygon: number[][]) {
  const xs = polygon.map((p) => p[0]);
  const ys = polygon.map((p) => p[1]);
  return { minX: Math.min(...xs), maxX: Math.max(...xs), minY: Math.min(...ys), maxY: Math.max(...ys) };
}

it("on a landscape tablet, sets the scale and draws, selects, moves, resizes, pinches, pans, copies, undoes and deletes by finger, and autosave keeps it", async () => {
  const context = await newContext(browser, { viewport: { width: 1024, height: 768 }, ...TABLET });
  const page = await context.newPage();
  const cdp = await touchSession(page);
  const failures: string[] = [];
  page.on("pageerror", (e) => failures.push(String(e)));
  page.on("console", (m) => m.type() === "error" && failures.push(m.text()));

  await signInThroughForm(page, server.url, co.people["lead-tech"].email, PASSWORD);
  await page.goto(`${server.url}/stores/${co.store.id}`);
  await page.getByLabel("Drawing file").setInputFiles(await drawingPng("brackwater-floor.png"));
  await page.getByRole("button", { name: "Upload drawing" }).tap();
  await page.getByRole("heading", { name: "Set the scale" }).waitFor();
  const picker = page.getByRole("group", { name: "Calibration line on the drawing" });
  await picker.locator("canvas").first().waitFor();
  await picker.scrollIntoViewIfNeeded();
  // No wheel on a tablet: a pinch zooms the drawing (×1.2 about its middle keeps the wall's ends in view).
  const pickerBox = (await picker.locator("canvas").first().boundingBox())!;
  const fitZoom = await numberAttr(page, "[data-testid=picker-view]", "data-zoom");
  await pinch(cdp, { x: pickerBox.x + pickerBox.width / 2, y: pickerBox.y + pickerBox.height / 2 }, 100, 120);
  const pinchedZoom = await numberAttr(page, "[data-testid=picker-view]", "data-zoom");
  expect(pinchedZoom / fitZoom).toBeCloseTo(1.2, 1);
  await page.waitForTimeout(450);
  // The wall is 600 px and 12 m long: 0.02 m a pixel. Two taps on its ends.
  for (const [x, y] of [
    [100, 250],
    [700, 250],
  ])
    await tap(page, await pickerScreen(page, x, y));
  await page.getByLabel("Real length of the line").fill("12 m");
  await page.getByRole("button", { name: "Save scale" }).tap();
  await page.getByText("The plan's scale is set.").waitFor();
  const plans = await (await page.request.get(`${server.url}/api/stores/${co.store.id}/plans`)).json();
  planId = plans.plans[0].id;
  // A tap lands on a screen pixel at the picker's zoom: the line is 600 px to within 2.
  expect(plans.plans[0].metresPerPixel).toBeGreaterThan(12 / 602);
  expect(plans.plans[0].metresPerPixel).toBeLessThan(12 / 598);

  await page.getByRole("link", { name: "Open the layout editor" }).tap();
  await page.locator(`${STAGE} canvas`).first().waitFor();
  await stageUnderTools(page);
  // The tools are on screen above the stage, not over it.
  const bar = (await page.getByRole("toolbar", { name: "Layout tools" }).boundingBox())!;
  expect(bar.y).toBeGreaterThanOrEqual(0);
  const stageBox = (await page.locator(STAGE).boundingBox())!;
  expect(bar.y + bar.height).toBeLessThanOrEqual(stageBox.y);
  expect(stageBox.y + stageBox.height).toBeLessThanOrEqual(768);
  // The selection's panel is beside the plan, not below it.
  const panel = (await page.getByRole("complementary").boundingBox())!;
  expect(panel.x).toBeGreaterThanOrEqual(stageBox.x + stageBox.width);
  expect(panel.y).toBeLessThan(768);

  // 1. A case: one finger dragged from (2, 2) m to (5.5, 3.2) m (10 cm grid).
  await tapButton(page, "Rectangle");
  await touchDrag(cdp, await at(page, 2, 2), await at(page, 5.5, 3.2));
  await count(page, 1);

  // 2. A walk-in by its outline: corners tapped quickly (Konva would call two taps within 400 ms
  // a double-tap), closed by a tap 14 px off the first corner — a fingertip's miss.
  await page.getByLabel("Kind to draw").selectOption("walk-in-cooler");
  await tapButton(page, "Outline");
  for (const [x, y] of [
    [9, 1],
    [14, 1],
    [14, 4],
  ])
    await tap(page, await at(page, x, y));
  // A corner tapped in the wrong place; with no Backspace to hand, Undo takes it back.
  await tap(page, await at(page, 12, 7));
  await tapButton(page, "Undo");
  // A pinch (out a little, over empty plan) half way through keeps the corners placed so far.
  const zoomBefore = (await stageView(page)).zoom;
  await pinch(cdp, await at(page, 5, 7), 120, 100);
  expect((await stageView(page)).zoom).toBeLessThan(zoomBefore);
  await page.waitForTimeout(450);
  await tap(page, await at(page, 9, 4));
  // Four quick corner taps close nothing by themselves.
  await page.waitForTimeout(450);
  expect(await page.getByRole("heading", { name: "All fixtures (1)" }).count()).toBe(1);
  const first = await at(page, 9, 1);
  await tap(page, { x: first.x + 10, y: first.y + 10 });
  await count(page, 2);

  // 3. A line-set drop at (8, 7) m.
  await page.getByLabel("Kind to draw").selectOption("line-set-drop");
  await tapButton(page, "Place point");
  let fixtures = await stored(page, async () => {
    await tap(page, await at(page, 8, 7));
    await count(page, 3);
  });
  const walkIn = fixtures.find((f) => f.kind === "walk-in-cooler")!;
  [
    [9, 1],
    [14, 1],
    [14, 4],
    [9, 4],
  ].forEach((c, i) => c.forEach((v, j) => expect(walkIn.polygon![i][j]).toBeCloseTo(v, 6)));
  const caseId = fixtures.find((f) => f.kind === "open-case")!.id;

  // 4. Back to Select; a tap on empty plan clears the selection, and a tap 16 px beside the drop
  // (outside its 8 px glyph) still picks it.
  await tapButton(page, "Select");
  const kindField = page.getByLabel("Kind", { exact: true });
  await tap(page, await at(page, 12, 8));
  await kindField.waitFor({ state: "detached" });
  const drop = await at(page, 8, 7);
  await tap(page, { x: drop.x + 16, y: drop.y - 6 });
  await kindField.waitFor();
  expect(await kindField.inputValue()).toBe("line-set-drop");

  // 5. Tap the case and drag it 1 m right by its body.
  await tap(page, await at(page, 3, 2.6));
  const v0 = await stageView(page);
  const pxPerM = v0.zoom / v0.mpp;
  const body = await at(page, 3, 2.6);
  fixtures = await stored(page, () => touchDrag(cdp, body, { x: body.x + pxPerM, y: body.y }));
  let kase = boxOf(fixtures.find((f) => f.id === caseId)!.polygon!);
  expect(kase.minX).toBeCloseTo(3, 6);
  expect(kase.maxX).toBeCloseTo(6.5, 6);

  // 6. Resize by the bottom-right handle, grabbed 18 px right of and below its corner: outside the
  // drawn handle, inside its 48 px finger target (a 12 px handle would have been missed and the
  // finger would have panned the plan). Dragged 40 px right.
  const corner = await at(page, 6.5, 3.2);
  fixtures = await stored(page, () =>
    touchDrag(cdp, { x: corner.x + 18, y: corner.y + 18 }, { x: corner.x + 58, y: corner.y + 18 }),
  );
  kase = boxOf(fixtures.find((f) => f.id === caseId)!.polygon!);
  expect(kase.minX).toBeCloseTo(3, 6);
  expect(kase.maxX).toBeCloseTo(6.5 + 40 / pxPerM, 1);
  expect(kase.maxY).toBeCloseTo(3.2, 6);
  expect((await stageView(page)).panX).toBe(v0.panX);

  // 7. A pinch whose first finger lands on the case zooms in and leaves the case where it was.
  const mid = await at(page, (kase.minX + kase.maxX) / 2, 2.6);
  await pinch(cdp, mid, 40, 160);
  const v1 = await stageView(page);
  expect(v1.zoom).toBeGreaterThan(v0.zoom * 2);
  await page.waitForTimeout(300);
  const afterPinch = boxOf((await stored(page)).find((f) => f.id === caseId)!.polygon!);
  expect(afterPinch).toEqual(kase);

  // 8. One finger on empty plan pans it (from the whole plan in view).
  await tapButton(page, "Fit");
  const v1b = await stageView(page);
  const empty = await at(page, 10, 8);
  await touchDrag(cdp, empty, { x: empty.x - 120, y: empty.y - 60 });
  const v2 = await stageView(page);
  expect(v2.panX - v1b.panX).toBeCloseTo(-120, 0);
  expect(v2.panY - v1b.panY).toBeCloseTo(-60, 0);
  expect(v2.zoom).toBe(v1b.zoom);
  await tapButton(page, "Fit");

  // 9. A row of copies: the panel comes into view, and the copies go 3 in a row downwards.
  await tap(page, await at(page, 3.5, 2.6));
  await tapButton(page, "Array…");
  const dialog = page.getByRole("dialog", { name: "Make a row of copies" });
  await page.waitForTimeout(300);
  const d = (await dialog.boundingBox())!;
  expect(d.y).toBeGreaterThanOrEqual(0);
  expect(d.y).toBeLessThan(768);
  await page.getByLabel("Items in the row, with the selected").fill("3");
  await page.getByLabel("Direction").selectOption("down");
  await tapButton(page, "Make copies");
  await count(page, 5);

  // 10. Undo, redo, delete — by the toolbar's buttons, still in view above the plan.
  await tapButton(page, "Undo");
  await count(page, 3);
  await tapButton(page, "Redo");
  await count(page, 5);
  fixtures = await stored(page, async () => {
    await tapButton(page, "Delete");
    await count(page, 3);
  });
  expect(fixtures.map((f) => f.kind).sort()).toEqual(["line-set-drop", "open-case", "walk-in-cooler"]);
  const dropAt = fixtures.find((f) => f.kind === "line-set-drop")!.point!;
  expect(dropAt.x).toBeCloseTo(8, 6);
  expect(dropAt.y).toBeCloseTo(7, 6);
  expect(failures).toEqual([]);
  await context.close();
});

it("in portrait, the editor keeps to the screen's width and its tools are in view above the stage", async () => {
  const context = await newContext(browser, { viewport: { width: 768, height: 1024 }, ...TABLET });
  const page = await context.newPage();
  await signInThroughForm(page, server.url, co.people["lead-tech"].email, PASSWORD);
  await page.goto(`${server.url}/stores/${co.store.id}/plans/${planId}/layout`);
  await page.locator(`${STAGE} canvas`).first().waitFor();
  await page.waitForTimeout(300);
  // No sideways scrolling: the stage (and its canvas) is no wider than the page.
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(768);
  const canvas = (await page.locator(`${STAGE} canvas`).first().boundingBox())!;
  expect(canvas.x + canvas.width).toBeLessThanOrEqual(768);
  await stageUnderTools(page);
  const bar = (await page.getByRole("toolbar", { name: "Layout tools" }).boundingBox())!;
  const stage = (await page.locator(STAGE).boundingBox())!;
  expect(bar.y).toBeGreaterThanOrEqual(0);
  expect(stage.y + stage.height).toBeLessThanOrEqual(1024);
  // The message shown while drawing sits over the plan and moves nothing.
  await tapButton(page, "Outline");
  const before = (await page.locator(STAGE).boundingBox())!.y;
  const p = await at(page, 3, 6);
  await tap(page, p);
  await tap(page, { x: p.x + 60, y: p.y });
  await page.keyboard.press("Enter");
  await page.getByTestId("editor-message").getByText("An outline needs at least 3 corners.").waitFor();
  expect((await page.locator(STAGE).boundingBox())!.y).toBe(before);
  await context.close();
});
