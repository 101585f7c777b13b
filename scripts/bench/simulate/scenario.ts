// One benchmark store end to end: invent the layout, rasterise it, blow a weak drift through it, solve
// the steady gas field of each leak (and of the benign zone when it emits), then let a technician sweep
// it with a lagging, noisy instrument. The result is the locator's command-line input plus the truth.
import { createGrid, fillRect, sampleField, cellOf, type Grid, type Rect } from "./grid";
import { potentialDrift, terminalFlows, type AirTerminal } from "./drift";
import { createRandom, logUniform, type Random } from "./random";
import { Sensor } from "./sensor";
import { generateLayout, round } from "./store-plan";
import type { Family, FixtureSpec, StoreLayout } from "./store-types";
import { Technician } from "./technician";
import { buildOperator, solveSteady, type TransportOperator } from "./transport";
import { buildWalkMap, type WalkMap } from "./walk-path";
import { chooseLeaks, type TrueLeak } from "./leak-sites";
import { stillAirPass } from "./still-air-pass";

export interface World {
  layout: StoreLayout;
  map: WalkMap;
  technician: Technician;
  plan: Scenario["input"]["plan"];
  instrument: Scenario["input"]["instrument"];
  truth: Scenario["truth"];
  notes: Omit<Scenario["notes"], "samplesInSolid">;
  /** Probe positions on a solid cell so far: should stay zero (a routing fault otherwise). */
  samplesInSolid: () => number;
  /** The store's own random stream, for what the technician decides after the first pass. */
  random: Random;
  /** Stops the fans of one fixture: the technician from now on samples the air solved without them. */
  stopFans: (fixtureId: string) => void;
  /** Each leak's own mean concentration at a point, ppm, at the strength it was given (diagnostic oracles only). */
  leakAir: (x: number, y: number) => number[];
  /**
   * The physics for a diagnostic ceiling (scripts/bench/oracle-along-case.ts): the steady field of a unit
   * leak at (x, y) in the sweep's air, as a sampler of the plan. Draws nothing from the random stream.
   */
  unitLeakAir: (x: number, y: number) => (px: number, py: number) => number;
  /** The instrument's noise and the ambient level the probe sees, as drawn for this store. */
  noise: { sigma: number; slowShare: number; slowCorrelationS: number; displayNoisePpm: number; ambientPpm: number };
}

export interface Scenario {
  input: {
    plan: {
      width: number;
      height: number;
      obstacles: { id: string; polygon: number[][] }[];
      fixtures: { id: string; kind: string; polygon: number[][]; fans: boolean }[];
      riskPoints: { id: string; kind: string; x: number; y: number }[];
      backgroundZones: { id: string; polygon: number[][]; note: string }[];
    };
    instrument: { transportDelayS: number; timeConstantS: number; alarmPpm: number };
    readings: { x: number; y: number; t: number; ppm: number; atLeast?: boolean; pass?: string }[];
    /** Pinpoint passes (the pinpoint-pass family): the fans of one fixture stopped. */
    passes?: { id: string; fans: "stopped"; fixture: string }[];
  };
  truth: { family: Family; leaks: TrueLeak[]; benignZoneActive: boolean };
  /** Simulation facts for the log, not part of either file. */
  notes: { cells: number; cellSize: number; solveIterations: number[]; peakPpm: number[]; samplesInSolid: number };
}

const polygon = (r: Rect) => [
  [r.x0, r.y0],
  [r.x1, r.y0],
  [r.x1, r.y1],
  [r.x0, r.y1],
];
const isCase = (f: FixtureSpec) => f.kind === "open-case" || f.kind === "door-case" || f.kind === "island-case";

function rasterise(
  layout: StoreLayout,
  random: Random,
): { grid: Grid; diffusivity: Float64Array; caseMask: Uint8Array; aisle: number } {
  const h = layout.width * layout.height > 2500 ? 0.2 : 0.15;
  const grid = createGrid(layout.width, layout.height, h);
  const aisle = random.uniform(0.01, 0.05); // eddy diffusivity of aisle air, m^2/s
  const diffusivity = new Float64Array(grid.nx * grid.ny).fill(aisle);
  const caseMask = new Uint8Array(grid.nx * grid.ny);
  for (const f of layout.fixtures) {
    // Running fans stir a fixture's air hard; with them stopped the cold air lies still.
    const k = f.fans ? random.uniform(0.1, 0.3) : aisle * random.uniform(0.4, 1);
    fillRect(grid, diffusivity, f.rect, k);
    if (isCase(f)) fillRect(grid, caseMask, f.rect, 1);
  }
  // Case units in a lineup are separate boxes: their end frames pass only aisle-like mixing between
  // neighbours, so one unit's fans do not stir the whole lineup.
  for (const f of layout.fixtures) {
    if (f.kind !== "open-case" && f.kind !== "door-case") continue;
    const { x0, y0, x1, y1 } = f.rect;
    const alongY = f.back === "x0" || f.back === "x1";
    fillRect(grid, diffusivity, alongY ? { x0, y0, x1, y1: y0 + h } : { x0, y0, x1: x0 + h, y1 }, aisle);
  }
  for (const s of layout.solids) fillRect(grid, grid.solid, s.rect, 1);
  return { grid, diffusivity, caseMask, aisle };
}

