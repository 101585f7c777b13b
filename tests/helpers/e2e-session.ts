import type { Page } from "playwright-core";

/** Signs in through the real form, as a person would, and waits for the signed-in header. */
export async function signInThroughForm(page: Page, baseUrl: string, email: string, password: string) {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
  // On a phone the account controls fold into the menu, so wait for what every size shows.
  await page.waitForURL((url) => !url.pathname.startsWith("/sign-in"));
  await page.locator("header #app-menu").waitFor({ state: "attached" });
}
