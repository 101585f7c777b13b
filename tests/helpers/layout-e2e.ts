import { mkdtemp, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
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
  await page.locator(`${LAYOUT_STAGE} canvas`).first().waitFor();
  await stageSettled(page);
  return { context, page, failures };
}
