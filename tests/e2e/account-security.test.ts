import { afterAll, beforeAll, expect, it } from "vitest";
import { mkdirSync } from "node:fs";
import path from "node:path";
import type { Browser } from "playwright-core";
import { launchBrowser, newContext } from "../helpers/browser";
import { startE2eServer, type E2eServer } from "../helpers/e2e-server";
import { PASSWORD, seedCompany } from "../helpers/fixtures";
import { signInThroughForm } from "../helpers/e2e-session";

// A member signs in on a phone and a laptop, changes the password on the laptop: the phone is signed
// out. The owner then reads it all on the security log.

const SCREENS = path.resolve(import.meta.dirname, "../../test-results/screens");
const NEW_PASSWORD = "a-brand-new-password-2026";
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

it("a new password signs the other device out, and the owner sees it on the security log", async () => {
  const phone = await newContext(browser, { viewport: { width: 390, height: 844 }, hasTouch: true, isMobile: true });
  const laptop = await newContext(browser, { viewport: { width: 1366, height: 860 } });
  const onPhone = await phone.newPage();
  const onLaptop = await laptop.newPage();
  await signInThroughForm(onPhone, server.url, co.people["lead-tech"].email, PASSWORD);
  await signInThroughForm(onLaptop, server.url, co.people["lead-tech"].email, PASSWORD);

  await onLaptop.goto(`${server.url}/profile`);
  const sessions = onLaptop.getByTestId("account-session");
  await sessions.nth(1).waitFor();
  expect(await sessions.count()).toBe(2);
  expect(await sessions.first().textContent()).toContain("this device");

  const form = onLaptop.getByRole("form", { name: "Change your password" });
  await form.getByLabel("Current password").fill(PASSWORD);
  await form.getByLabel("New password", { exact: true }).fill(NEW_PASSWORD);
  await form.getByLabel("New password again").fill(NEW_PASSWORD);
  await form.getByRole("button", { name: "Change password" }).click();
  await onLaptop.getByText("Every other device you were signed in on is signed out").waitFor();
  await onLaptop.getByText("You are signed in on this device only.").waitFor();
  await onLaptop.screenshot({ path: path.join(SCREENS, "laptop-profile-password-sessions.png"), fullPage: true });

  // The phone's next request finds its session gone and asks to sign in again.
  await onPhone.reload();
  await onPhone.waitForURL((url) => url.pathname.startsWith("/sign-in"));

  const owner = await newContext(browser, { viewport: { width: 390, height: 844 }, hasTouch: true, isMobile: true });
  const ownerPage = await owner.newPage();
  await signInThroughForm(ownerPage, server.url, co.people.owner.email, PASSWORD);
  await ownerPage.goto(`${server.url}/team`);
  const log = ownerPage.getByRole("list", { name: "Security log" });
  await log.waitFor();
  const lines = await log.getByTestId("security-event").allTextContents();
  const leadTech = co.people["lead-tech"].email;
  expect(lines.some((l) => l.includes(`${leadTech} changed their password.`))).toBe(true);
  expect(lines.filter((l) => l.includes(`${leadTech} signed in.`)).length).toBeGreaterThanOrEqual(2);
  await log.scrollIntoViewIfNeeded();
  await ownerPage.screenshot({ path: path.join(SCREENS, "phone-team-security-log.png") });
  await Promise.all([phone.close(), laptop.close(), owner.close()]);
});
