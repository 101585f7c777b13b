import { MinHeap } from "./binary-heap";
import { cellCentre, nearestFreeCell, type PlanGrid } from "./plan-grid";

/**
 * A circle of cell centres whose distances alone are wanted: a search with a focus does not step on from
 * a cell that cannot reach the circle within its maximum distance. The circle's cells get exactly the
 * distances of a search without focus; cells outside it may be left unreached.
 */
export interface SearchFocus {
  readonly x: number;
  readonly y: number;
  readonly radiusM: number;
}

/**
 * Obstacle-aware (geodesic) distance on the plan grid: Dijkstra over 8-connected free cells,
 * truncated at a maximum distance so one search per reading stays local (docs/reference/locator-methods.md §2).
 * A diagonal step is allowed only when both orthogonal neighbours are free, so paths never cut
 * the corner of a solid body (docs/reference/locator-methods.md §5, pitfall 8). On open floor the 8-connected
 * metric overestimates the Euclidean distance by at most 8.24% (1/cos 22.5°).
 *
 * The search object is reused between runs: `dist` keeps Infinity outside the cells last touched.
 */
export class GeodesicSearch {
  readonly dist: Float64Array;
  readonly parent: Int32Array;
  /** Cells settled by the last run, in order of increasing distance. */
  settled: Int32Array;
  settledCount = 0;
  private dirty: Int32Array;
  private dirtyCount = 0;
  private readonly heap = new MinHeap(4096);
  private readonly offsets: Int32Array;
  private readonly steps: Float64Array;
  /** Per cell, a bit per allowed move (in bounds, into a free cell, not cutting a solid corner). */
  private readonly moves: Uint8Array;
  /** Width of a bucket of `reach`: half the cheapest step, so a relaxed cell always lands in a later bucket. */
  private readonly bucketWidth: number;
  private readonly buckets = new BucketQueue();

  /**
   * `stepScale` (optional, per cell) shortens or stretches steps through a cell: an edge costs its length
   * times the mean scale of its two cells. Used for fixtures whose fans mix the air, where the screening
   * length √(K/λ) is longer, which is the same as distances being shorter.
   */
  constructor(
    readonly grid: PlanGrid,
    readonly stepScale: Float32Array | null = null,
  ) {
    const n = grid.width * grid.height;
    this.dist = new Float64Array(n).fill(Infinity);
    this.parent = new Int32Array(n).fill(-1);
    this.settled = new Int32Array(1024);
    this.dirty = new Int32Array(1024);
    const w = grid.width;
    const h = grid.cellSize;
    this.moves = movesOf(grid);
    this.offsets = Int32Array.from([1, -1, w, -w, w + 1, -w + 1, w - 1, -w - 1]);
    this.steps = Float64Array.from([h, h, h, h, h * Math.SQRT2, h * Math.SQRT2, h * Math.SQRT2, h * Math.SQRT2]);
    let minScale = 1;
    let notShortened = 0;
    const box = [Infinity, Infinity, -Infinity, -Infinity];
    if (stepScale)
      for (let k = 0; k < stepScale.length; k++) {
        if (!(stepScale[k] <= 1)) notShortened++;
        if (stepScale[k] < minScale) minScale = stepScale[k];
        if (stepScale[k] < 1) {
          const [cx, cy] = cellCentre(grid, k);
          box[0] = Math.min(box[0], cx);
          box[1] = Math.min(box[1], cy);
          box[2] = Math.max(box[2], cx);
          box[3] = Math.max(box[3], cy);
        }
      }
    this.bucketWidth = (h * minScale) / 2;
    this.minScale = minScale;
    this.shortBox = box;
    this.onlyShortened = notShortened === 0;
  }

  /** Every cell's step scale is 1 except the shortened ones (scale < 1) of `shortBox`. */
  private readonly onlyShortened: boolean;

  /** The smallest step scale (at most 1): no path is shorter than this times the straight line. */
  private readonly minScale: number;
  /** Bounding box (x0, y0, x1, y1) of the centres of cells whose steps are shortened (scale < 1). */
  private readonly shortBox: number[];

