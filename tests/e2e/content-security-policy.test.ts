import { afterAll, beforeAll, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { launchBrowser, newContext } from "../helpers/browser";
import { startE2eServer, type E2eServer } from "../helpers/e2e-server";
import { PASSWORD, seedCompany } from "../helpers/fixtures";
import { signInThroughForm } from "../helpers/e2e-session";
import { mapStoreForWalk } from "../helpers/walk-e2e";

// The built client under its Content-Security-Policy (CSP Level 3, W3C): every screen visited here
// must run without one `securitypolicyviolation` event, while an inline script (the control) is blocked.

let server: E2eServer;
let browser: Browser;
let co: Awaited<ReturnType<typeof seedCompany>>;

beforeAll(async () => {
  server = await startE2eServer();
  co = await seedCompany(server.ctx, "Fernhollow Grocers");
  await mapStoreForWalk(server.ctx, {
    companyId: co.company.id,
    storeId: co.store.id,
    createdById: co.people["lead-tech"].userId,
  });
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await server?.close();
});

type Violation = { directive: string; blocked: string; source: string };

async function watch(page: Page) {
  const consoleReports: string[] = [];
  page.on("console", (m) => {
    if (/Content Security Policy/i.test(m.text())) consoleReports.push(m.text());
  });
  await page.addInitScript(() => {
    const w = window as unknown as { __csp: Violation[] };
    w.__csp = [];
    document.addEventListener("securitypolicyviolation", (e) =>
      w.__csp.push({ directive: e.effectiveDirective, blocked: e.blockedURI, source: e.sourceFile }),
    );
  });
  return {
    consoleReports,
    violations: () => page.evaluate(() => (window as unknown as { __csp: Violation[] }).__csp),
  };
}

it("runs the client's screens without a CSP violation, and blocks an inline script", async () => {
  const context = await newContext(browser, { viewport: { width: 1024, height: 768 } });
  const page = await context.newPage();
  const csp = await watch(page);
  const first = await page.goto(`${server.url}/sign-in`);
  expect(first?.headers()["content-security-policy"]).toContain("script-src 'self'");
  await signInThroughForm(page, server.url, co.people["lead-tech"].email, PASSWORD);
  const seen: Violation[] = [];
  const plans = await (await page.request.get(`${server.url}/api/stores/${co.store.id}/plans`)).json();
  const planId = plans.plans[0].id;
  for (const [path, ready] of [
    ["/stores", "heading"],
    ["/today", "heading"],
    [`/stores/${co.store.id}`, "heading"],
    [`/stores/${co.store.id}/plans/${planId}/layout`, "canvas"],
    [`/stores/${co.store.id}/walk`, "heading"],
    ["/detectors", "heading"],
    ["/team", "heading"],
    ["/profile", "heading"],
  ] as const) {
    await page.goto(`${server.url}${path}`);
    await (ready === "canvas" ? page.locator("canvas").first() : page.getByRole("heading").first()).waitFor();
    await page.waitForLoadState("networkidle");
    seen.push(...(await csp.violations()).map((v) => ({ ...v, source: `${path}: ${v.source}` })));
  }
  // The Walk screen of a sweep starts its live-guide Web Worker from our origin (worker-src 'self').
  await page.goto(`${server.url}/stores/${co.store.id}/walk`);
  const worker = page.waitForEvent("worker");
  await page.getByRole("button", { name: "Start the sweep" }).click();
  await page.getByTestId("walk-plan").waitFor();
  expect(new URL((await worker).url()).origin).toBe(server.url);
  await page.waitForLoadState("networkidle");
  seen.push(...(await csp.violations()).map((v) => ({ ...v, source: `walk: ${v.source}` })));
  expect(seen).toEqual([]);
  expect(csp.consoleReports).toEqual([]);

  // The control: the listener does see a violation when one happens.
  await page.evaluate(() => {
    const s = document.createElement("script");
    s.textContent = "window.__inlineRan = true";
    document.body.append(s);
  });
  await page.waitForFunction(() => (window as unknown as { __csp: unknown[] }).__csp.length > 0);
  expect(await page.evaluate(() => (window as unknown as { __inlineRan?: boolean }).__inlineRan)).toBeUndefined();
  expect((await csp.violations())[0].directive).toBe("script-src-elem");
  await context.close();
});
