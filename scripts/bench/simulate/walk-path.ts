// How the technician gets from the end of one sweep leg to the start of the next: the cheapest
// 8-connected path on a coarse copy of the simulation grid (Dijkstra 1959), never through a solid
// body and, where possible, around cases rather than through them. Corners are not cut past blocked
// cells, so the straight moves between waypoints stay in open air.
import type { Grid } from "./grid";
import type { Point } from "./store-types";

export interface WalkMap {
  nx: number;
  ny: number;
  size: number;
  /** 0 blocked, otherwise the cost of stepping into the cell. */
  cost: Float64Array;
}

export function buildWalkMap(grid: Grid, fixtureMask: Uint8Array, factor = 2): WalkMap {
  const nx = Math.floor(grid.nx / factor),
    ny = Math.floor(grid.ny / factor);
  const cost = new Float64Array(nx * ny);
  for (let j = 0; j < ny; j++) {
    for (let i = 0; i < nx; i++) {
      let blocked = false,
        inCase = false;
      for (let dj = 0; dj < factor; dj++) {
        for (let di = 0; di < factor; di++) {
          const k = (j * factor + dj) * grid.nx + i * factor + di;
          if (grid.solid[k]) blocked = true;
          if (fixtureMask[k]) inCase = true;
        }
      }
      cost[j * nx + i] = blocked ? 0 : inCase ? 6 : 1;
    }
  }
  return { nx, ny, size: grid.h * factor, cost };
}

function nearestOpen(map: WalkMap, p: Point): number {
  const ci = Math.min(map.nx - 1, Math.max(0, Math.floor(p[0] / map.size)));
  const cj = Math.min(map.ny - 1, Math.max(0, Math.floor(p[1] / map.size)));
  for (let r = 0; r < 12; r++) {
    let best = -1,
      bestD = Infinity;
    for (let j = cj - r; j <= cj + r; j++) {
      for (let i = ci - r; i <= ci + r; i++) {
        if (i < 0 || j < 0 || i >= map.nx || j >= map.ny || !map.cost[j * map.nx + i]) continue;
        const d = Math.hypot((i + 0.5) * map.size - p[0], (j + 0.5) * map.size - p[1]);
        if (d < bestD) {
          bestD = d;
          best = j * map.nx + i;
        }
      }
    }
    if (best >= 0) return best;
  }
  throw new Error(`walk path: no open floor near (${p[0].toFixed(2)}, ${p[1].toFixed(2)})`);
}

/** Waypoints from a to b (excluding a, including b). */
export function findWalkPath(map: WalkMap, a: Point, b: Point): Point[] {
  const { nx, ny, cost, size } = map;
  const start = nearestOpen(map, a),
    goal = nearestOpen(map, b);
  const dist = new Float64Array(nx * ny).fill(Infinity);
  const prev = new Int32Array(nx * ny).fill(-1);
  const heap: [number, number][] = [];
  const push = (d: number, k: number) => {
    heap.push([d, k]);
    let c = heap.length - 1;
    while (c > 0) {
      const p = (c - 1) >> 1;
      if (heap[p][0] <= heap[c][0]) break;
      [heap[p], heap[c]] = [heap[c], heap[p]];
      c = p;
    }
  };
  const pop = (): [number, number] => {
    const top = heap[0];
    const last = heap.pop()!;
    if (heap.length > 0) {
      heap[0] = last;
      let c = 0;
      for (;;) {
        const l = 2 * c + 1,
          r = l + 1;
        let m = c;
        if (l < heap.length && heap[l][0] < heap[m][0]) m = l;
        if (r < heap.length && heap[r][0] < heap[m][0]) m = r;
        if (m === c) break;
        [heap[m], heap[c]] = [heap[c], heap[m]];
        c = m;
      }
    }
    return top;
  };
  dist[start] = 0;
  push(0, start);
  while (heap.length) {
    const [d, k] = pop();
    if (d > dist[k]) continue; // stale entry
    if (k === goal) break;
    const i = k % nx,
      j = (k - i) / nx;
    for (let dj = -1; dj <= 1; dj++) {
      for (let di = -1; di <= 1; di++) {
        if (!di && !dj) continue;
        const ii = i + di,
          jj = j + dj;
        if (ii < 0 || jj < 0 || ii >= nx || jj >= ny) continue;
        const n = jj * nx + ii;
        if (!cost[n]) continue;
        if (di && dj && (!cost[j * nx + ii] || !cost[jj * nx + i])) continue;
        const nd = d + cost[n] * (di && dj ? Math.SQRT2 : 1);
        if (nd < dist[n]) {
          dist[n] = nd;
          prev[n] = k;
          push(nd, n);
        }
      }
    }
  }
  if (!Number.isFinite(dist[goal])) throw new Error("walk path: the next sweep leg cannot be reached on foot");
  const cells: number[] = [];
  for (let k = goal; k !== start && k >= 0; k = prev[k]) cells.push(k);
  cells.reverse();
  const out: Point[] = cells.map((k) => [((k % nx) + 0.5) * size, (Math.floor(k / nx) + 0.5) * size]);
  out.push(b);
  return out;
}