  /**
   * What no path from (x, y) within maxDistance is shorter than, times the straight line: 1 when the
   * shortened cells are too far to be reached (every step before the first of them costs its length),
   * else the smallest scale.
   */
  private floorFrom(x: number, y: number, maxDistance: number): number {
    const [x0, y0, x1, y1] = this.shortBox;
    if (!(x0 <= x1)) return 1;
    const dx = Math.max(x0 - x, 0, x - x1);
    const dy = Math.max(y0 - y, 0, y - y1);
    return Math.hypot(dx, dy) > maxDistance + 2 * this.grid.cellSize ? 1 : this.minScale;
  }

  /**
   * Distances from the point (x, y) to every free cell within maxDistance. The point's own cell and its
   * free neighbours start at their exact Euclidean distance, which removes most of the snapping error.
   * Stops early once `target` is settled (when given; then only settled cells hold exact distances).
   * Returns the number of settled cells.
   */
  fromPoint(x: number, y: number, maxDistance: number, target = -1): number {
    this.seedPoint(x, y);
    return this.run(maxDistance, target);
  }

  /**
   * The same distances as fromPoint, found with a bucket queue instead of the heap: the settled cells come
   * in no particular order and `parent` is not kept, which is all the per-reading searches need. Buckets
   * are half the cheapest step wide, so a cell is final when its bucket comes up (Dial's method with wide
   * buckets) and every distance is the same sum of the same steps as the heap's.
   */
  reach(x: number, y: number, maxDistance: number, focus: SearchFocus | null = null): number {
    if (!(this.bucketWidth > 0) || !Number.isFinite(maxDistance / this.bucketWidth))
      return this.fromPoint(x, y, maxDistance);
    const seeds = this.seedPoint(x, y);
    if (seeds === 0) return 0;
    const floor = this.stepScale ? this.floorFrom(x, y, maxDistance) : 1;
    // No shortened cell within reach: every step this search takes costs its length times (1 + 1) / 2,
    // exactly its length, so the steps' scales need not be read (docs/decisions/0160).
    const plain = this.stepScale !== null && floor === 1 && this.onlyShortened;
    return this.runBuckets(maxDistance, true, focus, focus ? floor : 1, plain);
  }

  /** Resets, then seeds the point's own cell and its free neighbours at their Euclidean distance; the seed count. */
  private seedPoint(x: number, y: number): number {
    this.reset();
    const g = this.grid;
    const k0 = nearestFreeCell(g, x, y);
    if (k0 < 0) return 0;
    let seeds = 0;
    const i0 = k0 % g.width;
    const j0 = (k0 - i0) / g.width;
    for (let dj = -1; dj <= 1; dj++) {
      for (let di = -1; di <= 1; di++) {
        const i = i0 + di;
        const j = j0 + dj;
        if (i < 0 || j < 0 || i >= g.width || j >= g.height) continue;
        const k = j * g.width + i;
        if (g.blocked[k]) continue;
        if (di !== 0 && dj !== 0 && (g.blocked[j0 * g.width + i] || g.blocked[j * g.width + i0])) continue;
        const [cx, cy] = cellCentre(g, k);
        this.seed(k, Math.hypot(cx - x, cy - y), -1);
        seeds++;
      }
    }
    return seeds;
  }

  /** Distances from a set of cells (all at distance 0), e.g. the cells of a benign-source zone. */
  fromCells(cells: readonly number[], maxDistance: number): number {
    this.reset();
    for (const k of cells) if (!this.grid.blocked[k]) this.seed(k, 0, -1);
    return this.run(maxDistance, -1);
  }

