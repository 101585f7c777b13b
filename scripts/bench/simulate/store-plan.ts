// Invents a supermarket: outer walls, a back room behind a partition with door gaps, walk-ins and a
// machine room (panel walls with a door gap), perimeter cases, case lineups and gondolas on the sales
// floor, island cases and checkouts at the front. Sizes follow the benchmark's ranges (40–80 m by
// 25–50 m); everything is an axis-aligned rectangle so rasterising it is exact.
import type { Rect } from "./grid";
import type { Random } from "./random";
import type {
  FixtureKind,
  FixtureSpec,
  Leg,
  Point,
  RiskPointSpec,
  Side,
  SolidBody,
  StoreLayout,
  ZoneSpec,
} from "./store-types";

const WALL = 0.3;
const PANEL = 0.2;
const PROBE_IN = 0.1; // the probe is held just inside the case front (at the grille / air curtain)

class Builder {
  solids: SolidBody[] = [];
  fixtures: FixtureSpec[] = [];
  riskPoints: RiskPointSpec[] = [];
  legs: Leg[] = [];
  private counts = new Map<string, number>();
  constructor(readonly random: Random) {}
  id(prefix: string): string {
    const n = (this.counts.get(prefix) ?? 0) + 1;
    this.counts.set(prefix, n);
    return `${prefix}-${n}`;
  }
  solid(prefix: string, rect: Rect) {
    this.solids.push({ id: this.id(prefix), rect });
  }
  fixture(kind: FixtureKind, rect: Rect, back: Side): FixtureSpec {
    const prefix =
      kind === "walk-in" ? "walkin" : kind === "machine-room" ? "machine" : kind === "island-case" ? "island" : "case";
    const f: FixtureSpec = { id: this.id(prefix), kind, rect, fans: true, back };
    this.fixtures.push(f);
    return f;
  }
  risk(kind: RiskPointSpec["kind"], x: number, y: number, fixtureId: string) {
    const prefix = kind === "line-set" ? "ls" : kind;
    this.riskPoints.push({ id: this.id(prefix), kind, x: round(x), y: round(y), fixtureId });
  }
  /** A panel-walled room whose door gap is on its lower (y1) side; returns the air inside. */
  room(outer: Rect, doorX: number, doorWidth: number, walls: { top: boolean; right: boolean }): Rect {
    const { x0, y0, x1, y1 } = outer;
    if (walls.top) this.solid("panel", { x0, y0, x1, y1: y0 + PANEL });
    this.solid("panel", { x0, y0, x1: x0 + PANEL, y1 });
    if (walls.right) this.solid("panel", { x0: x1 - PANEL, y0, x1, y1 });
    this.solid("panel", { x0, y0: y1 - PANEL, x1: doorX, y1 });
    this.solid("panel", { x0: doorX + doorWidth, y0: y1 - PANEL, x1, y1 });
    return { x0: x0 + PANEL, y0: walls.top ? y0 + PANEL : y0, x1: walls.right ? x1 - PANEL : x1, y1: y1 - PANEL };
  }
}

export function round(v: number): number {
  return Math.round(v * 100) / 100;
}

/** Splits [a, b] into case units 2.4–3.7 m long (8 and 12 ft lineups), merging a short remainder. */
function units(random: Random, a: number, b: number): [number, number][] {
  const out: [number, number][] = [];
  let s = a;
  while (b - s > 0.5) {
    let len = random.uniform(2.4, 3.7);
    if (b - (s + len) < 1.5) len = b - s;
    out.push([s, s + len]);
    s += len;
  }
  return out;
}

/** A rectangular loop inset from a room's walls, starting at the corner nearest the door. */
function roomLoop(air: Rect, inset: number, doorX: number): Point[] {
  const x0 = air.x0 + inset,
    x1 = air.x1 - inset,
    y0 = air.y0 + inset,
    y1 = air.y1 - inset;
  const leftFirst = Math.abs(doorX - x0) < Math.abs(doorX - x1);
  return leftFirst
    ? [
        [x0, y1],
        [x0, y0],
        [x1, y0],
        [x1, y1],
        [x0, y1],
      ]
    : [
        [x1, y1],
        [x1, y0],
        [x0, y0],
        [x0, y1],
        [x1, y1],
      ];
}

