import { describe, expect, it } from "vitest";
import type { Fixture } from "#core/contracts/fixtures";
import { locatorInputSchema } from "#core/contracts/locator-input";
import { locate } from "#core/analysis/locate";
import { toLocatorPlan } from "#core/domain/layout/to-locator-input";
import { peakIndex, peakLagHint, RECHECK_SPACING_M } from "./lag-hint";
import { walkModelFor } from "./walk-model";

const start = Date.parse("2026-11-02T14:00:00Z");
const walk = (n: number, ppmAt: (i: number) => number) =>
  Array.from({ length: n }, (_, i) => ({
    x: i,
    y: 0,
    takenAt: new Date(start + i * 1000).toISOString(),
    ppm: ppmAt(i),
    atLeast: false,
  }));

describe("the Walk screen's lag hint", () => {
  it("marks the alarm's air 5 m back on a 1 m/s straight walk with a 5 s delay (common practice delay, worked example)", () => {
    const hint = peakLagHint(
      walk(13, (i) => (i === 12 ? 6 : 0)),
      5,
      0,
      2,
    )!;
    expect(hint).toMatchObject({ index: 12, x: 7, y: 0, beforeDelay: false });
    expect(hint.backM).toBeCloseTo(5, 12);
    // re-check spots every 0.6 m around x = 7 (common practice, no published source)
    expect(hint.recheck.map((p) => +p.x.toFixed(6))).toEqual([5.2, 5.8, 6.4, 7, 7.6, 8.2, 8.8]);
    expect(RECHECK_SPACING_M).toBe(0.6);
  });

  it("adds the sensor's time constant to the transport delay", () => {
    expect(
      peakLagHint(
        walk(13, (i) => (i === 12 ? 6 : 0)),
        3.5,
        1.5,
        2,
      )!.x,
    ).toBeCloseTo(7, 12);
  });

  it("flags an alarm before one delay has passed and places it at the first reading", () => {
    expect(
      peakLagHint(
        walk(4, (i) => (i === 3 ? 9 : 0)),
        5,
        0,
        2,
      ),
    ).toMatchObject({ x: 0, beforeDelay: true });
  });

  it("follows the sweep's peak, not the latest reading at or above the alarm", () => {
    // 30 ppm at x = 8, then a 2 ppm alarm at x = 12: the hint stays on the 30 ppm peak.
    const hint = peakLagHint(
      walk(13, (i) => (i === 8 ? 30 : i === 12 ? 2 : 0)),
      5,
      0,
      2,
    )!;
    expect(hint).toMatchObject({ index: 8, x: 3, beforeDelay: false });
    expect(peakIndex([{ ppm: 3 }, { ppm: 9 }, { ppm: 9 }, { ppm: 4 }], 2)).toBe(2); // the later of equal peaks
    expect(peakIndex([{ ppm: 1 }, { ppm: 0 }], 2)).toBe(-1);
  });

  it("does not move a pinpoint pass's alarm back across the pause before the pass (docs/locator/method.md, step 1)", () => {
    // the first pass along x 0–12, then three minutes later a still-air pass from x 20
    const first = walk(13, () => 0);
    const pass = Array.from({ length: 6 }, (_, k) => ({
      x: 20 + k,
      y: 0,
      takenAt: new Date(start + (192 + k) * 1000).toISOString(),
      ppm: k === 2 ? 9 : 0,
      atLeast: false,
      passId: "p2",
    }));
    // 2 s into the pass with a 5 s delay: its air was drawn in before the pass began, so at its first tap
    expect(peakLagHint([...first, ...pass], 5, 0, 2, { walkSpeedMps: 1 })).toMatchObject({
      index: 15,
      x: 20,
      beforeDelay: true,
      recheck: [],
    });
    // 5 s in: 5 m back is the pass's own first tap; the re-check spots stay in the pass
    const later = pass.map((r, k) => ({ ...r, ppm: k === 5 ? 9 : 0 }));
    const hint = peakLagHint([...first, ...later], 5, 0, 2, { walkSpeedMps: 1 })!;
    expect(hint).toMatchObject({ index: 18, x: 20, beforeDelay: false });
    expect(Math.min(...hint.recheck.map((p) => p.x))).toBeGreaterThanOrEqual(20);
  });

  it("gives no hint below the alarm level", () => {
    expect(
      peakLagHint(
        walk(10, () => 1.9),
        5,
        0,
        2,
      ),
    ).toBeNull();
  });
});

describe("the lag hint and the locator agree", () => {
  // A 10 m x 6 m plan with a shelving run from the north wall down to y = 4 m between two taps: the
  // technician walks around its south end, so the air sampled mid-way was there, not inside the run.
  const gondola: Fixture = {
    id: "5b0c7f4e-2a1d-4c3b-9e8f-7a6b5c4d3e2f",
    kind: "gondola",
    label: "Aisle 1",
    systemId: null,
    hasFans: false,
    polygon: [
      [4, 0],
      [5, 0],
      [5, 4],
      [4, 4],
    ],
  };
  const plan = { widthM: 10, heightM: 6 };
  const taps = [
    { x: 3, y: 2, s: 0, ppm: 0 },
    { x: 6, y: 2, s: 6, ppm: 0 },
    { x: 7, y: 2, s: 7, ppm: 9 },
  ];
  const readings = taps.map((t) => ({
    x: t.x,
    y: t.y,
    takenAt: new Date(start + t.s * 1000).toISOString(),
    ppm: t.ppm,
    atLeast: false,
  }));

  it("places the alarm's air where the server's locator corrects that reading to, around the shelving", () => {
    const hint = peakLagHint(readings, 3.5, 0, 2, walkModelFor(plan, [gondola]))!;
    const result = locate(
      locatorInputSchema.parse({
        plan: toLocatorPlan({ width: 10, height: 6 }, [gondola], { fansRunning: true }),
        instrument: { transportDelayS: 3.5, timeConstantS: 0, alarmPpm: 2 },
        readings: taps.map((t) => ({ x: t.x, y: t.y, t: t.s, ppm: t.ppm })),
      }),
    );
    const corrected = result.readings[2].corrected;
    // the locator reports corrected positions to the centimetre
    expect(Math.abs(hint.x - corrected.x)).toBeLessThanOrEqual(0.005);
    expect(Math.abs(hint.y - corrected.y)).toBeLessThanOrEqual(0.005);
    // not inside the shelving run (x 4–5 m, y 0–4 m), where a straight line between the taps puts it
    expect(hint.x >= 4 && hint.x <= 5 && hint.y <= 4).toBe(false);
    const straight = peakLagHint(readings, 3.5, 0, 2)!;
    expect(straight.y).toBeCloseTo(2, 9);
    expect(straight.x).toBeGreaterThan(4);
    expect(straight.x).toBeLessThan(5);
  });

  it("measures the way back along the route, not across the shelving", () => {
    const hint = peakLagHint(readings, 3.5, 0, 2, walkModelFor(plan, [gondola]))!;
    // 1 m from the alarm tap back to (6, 2), then part of the leg round the run's end
    expect(hint.backM).toBeGreaterThan(1 + Math.hypot(hint.x - 6, hint.y - 2) - 1e-6);
    for (const p of hint.recheck) expect(p.x >= 4 && p.x <= 5 && p.y <= 4).toBe(false);
  });
});
