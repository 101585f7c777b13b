/**
 * A rack is retired with a leak still open on it, at desktop size (1440 × 900): the retire dialog names
 * the open finding; afterwards the finding screen says the system left service, refuses a repair dated
 * after that day at the date field, and an engineer closes it with "Close: the system left service"
 * (docs/decisions/0166). The records page then shows it closed that way, and Today no longer lists it.
 * Invented store; screenshots to test-results/screens/ for a person to look at.
 */
import path from "node:path";
import { mkdirSync } from "node:fs";
import { afterAll, beforeAll, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { signIn } from "../helpers/test-app";
import { launchBrowser, newContext } from "../helpers/browser";
import { startE2eServer, type E2eServer } from "../helpers/e2e-server";
import { PASSWORD, seedCompany } from "../helpers/fixtures";
import { signInThroughForm } from "../helpers/e2e-session";
import { formatCalendarDay } from "#core/domain/dates/format-in-zone";
import { localDateOf } from "#core/domain/dates/time-zone";

const SCREENS = path.resolve(import.meta.dirname, "../../test-results/screens");
const DESKTOP = { viewport: { width: 1440, height: 900 } };
const RACK = "Rack M (medium temp)";

let server: E2eServer;
let browser: Browser;
let co: Awaited<ReturnType<typeof seedCompany>>;
let systemId: string;
let findingId: string;

beforeAll(async () => {
  mkdirSync(SCREENS, { recursive: true });
  server = await startE2eServer();
  co = await seedCompany(server.ctx, "Thornbury Market");
  const lead = await signIn(server.app, co.people["lead-tech"]);
  const sys = await lead.post(`/api/stores/${co.store.id}/systems`, {
    name: RACK,
    refrigerantId: "R-448A",
    fullCharge: { value: 300, unit: "lb" },
    applianceType: "commercial-refrigeration",
    automaticLeakDetection: false,
    inServiceOn: "2026-01-01",
  });
  expect(sys.status, JSON.stringify(sys.body)).toBe(201);
  systemId = sys.body.id;
  const tech = await signIn(server.app, co.people.technician);
  const f = await tech.post(`/api/stores/${co.store.id}/findings`, {
    systemId,
    status: "confirmed",
    component: "brazed-joint",
    note: "Oil stain and bubbles at the suction header braze",
    foundAt: "2026-03-03T15:00:00Z",
  });
  expect(f.status, JSON.stringify(f.body)).toBe(201);
  findingId = f.body.id;
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await server?.close();
});

const shot = (page: Page, name: string) => page.screenshot({ path: path.join(SCREENS, `${name}.png`), fullPage: true });

it("retires a rack with a leak open on it, then closes the finding because the rack left service", async () => {
  const failures: string[] = [];
  // The lead tech retires the rack; the dialog names the finding that will need closing.
  const leadContext = await newContext(browser, DESKTOP);
  const lead = await leadContext.newPage();
  lead.setDefaultTimeout(15_000);
  lead.on("pageerror", (e) => failures.push(String(e)));
  await signInThroughForm(lead, server.url, co.people["lead-tech"].email, PASSWORD);
  await lead.goto(`${server.url}/stores/${co.store.id}`);
  const row = lead.getByRole("row").filter({ hasText: RACK });
  await row.getByRole("button", { name: `Retire ${RACK}…` }).click();
  const dialog = lead.getByRole("dialog", { name: `Retire ${RACK}` });
  await dialog.getByText("One finding is still open").waitFor();
  expect(await dialog.getByRole("list", { name: "Open findings" }).innerText()).toBe(
    "3 Mar 2026 · Brazed joint · confirmed",
  );
  await dialog.getByLabel("Retired on").fill("2026-04-30");
  await dialog.getByLabel("Reason").selectOption("removed");
  await shot(lead, "finding-left-service-retire-dialog-1440");
  await dialog.getByRole("button", { name: `Retire ${RACK}` }).click();
  await dialog.waitFor({ state: "hidden" });

  // The engineer opens the finding: it says the rack left service and offers the closing first.
  const engContext = await newContext(browser, DESKTOP);
  const page = await engContext.newPage();
  page.setDefaultTimeout(15_000);
  page.on("pageerror", (e) => failures.push(String(e)));
  await signInThroughForm(page, server.url, co.people.engineer.email, PASSWORD);
  // Before it is closed, the store page's records say it waits to be closed.
  await page.goto(`${server.url}/stores/${co.store.id}`);
  await page.getByText("confirmed; the system left service on 30 Apr 2026: to be closed").waitFor();
  await page.goto(`${server.url}/findings/${findingId}`);
  await page.getByText(`${RACK} left service on 30 Apr 2026`).waitFor();
  await page
    .getByTestId("finding-status")
    .getByText("confirmed; the system left service on 30 Apr 2026: to be closed")
    .waitFor();
  const form = page.getByRole("form", { name: "Next step" });
  const close = form.getByRole("button", { name: "Close: the system left service", exact: true });
  expect(await close.getAttribute("aria-pressed")).toBe("true");

  // A repair dated after the retirement day is refused at the date field, naming the day.
  await form.getByRole("button", { name: "Record the repair" }).click();
  await form.getByLabel("Date").fill("2026-05-04");
  await form.getByRole("button", { name: "Save: record the repair" }).click();
  await form
    .getByText(/must not be after 30 Apr 2026, the day Rack M \(medium temp\) left service/)
    .first()
    .waitFor();
  await shot(page, "finding-left-service-refused-1440");

  await close.click();
  await form.getByLabel("Note").fill("Rack removed in the store refit; circuit recovered");
  await form.getByRole("button", { name: "Save: close: the system left service" }).click();
  await page.getByTestId("finding-status").getByText("closed: the system left service on 30 Apr 2026").waitFor();
  // The closing is dated the day it is done, on the store's calendar, whatever day the refused repair named.
  const storeToday = formatCalendarDay(localDateOf(new Date(), co.store.timeZone));
  const closing = page.getByRole("listitem").filter({ hasText: "Closed: the system left service" });
  expect(await closing.innerText()).toMatch(
    new RegExp(`^${storeToday} · Closed: the system left service · signed engineer of Thornbury Market`),
  );
  expect(await page.getByRole("form", { name: "Next step" }).count()).toBe(0);
  await shot(page, "finding-left-service-closed-1440");

  // The records page lists it closed that way; Today lists no open finding.
  await page.goto(`${server.url}/systems/${systemId}`);
  await page
    .getByRole("link", { name: /3 Mar 2026 · Brazed joint · closed: the system left service on 30 Apr 2026/ })
    .waitFor();
  await page.goto(`${server.url}/today`);
  await page.getByRole("heading", { name: "Open findings" }).waitFor();
  await page.getByText("No open findings.").waitFor();
  expect(failures).toEqual([]);
});
