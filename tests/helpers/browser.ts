import { chromium, type Browser, type BrowserContext } from "playwright-core";

// Debian's Chromium, never a downloaded build. The background-networking flags keep it from
// calling out to the internet, which this machine's closed network refuses.
export const CHROMIUM_PATH = process.env.CHROMIUM_PATH ?? "/usr/bin/chromium";
const ARGS = [
  "--no-sandbox",
  "--disable-gpu",
  "--disable-quic",
  "--no-first-run",
  "--disable-background-networking",
  "--disable-component-update",
  "--disable-sync",
  "--disable-dev-shm-usage",
];

export async function launchBrowser(): Promise<Browser> {
  return chromium.launch({ executablePath: CHROMIUM_PATH, headless: true, args: ARGS });
}

/**
 * `E2E_CPU_SLOWDOWN=4` runs every page's scripts four times slower (Chromium's CPU throttling), as
 * on a loaded CI machine: a test that leans on how fast the page answers fails here every time
 * instead of once in a few runs. For hunting races by hand; the suite runs at full speed.
 */
const CPU_SLOWDOWN = Number(process.env.E2E_CPU_SLOWDOWN ?? 1);

export async function newContext(
  browser: Browser,
  options: Parameters<Browser["newContext"]>[0] = {},
): Promise<BrowserContext> {
  const context = await browser.newContext({ viewport: { width: 1280, height: 800 }, ...options });
  if (CPU_SLOWDOWN > 1) {
    context.on("page", (page) => {
      void context
        .newCDPSession(page)
        .then((cdp) => cdp.send("Emulation.setCPUThrottlingRate", { rate: CPU_SLOWDOWN }))
        .catch(() => undefined);
    });
  }
  return context;
}
