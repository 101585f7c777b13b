import { describe, expect, it } from "vitest";
import { createGrid, fillRect } from "./grid";
import { createRandom } from "./random";
import { Sensor } from "./sensor";
import { Technician } from "./technician";
import { buildWalkMap, findWalkPath } from "./walk-path";

// Walking pattern of docs/locator/design-ranges.md (0.7–1.2 m/s, a stop every 1.2–1.5 m for
// 1–4 s, tap on arrival, a ~0.6 m re-check after an alarm); the checks are plain arithmetic on them.
const sensorSettings = {
  dt: 0.05,
  transportDelayS: 4,
  timeConstantS: 1,
  sigma: 0,
  slowShare: 0.5,
  slowCorrelationS: 2,
  displayNoisePpm: 0,
  rangePpm: 200,
};
const walkSettings = {
  speed: 1,
  stopSpacing: [1.2, 1.5] as [number, number],
  dwellS: [1, 4] as [number, number],
  recheckSpacing: [0.55, 0.65] as [number, number],
  recheckDwellS: [2, 4] as [number, number],
  recheckSpeedFactor: 0.6,
  tapJitter: 0,
  alarmPpm: 2,
};

describe("technician", () => {
  it("walks around a wall through its door gap, never onto a solid cell", () => {
    const grid = createGrid(10, 6, 0.2);
    fillRect(grid, grid.solid, { x0: 5, y0: 0, x1: 5.2, y1: 4.8 }, 1);
    const path = findWalkPath(buildWalkMap(grid, new Uint8Array(grid.nx * grid.ny)), [1, 1], [9, 1]);
    let prev: [number, number] = [1, 1];
    for (const p of path) {
      for (let s = 0; s <= 20; s++) {
        const x = prev[0] + ((p[0] - prev[0]) * s) / 20,
          y = prev[1] + ((p[1] - prev[1]) * s) / 20;
        expect(grid.solid[Math.floor(y / 0.2) * grid.nx + Math.floor(x / 0.2)]).toBe(0);
      }
      prev = p;
    }
    expect(Math.max(...path.map((p) => p[1]))).toBeGreaterThan(4.8); // it went through the gap
  });

  it("stops every 1.2–1.5 m, taps on arrival, and re-checks an alarm stretch at ~0.6 m", () => {
    const grid = createGrid(30, 6, 0.2);
    const random = createRandom(9);
    // Gas only around x = 15 (a top hat), so the alarm stretch is known.
    const air = (x: number) => (Math.abs(x - 15) < 1 ? 20 : 0);
    const tech = new Technician(
      walkSettings,
      new Sensor(sensorSettings, random),
      0.05,
      air,
      0,
      random,
      { width: 30, height: 6 },
      [2, 3],
      10,
    );
    tech.sweep(buildWalkMap(grid, new Uint8Array(grid.nx * grid.ny)), {
      points: [
        [2, 3],
        [28, 3],
      ],
      label: "test",
    });
    const r = tech.readings;
    const firstPass = r.filter((_, k) => k === 0 || r[k].x > r[k - 1].x);
    for (let k = 1; k < firstPass.length; k++) {
      const step = firstPass[k].x - firstPass[k - 1].x;
      expect(step).toBeGreaterThanOrEqual(1.2 - 1e-6);
      expect(step).toBeLessThanOrEqual(1.5 + 1e-6);
      // walking time at 1 m/s plus a 1–4 s dwell
      expect(firstPass[k].t - firstPass[k - 1].t).toBeGreaterThanOrEqual(step + 1 - 0.11);
      expect(firstPass[k].t - firstPass[k - 1].t).toBeLessThanOrEqual(step + 4 + 0.11);
    }
    const recheck = r.slice(firstPass.length);
    expect(recheck.length).toBeGreaterThan(3);
    for (let k = 1; k < recheck.length; k++) {
      expect(recheck[k - 1].x - recheck[k].x).toBeGreaterThanOrEqual(0.55 - 1e-6);
      expect(recheck[k - 1].x - recheck[k].x).toBeLessThanOrEqual(0.65 + 1e-6);
    }
    // The delay and lag put the highest first-pass reading downstream of the gas (x > 16 m).
    const peak = firstPass.reduce((a, b) => (b.ppm > a.ppm ? b : a));
    expect(peak.x).toBeGreaterThan(16);
  });
});
