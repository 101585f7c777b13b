// The records tables, the Outbox and the system plots as people use them: searched, filtered and sorted,
// readable on a phone without sideways scrolling (390 × 844), and on a laptop (1366 × 860) the Systems
// table's actions are never clipped. Screenshots go to test-results/screens/ for a person to look at.
import { afterAll, beforeAll, expect, it } from "vitest";
import { mkdirSync } from "node:fs";
import path from "node:path";
import type { Browser, Page } from "playwright-core";
import { chargeAdditions, companies, leakChecks, outboxMessages, systems } from "../../server/db/schema/index";
import { eq } from "drizzle-orm";
import { launchBrowser, newContext } from "../helpers/browser";
import { startE2eServer, type E2eServer } from "../helpers/e2e-server";
import { PASSWORD, seedCompany } from "../helpers/fixtures";
import { signInThroughForm } from "../helpers/e2e-session";

const SCREENS = path.resolve(import.meta.dirname, "../../test-results/screens");
const KG_PER_LB = 0.45359237; // NIST SP 811, appendix B.8
let server: E2eServer;
let browser: Browser;
let co: Awaited<ReturnType<typeof seedCompany>>;
let rackId: string;

const SYSTEMS = [
  { name: "Rack A – medium temperature, dairy and deli line", refrigerantId: "R-448A", lb: 820 },
  { name: "Rack B – low temperature, frozen food and ice cream", refrigerantId: "R-448A", lb: 610 },
  { name: "Transcritical booster for the produce and meat cases", refrigerantId: "R-744", lb: 480 },
  { name: "Bakery walk-in condensing unit", refrigerantId: "R-404A", lb: 38 },
  { name: "Café reach-in", refrigerantId: "R-290", lb: 0.3 },
];

beforeAll(async () => {
  mkdirSync(SCREENS, { recursive: true });
  server = await startE2eServer();
  co = await seedCompany(server.ctx, "Brindlecombe Grocers");
  await server.ctx.db.update(companies).set({ massUnit: "lb" }).where(eq(companies.id, co.company.id));
  const rows = await server.ctx.db
    .insert(systems)
    .values(
      SYSTEMS.map((s) => ({
        companyId: co.company.id,
        storeId: co.store.id,
        name: s.name,
        refrigerantId: s.refrigerantId,
        fullChargeKg: s.lb * KG_PER_LB,
        applianceType: "commercial-refrigeration" as const,
      })),
    )
    .returning();
  rackId = rows[0].id;
  const day = (n: number) => new Date(Date.UTC(2026, 0, 10) + n * 86_400_000).toISOString().slice(0, 10);
  await server.ctx.db.insert(chargeAdditions).values(
    [0, 40, 75, 120, 160, 230, 290].map((d, i) => ({
      companyId: co.company.id,
      systemId: rackId,
      addedOn: day(d),
      amountKg: [12, 20, 8, 45, 15, 30, 22][i] * KG_PER_LB,
      enteredValue: [12, 20, 8, 45, 15, 30, 22][i],
      enteredUnit: "lb" as const,
      technicianId: co.people.technician.userId,
      reason: i === 3 ? "Large top-up after the receiver ran low on a hot afternoon" : "Routine top-up",
      recordedById: co.people.technician.userId,
    })),
  );
  await server.ctx.db.insert(leakChecks).values({
    companyId: co.company.id,
    systemId: rackId,
    checkedOn: day(100),
    leakFound: true,
    note: "flare at the TXV",
    byId: co.people.technician.userId,
  });
  await server.ctx.db.insert(outboxMessages).values(
    [
      ["Sweep report: Brindlecombe Grocers – Main Street", "store.manager@example.org", true],
      ["You are invited to Brindlecombe Grocers", "new.tech@example.org", false],
      ["Due today: 2 items at Brindlecombe Grocers", "owner@brindlecombegrocers.test", false],
    ].map(([subject, to, pdf], i) => ({
      companyId: co.company.id,
      from: "Plumeline <no-reply@plumeline.local>",
      to: [to as string],
      subject: subject as string,
      text: `${subject}\n\nA message body long enough to wrap on a phone screen without pushing the page sideways.`,
      attachments: pdf
        ? [{ filename: "sweep-main-street-2026-11-04.pdf", contentType: "application/pdf", size: 48213 }]
        : [],
      rawSize: 1000,
      receivedAt: new Date(Date.now() - i * 3_600_000),
    })),
  );
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await server?.close();
});

/** No sideways scroll: neither the page nor any table region is wider than its box. */
async function sidewaysOverflow(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const wide: string[] = [];
    if (document.documentElement.scrollWidth > window.innerWidth + 1)
      wide.push(`page ${document.documentElement.scrollWidth} > ${window.innerWidth}`);
    for (const r of document.querySelectorAll<HTMLElement>('[role="region"]'))
      if (r.scrollWidth > r.clientWidth + 1)
        wide.push(`${r.getAttribute("aria-label")} ${r.scrollWidth} > ${r.clientWidth}`);
    return wide;
  });
}

