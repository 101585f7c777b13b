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
  co = await seedCompany(server.ctx, "Wrenfield Market");
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await server?.close();
});

it("on a phone the header is one row and the navigation opens from Menu; the help for a technician starts with the sweep", async () => {
  const context = await newContext(browser, { viewport: { width: 390, height: 844 }, hasTouch: true, isMobile: true });
  const page = await context.newPage();
  await signInThroughForm(page, server.url, co.people.technician.email, PASSWORD);

  const header = (await page.locator("header").boundingBox())!;
  // one row: well under a third of the screen (it was about 280 px of 844)
  expect(header.height).toBeLessThan(90);
  const nav = page.getByRole("navigation", { name: "Main" });
  expect(await nav.isVisible()).toBe(false);
  await page.screenshot({ path: path.join(SCREENS, "phone-header-folded.png") });

  await page.getByRole("button", { name: "Menu" }).tap();
  await nav.waitFor();
  expect(await page.getByRole("button", { name: "Sign out" }).isVisible()).toBe(true);
  await page.screenshot({ path: path.join(SCREENS, "phone-header-menu-open.png") });
  await nav.getByRole("link", { name: "Help" }).tap();

  await page.getByRole("heading", { name: "Help", level: 1 }).waitFor();
  // The menu folds after a page change (on the render after the new page's, so waited for).
  await nav.waitFor({ state: "hidden" });
  const topics = await page.locator("main li a").allTextContents();
  expect(topics[0]).toBe("How a sweep works");
  await page.getByRole("link", { name: "How a sweep works" }).tap();
  await page.getByText("local codes always come first").waitFor();
  await page.screenshot({ path: path.join(SCREENS, "phone-help-sweep.png"), fullPage: true });
  await context.close();
});

it("on a tablet the navigation stays in view with no menu button", async () => {
  const context = await newContext(browser, { viewport: { width: 820, height: 1180 }, hasTouch: true, isMobile: true });
  const page = await context.newPage();
  await signInThroughForm(page, server.url, co.people.engineer.email, PASSWORD);
  await page.getByRole("navigation", { name: "Main" }).waitFor();
  expect(await page.getByRole("button", { name: "Menu" }).isVisible()).toBe(false);
  expect(await page.getByRole("button", { name: "Sign out" }).isVisible()).toBe(true);
  await context.close();
});
