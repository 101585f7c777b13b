import { describe, expect, it } from "vitest";
import { borrowSearch, GeodesicSearch, giveBackSearch } from "./geodesic-distance";
import { routeBetween } from "./grid-path";
import { cellIndexOf, createPlanGrid } from "./plan-grid";

const h = 0.25;
// 8-connected grid distance between cells Δi, Δj apart (octile metric): (max − min) + √2·min cells.
const octile = (di: number, dj: number) => h * (Math.max(di, dj) - Math.min(di, dj) + Math.SQRT2 * Math.min(di, dj));

describe("geodesic distance on the plan grid", () => {
  it("on open floor lies between the Euclidean distance and 8.24% above it (1/cos 22.5°, the 8-connected bound)", () => {
    const grid = createPlanGrid(10, 10, h, []);
    const s = new GeodesicSearch(grid);
    s.fromPoint(1.125, 1.125, 20);
    for (const [x, y] of [
      [8.875, 1.125],
      [8.875, 8.875],
      [5.125, 9.125],
      [3.375, 7.625],
    ]) {
      const e = Math.hypot(x - 1.125, y - 1.125);
      const d = s.dist[cellIndexOf(grid, x, y)];
      expect(d).toBeGreaterThanOrEqual(e - 1e-9);
      expect(d).toBeLessThanOrEqual(e * 1.0824 + 1e-9);
    }
  });

  it("around one wall equals the hand-computed path round its end", () => {
    // A wall from the top edge down to y = 6 m between x = 4.9 and 5.1 blocks cell columns 19-20, rows 0-23.
    const grid = createPlanGrid(10, 10, h, [
      [
        [4.9, 0],
        [5.1, 0],
        [5.1, 6],
        [4.9, 6],
      ],
    ]);
    expect(grid.blocked[cellIndexOf(grid, 5.0, 5.9)]).toBe(1);
    expect(grid.blocked[cellIndexOf(grid, 5.0, 6.1)]).toBe(0);
    const s = new GeodesicSearch(grid);
    // From cell (8, 8) to cell (31, 8): down to (18, 24), across to (21, 24) under the wall's end, up again.
    // The diagonal into (19, 24) is refused because (19, 23) is wall (no corner cutting).
    s.fromPoint(2.125, 2.125, 30);
    const hand = octile(10, 16) + 3 * h + octile(10, 16);
    expect(s.dist[cellIndexOf(grid, 7.875, 2.125)]).toBeCloseTo(hand, 9);
    // The continuous path round the wall's corners (4.75, 6) and (5.25, 6) is 9.86 m; straight through, 5.75 m.
    const continuous = 2 * Math.hypot(4.75 - 2.125, 6 - 2.125) + 0.5;
    expect(hand / continuous).toBeLessThan(1.1);
    expect(hand).toBeGreaterThan(5.75 * 1.7);
  });

  it("does not cut the corner between two diagonal solid cells", () => {
    // cells (1,0) and (0,1) are solid: (0,0) and (1,1) touch only at a corner, so they are not connected
    const grid = createPlanGrid(0.5, 0.5, h, [
      [
        [0.25, 0],
        [0.5, 0],
        [0.5, 0.25],
        [0.25, 0.25],
      ],
      [
        [0, 0.25],
        [0.25, 0.25],
        [0.25, 0.5],
        [0, 0.5],
      ],
    ]);
    const s = new GeodesicSearch(grid);
    s.fromPoint(0.125, 0.125, 10);
    expect(s.dist[cellIndexOf(grid, 0.375, 0.375)]).toBe(Infinity);
  });

  it("truncates at the maximum distance and leaves Infinity beyond it", () => {
    const grid = createPlanGrid(10, 2, h, []);
    const s = new GeodesicSearch(grid);
    s.fromPoint(0.125, 0.125, 3);
    expect(s.dist[cellIndexOf(grid, 2.875, 0.125)]).toBeCloseTo(2.75, 12);
    expect(s.dist[cellIndexOf(grid, 3.625, 0.125)]).toBe(Infinity);
  });

  it("the bucket search (reach) gives the heap's distances, round a wall's end and through a fan-stirred room", () => {
    const grid = createPlanGrid(10, 10, h, [
      [
        [4.9, 0],
        [5.1, 0],
        [5.1, 6],
        [4.9, 6],
      ],
    ]);
    // a room at the bottom right whose steps cost 0.35 of their length (fans, plan-masks.ts fanStepScale)
    const scale = new Float32Array(grid.width * grid.height).fill(1);
    for (let k = 0; k < scale.length; k++)
      if (k % grid.width >= 28 && Math.floor(k / grid.width) >= 28) scale[k] = 0.35;
    for (const stepScale of [null, scale]) {
      const heap = new GeodesicSearch(grid, stepScale);
      const buckets = new GeodesicSearch(grid, stepScale);
      for (const [x, y] of [
        [2.13, 2.07],
        [6.4, 1.2],
        [8.1, 8.3],
        [4.8, 6.3],
      ]) {
        const settled = heap.fromPoint(x, y, 6);
        expect(buckets.reach(x, y, 6)).toBe(settled);
        const reached = new Set(Array.from(buckets.settled.subarray(0, settled)));
        for (let q = 0; q < settled; q++) {
          const c = heap.settled[q];
          expect(reached.has(c)).toBe(true);
          expect(buckets.dist[c]).toBe(heap.dist[c]);
        }
      }
    }
    // the hand-computed path round the wall's end of the test above, found by the bucket search too
    const s = new GeodesicSearch(grid);
    s.reach(2.125, 2.125, 30);
    expect(s.dist[cellIndexOf(grid, 7.875, 2.125)]).toBeCloseTo(octile(10, 16) + 3 * h + octile(10, 16), 9);
    expect(s.dist[cellIndexOf(grid, 5.0, 3.0)]).toBe(Infinity); // the wall itself
  });

  it("a search that cannot reach a fan-stirred room gives exactly the distances of a search without step scales", () => {
    const grid = createPlanGrid(20, 10, h, []);
    // the room's cells (x 16-20 m) cost 0.35 of their length; a 6 m search from x = 3 m stops 7 m short of it
    const scale = new Float32Array(grid.width * grid.height).fill(1);
    for (let k = 0; k < scale.length; k++) if (k % grid.width >= 64) scale[k] = 0.35;
    const withScale = new GeodesicSearch(grid, scale);
    const without = new GeodesicSearch(grid);
    const settled = without.reach(3.1, 4.9, 6);
    expect(withScale.reach(3.1, 4.9, 6)).toBe(settled);
    for (let q = 0; q < settled; q++) {
      const c = without.settled[q];
      expect(withScale.dist[c]).toBe(without.dist[c]);
    }
    // beside the room the scales count: a cell inside it is nearer than without them
    withScale.reach(15.1, 4.9, 6);
    without.reach(15.1, 4.9, 6);
    const inRoom = cellIndexOf(grid, 19.1, 4.9);
    expect(withScale.dist[inRoom]).toBeLessThan(without.dist[inRoom]);
  });

  it("the bucket search from many cells (reachFromCells) settles the heap's cells at the heap's distances", () => {
    const grid = createPlanGrid(10, 10, h, [
      [
        [4.9, 0],
        [5.1, 0],
        [5.1, 6],
        [4.9, 6],
      ],
    ]);
    const scale = new Float32Array(grid.width * grid.height).fill(1);
    for (let k = 0; k < scale.length; k++)
      if (k % grid.width >= 28 && Math.floor(k / grid.width) >= 28) scale[k] = 0.35;
    // two drawn "cases" beside the wall, one cell given twice, one seed inside the wall (ignored)
    const seeds: number[] = [cellIndexOf(grid, 5, 3)];
    for (let j = 8; j < 12; j++) for (let i = 8; i < 17; i++) seeds.push(j * grid.width + i);
    for (let j = 30; j < 34; j++) for (let i = 22; i < 36; i++) seeds.push(j * grid.width + i);
    seeds.push(seeds[5]);
    for (const stepScale of [null, scale]) {
      // 0.25, 0.3 and 0.35 are within a diagonal step (0.354 m): seeds and orthogonal neighbours, no search
      for (const margin of [0, 0.2, 0.25, 0.3, 0.35, 0.36, 1.7]) {
        const heap = new GeodesicSearch(grid, stepScale);
        const buckets = new GeodesicSearch(grid, stepScale);
        const settled = heap.fromCells(seeds, margin);
        expect(buckets.reachFromCells(seeds, margin)).toBe(settled);
        const reached = new Set(Array.from(buckets.settled.subarray(0, settled)));
        for (let q = 0; q < settled; q++) {
          expect(reached.has(heap.settled[q])).toBe(true);
          expect(buckets.dist[heap.settled[q]]).toBe(heap.dist[heap.settled[q]]);
        }
        for (let c = 0; c < grid.width * grid.height; c++) expect(buckets.dist[c]).toBe(heap.dist[c]);
      }
    }
  });

  it("a search given back and lent again gives a new search's distances, and only on its own step scale", () => {
    const grid = createPlanGrid(10, 10, h, [
      [
        [4.9, 0],
        [5.1, 0],
        [5.1, 6],
        [4.9, 6],
      ],
    ]);
    const scale = new Float32Array(grid.width * grid.height).fill(0.5);
    const first = borrowSearch(grid);
    first.reach(2.1, 2.1, 9);
    giveBackSearch(first);
    expect(borrowSearch(grid, scale)).not.toBe(first); // another step scale: another search
    const again = borrowSearch(grid);
    expect(again).toBe(first);
    again.reach(8.3, 1.4, 4);
    const fresh = new GeodesicSearch(grid);
    fresh.reach(8.3, 1.4, 4);
    for (let c = 0; c < grid.width * grid.height; c++) expect(again.dist[c]).toBe(fresh.dist[c]);
    expect(borrowSearch(grid)).not.toBe(first); // lent out: not lent twice
  });

  it("a search with a focus circle gives the circle's cells the full search's distances, and settles fewer cells", () => {
    const grid = createPlanGrid(20, 12, h, [
      [
        [9.9, 0],
        [10.1, 0],
        [10.1, 8],
        [9.9, 8],
      ],
    ]);
    // a fan-stirred room (steps cost 0.35 of their length) between the readings and the circle
    const scale = new Float32Array(grid.width * grid.height).fill(1);
    for (let k = 0; k < scale.length; k++) {
      const i = k % grid.width;
      if (i >= 44 && i < 56 && Math.floor(k / grid.width) >= 32) scale[k] = 0.35;
    }
    const focus = { x: 13, y: 6, radiusM: 3 };
    const inCircle = (c: number) =>
      Math.hypot(((c % grid.width) + 0.5) * h - focus.x, (Math.floor(c / grid.width) + 0.5) * h - focus.y) <= 3;
    for (const stepScale of [null, scale]) {
      const full = new GeodesicSearch(grid, stepScale);
      const part = new GeodesicSearch(grid, stepScale);
      // beside the circle, behind the wall (the path goes round its end), far off (reaches nothing)
      for (const [x, y] of [
        [12.2, 3.1],
        [8.4, 7.0],
        [9.1, 10.6],
        [2.2, 2.2],
      ]) {
        const all = full.reach(x, y, 6);
        const some = part.reach(x, y, 6, focus);
        expect(some).toBeLessThanOrEqual(all);
        let checked = 0;
        for (let c = 0; c < grid.width * grid.height; c++) {
          if (!inCircle(c)) continue;
          expect(part.dist[c]).toBe(full.dist[c]);
          if (full.dist[c] < Infinity) checked++;
        }
        if (x === 8.4 || x === 12.2) expect(checked).toBeGreaterThan(20);
        if (x === 2.2) expect(some).toBeLessThan(all / 4);
      }
    }
  });

  it("routes a walk round a wall instead of through it", () => {
    const grid = createPlanGrid(10, 10, h, [
      [
        [4.9, 0],
        [5.1, 0],
        [5.1, 6],
        [4.9, 6],
      ],
    ]);
    const route = routeBetween(new GeodesicSearch(grid), 2.125, 2.125, 7.875, 2.125, 30)!;
    expect(route[0]).toEqual([2.125, 2.125]);
    expect(route[route.length - 1]).toEqual([7.875, 2.125]);
    expect(Math.max(...route.map((p) => p[1]))).toBeGreaterThan(6);
    expect(routeBetween(new GeodesicSearch(grid), 1, 8, 9, 8, 30)).toEqual([
      [1, 8],
      [9, 8],
    ]);
  });
});