it("on a laptop the Systems table can be searched, filtered and sorted, and every action button is fully in view", async () => {
  const context = await newContext(browser, { viewport: { width: 1366, height: 860 } });
  const page = await context.newPage();
  await signInThroughForm(page, server.url, co.people.owner.email, PASSWORD);
  await page.goto(`${server.url}/stores/${co.store.id}`);
  const region = page.locator('div[role="region"][aria-label="Systems"]');
  await region.waitFor();
  expect(await sidewaysOverflow(page)).toEqual([]);
  const box = (await region.boundingBox())!;
  for (const s of SYSTEMS) {
    for (const name of [`Edit ${s.name}`, `Retire ${s.name}…`]) {
      const b = (await page.getByRole("button", { name, exact: true }).boundingBox())!;
      expect(b.x + b.width, name).toBeLessThanOrEqual(Math.min(box.x + box.width, 1366));
      expect(b.x, name).toBeGreaterThanOrEqual(box.x);
    }
  }
  await region.scrollIntoViewIfNeeded();
  await page.screenshot({ path: path.join(SCREENS, "systems-table-1366.png") });

  await page.getByLabel("Search systems").fill("produce");
  await page.getByText("Showing 1 of 5.").waitFor();
  await page.getByLabel("Search systems").fill("");
  await page.getByLabel("Refrigerant (Systems)").selectOption("R-448A");
  await page.getByText("Showing 2 of 5.").waitFor();
  await page.getByLabel("Refrigerant (Systems)").selectOption("");
  await page.getByRole("button", { name: /Full charge/ }).click();
  // The table sorts on the next render, not within the click: read it until it has.
  await expect.poll(() => region.locator("tbody tr").first().locator("td").first().textContent()).toBe("Café reach-in");
  await context.close();
});

it("on a laptop a system's records show the leak rate against the threshold and the charge added as plots", async () => {
  const context = await newContext(browser, { viewport: { width: 1366, height: 860 } });
  const page = await context.newPage();
  await signInThroughForm(page, server.url, co.people.engineer.email, PASSWORD);
  await page.goto(`${server.url}/systems/${rackId}`);
  const rate = page.getByRole("figure", { name: "Leak rate at each addition" });
  await rate.waitFor();
  const charge = page.getByRole("figure", { name: "Charge added over time" });
  // drawn: a line through the figures and a bar per day of charge added (7 additions). The charts
  // draw once their container has been measured, after the figure is on the page: wait for the marks.
  await rate.locator("svg .recharts-line-curve").first().waitFor({ state: "attached" });
  await expect.poll(() => charge.locator("svg .recharts-bar-rectangle").count()).toBe(7);
  // axis labels in the member's units (the company weighs in pounds)
  await expect.poll(() => charge.locator(".recharts-label").allTextContents()).toContain("Refrigerant, lb");
  await page.getByRole("heading", { name: "Over time" }).scrollIntoViewIfNeeded();
  await page.screenshot({ path: path.join(SCREENS, "system-plots-1366.png") });
  await context.close();
});

it("on a phone the tables stack into cards, the Outbox is searchable, and nothing scrolls sideways", async () => {
  const context = await newContext(browser, { viewport: { width: 390, height: 844 }, hasTouch: true, isMobile: true });
  const page = await context.newPage();
  await signInThroughForm(page, server.url, co.people.owner.email, PASSWORD);

  await page.goto(`${server.url}/stores/${co.store.id}`);
  const region = page.locator('div[role="region"][aria-label="Systems"]');
  await region.waitFor();
  expect(await sidewaysOverflow(page)).toEqual([]);
  // each cell is labelled by its column in the card
  const cell = region.locator('td[data-label="Full charge"]').first();
  expect(await cell.evaluate((el) => getComputedStyle(el, "::before").content)).toBe('"Full charge"');
  await page.getByLabel("Sort by (Systems)").selectOption({ label: "Full charge, descending" });
  await expect.poll(() => region.locator("tbody tr").first().locator("td").first().textContent()).toBe(SYSTEMS[0].name);
  await region.scrollIntoViewIfNeeded();
  await page.screenshot({ path: path.join(SCREENS, "systems-table-390.png") });

  await page.goto(`${server.url}/systems/${rackId}`);
  await page.getByRole("figure", { name: "Charge added over time" }).waitFor();
  expect(await sidewaysOverflow(page)).toEqual([]);
  await page.screenshot({ path: path.join(SCREENS, "system-records-390.png"), fullPage: true });

  await page.goto(`${server.url}/outbox`);
  const outbox = page.locator('div[role="region"][aria-label="Messages, newest first"]');
  await outbox.waitFor();
  expect(await sidewaysOverflow(page)).toEqual([]);
  await page.getByLabel("Search messages").fill("store.manager");
  await page.getByText("Showing 1 of 3.").waitFor();
  await page.getByLabel("Search messages").fill("");
  // The count goes while nothing narrows the list, so the next "1 of 3" is the attachment filter's.
  await page.getByText("Showing 1 of 3.").waitFor({ state: "detached" });
  await page.getByLabel("Attachment (Messages, newest first)").selectOption("PDF attached");
  await page.getByText("Showing 1 of 3.").waitFor();
  await page.screenshot({ path: path.join(SCREENS, "outbox-390.png"), fullPage: true });
  await context.close();
});
