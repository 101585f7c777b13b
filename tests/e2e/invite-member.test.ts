import { afterAll, beforeAll, expect, it } from "vitest";
import type { Browser } from "playwright-core";
import { launchBrowser, newContext } from "../helpers/browser";
import { startE2eServer, type E2eServer } from "../helpers/e2e-server";
import { PASSWORD, seedCompany } from "../helpers/fixtures";
import { signInThroughForm } from "../helpers/e2e-session";

let server: E2eServer;
let browser: Browser;
let co: Awaited<ReturnType<typeof seedCompany>>;

beforeAll(async () => {
  server = await startE2eServer();
  co = await seedCompany(server.ctx, "Wrenfield Market");
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await server?.close();
});

it("an owner invites a technician, reads the invitation in the Outbox, and the newcomer accepts it", async () => {
  const ownerContext = await newContext(browser);
  const page = await ownerContext.newPage();
  const failures: string[] = [];
  page.on("pageerror", (e) => failures.push(String(e)));

  await signInThroughForm(page, server.url, co.people.owner.email, PASSWORD);
  await page.getByRole("link", { name: "Team" }).click();
  await page.getByLabel("E-mail").fill("sam.newhire@wrenfield.test");
  await page.getByLabel("Role", { exact: true }).selectOption("technician");
  await page.getByRole("button", { name: "Send invitation" }).click();
  await page.getByText("sam.newhire@wrenfield.test").first().waitFor();

  await page.getByRole("link", { name: "Outbox" }).click();
  await page.getByRole("link", { name: /You are invited to Wrenfield Market/ }).click();
  const link = page.getByRole("link", { name: /\/invite\// });
  const href = await link.getAttribute("href");
  expect(href).toMatch(/^http:\/\/127\.0\.0\.1:\d+\/invite\/[A-Za-z0-9_-]+$/);

  // The newcomer opens the link in a browser of their own.
  const guestContext = await newContext(browser);
  const guest = await guestContext.newPage();
  await guest.goto(href!);
  await guest.getByRole("heading", { name: "Join Wrenfield Market" }).waitFor();
  await guest.getByLabel("Your name").fill("Sam Newhire");
  await guest.getByLabel("New password", { exact: true }).fill("a long enough secret");
  await guest.getByLabel("New password again").fill("a long enough secret");
  await guest.getByRole("button", { name: /join|accept/i }).click();
  await guest.getByRole("button", { name: "Sign out" }).waitFor();
  await guest.getByText("Wrenfield Market").first().waitFor();

  // The owner, reloading the Team page, now sees the new member. The router changes the address
  // only once the route is ready: reloading before then would reload the Outbox message instead.
  await page.getByRole("link", { name: "Team" }).click();
  await page.waitForURL((url) => url.pathname === "/team");
  await page.reload();
  await page.getByRole("cell", { name: "Sam Newhire", exact: true }).waitFor();
  expect(failures).toEqual([]);
  await ownerContext.close();
  await guestContext.close();
});
