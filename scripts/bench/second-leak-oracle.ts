// A measured ceiling for the second leak of two-leak stores (`tsx scripts/bench/second-leak-oracle.ts DIR
// [first last] [--all] [--settings JSON]`). An oracle: it rebuilds each store with the simulator and asks
// its forward model, which knows the physics, what each leak alone adds to every reading (the sensor's
// mean response, no noise). A second leak whose gas stays under the readings' noise cannot be found by
// any method. For the stores the locator fails (both leaks not among the first four), it also prints
// where the residual after the locator's first fitted source peaks, and where the fitted sources sit.
// Measuring, not tuning: nothing here feeds back into the locator.
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { createPlanGrid } from "#core/analysis/grid/plan-grid";
import { locate } from "#core/analysis/locate";
import { readingAir } from "#core/analysis/locator/pass-air";
import { casesRunFans, fanStepScale } from "#core/analysis/locator/plan-masks";
import { settingsWith } from "./settings-override";
import { residualOf } from "#core/analysis/locator/greedy-sources";
import { fieldStage } from "#core/analysis/pipeline/field-stage";
import { lagStage } from "#core/analysis/pipeline/lag-stage";
import { passFitOf } from "#core/analysis/pipeline/pass-fit";
import { sourcesStage } from "#core/analysis/pipeline/sources-stage";
import { zonesStage } from "#core/analysis/pipeline/zones-stage";
import { parseLocatorInput } from "#core/contracts/locator-input";
import { buildWorld } from "./simulate/scenario";
import { storeName, storeStream } from "./simulate/store-types";

const args = process.argv.slice(2);
const take = (flag: string) => {
  const i = args.indexOf(flag);
  return i >= 0 ? args.splice(i, 2)[1] : undefined;
};
const all = args.includes("--all") ? (args.splice(args.indexOf("--all"), 1), true) : false;
const settingsJson = take("--settings");
const [dir, firstArg, lastArg] = args;
const first = Number(firstArg ?? 1001);
const last = Number(lastArg ?? 1030);
const settings = settingsWith(settingsJson);

type P = { x: number; y: number };
const dist = (a: P, b: P) => Math.hypot(a.x - b.x, a.y - b.y);
const DT = 0.05; // the simulator's sensor step (scenario.ts)
const PREROLL_S = 15;

/** Each leak's noise-free share of every reading: the simulator's walk replayed through the sensor's mean response. */
function leakShares(n: number): { shares: number[][]; readings: { x: number; y: number; t: number; ppm: number }[] } {
  const world = buildWorld("two-leaks", storeStream("two-leaks", n));
  const tech = world.technician as unknown as {
    air: (x: number, y: number) => number;
    sensor: { read: () => unknown };
  };
  const start = world.layout.legs[0].points[0];
  const probe: [number, number][] = [];
  // the constructor's warm-up ticks at the first case, counted as it counts them
  for (let t = -PREROLL_S; t < 0; t += DT) probe.push([start[0], start[1]]);
  const air = tech.air;
  tech.air = (x, y) => {
    probe.push([x, y]);
    return air(x, y);
  };
  const taps: number[] = [];
  const read = tech.sensor.read.bind(tech.sensor);
  tech.sensor.read = () => {
    taps.push(probe.length);
    return read();
  };
  for (const leg of world.layout.legs) world.technician.sweep(world.map, leg);
  const { transportDelayS, timeConstantS } = world.instrument;
  const delay = Math.round(transportDelayS / DT);
  const gain = 1 - Math.exp(-DT / timeConstantS);
  const leaks = world.truth.leaks.length;
  const perTick = probe.map(([x, y]) => world.leakAir(x, y));
  const shares: number[][] = [];
  for (let l = 0; l < leaks; l++) {
    let response = 0;
    const out: number[] = [];
    let next = 0;
    for (let k = 0; k < perTick.length; k++) {
      const idx = k - delay;
      response += gain * ((idx >= 0 ? perTick[idx][l] : 0) - response);
      while (next < taps.length && taps[next] === k + 1) {
        out.push(response);
        next++;
      }
    }
    shares.push(out);
  }
  return { shares, readings: world.technician.readings };
}

/** Standard deviation of a reading around its mean, ppm: display noise, rounding, log-normal fluctuation (sensor.ts). */
const noiseSd = (mean: number) => Math.sqrt(0.5 ** 2 + 1 / 12 + (0.3 * mean) ** 2);

