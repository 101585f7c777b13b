import { afterAll, beforeAll, expect, it } from "vitest";
import fs from "node:fs/promises";
import os from "node:os";
import path from "node:path";
import type { Browser } from "playwright-core";
import { launchBrowser, newContext } from "../helpers/browser";
import { startE2eServer, type E2eServer } from "../helpers/e2e-server";
import { signInThroughForm } from "../helpers/e2e-session";
import { DEMO_SIGN_INS, seedDemoIfEmpty } from "../../server/db/seed/demo";

// One finding, three screens, one cache: a repair recorded on the field map shows on Today and on
// the system's records as soon as they are opened again, without reloading the page
// (src/entities/invalidate.ts; docs/decisions/0060-client-entity-layer.md).

let server: E2eServer;
let browser: Browser;
let uploads: string;

beforeAll(async () => {
  uploads = await fs.mkdtemp(path.join(os.tmpdir(), "plumeline-e2e-entities-"));
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

const RACK_A = "Rack A – medium temperature";

it("a repair marked on the field map shows on Today and on the system's records without a reload", async () => {
  const context = await newContext(browser, { viewport: { width: 1440, height: 900 } });
  const page = await context.newPage();
  const failures: string[] = [];
  page.on("pageerror", (e) => failures.push(String(e)));
  const engineer = DEMO_SIGN_INS.people.find((p) => p.role === "engineer")!;
  await signInThroughForm(page, server.url, engineer.email, DEMO_SIGN_INS.password);
  const storeId = await page.evaluate(async () => (await (await fetch("/api/stores")).json()).stores[0].id as string);

  // The latest sweep's field map lists the confirmed brazed-joint leak found behind Dairy 3.
  await page.goto(`${server.url}/stores/${storeId}/sweeps`);
  // From here on every screen is reached inside the app; a reload would drop this mark.
  await page.evaluate(() => Object.assign(window, { loadedOnce: true }));
  await page.getByTestId("sweep-row").first().getByRole("link", { name: "Open field map" }).click();
  const finding = page.getByTestId("sweep-finding").filter({ hasText: "confirmed" });
  await finding.waitFor({ timeout: 60_000 });

  // Today and the system's records, read once, so both are in the cache.
  await page.getByRole("link", { name: "Today", exact: true }).click();
  const openFindings = page.getByRole("table", { name: "Open findings" });
  const row = openFindings.getByRole("row").filter({ hasText: `Brazed joint on ${RACK_A}` });
  await row.getByRole("cell", { name: "confirmed", exact: true }).waitFor();
  await page.getByRole("heading", { name: "Systems over threshold" }).waitFor();
  await page.getByRole("link", { name: RACK_A, exact: true }).first().click();
  await page.getByRole("heading", { name: "Findings on this system" }).waitFor();
  await page.getByRole("link", { name: /Brazed joint · confirmed/ }).waitFor();

  // Back to the field map (history, no reload): the repair is recorded there.
  await page.goBack();
  await page.goBack();
  await finding.waitFor();
  await finding.getByLabel("What was done").fill("Brazed elbow re-made, pressure tested with nitrogen");
  await finding.getByRole("button", { name: "Mark repaired" }).click();
  await page.getByTestId("sweep-finding").filter({ hasText: "repaired" }).waitFor();

  // Forward to Today: the finding is repaired and no system is left over threshold unrepaired.
  await page.goForward();
  await row.getByRole("cell", { name: "repaired", exact: true }).waitFor();
  await page.getByText("No system has an unrepaired leak rate above its threshold.").waitFor();

  // Forward to the system's records: the finding reads repaired there too.
  await page.goForward();
  await page.getByRole("link", { name: /Brazed joint · repaired/ }).waitFor();
  expect(await page.getByRole("link", { name: /Brazed joint · confirmed/ }).count()).toBe(0);

  expect(await page.evaluate(() => (window as unknown as { loadedOnce?: boolean }).loadedOnce)).toBe(true);
  expect(failures).toEqual([]);
  await context.close();
});