function backRoom(b: Builder, width: number, depth: number): { zone: ZoneSpec; doors: number[] } {
  const r = b.random;
  const top = WALL;
  // Walk-ins along the rear wall, each a panel box with a 1 m door on the corridor side.
  const walkins: { air: Rect; doorX: number }[] = [];
  let x = WALL + r.uniform(1.5, 2.5);
  const count = r.int(2, 3);
  const maxDepth = Math.min(4.5, depth - WALL - 2.2);
  for (let k = 0; k < count; k++) {
    const w = r.uniform(3, 5);
    const d = r.uniform(Math.min(3, maxDepth), maxDepth);
    const doorX = r.uniform(x + PANEL + 0.3, x + w - PANEL - 1.3);
    const air = b.room({ x0: x, y0: top, x1: x + w, y1: top + d }, doorX, 1.0, { top: true, right: true });
    const f = b.fixture("walk-in", air, "y0");
    b.risk("coil", (air.x0 + air.x1) / 2, air.y0 + 0.35, f.id);
    b.risk("line-set", air.x0 + 0.3, air.y0 + 0.3, f.id);
    walkins.push({ air, doorX: doorX + 0.5 });
    x += w + r.uniform(0.5, 1.5);
  }
  const walkinEnd = x;
  // Machine room in the corner: valves, a line-set header, fans (ventilation) always running.
  // The corridor runs between the walk-ins and the partition; the machine room must end above it.
  const corridorY = (top + maxDepth + depth) / 2 + 0.2;
  const mdMax = corridorY - 0.8 - top;
  const mw = r.uniform(4, 6),
    md = r.uniform(Math.min(4, mdMax), mdMax);
  const mx = width - WALL - mw;
  const mDoor = mx + r.uniform(0.5, 1.2);
  const machineAir = b.room({ x0: mx, y0: top, x1: width - WALL, y1: top + md }, mDoor, 1.0, {
    top: false,
    right: false,
  });
  const machine = b.fixture("machine-room", machineAir, "y0");
  for (let k = r.int(2, 4); k > 0; k--) {
    b.risk(
      "valve",
      r.uniform(machineAir.x0 + 0.5, machineAir.x1 - 0.5),
      r.uniform(machineAir.y0 + 0.5, machineAir.y1 - 0.5),
      machine.id,
    );
  }
  b.risk("line-set", machineAir.x0 + 0.4, machineAir.y0 + 0.4, machine.id);
  // Dry storage with aerosol cans between the walk-ins and the machine room, across the corridor.
  const zw = r.uniform(3, 4.5);
  const zx = r.uniform(walkinEnd + 0.5, Math.max(walkinEnd + 0.5, mx - zw - 1));
  const zone: ZoneSpec = {
    id: "zone-1",
    rect: { x0: round(zx), y0: round(top + 0.4), x1: round(zx + zw), y1: round(depth - 0.3) },
    note: r.pick([
      "aerosol storage: cans of the same gas",
      "cleaning and aerosol stock",
      "bakery storage: aerosol cans",
    ]),
  };
  // Partition between back room and sales floor, with two door gaps.
  const doors = [r.uniform(0.2, 0.4) * width, r.uniform(0.6, 0.8) * width];
  let px = WALL;
  for (const d of doors) {
    b.solid("wall", { x0: px, y0: depth, x1: d - 0.9, y1: depth + 0.25 });
    px = d + 0.9;
  }
  b.solid("wall", { x0: px, y0: depth, x1: width - WALL, y1: depth + 0.25 });
  // Back-room sweep: machine room, then the corridor past the storage, then each walk-in.
  b.legs.push({ points: roomLoop(machineAir, 0.6, mDoor), label: "machine room" });
  b.legs.push({
    points: [
      [mDoor + 0.5, corridorY],
      [WALL + 1.0, corridorY],
    ],
    label: "back-room corridor",
  });
  for (const w of walkins) b.legs.push({ points: roomLoop(w.air, 0.5, w.doorX), label: "walk-in" });
  return { zone, doors };
}

