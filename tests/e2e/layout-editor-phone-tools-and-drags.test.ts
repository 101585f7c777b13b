/**
 * The layout editor's tools on a phone (390 × 844, touch) are one compact row that scrolls
 * sideways, and a tool far along it can still be reached and chosen by finger.
 *
 * No stray shape after a drag: whatever a drag drew while it ran (the dragged fixture on its own
 * layer, a drawing tool's outline, the marquee) is gone once it ends, also when the mouse is let
 * go off the stage. Checked on the canvas itself: no node of a tool's preview is left, and every
 * Konva layer, drawn again from its nodes, gives the same pixels it showed (nothing stale on it).
 * Screenshots go to test-results/screens/.
 */
import path from "node:path";
import { mkdir } from "node:fs/promises";
import { afterAll, beforeAll, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { eq } from "drizzle-orm";
import { launchBrowser } from "../helpers/browser";
import { startE2eServer, type E2eServer } from "../helpers/e2e-server";
import { seedCompany } from "../helpers/fixtures";
import { touchDrag, touchSession } from "../helpers/touch";
import { LAYOUT_STAGE, openLayoutEditor, storedFixtures } from "../helpers/layout-e2e";
import { mapStoreForWalk } from "../helpers/walk-e2e";
import { plans } from "../../server/db/schema/index";

const SCREENS = path.resolve(import.meta.dirname, "../../test-results/screens");
const STAGE = LAYOUT_STAGE;

type Box = { x: number; y: number; width: number; height: number };

let server: E2eServer;
let browser: Browser;
let co: Awaited<ReturnType<typeof seedCompany>>;
let planId = "";

beforeAll(async () => {
  server = await startE2eServer();
  co = await seedCompany(server.ctx, "Halloway Greens");
  // The invented demo layout: a 60 m × 36 m store with 42 fixtures.
  await mapStoreForWalk(server.ctx, {
    companyId: co.company.id,
    storeId: co.store.id,
    createdById: co.people["lead-tech"].userId,
  });
  planId = (await server.ctx.db.select().from(plans).where(eq(plans.storeId, co.store.id)))[0].id;
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

/** Screen point of plan metres, from the view the stage reports. */
async function at(page: Page, x: number, y: number) {
  return page.evaluate(
    ({ sel, x, y }) => {
      const stage = document.querySelector(sel) as HTMLElement;
      const c = stage.querySelector("canvas")!.getBoundingClientRect();
      const d = stage.dataset;
      const scale = Number(d.zoom) / Number(d.mpp);
      return { x: c.left + Number(d.panX) + x * scale, y: c.top + Number(d.panY) + y * scale, scale };
    },
    { sel: STAGE, x, y },
  );
}

/**
 * The layers whose pixels differ from a fresh drawing of their nodes: something stale is on them.
 * Waits two frames first, so draws Konva has already asked for have run.
 */
async function staleLayers(page: Page): Promise<number[]> {
  return page.evaluate(async () => {
    await new Promise((r) => requestAnimationFrame(() => requestAnimationFrame(r)));
    type Layer = { getCanvas(): { _canvas: HTMLCanvasElement }; draw(): void };
    const konva = (window as unknown as { Konva: { stages: { getLayers(): Layer[] }[] } }).Konva;
    const stale: number[] = [];
    konva.stages[0].getLayers().forEach((layer, i) => {
      const canvas = layer.getCanvas()._canvas;
      const before = canvas.toDataURL();
      layer.draw();
      if (canvas.toDataURL() !== before) stale.push(i);
    });
    return stale;
  });
}

/** How many nodes of a tool's preview (the drawn outline, its corners, the marquee) are on the stage. */
async function previewNodes(page: Page): Promise<number> {
  return page.evaluate(() => {
    const konva = (window as unknown as { Konva: { stages: { find(selector: string): unknown[] }[] } }).Konva;
    return konva.stages[0].find(".tool-preview").length;
  });
}

/**
 * Outlines drawn where no selected fixture is: the transformer's box (and any other shape on the
 * drag layer) must sit on the selection's own outline, not where it was before a drag.
 */
async function strayOutlines(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    type N = {
      getClassName(): string;
      name(): string;
      isVisible(): boolean;
      getClientRect(): { x: number; y: number; width: number; height: number };
      nodes?: () => N[];
    };
    const konva = (window as unknown as { Konva: { stages: { getLayers(): { find(f: (n: N) => boolean): N[] }[] }[] } })
      .Konva;
    const layers = konva.stages[0].getLayers();
    const out: string[] = [];
    for (const tr of layers.flatMap((l) => l.find((n) => n.getClassName() === "Transformer"))) {
      const nodes = tr.nodes!();
      if (nodes.length === 0) continue;
      const back = (tr as unknown as { findOne(s: string): N }).findOne(".back").getClientRect();
      const xs = nodes.map((n) => n.getClientRect());
      const box = {
        x: Math.min(...xs.map((r) => r.x)),
        y: Math.min(...xs.map((r) => r.y)),
        right: Math.max(...xs.map((r) => r.x + r.width)),
        bottom: Math.max(...xs.map((r) => r.y + r.height)),
      };
      // A few pixels for the stroke and the rotation line's reach above the box.
      const off = Math.max(
        Math.abs(back.x - box.x),
        Math.abs(back.x + back.width - box.right),
        Math.abs(back.y + back.height - box.bottom),
      );
      if (off > 6) out.push(`transformer box ${JSON.stringify(back)} vs its nodes ${JSON.stringify(box)}`);
    }
    return out;
  });
}

/** The stored fixtures; after `edit` has been saved when one is given. */
function stored(page: Page, edit?: () => Promise<unknown>) {
  return storedFixtures(page, server.url, planId, edit);
}

async function mouseDrag(page: Page, from: { x: number; y: number }, to: { x: number; y: number }) {
  await page.mouse.move(from.x, from.y);
  await page.mouse.down();
  await page.mouse.move((from.x + to.x) / 2, (from.y + to.y) / 2, { steps: 5 });
  await page.mouse.move(to.x, to.y, { steps: 5 });
  await page.mouse.up();
}

it("on a phone the tools are one row at most 120 px tall that scrolls sideways, and its last control and a drawing tool are chosen by touch", async () => {
  const { context, page, failures } = await openEditor({ width: 390, height: 844 }, true);
  const toolbar = page.getByTestId("editor-toolbar");
  const bar = (await toolbar.boundingBox())!;
  await page.screenshot({ path: path.join(SCREENS, "layout-tools-phone.png") });
  // About 418 px of wrapped rows before; one row of 44 px buttons now.
  expect(bar.height).toBeLessThanOrEqual(120);
  // The stage starts right under the tools and the save state: the plan keeps the screen.
  const stage = (await page.locator(STAGE).boundingBox())!;
  expect(stage.y - bar.y).toBeLessThanOrEqual(130);
  // One row that scrolls sideways: the row is wider than the screen and scrolls on its own axis.
  const row = await toolbar.evaluate((el) => ({
    width: el.scrollWidth,
    box: el.clientWidth,
    overflowX: getComputedStyle(el).overflowX,
    wraps: getComputedStyle(el).flexWrap,
  }));
  expect(row.width).toBeGreaterThan(row.box);
  expect(row.overflowX).toBe("auto");
  expect(row.wraps).toBe("nowrap");
  const inView = async (l: { boundingBox(): Promise<Box | null> }) => {
    const b = (await l.boundingBox())!;
    return b.x >= 0 && b.x + b.width <= 390;
  };
  // The last control starts past the screen's edge; a finger swiping the row leftwards scrolls it
  // (the row scrolls on its own axis, not the page nor the plan).
  const snap = page.getByLabel("Snap to fixtures");
  expect(await inView(snap)).toBe(false);
  const cdp = await touchSession(page);
  const mid = Math.round(bar.y + bar.height / 2);
  await touchDrag(cdp, { x: bar.x + bar.width - 6, y: mid }, { x: bar.x + 24, y: mid }, 30);
  await expect.poll(() => toolbar.evaluate((el) => el.scrollLeft)).toBeGreaterThan(100);
  expect(await page.evaluate(() => window.scrollX)).toBe(0);
  // Back to the start, then a tap on the hidden control brings it into view and works it by touch.
  await toolbar.evaluate((el) => el.scrollTo({ left: 0 }));
  const wasOn = await snap.isChecked();
  await snap.tap();
  await expect.poll(() => snap.isChecked()).toBe(!wasOn);
  expect(await toolbar.evaluate((el) => el.scrollLeft)).toBeGreaterThan(0);
  expect(await inView(snap)).toBe(true);
  await page.screenshot({ path: path.join(SCREENS, "layout-tools-phone-scrolled.png") });
  // And back along the row to a drawing tool, chosen by a tap.
  const outline = page.getByRole("button", { name: "Outline", exact: true });
  await outline.tap();
  await expect.poll(() => outline.getAttribute("aria-pressed")).toBe("true");
  expect(failures).toEqual([]);
  await context.close();
});

it("on a laptop, dragging a risk point, an unselected case and a selected one leaves no outline where they were", async () => {
  const { context, page, failures } = await openEditor({ width: 1366, height: 860 }, false);
  expect(await staleLayers(page)).toEqual([]);

  // A risk point (Drop M1 at 39.3 m, 8.9 m): points have no transformer on the drag layer.
  const drop = await at(page, 39.3, 8.9);
  const afterDrop = await stored(page, async () => {
    await mouseDrag(page, drop, { x: drop.x + 2 * drop.scale, y: drop.y + drop.scale });
    // Looked at as the drag ends, before the save's answer redraws anything.
    expect(await staleLayers(page)).toEqual([]);
  });
  const moved = afterDrop.find((f) => f.label === "Drop M1 (meat)")!;
  expect(moved.point!.x).toBeGreaterThan(40);
  await page.screenshot({ path: path.join(SCREENS, "layout-no-ghost-point-laptop.png") });

  // The walk-in freezer (13.5–21.5 m × 1–7 m), pressed and dragged in one go, then dragged again selected.
  for (const dy of [2, -1]) {
    const from = await at(page, 19.5, 4);
    await stored(page, async () => {
      await mouseDrag(page, from, { x: from.x, y: from.y + dy * from.scale });
      expect(await staleLayers(page)).toEqual([]);
      expect(await strayOutlines(page)).toEqual([]);
    });
    expect(await staleLayers(page)).toEqual([]);
    expect(await strayOutlines(page)).toEqual([]);
  }
  await page.screenshot({ path: path.join(SCREENS, "layout-no-ghost-case-laptop.png") });

  // A marquee over empty floor.
  const a = await at(page, 30, 31);
  const b = await at(page, 40, 34);
  await mouseDrag(page, a, b);
  expect(await staleLayers(page)).toEqual([]);
  expect(failures).toEqual([]);
  await context.close();
});

it("on a laptop, a rectangle dragged out and released off the plan leaves no outline behind", async () => {
  const { context, page, failures } = await openEditor({ width: 1366, height: 860 }, false);
  await page.getByRole("button", { name: "Rectangle", exact: true }).click();
  const from = await at(page, 30, 30);
  const to = await at(page, 34, 33);
  await page.mouse.move(from.x, from.y);
  await page.mouse.down();
  await page.mouse.move(to.x, to.y, { steps: 6 });
  // Off the stage, onto the tools, and let go there.
  const bar = (await page.getByTestId("editor-toolbar").boundingBox())!;
  await page.mouse.move(bar.x + bar.width / 2, bar.y + bar.height / 2, { steps: 6 });
  await page.mouse.up();
  await page.waitForTimeout(200);
  expect(await previewNodes(page)).toBe(0);
  expect(await staleLayers(page)).toEqual([]);
  await page.screenshot({ path: path.join(SCREENS, "layout-no-ghost-rectangle-laptop.png") });
  expect(failures).toEqual([]);
  await context.close();
});

it("on a tablet, a case dragged by a finger leaves no outline where it was", async () => {
  const { context, page, failures } = await openEditor({ width: 1180, height: 820 }, true);
  const cdp = await touchSession(page);
  // Produce island 1 (6–12 m × 13–15 m), tapped, then dragged 2 m down by a finger on its body,
  // away from the middle of its long sides where the resize handles reach in.
  const before = (await stored(page)).find((f) => f.label === "Produce island 1")!;
  const from = await at(page, 7.5, 14);
  await page.touchscreen.tap(from.x, from.y);
  await page.getByLabel("Kind", { exact: true }).waitFor();
  await page.waitForTimeout(350);
  const afterDrag = await stored(page, () => touchDrag(cdp, from, { x: from.x, y: from.y + 2 * from.scale }, 12));
  const after = afterDrag.find((f) => f.id === before.id)!;
  expect(after.polygon![0][1]).toBeGreaterThan(before.polygon![0][1] + 1);
  expect(await staleLayers(page)).toEqual([]);
  expect(await strayOutlines(page)).toEqual([]);
  await page.screenshot({ path: path.join(SCREENS, "layout-no-ghost-tablet.png") });
  expect(failures).toEqual([]);
  await context.close();
});