let findable = 0;
let failing = 0;
for (let n = first; n <= last; n++) {
  const name = storeName("two-leaks", n);
  const raw = JSON.parse(readFileSync(join(dir, `${name}.json`), "utf8"));
  const truth = JSON.parse(readFileSync(join(dir, `${name}.truth.json`), "utf8"));
  const input = parseLocatorInput(raw);
  const result = locate(input, {}, settings);
  const cands = result.candidates;
  const both = truth.leaks.every((l: P) => cands.slice(0, 4).some((k) => dist(k, l) <= 1.5));
  if (both && !all) continue;
  if (!both) failing++;
  const { shares, readings } = leakShares(n);
  if (readings.length !== raw.readings.length || readings.some((r, i) => r.ppm !== raw.readings[i].ppm))
    throw new Error(`${name}: the replayed sweep differs from the stored one`);
  // the leak the first suspect found (nearest it), and the other
  const k0 = cands[0];
  const a = k0 && dist(k0, truth.leaks[1]) < dist(k0, truth.leaks[0]) ? 1 : 0;
  const b = 1 - a;
  const [L1, L2] = [truth.leaks[a], truth.leaks[b]];
  let above = 0;
  let snr2 = 0;
  for (let i = 0; i < readings.length; i++) {
    const sd = noiseSd(shares[a][i] + shares[b][i]);
    if (shares[b][i] > 2 * sd) above++;
    snr2 += (shares[b][i] / sd) ** 2;
  }
  const ok = above >= 2 && snr2 >= 25;
  if (ok && !both) findable++;
  const near2 = cands.map((k) => `${dist(k, L1).toFixed(1)}/${dist(k, L2).toFixed(1)}`).join(" ");
  console.log(
    `${name} ${both ? "found" : "FAIL "} first-found ${L1.kind}@${L1.fixtureId} other ${L2.kind}@${L2.fixtureId} ` +
      `(${L2.x},${L2.y}) sep ${dist(L1, L2).toFixed(1)} m | 2nd adds >2σ at ${above} readings, Σ(share/σ)² ${snr2.toFixed(0)}` +
      ` ${ok ? "findable" : "NOT findable"} | spots d1/d2: ${near2}`,
  );
  if (both) continue;
  // The locator's view: readings at lag-corrected positions minus the first fitted source.
  const grid = createPlanGrid(
    input.plan.width,
    input.plan.height,
    0.25,
    input.plan.obstacles.map((o) => o.polygon),
  );
  const k = settings.kernel;
  const stepScale = fanStepScale(grid, input.plan, k.fanMixingScale);
  const lag = lagStage(input.readings, input.instrument, grid, 1);
  const zones = zonesStage(input.plan.backgroundZones, input.instrument.alarmPpm, grid, stepScale, lag, {
    zones: settings.zones,
    noise: settings.noise,
    nearCutoffM: k.nearCutoffM,
    elevatedPpm: settings.sources.elevatedPpm,
  });
  const pf = passFitOf(input.plan, grid, readingAir(input), null, lag, zones, input.instrument.alarmPpm, settings);
  const field = fieldStage(grid, stepScale, casesRunFans(input.plan.fixtures), lag, zones, settings, null, pf.otherAir);
  const src = sourcesStage(
    input.plan,
    grid,
    lag,
    zones,
    field,
    { kernel: k, sources: settings.sources, zoneMarginM: settings.zones.marginM },
    pf.levelColumns,
  );
  const centre = (c: number) => ({ x: ((c % grid.width) + 0.5) * 0.25, y: (Math.floor(c / grid.width) + 0.5) * 0.25 });
  const fitted = src.found.filter((s) => !s.alternate);
  console.log(
    `   fitted: ${fitted
      .map((s) => {
        const p = centre(s.cell);
        let pk = 0;
        for (let i = 0; i < s.column.length; i++) pk = Math.max(pk, s.q * s.column[i]);
        return `(${p.x.toFixed(1)},${p.y.toFixed(1)}) d1 ${dist(p, L1).toFixed(1)} d2 ${dist(p, L2).toFixed(1)} q ${s.q.toFixed(1)} pk ${pk.toFixed(1)}`;
      })
      .join(" | ")}`,
  );
  const b0 = src.fit.b;
  const f1 = fitted[0];
  const res = residualOf(lag.ppm, [f1.column], [f1.q]);
  const oracleRes = Array.from(lag.ppm, (v, i) => v - shares[a][i]);
  const peakOf = (r: ArrayLike<number>) => {
    let m = 0;
    for (let i = 1; i < r.length; i++) if (r[i] > r[m]) m = i;
    return m;
  };
  const pr = peakOf(res);
  const po = peakOf(oracleRes);
  const at = (i: number) => ({ x: lag.xs[i], y: lag.ys[i] });
  // the readings the second leak raises most, at their corrected positions
  const top2 = Array.from(shares[b].keys())
    .sort((i, j) => shares[b][j] - shares[b][i])
    .slice(0, 5);
  console.log(
    `   residual after first fitted source: peak ${(res[pr] - b0).toFixed(1)} ppm at (${lag.xs[pr].toFixed(1)},${lag.ys[pr].toFixed(1)}) ` +
      `d2 ${dist(at(pr), L2).toFixed(1)} d1 ${dist(at(pr), L1).toFixed(1)}; oracle residual peak ${oracleRes[po].toFixed(1)} at d2 ${dist(at(po), L2).toFixed(1)}`,
  );
  console.log(
    `   2nd's strongest readings (share/read @corrected pos d2): ${top2
      .map((i) => `${shares[b][i].toFixed(1)}/${lag.ppm[i]}@${dist(at(i), L2).toFixed(1)}`)
      .join(" ")}`,
  );
}
console.log(`failing ${failing}, of which findable ${findable}`);
