import { afterAll, beforeAll, expect, it } from "vitest";
import { mkdirSync } from "node:fs";
import path from "node:path";
import type { Browser } from "playwright-core";
import { launchBrowser, newContext } from "../helpers/browser";
import { startE2eServer, type E2eServer } from "../helpers/e2e-server";
import { PASSWORD, seedCompany } from "../helpers/fixtures";
import { signInThroughForm } from "../helpers/e2e-session";

const SCREENS = path.resolve(import.meta.dirname, "../../test-results/screens");
let server: E2eServer;
let browser: Browser;
let co: Awaited<ReturnType<typeof seedCompany>>;

beforeAll(async () => {
  mkdirSync(SCREENS, { recursive: true });
  server = await startE2eServer();
  co = await seedCompany(server.ctx, "Hollyford Grocers");
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await server?.close();
});

it("on a phone a lead tech enters a refrigerant by composition, is told a wrong total at the field, and picks it for a system", async () => {
  const context = await newContext(browser, { viewport: { width: 390, height: 844 }, hasTouch: true, isMobile: true });
  const page = await context.newPage();
  await signInThroughForm(page, server.url, co.people["lead-tech"].email, PASSWORD);
  await page.goto(`${server.url}/stores/${co.store.id}`);
  await page.getByText("Refrigerant not in the catalogue?").tap();
  await page.getByRole("button", { name: "Enter a refrigerant" }).tap();

  await page.getByLabel("Name", { exact: true }).fill("Hollyford split 50");
  await page.getByLabel("Component 1", { exact: true }).selectOption("R-32");
  await page.getByLabel("Component 1 mass %").fill("50");
  await page.getByLabel("Component 2", { exact: true }).selectOption("R-125");
  await page.getByLabel("Component 2 mass %").fill("49.5");
  await page.getByRole("button", { name: "Save refrigerant" }).tap();
  // 99.5 % is outside ±0.1 percentage points (docs/decisions/0073): refused at the field, nothing lost.
  await page
    .getByText(/Composition mass per cents add up to 99\.5 %/)
    .first()
    .waitFor();
  expect(await page.getByLabel("Component 2 mass %").inputValue()).toBe("49.5");
  // Nothing spills sideways on a 390 px screen.
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
  await page.screenshot({ path: path.join(SCREENS, "company-refrigerant-phone-refused.png"), fullPage: true });

  await page.getByLabel("Component 2 mass %").fill("50");
  await page.getByRole("button", { name: "Save refrigerant" }).tap();
  await page.getByText("Hollyford split 50 was saved").waitFor();
  // 50/50 is R-410A's composition: GWP 2088 on AR4 (docs/reference/standards.md §3 [S:E7]).
  await page.getByText(/GWP 2088 \(AR4\)/).waitFor();
  await page.screenshot({ path: path.join(SCREENS, "company-refrigerant-phone-saved.png"), fullPage: true });

  await page.getByRole("button", { name: "Add system" }).tap();
  const picker = page.getByLabel("Refrigerant", { exact: true });
  const key = await picker.locator("option", { hasText: "Hollyford split 50" }).getAttribute("value");
  await picker.selectOption(key!);
  await page.getByText("Hollyford split 50, entered by the company").waitFor();
  await page.screenshot({ path: path.join(SCREENS, "company-refrigerant-phone-picked.png"), fullPage: true });
  await context.close();
});
