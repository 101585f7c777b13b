/**
 * A lead tech maps a new store in the browser: creates it, uploads a drawing (a PNG made here
 * with jimp), sets its scale, draws three fixtures of different kinds (one by duplicating and
 * re-kinding a case), drags one, reloads, and finds them where they were — checked in metres through the API.
 */
import { afterAll, beforeAll, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { launchBrowser, newContext } from "../helpers/browser";
import { startE2eServer, type E2eServer } from "../helpers/e2e-server";
import { PASSWORD, seedCompany } from "../helpers/fixtures";
import { signInThroughForm } from "../helpers/e2e-session";
import { drawingPng, numberAttr, pickerScreen, storedFixtures } from "../helpers/layout-e2e";
import { eq } from "drizzle-orm";
import { stores } from "../../server/db/schema/index";

let server: E2eServer;
let browser: Browser;
let co: Awaited<ReturnType<typeof seedCompany>>;

beforeAll(async () => {
  server = await startE2eServer();
  co = await seedCompany(server.ctx, "Quillby Grocers");
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await server?.close();
});

/** Screen position of a plan point (metres) in the layout editor. */
async function editorScreen(page: Page, xm: number, ym: number) {
  const stage = "[data-testid=layout-stage]";
  const box = (await page.locator(`${stage} canvas`).first().boundingBox())!;
  const [zoom, panX, panY, mpp] = await Promise.all(
    ["data-zoom", "data-pan-x", "data-pan-y", "data-mpp"].map((a) => numberAttr(page, stage, a)),
  );
  return { x: box.x + panX + (xm / mpp) * zoom, y: box.y + panY + (ym / mpp) * zoom };
}

it("creates a store, uploads and calibrates a plan, draws three fixtures and finds them after a reload, in metres", async () => {
  const context = await newContext(browser, { viewport: { width: 1400, height: 1000 } });
  const page = await context.newPage();
  const failures: string[] = [];
  page.on("pageerror", (e) => failures.push(String(e)));
  page.on("console", (m) => m.type() === "error" && failures.push(m.text()));

  await signInThroughForm(page, server.url, co.people["lead-tech"].email, PASSWORD);
  // A lead tech lands on Today; the stores are one link away.
  await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Stores" }).click();
  await page.getByRole("button", { name: "New store" }).click();
  await page.getByLabel("Store name").fill("Quillby Grocers – Fernbank");
  await page.getByLabel("Address").fill("12 Fernbank Parade");
  // The time zone is picked from the searchable list: a city typed, its zone clicked.
  await page.getByRole("combobox", { name: "Time zone" }).fill("chicago");
  await page.getByRole("option", { name: /Chicago, America/ }).click();
  await page.getByRole("button", { name: "Create store" }).click();
  await page.getByRole("heading", { name: "Quillby Grocers – Fernbank" }).waitFor();
  const storeId = new URL(page.url()).pathname.split("/")[2];
  expect((await server.ctx.db.select().from(stores).where(eq(stores.id, storeId)))[0].timeZone).toBe("America/Chicago");

  // Upload: the calibration panel opens by itself afterwards.
  await page.getByLabel("Drawing file").setInputFiles(await drawingPng("quillby-floor.png", { border: true }));
  await page.getByRole("button", { name: "Upload drawing" }).click();
  await page.getByRole("heading", { name: "Set the scale" }).waitFor();
  await page.getByRole("group", { name: "Calibration line on the drawing" }).locator("canvas").first().waitFor();

  // The wall from (100, 250) to (700, 250) px is 12 m long: 0.02 m per pixel.
  await page.getByRole("group", { name: "Calibration line on the drawing" }).scrollIntoViewIfNeeded();
  for (const [x, y] of [
    [100, 250],
    [700, 250],
  ]) {
    const s = await pickerScreen(page, x, y);
    await page.mouse.click(s.x, s.y);
  }
  await page.getByLabel("Real length of the line").fill("12 m");
  await page.getByRole("button", { name: "Save scale" }).click();
  await page.getByText("The plan's scale is set.").waitFor();

  const plans = await (await page.request.get(`${server.url}/api/stores/${storeId}/plans`)).json();
  expect(plans.plans).toHaveLength(1);
  const plan = plans.plans[0];
  // Clicks land on screen pixels at the picker's zoom, so the line is within about a pixel of 600.
  expect(plan.metresPerPixel).toBeGreaterThan(12 / 602);
  expect(plan.metresPerPixel).toBeLessThan(12 / 598);
  expect(plan.widthM).toBeCloseTo(800 * plan.metresPerPixel, 9);

  await page.getByRole("link", { name: "Open the layout editor" }).click();
  await page.locator("[data-testid=layout-stage] canvas").first().waitFor();

  await page.locator("[data-testid=layout-stage]").scrollIntoViewIfNeeded();

  // 1. An open case by dragging a rectangle from (2, 2) m to (5.5, 3.2) m; the 10 cm grid snaps it.
  await page.getByRole("button", { name: "Rectangle" }).click();
  const a = await editorScreen(page, 2, 2);
  const b = await editorScreen(page, 5.5, 3.2);
  await page.mouse.move(a.x, a.y);
  await page.mouse.down();
  await page.mouse.move((a.x + b.x) / 2, (a.y + b.y) / 2, { steps: 4 });
  await page.mouse.move(b.x, b.y, { steps: 4 });
  await page.mouse.up();
  await page.getByRole("heading", { name: "All fixtures (1)" }).waitFor();

  // 2. Ctrl+D duplicates the selected case, butted on its right; the copy becomes a glass-door case.
  await page.keyboard.press("Control+d");
  await page.getByRole("heading", { name: "All fixtures (2)" }).waitFor();
  await page.getByLabel("Kind", { exact: true }).selectOption("door-case");
  await page.getByLabel("Door count").waitFor();

  // 3. A valve at (8, 6) m.
  await page.getByLabel("Kind to draw").selectOption("valve");
  await page.getByRole("button", { name: "Place point" }).click();
  const v = await editorScreen(page, 8, 6);
  await page.mouse.click(v.x, v.y);
  await page.getByRole("heading", { name: "All fixtures (3)" }).waitFor();

  // Escape goes back to the select tool; dragging the valve moves it to (10, 7) m on drag end.
  await page.keyboard.press("Escape");
  await page.getByRole("button", { name: "Select", pressed: true }).waitFor();
  const from = await editorScreen(page, 8, 6);
  const to = await editorScreen(page, 10, 7);
  // Everything up to the drag is saved once the drag's own save is in (autosave waits for a pause).
  await storedFixtures(page, server.url, plan.id, async () => {
    await page.mouse.move(from.x, from.y);
    await page.mouse.down();
    await page.mouse.move(from.x + 10, from.y + 5, { steps: 3 });
    await page.mouse.move(to.x, to.y, { steps: 8 });
    await page.mouse.up();
    await page.getByRole("cell", { name: "10.00 m, 7.00 m" }).waitFor();
  });

  const check = async () => {
    const r = await (await page.request.get(`${server.url}/api/plans/${plan.id}/fixtures`)).json();
    const byKind = Object.fromEntries(r.fixtures.map((f: { kind: string }) => [f.kind, f]));
    expect(Object.keys(byKind).sort()).toEqual(["door-case", "open-case", "valve"]);
    const near = (got: number[][], want: number[][]) =>
      got.forEach((p, i) => p.forEach((c, j) => expect(c).toBeCloseTo(want[i][j], 6)));
    // Grid-snapped corners: exact to the micrometre.
    near(byKind["open-case"].polygon, [
      [2, 2],
      [5.5, 2],
      [5.5, 3.2],
      [2, 3.2],
    ]);
    near(byKind["door-case"].polygon, [
      [5.5, 2],
      [9, 2],
      [9, 3.2],
      [5.5, 3.2],
    ]);
    // 3.5 m of case at about 0.76 m a door (common practice, no published source) → 5 doors.
    expect(byKind["door-case"].doorCount).toBe(5);
    expect(byKind.valve.point.x).toBeCloseTo(10, 6);
    expect(byKind.valve.point.y).toBeCloseTo(7, 6);
    return r.fixtures.map((f: { id: string }) => f.id).sort();
  };
  const before = await check();

  await page.reload();
  await page.getByRole("heading", { name: "All fixtures (3)" }).waitFor();
  await page.locator("[data-testid=layout-stage] canvas").first().waitFor();
  expect(await check()).toEqual(before);
  // The list view shows the open case where it was: centre (3.75 m, 2.6 m).
  await expect(page.getByRole("cell", { name: "3.75 m, 2.60 m" }).count()).resolves.toBe(1);
  expect(failures).toEqual([]);
  await context.close();
});