  /**
   * The same distances as fromCells, found with the bucket queue (see reach): the settled cells in no
   * particular order and no `parent`. With thousands of seeds (every cell of a plan's fixtures) the heap
   * spends most of its time ordering cells that all start at 0.
   */
  reachFromCells(cells: readonly number[], maxDistance: number): number {
    if (!(this.bucketWidth > 0) || !Number.isFinite(maxDistance / this.bucketWidth) || !(maxDistance >= 0))
      return this.fromCells(cells, maxDistance);
    this.reset();
    if (this.stepScale === null && maxDistance < this.steps[4]) return this.seedsAndNeighbours(cells, maxDistance);
    this.buckets.reset(Math.floor(maxDistance / this.bucketWidth) + 1);
    for (const k of cells) {
      if (this.grid.blocked[k] || this.dist[k] === 0) continue;
      this.markDirty(k);
      this.dist[k] = 0;
      this.buckets.push(0, 0, k);
    }
    return this.runBuckets(maxDistance, false);
  }

  /**
   * reachFromCells within less than a diagonal step and without step scales (the equipment mask's 0.3 m
   * at 0.25 m cells): the seeds at 0 and, when a cell's width is within reach, their free orthogonal
   * neighbours at that width, the same sums the buckets would settle (0 + h; a second step costs more
   * than the reach). One pass instead of a search, whose first runs are cold (docs/decisions/0163).
   */
  private seedsAndNeighbours(cells: readonly number[], maxDistance: number): number {
    const { dist, moves, offsets, steps } = this;
    const blocked = this.grid.blocked;
    for (let q = 0; q < cells.length; q++) {
      const k = cells[q];
      if (blocked[k] || dist[k] === 0) continue;
      this.markDirty(k);
      dist[k] = 0;
      this.settle(k);
    }
    if (!(0 + steps[0] <= maxDistance)) return this.settledCount;
    const seeds = this.settledCount;
    for (let q = 0; q < seeds; q++) {
      const u = this.settled[q];
      const mask = moves[u];
      for (let m = 0; m < 4; m++) {
        if (!(mask & (1 << m))) continue;
        const v = u + offsets[m];
        if (dist[v] !== Infinity) continue;
        this.markDirty(v);
        dist[v] = 0 + steps[m];
        this.settle(v);
      }
    }
    return this.settledCount;
  }

  private settle(k: number): void {
    if (this.settledCount === this.settled.length) this.settled = growInt32(this.settled);
    this.settled[this.settledCount++] = k;
  }

  private seed(k: number, d: number, from: number): void {
    if (d >= this.dist[k]) return;
    if (this.dist[k] === Infinity) this.markDirty(k);
    this.dist[k] = d;
    this.parent[k] = from;
    this.heap.push(d, k);
  }

  private run(maxDistance: number, target: number): number {
    const { heap, dist, parent, offsets, steps, moves } = this;
    const scale = this.stepScale;
    while (heap.size > 0) {
      const key = heap.peekKey();
      const u = heap.pop();
      if (key > dist[u]) continue; // stale entry
      if (key > maxDistance) break;
      if (this.settledCount === this.settled.length) this.settled = growInt32(this.settled);
      this.settled[this.settledCount++] = u;
      if (u === target) break;
      const mask = moves[u];
      for (let m = 0; m < 8; m++) {
        if (!(mask & (1 << m))) continue;
        const v = u + offsets[m];
        const nd = scale ? key + steps[m] * 0.5 * (scale[u] + scale[v]) : key + steps[m];
        if (nd < dist[v]) {
          if (dist[v] === Infinity) this.markDirty(v);
          dist[v] = nd;
          parent[v] = u;
          heap.push(nd, v);
        }
      }
    }
    // Cells reached but not settled within maxDistance keep a tentative distance; clear them so that
    // `dist` is exact (or Infinity) everywhere, which callers rely on.
    for (let q = 0; q < this.dirtyCount; q++) {
      const k = this.dirty[q];
      if (dist[k] > maxDistance) dist[k] = Infinity;
    }
    return this.settledCount;
  }

