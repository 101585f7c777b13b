import { afterAll, beforeAll, expect, it } from "vitest";
import fs from "node:fs/promises";
import os from "node:os";
import path from "node:path";
import type { Browser } from "playwright-core";
import { PDFDocument } from "pdf-lib";
import { launchBrowser, newContext } from "../helpers/browser";
import { startE2eServer, type E2eServer } from "../helpers/e2e-server";
import { signInThroughForm } from "../helpers/e2e-session";
import { DEMO_SIGN_INS, seedDemoIfEmpty } from "../../server/db/seed/demo";

let server: E2eServer;
let browser: Browser;
let uploads: string;
const shots = path.join(os.tmpdir(), "plumeline-fieldmap-shots");
const screens = path.resolve(import.meta.dirname, "../../test-results/screens");

beforeAll(async () => {
  uploads = await fs.mkdtemp(path.join(os.tmpdir(), "plumeline-e2e-demo-"));
  await fs.mkdir(shots, { recursive: true });
  server = await startE2eServer({ uploadsDir: uploads });
  expect(await seedDemoIfEmpty(server.ctx)).toBe(true);
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await server?.ctx.analysisRunner?.close();
  await server?.close();
  await fs.rm(uploads, { recursive: true, force: true });
});

it("an engineer opens the latest sweep's field map, compares it with the month before, downloads the PDF, sends it and finds it in the Outbox", async () => {
  const context = await newContext(browser, { viewport: { width: 1440, height: 900 }, acceptDownloads: true });
  const page = await context.newPage();
  const failures: string[] = [];
  page.on("pageerror", (e) => failures.push(String(e)));
  const engineer = DEMO_SIGN_INS.people.find((p) => p.role === "engineer")!;
  await signInThroughForm(page, server.url, engineer.email, DEMO_SIGN_INS.password);
  const storeId = await page.evaluate(async () => (await (await fetch("/api/stores")).json()).stores[0].id as string);

  // the store's sweeps, newest first: open the latest
  await page.goto(`${server.url}/stores/${storeId}/sweeps`);
  await page.getByTestId("sweep-row").first().getByRole("link", { name: "Open field map" }).click();
  const canvas = page.getByTestId("field-canvas");
  await canvas.waitFor({ timeout: 60_000 });
  // numbered suspect spots over the plan, listed beside it (the demo's new leak behind Dairy 3)
  await page.getByTestId("suspect-spot").first().waitFor();
  expect(Number(await canvas.getAttribute("data-suspects"))).toBeGreaterThan(0);
  await expect(page.getByTestId("suspect-spot").first().textContent()).resolves.toMatch(/^1\s*Dairy 3/);
  // the canvas really holds the field: some pixels are the ramp's dark end, not just the plan
  const painted = await canvas.evaluate((c: HTMLCanvasElement) => {
    const d = c.getContext("2d")!.getImageData(0, 0, c.width, c.height).data;
    let dark = 0;
    for (let i = 0; i < d.length; i += 4) if (d[i] < 90 && d[i + 2] > d[i + 1]) dark++;
    return dark;
  });
  expect(painted).toBeGreaterThan(50);
  await page.screenshot({ path: path.join(shots, "field-map.png"), fullPage: true });
  // the demo company works in feet and inches: every length of a spot is in ft-in, none in metres,
  // and spots, risk points and fixtures are named as drawn
  const spotText = (await page.getByTestId("suspect-spot").first().textContent()) ?? "";
  expect(spotText).toMatch(/\d+ ft( \d+ in)? across, \d+ ft( \d+ in)? down, within \d+ ft/);
  expect(spotText).not.toMatch(/\d m\b/);
  expect(spotText).toMatch(/about [\d,.]+ (lb|oz)\/yr of R-[\dA-Z]+/);
  expect(spotText).not.toMatch(/[0-9a-f]{8}-[0-9a-f]{4}-/);
  // the delay checked against the readings, shown beside the spots
  const delayCheck = page.getByTestId("delay-check");
  await expect(delayCheck.textContent()).resolves.toMatch(
    /Delay check(Readings (fit|agree)|The delay could not be checked)/,
  );
  await delayCheck.scrollIntoViewIfNeeded();
  await fs.mkdir(screens, { recursive: true });
  await page.screenshot({ path: path.join(screens, "field-map-ft-in-delay-check.png"), fullPage: true });
  await page.getByRole("button", { name: "Zoom to spot 1" }).click();
  await page.getByRole("button", { name: "Show whole plan" }).waitFor();

  // compare with the month before
  await page.getByRole("link", { name: "Compare with the month before" }).click();
  await page.getByTestId("difference-map").waitFor({ timeout: 60_000 });
  await expect(page.getByTestId("fixture-trends").locator("tbody tr").first().textContent()).resolves.toMatch(
    /^Dairy [234]/,
  );
  await page.screenshot({ path: path.join(shots, "compare.png"), fullPage: true });
  await page.goBack();
  await canvas.waitFor();

  // Every text the long-work status regions show, in order, as a screen reader is told them.
  await page.evaluate(() => {
    const seen: string[] = [];
    (window as unknown as { statusSeen: string[] }).statusSeen = seen;
    new MutationObserver(() => {
      for (const el of document.querySelectorAll(
        "[data-testid=pdf-download-status], [data-testid=analysis-progress]",
      )) {
        const text = el.textContent ?? "";
        if (text && !seen.includes(text)) seen.push(text);
      }
    }).observe(document.body, { subtree: true, childList: true, characterData: true });
  });
  const statusSeen = () => page.evaluate(() => (window as unknown as { statusSeen: string[] }).statusSeen);

  // download the PDF report: the page says it is making it, then that it is downloaded
  const [download] = await Promise.all([
    page.waitForEvent("download"),
    page.getByRole("button", { name: "Download the PDF report" }).click(),
  ]);
  await page
    .getByTestId("pdf-download-status")
    .getByText(/The PDF report is downloaded \(/)
    .waitFor();
  expect(await statusSeen()).toContain("Making the PDF report… this takes a few seconds.");
  const file = await download.path();
  const bytes = await fs.readFile(file!);
  expect(bytes.subarray(0, 5).toString("latin1")).toBe("%PDF-");
  // parsed back by pdf-lib: a valid PDF of several pages
  expect((await PDFDocument.load(bytes)).getPageCount()).toBeGreaterThanOrEqual(2);

  // another transport delay: the map says it is recomputing, then that it is up to date
  await page.getByLabel("Transport delay (s)").fill("7");
  await page.getByRole("button", { name: "Recompute" }).click();
  await page
    .getByTestId("analysis-progress")
    .getByText(/The field map is up to date/)
    .waitFor({ timeout: 60_000 });
  expect(await statusSeen()).toContain("Recomputing the field map…");
  expect(await page.getByRole("button", { name: "Recompute" }).isEnabled()).toBe(true);

  // send it to the store contact and a typed address
  await page.getByLabel("Other addresses").fill("regional.manager@example.org");
  await page.getByRole("button", { name: "Send the report" }).click();
  await page.getByText(/Sending to .*regional\.manager@example\.org/).waitFor();
  await page
    .getByTestId("report-sends")
    .getByText(/regional\.manager@example\.org/)
    .waitFor();
  // The server's job makes the PDF, then the mail queue sends it: the live list follows it to "E-mail sent".
  await page.getByTestId("report-sends").getByText("E-mail sent.").first().waitFor({ timeout: 60_000 });
  await page.screenshot({ path: path.join(screens, "report-sent-after-its-pdf-job.png"), fullPage: true });

  // and find it in the Outbox, with the PDF attached
  await page.getByRole("link", { name: "Outbox" }).click();
  await page
    .getByRole("link", { name: /Sweep report: Larkspur Market – Cedar Hollow/ })
    .first()
    .click();
  await page
    .getByText(/sweep-larkspur-market-cedar-hollow-\d{4}-\d{2}-\d{2}\.pdf/)
    .first()
    .waitFor();
  await page.getByTestId("on-its-way").waitFor();
  await page.screenshot({ path: path.join(screens, "outbox-with-not-delivered-yet.png"), fullPage: true });
  expect(failures).toEqual([]);
  await context.close();
});