function airTerminals(layout: StoreLayout, random: Random): AirTerminal[] {
  const floorTop = Math.min(...layout.fixtures.filter((f) => f.kind === "open-case").map((f) => f.rect.y0));
  const spot = (): [number, number] => [
    random.uniform(3, layout.width - 3),
    random.uniform(floorTop + 2, layout.height - 3),
  ];
  const out: AirTerminal[] = [];
  for (let k = random.int(3, 6); k > 0; k--) out.push({ ...xy(spot()), radius: 1.2, sign: 1 });
  for (let k = random.int(1, 3); k > 0; k--) out.push({ ...xy(spot()), radius: 1.2, sign: -1 });
  return out;
}
const xy = (p: [number, number]) => ({ x: p[0], y: p[1] });

/** Highest value of a field along every sweep leg, sampled every 0.2 m: what a careful sweep could see. */
function peakAlongLegs(layout: StoreLayout, grid: Grid, field: Float64Array): number {
  let peak = 0;
  for (const leg of layout.legs) {
    for (let k = 1; k < leg.points.length; k++) {
      const [a, b] = [leg.points[k - 1], leg.points[k]];
      const n = Math.max(1, Math.ceil(Math.hypot(b[0] - a[0], b[1] - a[1]) / 0.2));
      for (let s = 0; s <= n; s++)
        peak = Math.max(peak, sampleField(grid, field, a[0] + ((b[0] - a[0]) * s) / n, a[1] + ((b[1] - a[1]) * s) / n));
    }
  }
  return peak;
}

function solveFor(op: TransportOperator, grid: Grid, cells: number[], iterations: number[]): Float64Array {
  const src = new Float64Array(grid.nx * grid.ny);
  for (const k of cells) src[k] += 1 / (grid.h * grid.h) / cells.length;
  const res = solveSteady(op, src, 1e-8);
  iterations.push(res.iterations);
  return res.field;
}

/**
 * One simulated store before anyone sweeps it: the layout, the solved gas field, the instrument and a
 * technician standing at the first case with the detector warmed up. The benchmark sweeps every leg;
 * the guidance benchmark (scripts/bench/guide/) lets a policy decide where the technician goes next.
 */
