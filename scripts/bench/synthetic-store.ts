// A synthetic 100 m x 60 m store for the speed benchmark only (its readings follow a simple made-up
// plume; accuracy is measured by bench:locate on the scenario generator's stores, not here).
import type { LocatorInputRaw } from "#core/contracts/locator-input";

type Poly = [number, number][];
const rect = (x0: number, y0: number, x1: number, y1: number): Poly => [
  [x0, y0],
  [x1, y0],
  [x1, y1],
  [x0, y1],
];

/** Deterministic pseudo-random numbers (mulberry32), so every run times the same store. */
function random(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export function syntheticStore(readingCount: number, seed = 7): LocatorInputRaw {
  const W = 100;
  const H = 60;
  const rnd = random(seed);
  const obstacles = [
    { id: "wall-n", polygon: rect(0, 0, W, 0.3) },
    { id: "wall-s", polygon: rect(0, H - 0.3, W, H) },
    { id: "wall-w", polygon: rect(0, 0, 0.3, H) },
    { id: "wall-e", polygon: rect(W - 0.3, 0, W, H) },
    // back-room wall with two door gaps
    { id: "wall-back-1", polygon: rect(0.3, 10, 30, 10.25) },
    { id: "wall-back-2", polygon: rect(32, 10, 70, 10.25) },
    { id: "wall-back-3", polygon: rect(72, 10, W - 0.3, 10.25) },
  ];
  const fixtures: LocatorInputRaw["plan"]["fixtures"] = [];
  // eight case lineups, each a gondola spine between two cases
  for (let row = 0; row < 8; row++) {
    const x0 = 8 + row * 11;
    obstacles.push({ id: `gondola-${row}`, polygon: rect(x0 + 1.1, 16, x0 + 2.3, 52) });
    fixtures.push({ id: `case-${row}-a`, kind: "open-case", polygon: rect(x0, 16, x0 + 1.1, 52), fans: true });
    fixtures.push({ id: `case-${row}-b`, kind: "island-case", polygon: rect(x0 + 2.3, 16, x0 + 3.4, 52), fans: false });
  }
  fixtures.push({ id: "walkin-1", kind: "walk-in", polygon: rect(4, 2, 14, 8), fans: true });
  const leak = [41.7, 30];
  const readings: LocatorInputRaw["readings"] = [];
  // serpentine walk up and down the aisles between lineups, spread to the requested count
  const aisles = Array.from({ length: 9 }, (_, k) => 5 + k * 11 - 0.5);
  const path: [number, number][] = [];
  aisles.forEach((x, k) => {
    const down = k % 2 === 0;
    path.push([x, down ? 13 : 55], [x, down ? 55 : 13]);
  });
  const legs: number[] = [];
  let total = 0;
  for (let k = 1; k < path.length; k++) {
    const d = Math.hypot(path[k][0] - path[k - 1][0], path[k][1] - path[k - 1][1]);
    legs.push(d);
    total += d;
  }
  let t = 0;
  for (let r = 0; r < readingCount; r++) {
    let s = (r / readingCount) * total;
    let k = 0;
    while (k < legs.length - 1 && s > legs[k]) s -= legs[k++];
    const f = s / legs[k];
    const x = path[k][0] + f * (path[k + 1][0] - path[k][0]) + (rnd() - 0.5) * 0.6;
    const y = path[k][1] + f * (path[k + 1][1] - path[k][1]) + (rnd() - 0.5) * 0.6;
    const d = Math.hypot(x - leak[0], y - leak[1]);
    const ppm = Math.round(40 * Math.exp(-d / 3) * Math.exp(0.3 * (rnd() * 2 - 1)) + rnd());
    t += 1.2 + rnd() * 2;
    readings.push({ x, y, t: Math.round(t * 10) / 10, ppm });
  }
  return {
    plan: {
      width: W,
      height: H,
      obstacles,
      fixtures,
      riskPoints: [{ id: "ls-1", kind: "line-set", x: 41.5, y: 30 }],
      backgroundZones: [],
    },
    instrument: { transportDelayS: 5, timeConstantS: 1.5, alarmPpm: 2 },
    readings,
  };
}