  /** `fromHeap`: the seeds are in the heap (seedPoint), else already in the buckets. */
  private runBuckets(
    maxDistance: number,
    fromHeap = true,
    focus: SearchFocus | null = null,
    floor = 1,
    plain = false,
  ): number {
    const { heap, dist, offsets, steps, moves, buckets } = this;
    const scale = plain ? null : this.stepScale;
    const toFocus = focus ? this.offsetsTo(focus) : null;
    const width = this.bucketWidth;
    const gw = this.grid.width;
    const h = this.grid.cellSize;
    const last = Math.floor(maxDistance / width);
    if (fromHeap) buckets.reset(last + 1);
    // the seeds, from the heap seedPoint filled
    while (heap.size > 0) {
      const key = heap.peekKey();
      const u = heap.pop();
      if (key === dist[u] && key <= maxDistance) buckets.push(Math.floor(key / width), key, u);
    }
    for (let b = 0; b <= last; b++) {
      for (let e = buckets.take(b); e >= 0; e = buckets.take(b)) {
        const u = buckets.cellOf(e);
        const key = buckets.keyOf(e);
        if (key !== dist[u]) continue; // stale entry
        if (this.settledCount === this.settled.length) this.settled = growInt32(this.settled);
        this.settled[this.settledCount++] = u;
        if (focus && toFocus) {
          // no step from here can still reach the focus circle within maxDistance: no path is shorter
          // than `floor` times the straight line (a small margin keeps rounding on the safe side)
          let off = toFocus[u];
          if (off !== off) {
            const ui = u % gw;
            off = Math.hypot((ui + 0.5) * h - focus.x, ((u - ui) / gw + 0.5) * h - focus.y) - focus.radiusM;
            toFocus[u] = off;
          }
          if (key + floor * off > maxDistance + 1e-9) continue;
        }
        const mask = moves[u];
        for (let m = 0; m < 8; m++) {
          if (!(mask & (1 << m))) continue;
          const v = u + offsets[m];
          const nd = scale ? key + steps[m] * 0.5 * (scale[u] + scale[v]) : key + steps[m];
          const dv = dist[v];
          if (nd < dv && nd <= maxDistance) {
            if (dv === Infinity) this.markDirty(v);
            dist[v] = nd;
            buckets.push((nd / width) | 0, nd, v);
          }
        }
      }
    }
    // a seed farther than maxDistance keeps its distance until cleared, as in run()
    for (let q = 0; q < this.dirtyCount; q++) {
      const k = this.dirty[q];
      if (dist[k] > maxDistance) dist[k] = Infinity;
    }
    return this.settledCount;
  }

  /**
   * Per cell, the straight line from its centre to the focus circle (NaN until a search asks): a retry
   * screen searches from a hundred readings with one focus, and each would otherwise work out the same
   * square roots again for the cells they share (docs/decisions/0160).
   */
  private offsetsTo(focus: SearchFocus): Float64Array {
    if (this.focusOfOffsets !== focus || !this.focusOffsets) {
      this.focusOffsets = (this.focusOffsets ?? new Float64Array(this.dist.length)).fill(NaN);
      this.focusOfOffsets = focus;
    }
    return this.focusOffsets;
  }

  private focusOffsets: Float64Array | null = null;
  private focusOfOffsets: SearchFocus | null = null;

  private markDirty(k: number): void {
    if (this.dirtyCount === this.dirty.length) this.dirty = growInt32(this.dirty);
    this.dirty[this.dirtyCount++] = k;
  }

  private reset(): void {
    for (let q = 0; q < this.dirtyCount; q++) {
      const k = this.dirty[q];
      this.dist[k] = Infinity;
      this.parent[k] = -1;
    }
    this.dirtyCount = 0;
    this.settledCount = 0;
    this.heap.clear();
  }
}

// A search holds two arrays the size of the plan (about 1 MB on a 100 m x 60 m plan at 0.25 m), and an
// analysis searches the same grid again and again (each delay it tries): a search given back is lent
// to the next caller on the same grid and step scale instead of a new one. Every run resets what the
// previous one touched, so a lent search gives the same distances as a new one.
const spareSearches = new WeakMap<PlanGrid, GeodesicSearch[]>();

