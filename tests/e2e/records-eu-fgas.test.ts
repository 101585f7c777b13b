/**
 * An engineer under EU F-gas (Regulation (EU) 2024/573), in a decimal-comma kg company, at laptop
 * size (1366 × 860): leak-check intervals by CO2-equivalent band, a leak found at a check, the
 * finding confirmed, charge added and one entry voided, the repair and the re-check within a month,
 * the statement PDF; then a system with records is retired and the owner's whole-record archive
 * still holds all of it. Nothing US appears on any screen or page (docs/decisions/0116). The systems
 * and their earlier history are entered through the API as a user would, so each has its first
 * revision, shown on the records page and the statement. Invented stores; screenshots to
 * test-results/screens/, PDF pages to test-results/pdf/.
 */
import path from "node:path";
import { mkdirSync } from "node:fs";
import { afterAll, beforeAll, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { eq } from "drizzle-orm";
import { unzip } from "../helpers/unzip";
import { companies, stores } from "../../server/db/schema/index";
import { signIn } from "../helpers/test-app";
import { launchBrowser, newContext } from "../helpers/browser";
import { startE2eServer, type E2eServer } from "../helpers/e2e-server";
import { PASSWORD, seedCompany } from "../helpers/fixtures";
import { signInThroughForm } from "../helpers/e2e-session";
import { pdfText } from "../helpers/pdf-text";
import { renderPdfPages } from "../helpers/pdf-pages";
import { formatCalendarDay } from "#core/domain/dates/format-in-zone";
import { addMonths } from "#core/domain/dates/calendar-date";

const SCREENS = path.resolve(import.meta.dirname, "../../test-results/screens");
mkdirSync(SCREENS, { recursive: true });
const LAPTOP = { viewport: { width: 1366, height: 860 } };
const PHONE = { viewport: { width: 390, height: 844 }, hasTouch: true, isMobile: true, deviceScaleFactor: 2 };
/** What an EU company never reads: US rules, their reports and their wording. */
const US_WORDS = /\bEPA\b|40 CFR|29 CFR|Part 8[24]|chronic|Section 608|OSHA|\bIMC\b|ASHRAE 15|every – months/i;
/**
 * The text with the one US name an EU reader may meet: the document the ACGIH CO2 limits were read
 * in, cited beside them (docs/reference/standards.md §5 [S:S2]; docs/decisions/0116).
 */
const withoutAcgihSource = (text: string) => text.replaceAll("OSHA PEL preamble (1989)", "");

let server: E2eServer;
let browser: Browser;
let co: Awaited<ReturnType<typeof seedCompany>>;
const ids = {} as Record<"nk" | "tk" | "co2" | "truhe", string>;

const localDay = (daysAgo: number) => {
  const today = new Intl.DateTimeFormat("en-CA", {
    timeZone: "Europe/Berlin",
    year: "numeric",
    month: "2-digit",
    day: "2-digit",
  }).format(new Date());
  return new Date(Date.parse(`${today}T00:00:00Z`) - daysAgo * 86_400_000).toISOString().slice(0, 10);
};

beforeAll(async () => {
  server = await startE2eServer();
  co = await seedCompany(server.ctx, "Marlbeck Kältedienst");
  const db = server.ctx.db;
  await db
    .update(companies)
    .set({ ruleProfile: "eu-fgas", numberFormat: "1.234,5", massUnit: "kg", lengthUnit: "m" })
    .where(eq(companies.id, co.company.id));
  await db
    .update(stores)
    .set({ name: "Frischmarkt Lindenhof", timeZone: "Europe/Berlin" })
    .where(eq(stores.id, co.store.id));
  // The systems and their history go in through the API, as a lead tech and a technician would enter
  // them: each system gets its first revision, which the records and the statement show.
  const owner = await signIn(server.app, co.people.owner);
  const tech = await signIn(server.app, co.people.technician);
  const add = async (name: string, refrigerantId: string, kg: number, lds: boolean, since: number) => {
    const res = await owner.post(`/api/stores/${co.store.id}/systems`, {
      name,
      refrigerantId,
      fullCharge: { value: kg, unit: "kg" },
      applianceType: "commercial-refrigeration",
      automaticLeakDetection: lds,
      inServiceOn: localDay(since),
    });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    return res.body.id as string;
  };
  ids.nk = await add("Verbund NK – Molkerei", "R-404A", 45.5, false, 400);
  ids.tk = await add("Verbund TK – Tiefkühlinseln", "R-449A", 1250, true, 100);
  ids.co2 = await add("CO2-Booster transkritisch", "R-744", 310, true, 200);
  ids.truhe = await add("Eistruhe Kasse 2 – Kühltruhe", "R-404A", 2.1, false, 500);
  for (const [id, daysAgo] of [
    [ids.nk, 190],
    [ids.truhe, 200],
  ] as const) {
    const res = await tech.post(`/api/systems/${id}/leak-checks`, { checkedOn: localDay(daysAgo), leakFound: false });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
  }
  const charge = await tech.post(`/api/systems/${ids.truhe}/charge-additions`, {
    addedOn: localDay(100),
    amount: { value: 0.35, unit: "kg" },
    reason: "Nachfüllung nach Scheuerstelle am Kapillarrohr",
  });
  expect(charge.status, JSON.stringify(charge.body)).toBe(201);
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await server?.close();
});

async function noUsWords(page: Page, where: string) {
  expect(withoutAcgihSource(await page.locator("main").innerText()), where).not.toMatch(US_WORDS);
}

async function openRecords(page: Page, id: string, name: string) {
  await page.goto(`${server.url}/systems/${id}`);
  await page.getByRole("heading", { name, exact: true }).waitFor();
}

it("an EU engineer follows a leak from the check through repair and re-check, in EU words and 1.234,5 numbers", async () => {
  const context = await newContext(browser, LAPTOP);
  const page = await context.newPage();
  page.setDefaultTimeout(15_000);
  const failures: string[] = [];
  page.on("pageerror", (e) => failures.push(String(e)));
  await signInThroughForm(page, server.url, co.people.engineer.email, PASSWORD);

  // The bands, each from Regulation (EU) 2024/573 / 517/2014 Art. 4 (docs/reference/standards.md §2 [S:E1]).
  // 1,250 kg R-449A × 1397 (AR4 with the 517/2014 HFO values, §3 [D]) = 1,746 t: ≥ 500 t, 6 months with a
  // leak detection system, which is required there [S:E2,E5].
  await openRecords(page, ids.tk, "Verbund TK – Tiefkühlinseln");
  await page
    .getByText(
      "1.746 t CO2e is in the ≥ 500 t CO2e band: every 6 months with leak detection; a leak detection system is required",
    )
    .first()
    .waitFor();
  // There the leak detection system itself is checked at least every 12 months (2024/573 Art. 5 [S:E2,E5]):
  // owed from the in-service day until a check is recorded, then 12 months from a check that found it working.
  await page.getByText(/Check of the leak detection system \(at least every 12 months; in service since/).waitFor();
  const lds = page.getByRole("form", { name: "Record a check of the leak detection system" });
  await lds.getByLabel("Detection system checked on").fill(localDay(2));
  await lds.getByLabel("What was checked").fill("Sensoren mit Prüfgas getestet, Alarm und Relais ausgelöst");
  await lds.getByRole("button", { name: "Record the detection system check" }).click();
  await page.getByText(/working — engineer of Marlbeck Kältedienst \(Sensoren mit Prüfgas/).waitFor();
  await page.getByText(/Check of the leak detection system \(at least every 12 months; last found working/).waitFor();
  await page.getByText(`${formatCalendarDay(addMonths(localDay(2), 12))} · Upcoming`).waitFor();
  await noUsWords(page, "R-449A records");
  await page.screenshot({ path: path.join(SCREENS, "records-eu-lds-check.png"), fullPage: true });
  // R-744 is no fluorinated gas: no periodic check (2024/573 Annex I lists F-gases only, §2).
  await openRecords(page, ids.co2, "CO2-Booster transkritisch");
  await page.getByText("R-744 is not a fluorinated gas covered by leak-check rules").waitFor();
  await page.getByText("None scheduled", { exact: true }).waitFor();
  await noUsWords(page, "R-744 records");
  await page.screenshot({ path: path.join(SCREENS, "records-eu-r744.png"), fullPage: true });
  // 45.5 kg R-404A × 3922 = 178.451 t (Art. 3 [S:E7]; GWP [S:E1]): 50–500 t, every 6 months without a system.
  await openRecords(page, ids.nk, "Verbund NK – Molkerei");
  await page
    .getByText("178,5 t CO2e is in the 50 to < 500 t CO2e band: every 6 months without leak detection")
    .first()
    .waitFor();
  await page.getByText("Next leak check", { exact: true }).waitFor();
  // Entered through the API, the system has its first revision: the history shows it (docs/decisions/0043).
  await page
    .getByRole("table", { name: "System history" })
    .getByRole("row")
    .filter({ hasText: "First values" })
    .filter({ hasText: formatCalendarDay(localDay(400)) })
    .first()
    .waitFor();
  await noUsWords(page, "R-404A records before the leak");

  // A leak found at a check three days ago, then recorded as a finding and confirmed today.
  const check = page.getByRole("form", { name: "Record a leak check" });
  await check.getByLabel("Checked on").fill(localDay(3));
  await check.getByLabel("Note").fill("Leck am Lötstoß, Verdampfer Molkereiregal 3");
  await check.getByLabel(/A leak was found/).check();
  await check.getByRole("button", { name: "Record the leak check" }).click();
  await page.getByText(/leak found — engineer of Marlbeck Kältedienst \(Leck am Lötstoß/).waitFor();
  await page.getByLabel("What was found").fill("Ölspur und 12 ppm am Lötstoß, Molkereiregal 3");
  await page.getByRole("button", { name: "Record a suspected leak" }).click();
  await page.waitForURL(/\/findings\//);
  await page.getByRole("button", { name: "Confirm the leak", exact: true }).click();
  await page.getByLabel("Component").selectOption("brazed-joint");
  await page.getByRole("button", { name: "Save: confirm the leak" }).click();
  await page.getByTestId("finding-status").filter({ hasText: "confirmed" }).waitFor();
  const findingUrl = page.url();

  // Charge added in the company's format: "8,5" is eight and a half kg; a duplicate entry is voided.
  await openRecords(page, ids.nk, "Verbund NK – Molkerei");
  const charge = page.getByRole("form", { name: "Record charge added" });
  const addCharge = async (amount: string, reason: string) => {
    await charge.getByLabel("Amount added").fill(amount);
    await charge.getByLabel("Reason").fill(reason);
    await charge.getByLabel("Linked finding").selectOption({ index: 1 });
    await charge.getByRole("button", { name: "Record charge added" }).click();
    await page.getByRole("cell", { name: reason }).first().waitFor();
  };
  await addCharge("8,5", "Nachfüllung nach Leckfund");
  await addCharge("8,5", "Doppelt erfasst");
  await page.getByText("entered 8,5 kg").first().waitFor(); // as typed, in the company's marks
  const duplicate = page.getByRole("row").filter({ hasText: "Doppelt erfasst" });
  await duplicate.getByRole("button", { name: "Void" }).click();
  await page.getByLabel("Why void this entry").fill("Dieselbe Nachfüllung zweimal erfasst");
  await page.getByRole("button", { name: "Void the entry" }).click();
  await page
    .getByText(
      `Voided ${formatCalendarDay(localDay(0))} by engineer of Marlbeck Kältedienst: Dieselbe Nachfüllung zweimal erfasst`,
    )
    .waitFor();
  // No leak rate under EU F-gas: the additions are listed, not turned into a rate (§2).
  await page.getByText("Not calculated under this profile").waitFor();
  expect(await page.locator("main").innerText()).not.toContain("No refrigerant has been added");

  // The repair today: the re-check falls due within one month of it (2024/573 [S:E6]).
  await page.goto(findingUrl);
  await page.getByRole("button", { name: "Record the repair", exact: true }).click();
  await page.getByLabel("Note").fill("Lötstoß neu hartgelötet, Druckprobe mit Stickstoff");
  await page.getByRole("button", { name: "Save: record the repair" }).click();
  await page.getByTestId("finding-status").filter({ hasText: "repaired" }).waitFor();
  await page.getByText(`Leak check after the repair: ${formatCalendarDay(addMonths(localDay(0), 1))}`).waitFor();
  await page.getByText(/certificate under Regulation \(EU\) 2024\/573/).waitFor();
  await page.getByText(/EN 378, ISO 5149, national and local codes/).waitFor();
  await noUsWords(page, "finding");
  await page.screenshot({ path: path.join(SCREENS, "records-eu-finding-repaired.png"), fullPage: true });

  // The re-check: a leak check with no leak on the repair day or after closes the item.
  await openRecords(page, ids.nk, "Verbund NK – Molkerei");
  await page.getByRole("link", { name: "Leak check after the repair" }).waitFor();
  await check.getByLabel("Checked on").fill(localDay(0));
  await check.getByLabel("Note").fill("Nachkontrolle nach der Reparatur, dicht");
  await check.getByRole("button", { name: "Record the leak check" }).click();
  await page.getByText(/no leak found — engineer of Marlbeck Kältedienst \(Nachkontrolle/).waitFor();
  await page.getByRole("link", { name: "Leak check after the repair" }).waitFor({ state: "detached" });
  // The next periodic check runs 6 months from the last one (standards.md §2 [S:E1]).
  await page.getByText(`${formatCalendarDay(addMonths(localDay(0), 6))} · Upcoming`).waitFor();
  await noUsWords(page, "R-404A records after the re-check");
  await page.screenshot({ path: path.join(SCREENS, "records-eu-after-recheck.png"), fullPage: true });

  // The statement PDF says the same, in the same words and numbers.
  const pdf = await page.request.get(`${server.url}/api/systems/${ids.nk}/leak-rate-statement.pdf`);
  expect(pdf.status()).toBe(200);
  const bytes = await pdf.body();
  const text = (await pdfText(bytes)).join("\n");
  expect(text).toContain("CO2-equivalent of the charge: 178,5 t");
  expect(text).toContain(`Next leak check due ${formatCalendarDay(addMonths(localDay(0), 6))}`);
  expect(text).toContain("Brazed joint – repaired");
  // The system's history: the first values and the day it entered service (docs/decisions/0126).
  const history = text.slice(text.indexOf("System history"), text.indexOf("Rule profile")).replace(/\s+/g, " ");
  expect(history).toContain("first values");
  expect(history).toContain(`in service since ${formatCalendarDay(localDay(400))}`);
  expect(history).toMatch(/45,5\d* kg/);
  expect(text).not.toContain("No refrigerant has been added");
  expect(text).not.toMatch(US_WORDS);
  renderPdfPages(bytes, "records-eu-statement");

  // The clean re-check verifies the repair under EU rules: the engineer closes the finding, with no US
  // verification test offered on the way (2024/573 [S:E6]).
  await page.goto(findingUrl);
  await page.getByRole("button", { name: "Close the finding", exact: true }).click();
  await page.getByRole("button", { name: "Save: close the finding" }).click();
  await page.getByTestId("finding-status").filter({ hasText: "closed" }).waitFor();
  expect(await page.getByRole("button", { name: /verification test/ }).count()).toBe(0);
  await noUsWords(page, "closed finding");

  // Today: leak checks, no rates or thresholds.
  await page.getByRole("link", { name: "Today", exact: true }).click();
  await page.getByRole("table", { name: "Systems and their next leak check" }).waitFor();
  expect(await page.getByRole("heading", { name: "Systems over threshold" }).count()).toBe(0);
  await noUsWords(page, "Today");
  await page.screenshot({ path: path.join(SCREENS, "records-eu-today.png"), fullPage: true });

  // Once at phone size: the same records read the same.
  const phone = await newContext(browser, PHONE);
  const small = await phone.newPage();
  small.on("pageerror", (e) => failures.push(String(e)));
  await signInThroughForm(small, server.url, co.people.engineer.email, PASSWORD);
  await openRecords(small, ids.nk, "Verbund NK – Molkerei");
  await small.getByText("Next leak check", { exact: true }).waitFor();
  await small.screenshot({ path: path.join(SCREENS, "records-eu-phone.png"), fullPage: true });
  expect(failures).toEqual([]);
  await phone.close();
  await context.close();
});

it("a retired system keeps every record: its page, the store's list of retired systems and the owner's archive", async () => {
  const context = await newContext(browser, LAPTOP);
  const page = await context.newPage();
  page.setDefaultTimeout(15_000);
  const failures: string[] = [];
  page.on("pageerror", (e) => failures.push(String(e)));
  await signInThroughForm(page, server.url, co.people.owner.email, PASSWORD);
  const name = "Eistruhe Kasse 2 – Kühltruhe";

  // A small hermetic unit, as a new owner adds it: 1,9 kg R-404A × 3922 / 1000 = 7,45 t CO2e, factory-sealed
  // and labelled, so below 10 t it owes no periodic leak check (docs/reference/standards.md §2 [S:E1]).
  const sealed = "Getränkekühler Eingang (steckerfertig)";
  await page.goto(`${server.url}/stores/${co.store.id}`);
  await page.getByRole("button", { name: "Add system" }).click();
  await page.getByLabel("System name", { exact: true }).fill(sealed);
  await page.getByLabel("Refrigerant", { exact: true }).selectOption("R-404A");
  await page.getByLabel("Full charge", { exact: true }).fill("1,9");
  await page.getByLabel("Hermetically sealed (factory-sealed, labelled as such)").check();
  await page.getByText("carries a label saying it is hermetically sealed").screenshot({
    path: path.join(SCREENS, "records-eu-hermetic-field.png"),
  });
  await page.getByRole("button", { name: "Add system" }).click(); // the form's own button
  await page.getByRole("cell", { name: sealed, exact: true }).waitFor();
  const listed = (await (await page.request.get(`${server.url}/api/stores/${co.store.id}/systems`)).json()) as {
    systems: { id: string; name: string }[];
  };
  await openRecords(page, listed.systems.find((x) => x.name === sealed)!.id, sealed);
  await page.getByText("Yes: factory-sealed, labelled as such").waitFor();
  await page.getByText("hermetically sealed and below 10 t CO2e.").waitFor();
  await page.getByText("None scheduled", { exact: true }).waitFor();
  await noUsWords(page, "hermetic unit");
  await page.screenshot({ path: path.join(SCREENS, "records-eu-hermetic-unit.png"), fullPage: true });

  // On a phone, a system with records is retired, never deleted (docs/decisions/0040, 0124): the dialog
  // asks the day it left service and why, and names a day before its last record as the mistake it is.
  const phone = await newContext(browser, PHONE);
  const small = await phone.newPage();
  small.setDefaultTimeout(15_000);
  small.on("pageerror", (e) => failures.push(String(e)));
  await signInThroughForm(small, server.url, co.people.owner.email, PASSWORD);
  await small.goto(`${server.url}/stores/${co.store.id}`);
  expect(await small.getByRole("button", { name: `Delete ${name}` }).count()).toBe(0);
  await small.getByRole("button", { name: `Retire ${name}…` }).click();
  const dialog = small.getByRole("dialog", { name: `Retire ${name}` });
  await dialog.getByLabel("Retired on").fill(localDay(101));
  await dialog.getByLabel("Reason").selectOption("replaced");
  await dialog.getByLabel("Note (optional)").fill("durch Truhe mit R-290");
  await dialog.getByRole("button", { name: `Retire ${name}` }).click();
  await dialog
    .getByText(`must not be before ${formatCalendarDay(localDay(100))}, when refrigerant was added`)
    .first()
    .waitFor();
  await small.screenshot({ path: path.join(SCREENS, "records-eu-retire-dialog-phone.png") });
  await dialog.getByLabel("Retired on").fill(localDay(1));
  await dialog.getByRole("button", { name: `Retire ${name}` }).click();
  await dialog.waitFor({ state: "hidden" });
  await phone.close();
  await page.goto(`${server.url}/stores/${co.store.id}`);
  await page.getByRole("heading", { name: "Retired systems" }).waitFor();
  await page.getByRole("heading", { name: "Retired systems" }).scrollIntoViewIfNeeded();
  await page.screenshot({ path: path.join(SCREENS, "records-eu-retired-list.png") });
  await page.getByRole("link", { name, exact: true }).click();
  await page.getByRole("heading", { name, exact: true }).waitFor();
  // Records kept at least 5 years after the day it left service (2024/573 Art. 7 [S:E8b]); no next check owed.
  await page
    .getByText(`left service on ${formatCalendarDay(localDay(1))} (Replaced by another system: durch Truhe mit R-290)`)
    .waitFor();
  const kept = `${Number(localDay(1).slice(0, 4)) + 5}${localDay(1).slice(4)}`;
  await page.getByText(`kept at least until ${formatCalendarDay(kept)}`).waitFor();
  await page.getByText("None scheduled", { exact: true }).waitFor();
  await page.getByText("Nachfüllung nach Scheuerstelle am Kapillarrohr").waitFor();
  // No new entry on a retired system (decision 0040): the forms for them are gone, corrections stay.
  expect(await page.getByRole("form", { name: "Record charge added" }).count()).toBe(0);
  expect(await page.getByRole("form", { name: "Record a leak check" }).count()).toBe(0);
  await page.getByRole("button", { name: "Correct" }).first().waitFor();
  await noUsWords(page, "retired system");
  await page.screenshot({ path: path.join(SCREENS, "records-eu-retired-system.png"), fullPage: true });

  // The owner's archive: every table and statement, the retired system's among them.
  const zip = await page.request.get(`${server.url}/api/company/records-archive.zip`);
  expect(zip.status()).toBe(200);
  const files = await unzip(await zip.body());
  const csv = (n: string) => files.get(`tables/${n}`)!.toString("utf8");
  expect(csv("systems.csv")).toMatch(new RegExp(`${ids.truhe},.*${name}.*,\\d{4}-\\d\\d-\\d\\dT`));
  expect(csv("leak-checks.csv")).toContain(ids.truhe);
  expect(csv("charge-added.csv")).toMatch(/Nachfüllung nach Scheuerstelle am Kapillarrohr/);
  expect(csv("compliance-audit.csv")).toContain("retired");
  // No chronic-leaker report exists under EU F-gas rules, so the archive holds no such table.
  expect([...files.keys()]).not.toContain("tables/chronic-leaker-filings.csv");
  // File names keep the letters of "Kühltruhe" without their accents.
  const statement = `statements/eistruhe-kasse-2-kuhltruhe-${ids.truhe.slice(0, 8)}.pdf`;
  expect([...files.keys()]).toContain(statement);
  const retiredText = (await pdfText(files.get(statement)!)).join("\n");
  expect(retiredText.replace(/\s+/g, " ")).toContain(
    `Retired on ${formatCalendarDay(localDay(1))} (Replaced by another system: durch Truhe mit R-290)`,
  );
  expect(csv("systems.csv")).toMatch(new RegExp(`${ids.truhe},.*,${localDay(1)},replaced,durch Truhe mit R-290,`));
  // Its audit trail reads on the store's clock (Europe/Berlin: CET or CEST), never as a UTC instant (decision 0125).
  const trail = retiredText.slice(retiredText.indexOf("Audit trail"), retiredText.indexOf("Record keeping"));
  expect(trail.replace(/\s+/g, " ")).toMatch(/\d{1,2} [A-Z][a-z]{2} \d{4}, \d\d:\d\d CES?T/);
  expect(trail).not.toMatch(/UTC|\d{4}-\d\d-\d\d/);
  expect(csv("compliance-audit.csv").split("\r\n")[0]).toContain("at_utc");
  for (const [file, body] of files)
    if (file.endsWith(".pdf")) expect((await pdfText(body)).join("\n"), file).not.toMatch(US_WORDS);
  renderPdfPages(files.get(statement)!, "records-eu-retired-statement");
  expect(failures).toEqual([]);
  await context.close();
});
