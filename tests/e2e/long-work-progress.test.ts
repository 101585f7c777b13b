/**
 * Long work shows that it is working: a plan upload over a slow connection says how much of the
 * drawing is sent, then that the server is preparing it, in a status region, and the button
 * cannot send it twice meanwhile. Screenshots go to test-results/screens/.
 */
import path from "node:path";
import { mkdir, mkdtemp, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import { afterAll, beforeAll, expect, it } from "vitest";
import type { Browser } from "playwright-core";
import { Jimp, JimpMime } from "jimp";
import { eq } from "drizzle-orm";
import { launchBrowser, newContext } from "../helpers/browser";
import { startE2eServer, type E2eServer } from "../helpers/e2e-server";
import { PASSWORD, seedCompany } from "../helpers/fixtures";
import { signInThroughForm } from "../helpers/e2e-session";
import { plans } from "../../server/db/schema/index";

const SCREENS = path.resolve(import.meta.dirname, "../../test-results/screens");

let server: E2eServer;
let browser: Browser;
let co: Awaited<ReturnType<typeof seedCompany>>;

beforeAll(async () => {
  server = await startE2eServer();
  co = await seedCompany(server.ctx, "Fernwick Market");
  browser = await launchBrowser();
  await mkdir(SCREENS, { recursive: true });
});
afterAll(async () => {
  await browser?.close();
  await server?.close();
});

/** A drawing that does not compress (noise), so its upload takes a while on a slow link. */
async function noisyDrawing(): Promise<{ file: string; bytes: number }> {
  const img = new Jimp({ width: 1000, height: 700, color: 0xffffffff });
  let seed = 7;
  for (let y = 0; y < 700; y++)
    for (let x = 0; x < 1000; x++) {
      seed = (seed * 1103515245 + 12345) % 2147483648; // a fixed linear congruential sequence
      const v = seed % 256;
      img.setPixelColor(((v << 24) | (v << 16) | (v << 8) | 0xff) >>> 0, x, y);
    }
  const buffer = await img.getBuffer(JimpMime.png);
  const file = path.join(await mkdtemp(path.join(tmpdir(), "plumeline-e2e-")), "fernwick-floor.png");
  await writeFile(file, buffer);
  return { file, bytes: buffer.length };
}

it("a plan upload over a slow link says how much is sent, then that the drawing is being prepared, and cannot be sent twice", async () => {
  const drawing = await noisyDrawing();
  const context = await newContext(browser, { viewport: { width: 1366, height: 860 } });
  const page = await context.newPage();
  const failures: string[] = [];
  page.on("pageerror", (e) => failures.push(String(e)));
  await signInThroughForm(page, server.url, co.people["lead-tech"].email, PASSWORD);
  await page.goto(`${server.url}/stores/${co.store.id}`);
  await page.getByLabel("Drawing file").setInputFiles(drawing.file);

  // Every text the status region shows, in order, as a screen reader would be told it.
  await page.evaluate(() => {
    const seen: string[] = [];
    (window as unknown as { statusSeen: string[] }).statusSeen = seen;
    const el = document.querySelector("[data-testid=plan-upload-status]")!;
    new MutationObserver(() => {
      const text = el.textContent ?? "";
      if (text && seen[seen.length - 1] !== text) seen.push(text);
    }).observe(el, { subtree: true, childList: true, characterData: true });
  });
  // About 4 s for the drawing at 1 Mbit/s up (Chrome DevTools Protocol, Network.emulateNetworkConditions).
  const cdp = await context.newCDPSession(page);
  await cdp.send("Network.enable");
  await cdp.send("Network.emulateNetworkConditions", {
    offline: false,
    latency: 20,
    downloadThroughput: -1,
    uploadThroughput: drawing.bytes / 4,
  });

  const button = page.getByRole("button", { name: "Upload drawing" });
  await button.click();
  await page
    .getByTestId("plan-upload-status")
    .getByText(/Uploading the drawing… \d+ %/)
    .waitFor();
  // While it runs: the form is busy and its button cannot send the drawing again.
  expect(await page.locator("form[aria-busy=true]").count()).toBe(1);
  expect(await button.isDisabled()).toBe(true);
  await page.screenshot({ path: path.join(SCREENS, "plan-upload-progress.png") });
  await page.getByRole("heading", { name: "Set the scale" }).waitFor({ timeout: 30_000 });

  const seen = await page.evaluate(() => (window as unknown as { statusSeen: string[] }).statusSeen);
  const percents = seen
    .map((t) => /Uploading the drawing… (\d+) %/.exec(t)?.[1])
    .filter((p): p is string => p !== undefined)
    .map(Number);
  // Several steps on the way, rising, and the server's part announced after the last byte.
  expect(percents.length).toBeGreaterThanOrEqual(3);
  expect(percents.some((p) => p > 0 && p < 100)).toBe(true);
  expect([...percents].sort((a, b) => a - b)).toEqual(percents);
  expect(seen.some((t) => t.includes("Checking and preparing the drawing"))).toBe(true);
  // One plan, not two.
  expect(await server.ctx.db.select().from(plans).where(eq(plans.storeId, co.store.id))).toHaveLength(1);
  expect(failures).toEqual([]);
  await context.close();
});
