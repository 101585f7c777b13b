import { mkdtemp, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import path, { join } from "node:path";
import type { Browser, Page } from "playwright-core";
import { newContext } from "./browser";
import { signInThroughForm } from "./e2e-session";
import { PASSWORD } from "./fixtures";
import { Jimp, JimpMime } from "jimp";

/**
 * An 800 × 500 px drawing (a PNG made here with jimp) with one 600 px wall from (100, 250) to
 * (700, 250), and a border round it when asked. Returns the file's path.
 */
export async function drawingPng(fileName: string, { border = false } = {}): Promise<string> {
  const img = new Jimp({ width: 800, height: 500, color: 0xffffffff });
  if (border) {
    for (let x = 0; x < 800; x++) for (const y of [0, 499]) img.setPixelColor(0x222222ff, x, y);
    for (let y = 0; y < 500; y++) for (const x of [0, 799]) img.setPixelColor(0x222222ff, x, y);
  }
  for (let x = 100; x <= 700; x++) for (let y = 248; y <= 252; y++) img.setPixelColor(0x222222ff, x, y);
  const dir = await mkdtemp(join(tmpdir(), "plumeline-e2e-"));
  const file = join(dir, fileName);
  await writeFile(file, await img.getBuffer(JimpMime.png));
  return file;
}

export async function numberAttr(page: Page, selector: string, name: string): Promise<number> {
  return Number(await page.locator(selector).first().getAttribute(name));
}

/** Screen position of a display-image pixel in the calibration picker, from the view it reports. */
export async function pickerScreen(page: Page, x: number, y: number) {
  const box = (await page
    .getByRole("group", { name: "Calibration line on the drawing" })
    .locator("canvas")
    .first()
    .boundingBox())!;
  const [zoom, panX, panY] = await Promise.all(
    ["data-zoom", "data-pan-x", "data-pan-y"].map((a) => numberAttr(page, "[data-testid=picker-view]", a)),
  );
  return { x: box.x + panX + x * zoom, y: box.y + panY + y * zoom };
}

/** A fixture as `GET /api/plans/:id/fixtures` answers it. */
export type StoredFixture = {
  id: string;
  kind: string;
  label: string;
  polygon?: number[][];
  point?: { x: number; y: number };
};

async function serverLayout(page: Page, baseUrl: string, planId: string) {
  // A GET is safe to send again: a connection the server reset under a loaded run (seen once as
  // ECONNRESET on a kept-alive socket) is retried, as a browser does, not taken as the answer.
  for (let attempt = 1; ; attempt++) {
    try {
      const res = await page.request.get(`${baseUrl}/api/plans/${planId}/fixtures`);
      return (await res.json()) as { layoutRevision: number; fixtures: StoredFixture[] };
    } catch (e) {
      if (attempt >= 3 || !/ECONNRESET|socket hang up/.test(String(e))) throw e;
    }
  }
}

/**
 * The plan's fixtures as the server holds them once the editor has nothing left to save. With
 * `edit`, runs it first and waits for the save it causes: the server's layout revision past the one
 * before the edit, then the editor saying "saved". (A fixed pause before looking for "saved" could
 * find the state from before the edit on a slow machine, and read the layout the edit had not reached.)
 */
export async function storedFixtures(
  page: Page,
  baseUrl: string,
  planId: string,
  edit?: () => Promise<unknown>,
): Promise<StoredFixture[]> {
  const saved = page.locator("[data-save-status=saved]");
  if (edit) {
    const before = (await serverLayout(page, baseUrl, planId)).layoutRevision;
    await edit();
    for (let waited = 0; (await serverLayout(page, baseUrl, planId)).layoutRevision <= before; waited += 250) {
      if (waited > 30_000) {
        const status = await page.locator("[data-save-status]").getAttribute("data-save-status");
        throw new Error(`the edit was never saved (layout revision still ${before}, save status "${status}")`);
      }
      await page.waitForTimeout(250);
    }
  }
  await saved.waitFor({ timeout: 15_000 });
  return (await serverLayout(page, baseUrl, planId)).fixtures;
}

/** The layout editor's stage, as the editor marks it. */
export const LAYOUT_STAGE = "[data-testid=layout-stage]";

/** Resolves once the stage's box and view have stopped changing (the fit and the scroll run after layout). */
export async function stageSettled(page: Page, stage = LAYOUT_STAGE): Promise<void> {
  const look = () =>
    page.evaluate((sel) => {
      const s = document.querySelector(sel) as HTMLElement;
      return JSON.stringify([s.getBoundingClientRect(), s.dataset.zoom, s.dataset.panX, s.dataset.panY]);
    }, stage);
  let last = await look();
  for (let i = 0; i < 40; i++) {
    await page.waitForTimeout(150);
    const now = await look();
    if (now === last) return;
    last = now;
  }
  throw new Error("the editor's stage never settled");
}

/**
 * A fresh browser context at `viewport` (a phone or tablet's touch when `touch`), signed in through the
 * form, on a plan's layout editor once its stage has settled; `failures` collects page errors.
 */
export async function openLayoutEditor(
  browser: Browser,
  at: { url: string; email: string; storeId: string; planId: string },
  viewport: { width: number; height: number },
  touch: boolean,
) {
  const context = await newContext(browser, {
    viewport,
    ...(touch ? { hasTouch: true, isMobile: true, deviceScaleFactor: 2 } : {}),
  });
  const page = await context.newPage();
  const failures: string[] = [];
  page.on("pageerror", (e) => failures.push(String(e)));
  page.on("console", (m) => m.type() === "error" && failures.push(m.text()));
  await signInThroughForm(page, at.url, at.email, PASSWORD);
  await page.goto(`${at.url}/stores/${at.storeId}/plans/${at.planId}/layout`);
  await page
    .locator(`${LAYOUT_STAGE} canvas`)
    .first()
    .waitFor()
    .catch(async (e) => {
      // Once in many loaded runs the editor had not opened after 30 s: say what the page showed.
      const shot = path.resolve(import.meta.dirname, `../../test-results/screens/layout-not-open-${Date.now()}.png`);
      await page.screenshot({ path: shot }).catch(() => undefined);
      const shown = await page
        .locator("main")
        .innerText({ timeout: 1000 })
        .catch(() => "(no main)");
      throw new Error(`the layout editor did not open; the page showed: ${shown.slice(0, 300)} (screenshot ${shot})`, {
        cause: e,
      });
    });
  await stageSettled(page);
  return { context, page, failures };
}
