import { afterAll, beforeAll, expect, it } from "vitest";
import fs from "node:fs/promises";
import { mkdirSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import type { Browser } from "playwright-core";
import { launchBrowser, newContext } from "../helpers/browser";
import { startE2eServer, type E2eServer } from "../helpers/e2e-server";
import { signInThroughForm } from "../helpers/e2e-session";
import { DEMO_SIGN_INS, seedDemoIfEmpty } from "../../server/db/seed/demo";

// The demo store's manager on a phone: the sweeps open as reports, the evidence behind them stays
// with the service team, screens and API alike (docs/decisions/0072).

const SCREENS = path.resolve(import.meta.dirname, "../../test-results/screens");
let server: E2eServer;
let browser: Browser;
let uploads: string;

beforeAll(async () => {
  mkdirSync(SCREENS, { recursive: true });
  uploads = await fs.mkdtemp(path.join(os.tmpdir(), "plumeline-e2e-contact-"));
  server = await startE2eServer({ uploadsDir: uploads });
  expect(await seedDemoIfEmpty(server.ctx)).toBe(true);
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await server?.close();
  await fs.rm(uploads, { recursive: true, force: true });
});

it("a store contact opens a sweep as its report, with the leak found, and never gets the readings", async () => {
  const context = await newContext(browser, { viewport: { width: 390, height: 844 }, hasTouch: true, isMobile: true });
  const page = await context.newPage();
  const failures: string[] = [];
  page.on("pageerror", (e) => failures.push(String(e)));
  const contact = DEMO_SIGN_INS.people.find((p) => p.role === "store-contact")!;
  await signInThroughForm(page, server.url, contact.email, DEMO_SIGN_INS.password);
  const storeId = await page.evaluate(async () => (await (await fetch("/api/stores")).json()).stores[0].id as string);

  await page.goto(`${server.url}/stores/${storeId}/sweeps`);
  const rows = page.getByTestId("sweep-row");
  await rows.first().waitFor();
  expect(await page.getByRole("link", { name: "Open field map" }).count()).toBe(0);
  expect(await page.getByRole("link", { name: "Compare months" }).count()).toBe(0);
  await rows.first().getByRole("link", { name: "Open report" }).tap();

  await page.getByRole("heading", { name: "Leaks found on this sweep" }).waitFor();
  const pdf = page.getByRole("link", { name: "Download the report (PDF)" });
  const href = await pdf.getAttribute("href");
  await page.screenshot({ path: path.join(SCREENS, "phone-store-contact-sweep-report.png"), fullPage: true });

  // The report is theirs; the readings and the field map behind it are not.
  const sweepId = href!.split("/")[3];
  const status = (url: string) => page.evaluate(async (u) => (await fetch(u)).status, url);
  expect(await status(href!)).toBe(200);
  expect(await status(`/api/sweeps/${sweepId}/readings`)).toBe(403);
  expect(await status(`/api/sweeps/${sweepId}/analysis`)).toBe(403);
  expect(failures).toEqual([]);
  await context.close();
});
