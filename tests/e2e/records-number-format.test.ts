/**
 * A decimal-comma company that works in pounds (number format "1.234,5", lb) on a phone
 * (390 × 844): the system's records show lb first and every figure in the company's format; the
 * charge-added form reads "12,5" as twelve and a half, echoes what it read before saving, and
 * refuses "12.5" with the reason, saving nothing and keeping what was typed (docs/decisions/0047,
 * 0054). Screenshots go to test-results/screens/.
 */
import path from "node:path";
import { mkdirSync } from "node:fs";
import { afterAll, beforeAll, expect, it } from "vitest";
import type { Browser } from "playwright-core";
import { eq } from "drizzle-orm";
import { chargeAdditions, companies, systems } from "../../server/db/schema/index";
import { launchBrowser, newContext } from "../helpers/browser";
import { startE2eServer, type E2eServer } from "../helpers/e2e-server";
import { PASSWORD, seedCompany } from "../helpers/fixtures";
import { signInThroughForm } from "../helpers/e2e-session";

const SCREENS = path.resolve(import.meta.dirname, "../../test-results/screens");
mkdirSync(SCREENS, { recursive: true });
const KG_PER_LB = 0.45359237; // NIST SP 811
const PHONE = { viewport: { width: 390, height: 844 }, hasTouch: true, isMobile: true, deviceScaleFactor: 2 };

let server: E2eServer;
let browser: Browser;
let co: Awaited<ReturnType<typeof seedCompany>>;
let systemId: string;

const localDay = (daysAgo: number) => {
  const today = new Intl.DateTimeFormat("en-CA", {
    timeZone: "America/New_York",
    year: "numeric",
    month: "2-digit",
    day: "2-digit",
  }).format(new Date());
  return new Date(Date.parse(`${today}T00:00:00Z`) - daysAgo * 86_400_000).toISOString().slice(0, 10);
};

beforeAll(async () => {
  server = await startE2eServer();
  co = await seedCompany(server.ctx, "Brackenfold Foods");
  await server.ctx.db
    .update(companies)
    .set({ numberFormat: "1.234,5", massUnit: "lb" })
    .where(eq(companies.id, co.company.id));
  const [row] = await server.ctx.db
    .insert(systems)
    .values({
      companyId: co.company.id,
      storeId: co.store.id,
      name: "Rack B – frozen line",
      refrigerantId: "R-448A",
      fullChargeKg: 1500 * KG_PER_LB,
      applianceType: "commercial-refrigeration",
    })
    .returning();
  systemId = row.id;
  await server.ctx.db.insert(chargeAdditions).values({
    companyId: co.company.id,
    systemId,
    addedOn: localDay(40),
    amountKg: 20 * KG_PER_LB,
    enteredValue: 20,
    enteredUnit: "lb",
    technicianId: co.people.technician.userId,
    reason: "Routine top-up",
    recordedById: co.people.technician.userId,
  });
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await server?.close();
});

it("on a phone, a decimal-comma lb company reads its records in its own format and records 12,5 lb as typed", async () => {
  const context = await newContext(browser, PHONE);
  const page = await context.newPage();
  page.setDefaultTimeout(15_000);
  const failures: string[] = [];
  page.on("pageerror", (e) => failures.push(String(e)));
  await signInThroughForm(page, server.url, co.people.technician.email, PASSWORD);
  await page.goto(`${server.url}/systems/${systemId}`);
  await page.getByRole("heading", { name: "Rack B – frozen line" }).waitFor();

  // 1,500 lb in the company's format, lb first (de-DE's CLDR symbols: "1.500,0").
  const de1 = new Intl.NumberFormat("de-DE", { minimumFractionDigits: 1, maximumFractionDigits: 1 });
  await page
    .getByText(`${de1.format(1500)} lb`, { exact: true })
    .first()
    .waitFor();
  await page.getByText("20,0 lb", { exact: true }).first().waitFor();

  const amount = page.getByLabel("Amount added");
  await amount.scrollIntoViewIfNeeded();
  expect(await page.getByLabel("Unit", { exact: true }).inputValue()).toBe("lb");
  await page.getByLabel("Reason").fill("Top-up after the evaporator leak");

  // "12.5" is not this company's way of writing twelve and a half: refused with the reason.
  await amount.fill("12.5");
  await page.getByRole("button", { name: "Record charge added" }).tap();
  await page.getByText(/must group thousands in threes: in 1\.234,5 the decimal mark is ","/).waitFor();
  expect(await amount.inputValue()).toBe("12.5");
  const stored = () => server.ctx.db.select().from(chargeAdditions).where(eq(chargeAdditions.systemId, systemId));
  expect(await stored()).toHaveLength(1);
  await page.screenshot({ path: path.join(SCREENS, "records-number-format-refused-phone.png") });

  // "12,5" is: echoed before it is saved, then stored as 12.5 lb.
  await amount.fill("12,5");
  await page.getByText("Read as 12,5 lb", { exact: true }).waitFor();
  await page.screenshot({ path: path.join(SCREENS, "records-number-format-echo-phone.png") });
  await page.getByRole("button", { name: "Record charge added" }).tap();
  // 12.5 lb of 1,500 lb, 40 days after the last addition: 12.5/1500 ÷ (40/365) × 100 = 7.6 % a
  // year (40 CFR 84.102 annualizing method; docs/reference/standards.md §1), written "7,6 %".
  await page.getByText("7,6 %", { exact: true }).first().waitFor();
  const rows = await stored();
  expect(rows).toHaveLength(2);
  const added = rows.find((r) => r.reason === "Top-up after the evaporator leak")!;
  expect(added.amountKg).toBeCloseTo(12.5 * KG_PER_LB, 9);
  await page.getByText("12,5 lb", { exact: true }).first().waitFor();
  await page.screenshot({ path: path.join(SCREENS, "records-number-format-phone.png"), fullPage: true });
  expect(failures).toEqual([]);
  await context.close();
});