/** Cases along a wall or partition; the probe runs just inside their fronts. */
function perimeterCases(
  b: Builder,
  kind: FixtureKind,
  along: "x" | "y",
  fixed: [number, number],
  from: number,
  to: number,
  gaps: number[],
) {
  const r = b.random;
  const runs: [number, number][] = [];
  let s = from;
  for (const g of [...gaps].sort((a, c) => a - c)) {
    if (g - 1.2 > s + 1.5) runs.push([s, g - 1.2]);
    s = Math.max(s, g + 1.2);
  }
  if (to > s + 1.5) runs.push([s, to]);
  for (const [a, c] of runs) {
    for (const [u0, u1] of units(r, a, c)) {
      const rect =
        along === "y" ? { x0: fixed[0], y0: u0, x1: fixed[1], y1: u1 } : { x0: u0, y0: fixed[0], x1: u1, y1: fixed[1] };
      const f = b.fixture(kind, rect, along === "y" ? "x0" : "y0");
      if (along === "y") {
        b.risk("coil", (fixed[0] + fixed[1]) / 2, (u0 + u1) / 2, f.id);
        if (r.chance(0.5)) b.risk("line-set", fixed[0] + 0.2, u0 + 0.35, f.id);
      } else {
        b.risk("coil", (u0 + u1) / 2, (fixed[0] + fixed[1]) / 2, f.id);
        if (r.chance(0.5)) b.risk("line-set", u0 + 0.35, fixed[0] + 0.2, f.id);
      }
    }
  }
  return runs;
}

export function generateLayout(random: Random): StoreLayout {
  for (let attempt = 0; attempt < 50; attempt++) {
    const layout = tryLayout(random);
    if (layout) return layout;
  }
  throw new Error("store layout: no usable layout after 50 attempts");
}

