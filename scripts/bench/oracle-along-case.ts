// A measured ceiling, not a locator: how well could anyone place a store's leak along its case from the
// readings as taken, knowing the physics? `tsx scripts/bench/oracle-along-case.ts [family ...] [--first N]
// [--count N] [--dir DIR] [--json OUT]` rebuilds each simulated store (scripts/bench/simulate/), records
// the probe's true path tick by tick, slides a unit leak along the true leak's case (its place across
// the case, the delay, the sensor's response and noise, the ambient level all as simulated) and finds
// the place by maximum likelihood, the leak's strength fitted at each place (profile likelihood). The
// readings are compared with the stored store file, so the ceiling is for exactly the sweep scored.
// Noise model: the simulator's log-normal fluctuation, its variance reduced by the first-order response
// (an Ornstein–Uhlenbeck component of correlation time T through a lag τ keeps T/(T+τ) of its variance),
// display noise and whole-ppm rounding as intervals; taps taken as independent (an approximation).
import { readFileSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { buildWorld } from "./simulate/scenario";
import { storeName, storeStream, type Family } from "./simulate/store-types";
import { Technician } from "./simulate/technician";
import { type Obs, profileWith, responseAtTaps } from "./oracle-likelihood";

const args = process.argv.slice(2);
const take = (flag: string) => {
  const i = args.indexOf(flag);
  return i >= 0 ? args.splice(i, 2)[1] : undefined;
};
const first = Number(take("--first") ?? "1001");
const count = Number(take("--count") ?? "30");
const dir = take("--dir") ?? ".data/locator-sets/dev";
const jsonOut = take("--json");
const families = (args.length ? args : ["single-fans", "single-still"]) as Family[];
const DT = 0.05; // the simulator's sensor step (scenario.ts)

// Record where the probe is at every sensor tick and which tick each tap reads.
interface Trace {
  xs: number[];
  ys: number[];
  taps: number[];
  /** Whether each tap was taken on a re-check (the slower, closer stops after an alarm). */
  recheck: boolean[];
}
const proto = Technician.prototype as unknown as Record<string, (...a: unknown[]) => unknown>;
const tick0 = proto.tick;
const tap0 = proto.tap;
const traceOf = (t: object): Trace => {
  const any = t as { __trace?: Trace };
  any.__trace ??= { xs: [], ys: [], taps: [], recheck: [] };
  return any.__trace;
};
proto.tick = function (this: { x: number; y: number }) {
  const tr = traceOf(this);
  tr.xs.push(this.x);
  tr.ys.push(this.y);
  return tick0.call(this);
};
const span0 = proto.sweepSpan;
proto.tap = function (this: { __inRecheck?: boolean }) {
  traceOf(this).taps.push(traceOf(this).xs.length);
  traceOf(this).recheck.push(!!this.__inRecheck);
  return tap0.call(this);
};
// A re-check sweeps at the closer spacing (under 1 m); the first pass at 1.2–1.5 m.
proto.sweepSpan = function (this: { __inRecheck?: boolean }, ...a: unknown[]) {
  this.__inRecheck = (a[3] as [number, number])[0] < 1;
  return span0.apply(this, a);
};

interface Row {
  store: string;
  kind: string;
  caseLength: number;
  errAlong: number;
  width2: number;
  truthLl: number;
  bestLl: number;
  places: number[];
  lls: number[];
  truthAlong: number;
  /** The along-case error with only some readings (which readings carry the place). */
  subsets: Record<string, number>;
  counts: Record<string, number>;
}

const rows: Row[] = [];
for (const family of families) {
  for (let n = first; n < first + count; n++) {
    const name = storeName(family, n);
    const world = buildWorld(family, storeStream(family, n));
    for (const leg of world.layout.legs) world.technician.sweep(world.map, leg);
    const stored = JSON.parse(readFileSync(join(dir, `${name}.json`), "utf8"));
    const taken = world.technician.readings;
    if (JSON.stringify(taken) !== JSON.stringify(stored.readings))
      throw new Error(`${name}: readings differ from ${dir}`);
    const trace = traceOf(world.technician);
    const { transportDelayS, timeConstantS } = world.instrument;
    const delaySamples = Math.round(transportDelayS / DT);
    const gain = 1 - Math.exp(-DT / timeConstantS);
    const { sigma, slowShare, slowCorrelationS, displayNoisePpm, ambientPpm } = world.noise;
    const fluct =
      (Math.exp(sigma * sigma) - 1) *
      ((slowShare * slowCorrelationS) / (slowCorrelationS + timeConstantS) +
        ((1 - slowShare) * 0.3) / (0.3 + timeConstantS));
    const obs: Obs[] = taken.map((r) => ({ ppm: r.ppm, atLeast: !!r.atLeast }));
    const ambient = new Float64Array(trace.xs.length).fill(ambientPpm);
    const base = responseAtTaps(ambient, delaySamples, gain, trace.taps);
    const unitAt = (x: number, y: number) => {
      const sample = world.unitLeakAir(x, y);
      const air = new Float64Array(trace.xs.length);
      for (let i = 0; i < air.length; i++) air[i] = sample(trace.xs[i], trace.ys[i]);
      return responseAtTaps(air, delaySamples, gain, trace.taps);
    };
    // Where the air each tap shows was drawn (the true path one delay plus one time constant earlier).
    const lagTicks = delaySamples + Math.round(timeConstantS / DT);
    const airAt = trace.taps.map((t) => Math.max(0, t - 1 - lagTicks));
    const trueUnits = world.truth.leaks.map((l) => unitAt(l.x, l.y));
    for (const [li, leak] of world.truth.leaks.entries()) {
      const others = trueUnits.filter((_, j) => j !== li);
      const f = world.layout.fixtures.find((x) => x.id === leak.fixtureId)!;
      const { x0, y0, x1, y1 } = f.rect;
      const alongX = x1 - x0 >= y1 - y0;
      const [lo, hi] = alongX ? [x0, x1] : [y0, y1];
      const [clo, chi] = alongX ? [y0, y1] : [x0, x1];
      const truthAlong = alongX ? leak.x : leak.y;
      const step = world.notes.cellSize;
      const places: number[] = [];
      for (let s = lo + step / 2; s < hi; s += step) places.push(s);
      const units: (Float64Array | undefined)[] = places.map(() => undefined);
      const unitOf = (k: number) => (units[k] ??= unitAt(alongX ? places[k] : leak.x, alongX ? leak.y : places[k]));
      // Which readings carry the place: the air in front of the case, past its ends along the lineup, the rest.
      const cls = airAt.map((i) => {
        const a = alongX ? trace.xs[i] : trace.ys[i];
        const c = alongX ? trace.ys[i] : trace.xs[i];
        const dc = Math.max(0, clo - c, c - chi);
        if (dc > 1.2) return "far";
        if (a >= lo && a <= hi) return "front";
        return Math.min(Math.abs(a - lo), Math.abs(a - hi)) <= 4 ? "ends" : "far";
      });
      const subsets: Record<string, boolean[]> = {
        all: obs.map(() => true),
        front: cls.map((c) => c === "front"),
        "no-front": cls.map((c) => c !== "front"),
        "front+ends": cls.map((c) => c !== "far"),
        "no-ends": cls.map((c) => c !== "ends"),
        "first-pass": trace.recheck.map((r) => !r),
        recheck: trace.recheck.slice(),
      };
      const ml = (mask: boolean[]) => {
        const idx = mask.flatMap((m, k) => (m ? [k] : []));
        const o = idx.map((k) => obs[k]);
        const b = Float64Array.from(idx, (k) => base[k]);
        const lls = places.map(() => Number.NEGATIVE_INFINITY);
        const at = (k: number) => {
          if (lls[k] === Number.NEGATIVE_INFINITY) {
            const u = unitOf(k);
            const sub = (v: Float64Array) => Float64Array.from(idx, (j) => v[j]);
            lls[k] = profileWith(o, b, sub(u), others.map(sub), fluct, displayNoisePpm).ll;
          }
          return lls[k];
        };
        // Every second place first, then the best one's neighbours.
        for (let k = 0; k < places.length; k += 2) at(k);
        if ((places.length - 1) % 2) at(places.length - 1);
        let top = 0;
        for (let k = 1; k < lls.length; k++) if (lls[k] > lls[top]) top = k;
        for (const k of [top - 1, top + 1]) if (k >= 0 && k < places.length) at(k);
        let best = 0;
        for (let k = 1; k < lls.length; k++) if (lls[k] > lls[best]) best = k;
        let spot = places[best];
        if (best > 0 && best < lls.length - 1 && Number.isFinite(lls[best - 1]) && Number.isFinite(lls[best + 1])) {
          const [a, bb, c] = [lls[best - 1], lls[best], lls[best + 1]];
          const den = a - 2 * bb + c;
          if (den < 0) spot += (0.5 * step * (a - c)) / den;
        }
        // The span where the likelihood is within e^2 of its best (places not solved count as outside).
        const within = places.filter((_, k) => lls[best] - lls[k] <= 2);
        return { err: Math.abs(spot - truthAlong), span: Math.max(...within) - Math.min(...within) + step, lls };
      };
      const results = Object.fromEntries(Object.entries(subsets).map(([k, m]) => [k, ml(m)]));
      const full = results.all;
      const truthLl = profileWith(obs, base, trueUnits[li], others, fluct, displayNoisePpm).ll;
      const row: Row = {
        store: name,
        kind: leak.kind,
        caseLength: hi - lo,
        errAlong: full.err,
        places,
        lls: full.lls,
        truthAlong,
        width2: full.span,
        truthLl,
        bestLl: Math.max(...full.lls),
        subsets: Object.fromEntries(Object.entries(results).map(([k, r]) => [k, r.err])),
        counts: Object.fromEntries(Object.entries(subsets).map(([k, m]) => [k, m.filter(Boolean).length])),
      };
      rows.push(row);
      console.log(
        `${name.padEnd(18)} ${leak.kind.padEnd(9)} case ${row.caseLength.toFixed(2)} m  along error ${row.errAlong.toFixed(2)} m  ` +
          `ΔlogL≤2 span ${row.width2.toFixed(2)} m  logL best ${row.bestLl.toFixed(1)} truth ${truthLl.toFixed(1)}  ` +
          Object.entries(results)
            .filter(([k]) => k !== "all")
            .map(([k, r]) => `${k} ${r.err.toFixed(2)}(${row.counts[k]})`)
            .join(" "),
      );
    }
  }
}
const median = (v: number[]) => {
  const s = [...v].sort((a, b) => a - b);
  return s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
};
for (const family of families) {
  const r = rows.filter((x) => x.store.startsWith(`${family}-`));
  if (!r.length) continue;
  console.log(
    `${family.padEnd(14)} oracle median along-case error ${median(r.map((x) => x.errAlong)).toFixed(2)} m, ` +
      `≤ 0.47 m in ${r.filter((x) => x.errAlong <= 0.47).length}/${r.length}, median ΔlogL≤2 span ${median(r.map((x) => x.width2)).toFixed(2)} m`,
  );
}
for (const key of Object.keys(rows[0]?.subsets ?? {}))
  for (const family of families) {
    const r = rows.filter((x) => x.store.startsWith(`${family}-`));
    if (r.length)
      console.log(
        `${family.padEnd(14)} readings ${key.padEnd(11)} median along-case error ${median(r.map((x) => x.subsets[key])).toFixed(2)} m, ≤ 0.47 m in ${r.filter((x) => x.subsets[key] <= 0.47).length}/${r.length}`,
      );
  }
if (jsonOut)
  writeFileSync(
    jsonOut,
    JSON.stringify(rows, (_k, v) => (v === Number.NEGATIVE_INFINITY ? null : v)),
  );
