import type { CDPSession, Page } from "playwright-core";

/**
 * Finger gestures for browser tests. Playwright's touchscreen only taps; drags and pinches go
 * through the DevTools protocol (Input.dispatchTouchEvent), which makes Chromium send the same
 * touch and pointer events a real finger does. Needs a context with hasTouch: true.
 */
export interface Finger {
  x: number;
  y: number;
}

const pause = (ms: number) => new Promise((r) => setTimeout(r, ms));

export async function touchSession(page: Page): Promise<CDPSession> {
  return page.context().newCDPSession(page);
}

/** One finger down at `from`, moved to `to` in `steps` frames, lifted. */
export async function touchDrag(cdp: CDPSession, from: Finger, to: Finger, steps = 10): Promise<void> {
  await cdp.send("Input.dispatchTouchEvent", { type: "touchStart", touchPoints: [{ x: from.x, y: from.y, id: 1 }] });
  for (let i = 1; i <= steps; i++) {
    const t = i / steps;
    await cdp.send("Input.dispatchTouchEvent", {
      type: "touchMove",
      touchPoints: [{ x: from.x + (to.x - from.x) * t, y: from.y + (to.y - from.y) * t, id: 1 }],
    });
    await pause(16);
  }
  await cdp.send("Input.dispatchTouchEvent", { type: "touchEnd", touchPoints: [] });
  await pause(50);
}

/**
 * Two fingers either side of `centre`, `from` px apart, spread (or closed) to `to` px apart.
 * The first finger lands a frame before the second, as a hand does.
 */
export async function pinch(cdp: CDPSession, centre: Finger, from: number, to: number, steps = 10): Promise<void> {
  const fingers = (d: number) => [
    { x: centre.x - d / 2, y: centre.y, id: 1 },
    { x: centre.x + d / 2, y: centre.y, id: 2 },
  ];
  await cdp.send("Input.dispatchTouchEvent", { type: "touchStart", touchPoints: [fingers(from)[0]] });
  await pause(16);
  await cdp.send("Input.dispatchTouchEvent", { type: "touchStart", touchPoints: fingers(from) });
  for (let i = 1; i <= steps; i++) {
    await cdp.send("Input.dispatchTouchEvent", {
      type: "touchMove",
      touchPoints: fingers(from + ((to - from) * i) / steps),
    });
    await pause(16);
  }
  await cdp.send("Input.dispatchTouchEvent", { type: "touchEnd", touchPoints: [fingers(to)[0]] });
  await cdp.send("Input.dispatchTouchEvent", { type: "touchEnd", touchPoints: [] });
  await pause(50);
}
