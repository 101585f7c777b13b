import { describe, expect, it } from "vitest";
import { cellOf, createGrid, fillRect, type Grid, type Rect } from "./grid";
import { chooseLeaks } from "./leak-sites";
import { createRandom } from "./random";
import { generateLayout } from "./store-plan";

// Ranges of docs/locator/design-ranges.md (stores 40-80 m by 25-50 m, walk-ins with walls
// and a door gap); the geometric checks are plain containment and flood-fill connectivity.
const overlap = (a: Rect, b: Rect) =>
  Math.max(0, Math.min(a.x1, b.x1) - Math.max(a.x0, b.x0)) * Math.max(0, Math.min(a.y1, b.y1) - Math.max(a.y0, b.y0));
const inside = (r: Rect, x: number, y: number) => x >= r.x0 && x <= r.x1 && y >= r.y0 && y <= r.y1;

function reachable(grid: Grid, from: number): Uint8Array {
  const seen = new Uint8Array(grid.nx * grid.ny);
  const queue = [from];
  seen[from] = 1;
  while (queue.length) {
    const k = queue.pop()!;
    const i = k % grid.nx;
    for (const n of [i > 0 ? k - 1 : -1, i < grid.nx - 1 ? k + 1 : -1, k - grid.nx, k + grid.nx]) {
      if (n < 0 || n >= seen.length || seen[n] || grid.solid[n]) continue;
      seen[n] = 1;
      queue.push(n);
    }
  }
  return seen;
}

describe("invented store layouts", () => {
  for (const key of [11, 23, 37, 41, 7919 * 2 + 104729 * 9]) {
    it(`store ${key}: sizes in range, bodies apart from air volumes, every room reachable through its door`, () => {
      const random = createRandom(key);
      const layout = generateLayout(random);
      expect(layout.width).toBeGreaterThanOrEqual(40);
      expect(layout.width).toBeLessThanOrEqual(80);
      expect(layout.height).toBeGreaterThanOrEqual(25);
      expect(layout.height).toBeLessThanOrEqual(50);
      expect(layout.fixtures.filter((f) => f.kind === "walk-in").length).toBeGreaterThanOrEqual(2);
      const clashes = layout.fixtures.flatMap((f) =>
        layout.solids.filter((s) => overlap(f.rect, s.rect) > 1e-6).map((s) => `${f.id}/${s.id}`),
      );
      expect(clashes).toEqual([]);
      const strayRisk = layout.riskPoints.filter(
        (p) => !inside(layout.fixtures.find((f) => f.id === p.fixtureId)!.rect, p.x, p.y),
      );
      expect(strayRisk).toEqual([]);
      const grid = createGrid(layout.width, layout.height, 0.2);
      for (const s of layout.solids) fillRect(grid, grid.solid, s.rect, 1);
      const start = layout.legs[0].points[0];
      const seen = reachable(grid, cellOf(grid, start[0], start[1]));
      const cutOff = layout.fixtures
        .filter((f) => !seen[cellOf(grid, (f.rect.x0 + f.rect.x1) / 2, f.rect.y0 + 0.35)])
        .map((f) => f.id);
      expect(cutOff).toEqual([]);
      // Every point of every sweep leg, every 0.1 m, lies on open air.
      const blockedLegPoints = layout.legs.flatMap((leg) =>
        leg.points.slice(1).flatMap((b, k) => {
          const a = leg.points[k];
          const n = Math.ceil(Math.hypot(b[0] - a[0], b[1] - a[1]) / 0.1);
          return Array.from({ length: n + 1 }, (_, s) => [
            a[0] + ((b[0] - a[0]) * s) / n,
            a[1] + ((b[1] - a[1]) * s) / n,
          ])
            .filter(([x, y]) => grid.solid[cellOf(grid, x, y)])
            .map(([x, y]) => `${leg.label} at ${x.toFixed(2)},${y.toFixed(2)}`);
        }),
      );
      expect(blockedLegPoints).toEqual([]);
      for (const family of ["single-fans", "two-leaks", "walkin-fans"] as const) {
        for (const leak of chooseLeaks(family, layout, grid, random)) {
          expect(inside(layout.fixtures.find((f) => f.id === leak.fixtureId)!.rect, leak.x, leak.y)).toBe(true);
          expect(grid.solid[cellOf(grid, leak.x, leak.y)]).toBe(0);
        }
      }
    });
  }

  it("the same stream key gives the same store, a different key a different one", () => {
    const a = JSON.stringify(generateLayout(createRandom(5)));
    expect(JSON.stringify(generateLayout(createRandom(5)))).toBe(a);
    expect(JSON.stringify(generateLayout(createRandom(6)))).not.toBe(a);
  });
});