function tryLayout(r: Random): StoreLayout | null {
  const b = new Builder(r);
  const width = round(r.uniform(40, 80)),
    height = round(r.uniform(25, 50));
  b.solid("wall", { x0: 0, y0: 0, x1: width, y1: WALL });
  b.solid("wall", { x0: 0, y0: height - WALL, x1: width, y1: height });
  b.solid("wall", { x0: 0, y0: 0, x1: WALL, y1: height });
  b.solid("wall", { x0: width - WALL, y0: 0, x1: width, y1: height });
  const depth = Math.min(9, Math.max(6, 0.2 * height)) + r.uniform(-0.3, 0.5);
  const { zone, doors } = backRoom(b, width, depth);
  const floorTop = depth + 0.25;
  const frontDepth = r.uniform(8.5, 10.5);
  const yTop = floorTop + 1.0 + r.uniform(2.5, 3.5);
  const yBot = height - WALL - frontDepth;
  if (yBot - yTop < 6) return null;
  const cd = r.uniform(0.9, 1.1);
  // Perimeter: glass-door cases along the left wall, open cases along the partition.
  const leftRuns = perimeterCases(b, "door-case", "y", [WALL, WALL + cd], floorTop + cd + 2.5, yBot + 1.5, []);
  const partRuns = perimeterCases(
    b,
    "open-case",
    "x",
    [floorTop, floorTop + cd],
    WALL + cd + 2.5,
    width - WALL - 2.5,
    doors,
  );
  const leftLeg: Point[] = [
    [WALL + cd - PROBE_IN, leftRuns[leftRuns.length - 1][1]],
    [WALL + cd - PROBE_IN, leftRuns[0][0]],
  ];
  const partLeg: Point[] = [
    [partRuns[0][0], floorTop + cd - PROBE_IN],
    [partRuns[partRuns.length - 1][1], floorTop + cd - PROBE_IN],
  ];
  // Lineups (back-to-back cases on a solid spine) and gondolas (solid shelving) across the floor.
  const rowLegs: Leg[] = [];
  let x = WALL + cd + r.uniform(2.4, 3.0);
  let lineups = 0;
  while (true) {
    const lineup = r.chance(0.6);
    const w = lineup ? 2 * cd + 0.15 : r.uniform(1.2, 1.5);
    if (x + w > width - WALL - 2.5) break;
    if (lineup) {
      lineups++;
      const kind: FixtureKind = r.chance(0.7) ? "open-case" : "door-case";
      b.solid("spine", { x0: x + cd, y0: yTop, x1: x + cd + 0.15, y1: yBot });
      for (const [u0, u1] of units(r, yTop, yBot)) {
        const left = b.fixture(kind, { x0: x, y0: u0, x1: x + cd, y1: u1 }, "x1");
        const right = b.fixture(kind, { x0: x + cd + 0.15, y0: u0, x1: x + w, y1: u1 }, "x0");
        b.risk("coil", x + cd / 2, (u0 + u1) / 2, left.id);
        b.risk("coil", x + cd + 0.15 + cd / 2, (u0 + u1) / 2, right.id);
        if (r.chance(0.5)) b.risk("line-set", x + cd - 0.2, u0 + 0.35, left.id);
        if (r.chance(0.5)) b.risk("line-set", x + cd + 0.35, u1 - 0.35, right.id);
      }
      rowLegs.push({
        points: [
          [x + PROBE_IN, yTop],
          [x + PROBE_IN, yBot],
        ],
        label: "lineup west face",
      });
      rowLegs.push({
        points: [
          [x + w - PROBE_IN, yBot],
          [x + w - PROBE_IN, yTop],
        ],
        label: "lineup east face",
      });
    } else {
      b.solid("gondola", { x0: x, y0: yTop, x1: x + w, y1: yBot });
    }
    x += w + r.uniform(2.2, 3.0);
  }
  if (lineups < 2) return null;
  // Front: checkouts (solid) and island cases (air volumes with a spine of wells along the centre).
  const coTop = height - WALL - 1.5 - 2.5;
  let cx = r.uniform(0.45, 0.55) * width;
  for (let k = r.int(3, 6); k > 0 && cx + 0.9 < width - WALL - 1.5; k--) {
    b.solid("checkout", { x0: cx, y0: coTop, x1: cx + 0.9, y1: coTop + 2.5 });
    cx += 0.9 + r.uniform(1.6, 2.2);
  }
  const islandLegs: Leg[] = [];
  const iw = r.uniform(1.8, 2.2);
  const iy = (yBot + coTop) / 2 - iw / 2;
  let ix = WALL + cd + r.uniform(2.5, 4);
  for (let k = r.int(1, 3); k > 0; k--) {
    const len = r.uniform(3.5, 6);
    if (ix + len > 0.45 * width - 2 || iy - yBot < 1.0) break;
    const rect = { x0: ix, y0: iy, x1: ix + len, y1: iy + iw };
    const f = b.fixture("island-case", rect, "centre-y");
    b.risk("coil", ix + len / 2, iy + iw / 2, f.id);
    b.risk("line-set", ix + 0.4, iy + iw / 2, f.id);
    const p = PROBE_IN;
    islandLegs.push({
      points: [
        [ix + p, iy + p],
        [ix + len - p, iy + p],
        [ix + len - p, iy + iw - p],
        [ix + p, iy + iw - p],
        [ix + p, iy + p],
      ],
      label: "island",
    });
    ix += len + r.uniform(2.5, 4);
  }
  // Sweep order: left wall north, partition east, back room, then lineups west to east, islands.
  const backLegs = b.legs;
  b.legs = [
    { points: leftLeg, label: "left wall cases" },
    { points: partLeg, label: "partition cases" },
    ...backLegs,
    ...rowLegs,
    ...islandLegs,
  ];
  const roundRect = (q: Rect): Rect => ({ x0: round(q.x0), y0: round(q.y0), x1: round(q.x1), y1: round(q.y1) });
  for (const s of b.solids) s.rect = roundRect(s.rect);
  for (const f of b.fixtures) f.rect = roundRect(f.rect);
  return { width, height, solids: b.solids, fixtures: b.fixtures, riskPoints: b.riskPoints, zone, legs: b.legs };
}
