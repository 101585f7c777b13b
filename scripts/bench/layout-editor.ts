/**
 * Layout benchmark, editor half: frame times in Chromium while a fixture is dragged on a plan
 * of 400 fixtures. Called by layout.ts (npm run bench:layout) with a running app that serves
 * the built client (dist/client; `npx vite build` first).
 *
 * How: playwright-core drives Debian's Chromium (never a downloaded build); the page collects
 * requestAnimationFrame timestamps while the mouse drags one fixture along a path, and the
 * gaps between them are the frame times. A drag that re-rendered every shape, or redrew
 * synchronously per pointer event, shows up as long frames here. Headless Chromium paces
 * frames at about 60 Hz, so about 16.7 ms per frame is the floor.
 */
import { chromium, type Page } from "playwright-core";

export interface EditorBenchOptions {
  origin: string;
  email: string;
  password: string;
  storeId: string;
  planId: string;
  /** Pointer moves in one drag (default 240). */
  moves?: number;
  /** Drags to measure (default 3); the figures pool their frames. */
  drags?: number;
}

export interface FrameStats {
  frames: number;
  medianMs: number;
  p95Ms: number;
  maxMs: number;
  longFrames: number;
  dragMs: number;
  fixturesOnPage: number;
  /** The same pointer path without pressing (no drag): what the page and machine cost anyway. */
  hover: { frames: number; medianMs: number; p95Ms: number; longFrames: number };
  /** How far the fixture's centre moved over all drags (a check that the drags really moved it). */
  movedM: number;
}

const CHROMIUM = process.env.CHROMIUM_PATH ?? "/usr/bin/chromium";
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
/** Two 60 Hz frames: a gap above this is a dropped frame. */
const LONG_FRAME_MS = 33.4;

function quantile(sorted: readonly number[], q: number): number {
  return sorted[Math.min(sorted.length - 1, Math.floor(sorted.length * q))];
}

async function planToScreen(page: Page, x: number, y: number) {
  const stage = page.locator("[data-testid=layout-stage]");
  const box = (await stage.locator("canvas").first().boundingBox())!;
  const read = async (name: string) => Number(await stage.getAttribute(name));
  const [zoom, panX, panY, mpp] = await Promise.all(["data-zoom", "data-pan-x", "data-pan-y", "data-mpp"].map(read));
  return { x: box.x + panX + (x / mpp) * zoom, y: box.y + panY + (y / mpp) * zoom };
}

export async function measureEditorDrag(o: EditorBenchOptions): Promise<FrameStats> {
  const moves = o.moves ?? 240;
  const drags = o.drags ?? 3;
  const browser = await chromium.launch({ executablePath: CHROMIUM, headless: true, args: ARGS });
  try {
    const page = await browser.newPage({ viewport: { width: 1600, height: 1000 } });
    await page.goto(`${o.origin}/sign-in`);
    await page.getByLabel("E-mail").fill(o.email);
    await page.getByLabel("Password").fill(o.password);
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.getByRole("button", { name: "Sign out" }).waitFor();
    await page.goto(`${o.origin}/stores/${o.storeId}/plans/${o.planId}/layout`);
    await page.locator("[data-testid=layout-stage] canvas").first().waitFor({ timeout: 60_000 });
    const heading = await page.getByRole("heading", { name: /^All fixtures/ }).textContent();
    const fixturesOnPage = Number(/\((\d+)\)/.exec(heading ?? "")?.[1] ?? 0);
    await page.locator("[data-testid=layout-stage]").scrollIntoViewIfNeeded();
    await page.waitForTimeout(500);

    // The fixture to drag: the first one in the list, picked by its centre (the list's data-x/y).
    const centre = page.locator("td[data-x]").first();
    let cx = Number(await centre.getAttribute("data-x"));
    const firstX = cx;
    const cy = Number(await centre.getAttribute("data-y"));

    // Scripts go to the page as strings: tsx's compiled functions carry helpers the page lacks.
    await page.evaluate(`(() => {
      window.__frames = [];
      window.__recording = false;
      const tick = (t) => {
        if (window.__recording) window.__frames.push(t);
        requestAnimationFrame(tick);
      };
      requestAnimationFrame(tick);
    })()`);

    const path = async (sx: number, sy: number) => {
      for (let i = 1; i <= moves; i++) {
        const f = i / moves;
        const along = f < 0.7 ? f / 0.7 : 1 - ((f - 0.7) / 0.3) * 0.5;
        await page.mouse.move(sx + 240 * along, sy + 60 * Math.sin(along * Math.PI));
      }
    };
    const collect = async () =>
      (await page.evaluate(
        "(() => { window.__recording = false; const f = window.__frames; window.__frames = []; return f; })()",
      )) as number[];
    const toGaps = (frames: number[]) => frames.slice(1).map((t, i) => t - frames[i]);

    // Baseline: the same moves over the plan with no button held (nothing is dragged).
    const origin = await planToScreen(page, cx, cy);
    await page.mouse.move(origin.x, origin.y + 400);
    await page.evaluate("window.__recording = true");
    await path(origin.x, origin.y + 400);
    const hoverGaps = toGaps(await collect()).sort((a, b) => a - b);

    const gaps: number[] = [];
    let dragMs = 0;
    for (let d = 0; d < drags; d++) {
      const start = await planToScreen(page, cx, cy);
      await page.mouse.move(start.x, start.y);
      await page.mouse.down();
      await page.evaluate("window.__recording = true");
      const t0 = Date.now();
      // Out 240 px to the right and down, and part of the way back: a drag across neighbours.
      await path(start.x, start.y);
      dragMs += Date.now() - t0;
      const frames = await collect();
      await page.mouse.up();
      await page.waitForTimeout(300);
      for (let i = 1; i < frames.length; i++) gaps.push(frames[i] - frames[i - 1]);
      // The fixture moved; follow it for the next drag.
      cx = Number(await page.locator("td[data-x]").first().getAttribute("data-x"));
    }
    gaps.sort((a, b) => a - b);
    if (gaps.length === 0) throw new Error("no animation frames were recorded during the drag");
    return {
      frames: gaps.length,
      medianMs: quantile(gaps, 0.5),
      p95Ms: quantile(gaps, 0.95),
      maxMs: gaps[gaps.length - 1],
      longFrames: gaps.filter((g) => g > LONG_FRAME_MS).length,
      dragMs: dragMs / drags,
      fixturesOnPage,
      movedM: cx - firstX,
      hover: {
        frames: hoverGaps.length,
        medianMs: quantile(hoverGaps, 0.5),
        p95Ms: quantile(hoverGaps, 0.95),
        longFrames: hoverGaps.filter((g) => g > LONG_FRAME_MS).length,
      },
    };
  } finally {
    await browser.close();
  }
}
