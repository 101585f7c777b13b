import { afterAll, beforeAll, expect, it } from "vitest";
import { mkdirSync } from "node:fs";
import path from "node:path";
import { arrayContains, eq } from "drizzle-orm";
import type { Browser } from "playwright-core";
import { launchBrowser, newContext } from "../helpers/browser";
import { startE2eServer, type E2eServer } from "../helpers/e2e-server";
import { companies, outboxMessages } from "../../server/db/schema/index";

const SCREENS = path.resolve(import.meta.dirname, "../../test-results/screens");
let server: E2eServer;
let browser: Browser;

beforeAll(async () => {
  mkdirSync(SCREENS, { recursive: true });
  server = await startE2eServer();
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await server?.close();
});

/** The link in the mail to `address`, once the mail worker has sent it (bounded well inside the test's time). */
async function linkMailedTo(address: string): Promise<string> {
  for (let i = 0; i < 1200; i++) {
    const [m] = await server.ctx.db
      .select()
      .from(outboxMessages)
      .where(arrayContains(outboxMessages.to, [address]));
    if (m) return /(http\S+\/sign-up\/confirm\/[A-Za-z0-9_-]+)/.exec(m.text)![1];
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error(`no mail to ${address}`);
}

it("a new EU customer signs up on a phone, confirms the e-mail and lands on the first steps; the first store opens", async () => {
  const context = await newContext(browser, { viewport: { width: 390, height: 844 }, hasTouch: true, isMobile: true });
  const page = await context.newPage();
  const failures: string[] = [];
  page.on("pageerror", (e) => failures.push(String(e)));

  await page.goto(`${server.url}/sign-in`);
  await page.getByRole("link", { name: "Create your company's account" }).tap();
  await page.getByLabel("Company name").fill("Kestrel Kühltechnik");
  await page.getByLabel("Your name").fill("Jonas Albers");
  await page.getByLabel("E-mail").fill("jonas@kestrel.example");
  await page.getByLabel("New password", { exact: true }).fill("a long enough secret");
  await page.getByLabel("New password again").fill("a long enough secret");
  await page.getByLabel("Rules you work under").selectOption("eu-fgas");
  // the units follow the rules chosen
  expect(await page.getByLabel("Lengths in").inputValue()).toBe("m");
  expect(await page.getByLabel("Refrigerant mass in").inputValue()).toBe("kg");
  await page.screenshot({ path: path.join(SCREENS, "phone-sign-up.png"), fullPage: true });
  await page.getByRole("button", { name: "Create account" }).tap();
  await page.getByText("We sent a link to jonas@kestrel.example").waitFor();

  await page.goto(await linkMailedTo("jonas@kestrel.example"));
  await page.getByRole("heading", { name: "Welcome to Plumeline, Kestrel Kühltechnik" }).waitFor();
  await page.screenshot({ path: path.join(SCREENS, "phone-welcome.png"), fullPage: true });
  const [company] = await server.ctx.db.select().from(companies).where(eq(companies.name, "Kestrel Kühltechnik"));
  expect(company).toMatchObject({ ruleProfile: "eu-fgas", lengthUnit: "m", massUnit: "kg" });

  await page.getByRole("link", { name: "1. Create your first store" }).tap();
  await page.getByLabel("Store name").waitFor();
  expect(failures).toEqual([]);
  await context.close();
});