/** A search on this grid and step scale; give it back with `giveBackSearch` when done with it. */
export function borrowSearch(grid: PlanGrid, stepScale: Float32Array | null = null): GeodesicSearch {
  const spare = spareSearches.get(grid);
  const k = spare ? spare.findIndex((s) => s.stepScale === stepScale) : -1;
  return k >= 0 ? spare!.splice(k, 1)[0] : new GeodesicSearch(grid, stepScale);
}

/** Gives a borrowed search back; the caller must not use it afterwards. */
export function giveBackSearch(search: GeodesicSearch): void {
  const spare = spareSearches.get(search.grid) ?? [];
  if (spare.length < 4) spare.push(search);
  spareSearches.set(search.grid, spare);
}

// The allowed moves depend only on the grid, which is immutable: worked out once per grid and shared by
// every search on it (an analysis makes several searches per pipeline run, and may run it again).
const movesByGrid = new WeakMap<PlanGrid, Uint8Array>();

function movesOf(grid: PlanGrid): Uint8Array {
  let moves = movesByGrid.get(grid);
  if (!moves) {
    moves = allowedMoves(grid);
    movesByGrid.set(grid, moves);
  }
  return moves;
}

// Bit m of a cell's moves, m = 0..7: right, left, down, up, then the diagonals down-right, up-right,
// down-left, up-left, each only when both orthogonal neighbours beside it are free. Straight-line code
// per cell, without a closure or an inner loop: it runs once per grid over every cell, before the JIT
// has optimised anything (docs/decisions/0160).
function allowedMoves(grid: PlanGrid): Uint8Array {
  const { width, height, blocked } = grid;
  const out = new Uint8Array(width * height);
  for (let j = 0; j < height; j++) {
    for (let i = 0; i < width; i++) {
      const k = j * width + i;
      if (blocked[k]) continue;
      const right = i + 1 < width && !blocked[k + 1];
      const left = i > 0 && !blocked[k - 1];
      const down = j + 1 < height && !blocked[k + width];
      const up = j > 0 && !blocked[k - width];
      let mask = (right ? 1 : 0) | (left ? 2 : 0) | (down ? 4 : 0) | (up ? 8 : 0);
      if (right && down && !blocked[k + width + 1]) mask |= 16;
      if (right && up && !blocked[k - width + 1]) mask |= 32;
      if (left && down && !blocked[k + width - 1]) mask |= 64;
      if (left && up && !blocked[k - width - 1]) mask |= 128;
      out[k] = mask;
    }
  }
  return out;
}

/** Buckets of (key, cell) entries as linked lists in growable typed arrays, emptied by `reset`. */
class BucketQueue {
  private head = new Int32Array(256);
  private next = new Int32Array(4096);
  private keys = new Float64Array(4096);
  private cells = new Int32Array(4096);
  private used = 0;

  reset(count: number): void {
    if (this.head.length < count) this.head = new Int32Array(count);
    this.head.fill(-1, 0, count);
    this.used = 0;
  }

  push(bucket: number, key: number, cell: number): void {
    if (this.used === this.keys.length) this.grow();
    const e = this.used++;
    this.keys[e] = key;
    this.cells[e] = cell;
    this.next[e] = this.head[bucket];
    this.head[bucket] = e;
  }

  /** Removes an entry of the bucket and returns it, or -1 when the bucket is empty. */
  take(bucket: number): number {
    const e = this.head[bucket];
    if (e >= 0) this.head[bucket] = this.next[e];
    return e;
  }

  keyOf(e: number): number {
    return this.keys[e];
  }

  cellOf(e: number): number {
    return this.cells[e];
  }

  private grow(): void {
    const n = this.keys.length * 2;
    const next = new Int32Array(n);
    next.set(this.next);
    this.next = next;
    const keys = new Float64Array(n);
    keys.set(this.keys);
    this.keys = keys;
    const cells = new Int32Array(n);
    cells.set(this.cells);
    this.cells = cells;
  }
}

function growInt32(a: Int32Array): Int32Array {
  const b = new Int32Array(a.length * 2);
  b.set(a);
  return b;
}
