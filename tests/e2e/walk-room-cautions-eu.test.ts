/**
 * The Walk screen's room cautions for an EU F-gas company, on a phone (390 × 844): entering a machine
 * room with an R-744 rack gives the CO2 exposure limits as published (ACGIH 5,000 ppm TWA, 30,000 ppm
 * STEL, docs/reference/standards.md §5 [S:S2]) and defers to the site's CO2 detector and local codes;
 * an ammonia machine room says it is toxic and collects near the ceiling (§4 [D], §8). Neither names a
 * US rule or code (docs/decisions/0116). Invented stores; screenshots to test-results/screens/.
 */
import path from "node:path";
import { mkdirSync } from "node:fs";
import { expect, it } from "vitest";
import { and, eq, inArray } from "drizzle-orm";
import type { Page } from "playwright-core";
import { companies, fixtures, plans, systems } from "../../server/db/schema/index";
import { seedDemoLayout } from "../../server/db/seed/demo-store-map";
import { newContext } from "../helpers/browser";
import { signInThroughForm } from "../helpers/e2e-session";
import { PASSWORD } from "../helpers/fixtures";
import { planToScreen, waitForSteadyPlan } from "../helpers/walk-e2e";
import { walkSuite } from "../helpers/walk-suite";

const suite = walkSuite("Kestrelmoor Frischmarkt");
const SCREENS = path.resolve(import.meta.dirname, "../../test-results/screens");
mkdirSync(SCREENS, { recursive: true });
const PHONE = { viewport: { width: 390, height: 844 }, hasTouch: true, isMobile: true, deviceScaleFactor: 2 };
const US_WORDS = /\bEPA\b|40 CFR|29 CFR|Section 608|OSHA|\bIMC\b|ASHRAE 15|CSA B52/;
/** Inside the demo plan's machine room (the rectangle 47–59 m × 1–7 m, server/db/seed/demo-layout.ts). */
const MACHINE_ROOM = { x: 52, y: 6 };

async function enterMachineRoom(page: Page, storeName: string) {
  await page.goto(`${suite.server.url}/walk`);
  await page.getByRole("link", { name: storeName, exact: true }).tap();
  await page.getByRole("button", { name: "Start the sweep" }).tap();
  await page.getByTestId("walk-plan").waitFor();
  await waitForSteadyPlan(page);
  const at = await planToScreen(page, MACHINE_ROOM.x, MACHINE_ROOM.y);
  await page.touchscreen.tap(at.x, at.y);
  const dialog = page.getByRole("dialog", { name: "Before you enter Machine room" });
  await dialog.waitFor();
  return dialog;
}

it("an EU technician entering a CO2 machine room, then an ammonia one, reads the cautions of their rules", async () => {
  const { server, co } = suite;
  await server.ctx.db.update(companies).set({ ruleProfile: "eu-fgas" }).where(eq(companies.id, co.company.id));
  // The second store's machine room holds an ammonia chiller only: its racks' valves are unlinked.
  await server.ctx.db.transaction((tx) =>
    seedDemoLayout(server.ctx, tx, {
      companyId: co.company.id,
      storeId: co.otherStore.id,
      createdById: co.people["lead-tech"].userId,
    }),
  );
  const [chiller] = await server.ctx.db
    .insert(systems)
    .values({
      companyId: co.company.id,
      storeId: co.otherStore.id,
      name: "Kaltwassersatz NH3",
      refrigerantId: "R-717",
      fullChargeKg: 95,
      applianceType: "commercial-refrigeration",
    })
    .returning();
  const otherPlans = (
    await server.ctx.db.select({ id: plans.id }).from(plans).where(eq(plans.storeId, co.otherStore.id))
  ).map((p) => p.id);
  await server.ctx.db
    .update(fixtures)
    .set({ systemId: null })
    .where(and(inArray(fixtures.planId, otherPlans), eq(fixtures.kind, "valve")));
  await server.ctx.db
    .update(fixtures)
    .set({ systemId: chiller.id })
    .where(and(inArray(fixtures.planId, otherPlans), eq(fixtures.kind, "machine-room")));

  const context = await newContext(suite.browser, PHONE);
  const page = await context.newPage();
  page.setDefaultTimeout(15_000);
  const failures: string[] = [];
  page.on("pageerror", (e) => failures.push(String(e)));
  await signInThroughForm(page, server.url, co.people.technician.email, PASSWORD);

  // The demo machine room holds Rack B on R-744 (and Rack A on R-448A).
  const co2Room = await enterMachineRoom(page, co.store.name);
  const co2 = await co2Room.innerText();
  expect(co2).toMatch(/5,000 ppm averaged over a work shift and 30,000 ppm over 15 minutes \(ACGIH\)/);
  expect(co2).toMatch(/Trust the site's CO2 detector: leave when it alarms\. Local codes/);
  expect(co2).toMatch(/R-744 runs at very high pressure/);
  expect(co2).toMatch(/EN 378, ISO 5149, national and local codes/);
  expect(co2).not.toMatch(US_WORDS);
  await page.screenshot({ path: path.join(SCREENS, "walk-eu-co2-machine-room-phone.png") });
  await page.getByRole("button", { name: "I have checked the room's alarm — continue" }).tap();
  await co2Room.waitFor({ state: "hidden" });

  // Ammonia: toxic, and a leak collects near the ceiling, not from the floor up.
  const nh3Room = await enterMachineRoom(page, co.otherStore.name);
  const nh3 = await nh3Room.innerText();
  expect(nh3).toMatch(/Ammonia \(R-717\) is toxic/);
  expect(nh3).toMatch(/R-717 collects near the ceiling/);
  expect(nh3).not.toMatch(/R-744|floor up/);
  expect(nh3).not.toMatch(US_WORDS);
  await page.screenshot({ path: path.join(SCREENS, "walk-eu-ammonia-machine-room-phone.png") });
  expect(failures).toEqual([]);
  await context.close();
});