export function buildWorld(family: Family, key: number): World {
  const random = createRandom(key);
  const layout = generateLayout(random);
  for (const f of layout.fixtures) f.fans = family === "single-still" && isCase(f) ? false : true;
  const { grid, diffusivity, caseMask, aisle } = rasterise(layout, random);
  const ach = random.uniform(1.5, 4); // air changes per hour, including exchange with the air above
  const drift = potentialDrift(grid, terminalFlows(grid, airTerminals(layout, random)), random.uniform(0.02, 0.08));
  const op = buildOperator(grid, diffusivity, ach / 3600, drift);
  const leaks = chooseLeaks(family, layout, grid, random);
  const iterations: number[] = [];
  const peaks: number[] = [];
  const total = new Float64Array(grid.nx * grid.ny);
  const scales: number[] = [];
  const leakFields: Float64Array[] = [];
  for (const leak of leaks) {
    const g = solveFor(op, grid, [cellOf(grid, leak.x, leak.y)], iterations);
    // Strength is set by what the sweep could see, so every benchmark leak is findable in principle.
    const target = family === "single-still" ? logUniform(random, 5, 40) : logUniform(random, 3, 25);
    const scale = target / peakAlongLegs(layout, grid, g);
    for (let k = 0; k < total.length; k++) total[k] += scale * g[k];
    leakFields.push(g.map((v) => scale * v));
    scales.push(scale);
    peaks.push(round(target));
  }
  // What the technician's probe samples: the solved field, or after a fixture's fans are stopped, the
  // field solved again with that fixture's air still (the same leaks at the same strengths).
  let air = total;
  const stopFans = (fixtureId: string) => {
    const f = layout.fixtures.find((x) => x.id === fixtureId);
    if (!f) throw new Error(`stop fans: no fixture ${fixtureId}`);
    const still = Float64Array.from(diffusivity);
    fillRect(grid, still, f.rect, aisle * random.uniform(0.4, 1));
    const op2 = buildOperator(grid, still, ach / 3600, drift);
    const field = new Float64Array(grid.nx * grid.ny);
    leaks.forEach((leak, i) => {
      const g = solveFor(op2, grid, [cellOf(grid, leak.x, leak.y)], iterations);
      for (let k = 0; k < field.length; k++) field[k] += scales[i] * g[k];
    });
    air = field;
  };
  const zoneActive = family === "bg-zone";
  const zoneListed = zoneActive || random.chance(0.5);
  if (zoneActive) {
    const cells: number[] = [];
    const z = layout.zone.rect;
    for (let y = z.y0 + grid.h / 2; y < z.y1; y += grid.h) {
      for (let x = z.x0 + grid.h / 2; x < z.x1; x += grid.h) {
        const k = cellOf(grid, x, y);
        if (!grid.solid[k]) cells.push(k);
      }
    }
    const g = solveFor(op, grid, cells, iterations);
    let peak = 0;
    for (const k of cells) peak = Math.max(peak, g[k]);
    const scale = random.uniform(2.5, 6) / peak;
    for (let k = 0; k < total.length; k++) total[k] += scale * g[k];
  }
  const instrument = {
    transportDelayS: round(random.uniform(3, 7)),
    timeConstantS: round(random.uniform(0.5, 3)),
    alarmPpm: 2,
  };
  const dt = 0.05;
  const sensor = new Sensor(
    {
      dt,
      ...instrument,
      sigma: random.uniform(0.25, 0.35),
      slowShare: random.uniform(0.4, 0.8),
      slowCorrelationS: random.uniform(1, 4),
      displayNoisePpm: 0.5,
      rangePpm: 200,
    },
    random,
  );
  const speed = random.uniform(0.7, 1.2);
  const ambientPpm = random.uniform(0, 0.6);
  let samplesInSolid = 0; // probe positions on a solid cell: should stay zero (a routing fault otherwise)
  const tech = new Technician(
    {
      speed,
      stopSpacing: [1.2, 1.5],
      dwellS: [1, 4],
      recheckSpacing: [0.55, 0.65],
      recheckDwellS: [2, 4],
      recheckSpeedFactor: 0.6,
      tapJitter: 0.3 / Math.SQRT2,
      alarmPpm: instrument.alarmPpm,
    },
    sensor,
    dt,
    (x, y) => {
      if (grid.solid[cellOf(grid, x, y)]) samplesInSolid++;
      return sampleField(grid, air, x, y);
    },
    ambientPpm,
    random,
    layout,
    layout.legs[0].points[0],
    15,
  );
  const map = buildWalkMap(grid, caseMask);
  const plan: Scenario["input"]["plan"] = {
    width: layout.width,
    height: layout.height,
    obstacles: layout.solids.map((s) => ({ id: s.id, polygon: polygon(s.rect) })),
    fixtures: layout.fixtures.map((f) => ({ id: f.id, kind: f.kind, polygon: polygon(f.rect), fans: f.fans })),
    riskPoints: layout.riskPoints.map((p) => ({ id: p.id, kind: p.kind, x: p.x, y: p.y })),
    backgroundZones: zoneListed
      ? [{ id: layout.zone.id, polygon: polygon(layout.zone.rect), note: layout.zone.note }]
      : [],
  };
  return {
    layout,
    map,
    technician: tech,
    plan,
    instrument,
    truth: { family, leaks, benignZoneActive: zoneActive },
    notes: { cells: grid.nx * grid.ny, cellSize: grid.h, solveIterations: iterations, peakPpm: peaks },
    samplesInSolid: () => samplesInSolid,
    random,
    stopFans,
    leakAir: (x, y) => leakFields.map((f) => sampleField(grid, f, x, y)),
    unitLeakAir: (x, y) => {
      const g = solveFor(op, grid, [cellOf(grid, x, y)], []);
      return (px, py) => sampleField(grid, g, px, py);
    },
    noise: { ...sensor.noise, ambientPpm },
  };
}

/**
 * Which case the technician stills in the pinpoint-pass family, given the first pass as the locator's
 * input: a fixture id, or null for the trade's rule. Data handed in from outside, so this folder never
 * imports locator code.
 */
export type PassCaseChoice = (firstPass: Scenario["input"]) => string | null;

export function buildScenario(family: Family, key: number, passCase?: PassCaseChoice): Scenario {
  const world = buildWorld(family, key);
  for (const leg of world.layout.legs) world.technician.sweep(world.map, leg);
  const chosen = () =>
    passCase?.({
      plan: world.plan,
      instrument: world.instrument,
      readings: world.technician.readings.map((r) => ({ ...r })),
    }) ?? null;
  const passes =
    family === "pinpoint-pass" ? [stillAirPass({ ...world, delayS: world.instrument.transportDelayS }, chosen())] : [];
  return {
    input: {
      plan: world.plan,
      instrument: world.instrument,
      readings: world.technician.readings,
      ...(passes.length ? { passes } : {}),
    },
    truth: world.truth,
    notes: { ...world.notes, samplesInSolid: world.samplesInSolid() },
  };
}
